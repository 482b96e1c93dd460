import type { LotAmount } from '../../shared/api/trace-record.ts';
import { Decimal, ZERO } from '../../shared/decimal.ts';

/** Amounts added up per measure, in the order the measures first come. */
export function totalsByMeasure(amounts: readonly LotAmount[]): LotAmount[] {
  const totals = new Map<LotAmount['measure'], Decimal>();
  for (const { amount, measure } of amounts)
    totals.set(measure, (totals.get(measure) ?? ZERO).plus(new Decimal(amount)));
  return [...totals].map(([measure, amount]) => ({ amount: amount.toString(), measure }));
}
