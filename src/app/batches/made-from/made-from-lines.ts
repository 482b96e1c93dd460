import { Decimal } from '../../../../shared/decimal.ts';
import type { LotOnHand, LotUseView, SuggestedItem } from '../../../../shared/api/batch-lots.ts';
import type { LotPick } from '../../../../shared/api/batch-lots.ts';
import { lotAmountWords } from '../../../../shared/presentation/lot-amount-words.ts';

/** One lot line a cook may change: which lot, and how much of it went in, as typed. */
export interface PickLine {
  readonly lot: string;
  readonly amount: string;
}

/**
 * An amount as the cook would type it, in the unit the lot came in, to the gram (three places of
 * a kilogram or litre) or to the piece: "4 kg", "0.225 kg", "12".
 */
export function amountText(use: Pick<LotUseView, 'lotAmount' | 'lotUnit'>): string {
  const unit = use.lotUnit ?? 'g';
  const places = unit === 'each' || unit === 'g' || unit === 'ml' ? 0 : 3;
  const value = new Decimal(use.lotAmount).toDecimalPlaces(places).toString();
  return unit === 'each' ? value : `${value} ${unit}`;
}

/** The lines the form starts from: the suggested lots, or the lots recorded, of one item. */
export function startingLines(item: SuggestedItem, uses: readonly LotUseView[] = []): PickLine[] {
  const own = uses.filter((use) => use.item === item.item);
  const from = own.length ? own : item.takes;
  return from.map((use) => ({ lot: use.lotCode, amount: amountText(use) }));
}

/** The picks the form's lines make, item by item, leaving out lines with no lot chosen. */
export function picksOf(
  items: readonly { readonly item: SuggestedItem; readonly lines: readonly PickLine[] }[],
): LotPick[] {
  return items.flatMap(({ item, lines }) =>
    lines
      .filter((line) => line.lot !== '' && line.amount.trim() !== '')
      .map((line): LotPick =>
        item.source === 'batch'
          ? { part: item.item, batch: line.lot, amount: line.amount.trim() }
          : { item: item.item, lot: line.lot, amount: line.amount.trim() },
      ),
  );
}

/** What a cook needs to know of a lot on hand after its code: "Hollin Vale Farm HV-01 · 6000 g left". */
export function lotDetailWords(lot: LotOnHand, item: SuggestedItem, useBy?: string): string {
  const supplier = [lot.supplier, lot.supplierLot].filter(Boolean).join(' ');
  const left =
    lot.remaining === null
      ? null
      : `${lotAmountWords(new Decimal(lot.remaining), item.measure, item.unit)} left`;
  return [supplier, useBy ? `use by ${useBy}` : null, left].filter(Boolean).join(' · ');
}

/** A lot on hand in a cook's words: "R261201-01 · Hollin Vale Farm HV-01 · 6000 g left". */
export function lotChoiceWords(lot: LotOnHand, item: SuggestedItem, useBy?: string): string {
  return [lot.lotCode, lotDetailWords(lot, item, useBy)].filter(Boolean).join(' · ');
}
