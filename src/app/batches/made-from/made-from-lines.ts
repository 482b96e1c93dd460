import { Decimal } from '../../../../shared/decimal.ts';
import type { LotOnHand, LotUseView, SuggestedItem } from '../../../../shared/api/batch-lots.ts';
import type { LotPick } from '../../../../shared/api/batch-lots.ts';
import { dayWords } from '../../../../shared/presentation/date-words.ts';
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

/**
 * What a cook needs to know of a lot after its code: "Hollin Vale Farm HV-01 · use by 5 Dec 2026
 * · 6 kg left"; of a batch, its use-by and the day it was made: "use by 9 Dec 2026 · made 3 Dec
 * 2026", "no use-by · made …", or "under way" before it is marked done.
 */
export function lotDetailWords(lot: LotOnHand, item: SuggestedItem): string {
  if (item.source === 'batch') {
    // The use-by first: a phone's field shows the start of the words only.
    if (!lot.madeOn) return 'under way';
    const useBy = lot.useBy ? `use by ${dayWords(lot.useBy)}` : 'no use-by';
    return `${useBy} · made ${dayWords(lot.madeOn)}`;
  }
  const supplier = [lot.supplier, lot.supplierLot].filter(Boolean).join(' ');
  const left =
    lot.remaining === null
      ? null
      : `${lotAmountWords(new Decimal(lot.remaining), item.measure, item.unit)} left`;
  return [supplier, lot.useBy ? `use by ${dayWords(lot.useBy)}` : null, left]
    .filter(Boolean)
    .join(' · ');
}

/** A lot on hand in a cook's words: its code, then its detail (see lotDetailWords). */
export function lotChoiceWords(lot: LotOnHand, item: SuggestedItem): string {
  return [lot.lotCode, lotDetailWords(lot, item)].filter(Boolean).join(' · ');
}

/**
 * Why the finished batches of a part offered have no use-by, each reason once ("not ready to eat:
 * …"); none for a received item, or when every finished batch has one.
 */
export function noUseByReasons(item: SuggestedItem): string[] {
  if (item.source !== 'batch') return [];
  const reasons = item.onHand.flatMap((lot) => (lot.madeOn && lot.noUseBy ? [lot.noUseBy] : []));
  return [...new Set(reasons)];
}
