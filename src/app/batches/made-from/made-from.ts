import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import type { LotOnHand, LotUseView, SuggestedItem } from '../../../../shared/api/batch-lots.ts';
import { Decimal } from '../../../../shared/decimal.ts';
import { dayWords } from '../../../../shared/presentation/date-words.ts';
import { lotAmountWords } from '../../../../shared/presentation/lot-amount-words.ts';
import { SessionStore } from '../../core/auth/session-store';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { MadeFromStore } from './made-from-store';
import { lotChoiceWords, picksOf, startingLines, type PickLine } from './made-from-lines';

type LineForm = FormGroup<{ lot: FormControl<string>; amount: FormControl<string> }>;

/** One item of the form: what the batch needs of it, and the lots chosen. */
interface Entry {
  readonly item: SuggestedItem;
  readonly lines: FormArray<LineForm>;
  /** The lots a line may name: on hand, and those recorded before (given back on replacing). */
  readonly choices: readonly { readonly value: string; readonly words: string }[];
}

function lineForm(line: PickLine): LineForm {
  return new FormGroup({
    lot: new FormControl(line.lot, { nonNullable: true }),
    amount: new FormControl(line.amount, { nonNullable: true }),
  });
}

/**
 * "Made from": the lots a batch used (item, our lot, the supplier's lot, amount, day), or, until
 * they are recorded, the lots suggested first to expire first, which a cook accepts as they are
 * or changes line by line. Lines of the batch with no catalogue item are named apart.
 */
@Component({
  selector: 'app-made-from',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatIconButton,
    MatIcon,
    MatFormField,
    MatLabel,
    MatInput,
    MatSelect,
    MatOption,
    IsoDayPipe,
  ],
  providers: [MadeFromStore],
  templateUrl: './made-from.html',
  styleUrl: './made-from.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MadeFrom {
  private readonly session = inject(SessionStore);
  private readonly route = inject(ActivatedRoute);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly store = inject(MadeFromStore);

  /** The batch's lot code. */
  readonly lot = input.required<string>();

  protected readonly lots = this.store.lots;
  protected readonly canRecord = computed(
    () => this.session.hasRole('admin', 'cook') && !!this.lots()?.canRecord,
  );
  /** Whether the cook is changing lots already recorded. */
  protected readonly replacing = signal(false);
  protected readonly entries = signal<Entry[]>([]);
  protected readonly form = new FormArray<FormArray<LineForm>>([]);
  /** The form element's group: every item's lines. */
  protected readonly picks = new FormGroup({ items: this.form });
  /** Whether the page was opened straight after recording the batch. */
  protected readonly justRecorded = this.route.snapshot.fragment === 'made-from';
  protected readonly editing = computed(() => {
    const lots = this.lots();
    return !!lots && this.canRecord() && (lots.uses.length === 0 || this.replacing());
  });

  constructor() {
    effect(() => {
      const lot = this.lot();
      untracked(() => void this.load(lot));
    });
  }

  private async load(lot: string): Promise<void> {
    await this.store.load(lot);
    this.startForm();
    if (this.justRecorded)
      this.host.nativeElement.scrollIntoView({ block: 'start', behavior: 'instant' });
  }

  /** The form's lines from the suggestion, or from the lots recorded when changing them. */
  private startForm(): void {
    const lots = this.lots();
    const uses = this.replacing() ? (lots?.uses ?? []) : [];
    this.form.clear();
    const entries = (lots?.suggested ?? []).map((item): Entry => {
      const lines = new FormArray(startingLines(item, uses).map(lineForm));
      this.form.push(lines);
      return { item, lines, choices: choicesOf(item, uses) };
    });
    this.form.markAsPristine();
    this.entries.set(entries);
  }

  protected addLine(entry: Entry): void {
    entry.lines.push(lineForm({ lot: '', amount: '' }));
    this.form.markAsDirty();
  }

  protected removeLine(entry: Entry, index: number): void {
    entry.lines.removeAt(index);
    this.form.markAsDirty();
  }

  protected change(): void {
    this.replacing.set(true);
    this.startForm();
  }

  protected cancelChange(): void {
    this.replacing.set(false);
    this.startForm();
  }

  /** Records the lots: the suggestion as it stands when untouched, else the lines as typed. */
  protected async save(): Promise<void> {
    const replace = this.replacing();
    const body =
      !this.form.dirty && !replace
        ? { accept: true }
        : {
            picks: picksOf(
              this.entries().map((entry) => ({
                item: entry.item,
                lines: entry.lines.getRawValue(),
              })),
            ),
            ...(replace ? { replace: true } : {}),
          };
    if ('picks' in body && body.picks.length === 0) return;
    if (await this.store.record(this.lot(), body)) {
      this.replacing.set(false);
      this.startForm();
    }
  }

  /** Whether the batch is made from batches (an assembly's parts), not from lots received. */
  protected readonly fromBatches = computed(
    () =>
      !!this.lots()?.suggested.length && this.lots()!.suggested.every((s) => s.source === 'batch'),
  );

  /** Whether there is anything to record. */
  protected readonly anyLine = computed(() => this.entries().some((e) => e.lines.length > 0));

  protected amountWords(use: LotUseView): string {
    return lotAmountWords(new Decimal(use.amount), use.measure, use.lotUnit);
  }

  protected needWords(item: SuggestedItem): string | null {
    return item.need === null
      ? null
      : lotAmountWords(new Decimal(item.need), item.measure, item.unit);
  }

  protected shortWords(item: SuggestedItem): string | null {
    if (item.shortfall === null || new Decimal(item.shortfall).isZero()) return null;
    return lotAmountWords(new Decimal(item.shortfall), item.measure, item.unit);
  }

  protected expiredWords(lot: LotOnHand): string {
    return `${lot.lotCode} was to be used by ${lot.useBy ? dayWords(lot.useBy) : '—'}: discard it`;
  }
}

/** The lots a line of an item may name, in a cook's words. */
function choicesOf(item: SuggestedItem, uses: readonly LotUseView[]) {
  const onHand = item.onHand.map((lot) => ({
    value: lot.lotCode,
    words: lotChoiceWords(lot, item, lot.useBy ? dayWords(lot.useBy) : undefined),
  }));
  const recorded = uses
    .filter((use) => use.item === item.item && !item.onHand.some((l) => l.lotCode === use.lotCode))
    .map((use) => ({ value: use.lotCode, words: `${use.lotCode} · used in this batch` }));
  return [...onHand, ...recorded];
}
