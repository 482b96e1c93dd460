import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import type { LotOnHand, LotUseView, SuggestedItem } from '../../../../shared/api/batch-lots.ts';
import { Decimal } from '../../../../shared/decimal.ts';
import { dayWords } from '../../../../shared/presentation/date-words.ts';
import { lotAmountWords } from '../../../../shared/presentation/lot-amount-words.ts';
import { SessionStore } from '../../core/auth/session-store';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { MadeFromStore } from './made-from-store';
import {
  lotChoiceWords,
  lotDetailWords,
  noUseByReasons,
  picksOf,
  startingLines,
  type PickLine,
} from './made-from-lines';

type LineForm = FormGroup<{ lot: FormControl<string>; amount: FormControl<string> }>;

/** One item of the form: what the batch needs of it, and the lots chosen. */
interface Entry {
  readonly item: SuggestedItem;
  readonly lines: FormArray<LineForm>;
  /**
   * The lots a line may name: on hand, and those recorded before (given back on replacing); each
   * in full for the list, and its detail (all but the code) for under the field once chosen.
   */
  readonly choices: readonly {
    readonly value: string;
    readonly words: string;
    readonly detail: string;
  }[];
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
    MatHint,
    MatLabel,
    MatInput,
    MatSelect,
    MatSelectTrigger,
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
  /** Emitted once the lots used are recorded, so what depends on them (the label) reads again. */
  readonly recorded = output<void>();

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
    this.countLines();
  }

  protected addLine(entry: Entry): void {
    entry.lines.push(lineForm({ lot: '', amount: '' }));
    this.countLines();
    this.form.markAsDirty();
  }

  protected removeLine(entry: Entry, index: number): void {
    entry.lines.removeAt(index);
    this.countLines();
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
      this.recorded.emit();
    }
  }

  /** Whether the batch is made from batches (an assembly's parts), not from lots received. */
  protected readonly fromBatches = computed(
    () =>
      !!this.lots()?.suggested.length && this.lots()!.suggested.every((s) => s.source === 'batch'),
  );

  /** Whether there is anything to record. */
  /** Lines in the form: the form arrays are not signals, so adding one is counted here. */
  private readonly lineCount = signal(0);

  protected readonly anyLine = computed(() => this.lineCount() > 0);

  private countLines(): void {
    this.lineCount.set(this.entries().reduce((n, e) => n + e.lines.length, 0));
  }

  protected amountWords(use: LotUseView): string {
    return lotAmountWords(new Decimal(use.amount), use.measure, use.lotUnit);
  }

  protected needWords(item: SuggestedItem): string | null {
    if (item.need === null) return null;
    const need = lotAmountWords(new Decimal(item.need), item.measure, item.unit);
    if (item.weighs === null || item.grams === null) return need;
    // Turned from the batch's grams through the catalogue: say how, so the cook can check it.
    const grams = lotAmountWords(new Decimal(item.grams), 'g');
    return item.measure === 'each'
      ? `${need} (${grams} at ${item.weighs} for one, whole pieces)`
      : `${need} (${grams} at ${item.weighs})`;
  }

  protected shortWords(item: SuggestedItem): string | null {
    if (item.shortfall === null || new Decimal(item.shortfall).isZero()) return null;
    return lotAmountWords(new Decimal(item.shortfall), item.measure, item.unit);
  }

  protected readonly noUseByReasons = noUseByReasons;

  /** The chosen lot's detail, in full under its field (the field has room for the code only). */
  protected detailOf(entry: Entry, lot: string): string | undefined {
    return entry.choices.find((choice) => choice.value === lot)?.detail;
  }

  protected expiredWords(lot: LotOnHand): string {
    return `${lot.lotCode} was to be used by ${lot.useBy ? dayWords(lot.useBy) : '—'}: discard it`;
  }
}

/** The lots a line of an item may name, in a cook's words. */
function choicesOf(item: SuggestedItem, uses: readonly LotUseView[]) {
  const onHand = item.onHand.map((lot) => ({
    value: lot.lotCode,
    words: lotChoiceWords(lot, item),
    detail: lotDetailWords(lot, item),
  }));
  const recorded = uses
    .filter((use) => use.item === item.item && !item.onHand.some((l) => l.lotCode === use.lotCode))
    .map((use) => ({
      value: use.lotCode,
      words: `${use.lotCode} · used in this batch`,
      detail: 'used in this batch',
    }));
  return [...onHand, ...recorded];
}
