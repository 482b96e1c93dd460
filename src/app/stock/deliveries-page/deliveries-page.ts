import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  effect,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { LoadState } from '../../ui/load-state/load-state';
import { PageHead } from '../../ui/page-head/page-head';
import { StockStore, type Receipt, type ReceiptRequest, type StockLotView } from '../stock-store';

/** What was done with a delivery, in a cook's words. */
const DECISION_WORDS: Readonly<Record<Receipt['decision'], string>> = {
  accepted: 'Taken in',
  'accepted-with-action': 'Taken in with a corrective action',
  refused: 'Refused',
};

/** What happened to the product of a delivery taken in over its limit. */
const DISPOSITIONS = [
  { value: 'rechilled', label: 'Chilled again' },
  { value: 'reworked', label: 'Reworked' },
  { value: 'diverted', label: 'Put to another use' },
  { value: 'discarded', label: 'Thrown away' },
  { value: 'recooked', label: 'Cooked again' },
] as const;

/** The latest deliveries shown at first. */
const RECENT_FEW = 6;

/**
 * Deliveries: the receiving form (the item's limit beside the temperature; over it, refuse or
 * take it in with a corrective action), stock on hand by item with its lots first to expire
 * first, and the latest deliveries. Cooks and admins receive and discard; reviewers read.
 */
@Component({
  selector: 'app-deliveries-page',
  imports: [
    ReactiveFormsModule,
    IsoDayPipe,
    LoadState,
    MatButton,
    MatCheckbox,
    DAY_INPUT_IMPORTS,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSuffix,
    PageHead,
  ],
  providers: [provideDayInputs()],
  templateUrl: './deliveries-page.html',
  styleUrl: './deliveries-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class DeliveriesPage implements OnInit {
  protected readonly store = inject(StockStore);
  private readonly session = inject(SessionStore);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly receives = computed(() => this.session.hasRole('admin', 'cook'));
  protected readonly decisionWords = DECISION_WORDS;
  protected readonly dispositions = DISPOSITIONS;

  protected readonly form = this.fb.group({
    item: ['', Validators.required],
    supplier: ['', Validators.required],
    supplierLot: ['', Validators.required],
    establishment: [''],
    packedOn: [null as Date | null],
    useBy: [null as Date | null],
    quantity: ['', Validators.required],
    unit: [''],
    unitCost: [''],
    temperature: [''],
    scale: ['°C' as '°C' | '°F'],
    shippedFrozen: [false],
    frozenSolid: [true],
    note: [''],
  });
  protected readonly action = this.fb.group({
    cause: [''],
    restored: [''],
    prevention: [''],
    disposition: ['rechilled' as (typeof DISPOSITIONS)[number]['value']],
  });

  // Reset through the directive, so a delivery received leaves no field marked as missing.
  private readonly formDirective = viewChild(FormGroupDirective);
  private readonly itemKey = toSignal(this.form.controls.item.valueChanges, { initialValue: '' });
  private readonly frozen = toSignal(this.form.controls.shippedFrozen.valueChanges, {
    initialValue: false,
  });
  /** The chosen item, with its limit and what the door needs of it. */
  protected readonly item = computed(() =>
    this.store.items().find((item) => item.key === this.itemKey()),
  );
  protected readonly limit = computed(() => {
    const item = this.item();
    if (!item) return null;
    return this.frozen() ? item.frozenLimit : item.limit;
  });

  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** Over its limit: what the door found, while the cook chooses to refuse or take it in. */
  protected readonly over = signal<string | null>(null);
  /** Taking it in: the corrective action is being asked for. */
  protected readonly takingIn = signal(false);
  protected readonly saved = signal<Receipt | null>(null);
  /** How many of the latest deliveries show until all are asked for: the stock stays in reach. */
  protected readonly recentFew = RECENT_FEW;
  protected readonly allRecent = signal(false);
  protected readonly recentShown = computed(() =>
    this.allRecent() ? this.store.recent() : this.store.recent().slice(0, RECENT_FEW),
  );
  /** The lot whose discard is being confirmed, and the reason typed. */
  protected readonly discarding = signal<string | null>(null);
  protected readonly discardReason = this.fb.control('');

  constructor() {
    // A tap on an empty item list opens nothing; until the items arrive the list is shown as
    // not ready instead, and taps wait for it.
    effect(() => {
      const item = this.form.controls.item;
      if (this.store.items().length) item.enable({ emitEvent: false });
      else item.disable({ emitEvent: false });
    });
  }

  ngOnInit(): void {
    void this.store.load();
  }

  /** Picks the item's own unit when an item is chosen. */
  protected itemChosen(): void {
    const item = this.item();
    if (item) this.form.controls.unit.setValue(item.unit === 'each' ? 'each' : item.unit);
    this.over.set(null);
    this.takingIn.set(false);
  }

  private request(decision?: 'refuse' | 'accept'): ReceiptRequest {
    const v = this.form.getRawValue();
    const text = (value: string) => value.trim() || undefined;
    const temperature = text(v.temperature);
    const packedOn = isoDateOf(v.packedOn);
    const useBy = isoDateOf(v.useBy);
    const a = this.action.getRawValue();
    return {
      item: v.item,
      supplier: v.supplier.trim(),
      supplierLot: v.supplierLot.trim(),
      quantity: v.quantity.trim(),
      unit: v.unit as ReceiptRequest['unit'],
      ...(this.item()?.establishment && text(v.establishment)
        ? { establishment: text(v.establishment) }
        : {}),
      ...(packedOn ? { packedOn } : {}),
      ...(useBy ? { useBy } : {}),
      ...(text(v.unitCost) ? { unitCost: text(v.unitCost) } : {}),
      ...(temperature ? { temperature: `${temperature} ${v.scale}` } : {}),
      ...(v.shippedFrozen ? { shippedFrozen: true, frozenSolid: v.frozenSolid } : {}),
      ...(text(v.note) ? { note: text(v.note) } : {}),
      ...(decision ? { decision } : {}),
      ...(decision === 'accept'
        ? {
            action: {
              cause: a.cause.trim(),
              restored: a.restored.trim(),
              prevention: a.prevention.trim(),
              disposition: a.disposition,
            },
          }
        : {}),
    };
  }

  /** Sends the delivery; over its limit, the API asks what was done, and the form asks the cook. */
  protected async receive(decision?: 'refuse' | 'accept'): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    // The last delivery's "Taken in" must not stand beside this one's question.
    this.saved.set(null);
    try {
      const receipt = await this.store.receive(this.request(decision));
      this.saved.set(receipt);
      this.over.set(null);
      this.takingIn.set(false);
      this.formDirective()?.resetForm();
      this.form.reset();
      this.action.reset();
    } catch (error) {
      if (error instanceof ApiError && error.code === 'decision-needed') {
        const found = (error.details[0] as { found?: string } | undefined)?.found;
        this.over.set(found ?? error.message);
      } else this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  protected async confirmDiscard(lot: StockLotView): Promise<void> {
    const reason = this.discardReason.value.trim();
    if (!reason) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      await this.store.discard(lot.lotCode, reason);
      this.discarding.set(null);
      this.discardReason.reset();
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  /** "use by 14 Dec 2026 · 3 days left" in words. */
  protected daysWords(lot: StockLotView): string {
    if (lot.daysLeft === null) return '';
    if (lot.expired)
      return `past its use-by by ${-lot.daysLeft} day${lot.daysLeft === -1 ? '' : 's'}`;
    if (lot.daysLeft === 0) return 'use today';
    return `${lot.daysLeft} day${lot.daysLeft === 1 ? '' : 's'} left`;
  }
}
