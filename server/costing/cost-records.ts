import type { BatchCostRecord, CostLineRecord } from '../../shared/api/cost-record.ts';
import type { BatchCost, CostedLine } from '../../shared/costing/batch-cost.ts';
import type { Decimal } from '../../shared/decimal.ts';
import { formatMass } from '../../shared/presentation/format-figure.ts';
import { moneyText } from '../../shared/presentation/money.ts';

/** An amount in its base measure, for a person. */
function amountText(line: CostedLine): string {
  const measure = line.measure ?? 'g';
  if (measure === 'g') return formatMass(line.amount, 'metric');
  if (measure === 'ml') return `${line.amount.toDecimalPlaces(0).toString()} ml`;
  return `${line.amount.toString()} each`;
}

/** A decimal and its text to the cent, or both null. */
export function money(amount: Decimal | null): { exact: string | null; text: string | null } {
  return amount === null
    ? { exact: null, text: null }
    : { exact: amount.toString(), text: moneyText(amount) };
}

function lineRecord(line: CostedLine): CostLineRecord {
  return {
    name: line.name,
    item: line.item ?? null,
    amount: line.amount.toString(),
    amountText: amountText(line),
    source: line.source,
    lot: line.lot ?? null,
    cost: money(line.cost).exact,
    costText: money(line.cost).text,
    unpriced: line.cost === null ? (line.unpriced ?? 'no price known') : null,
  };
}

/** A batch's cost as the API sends it. */
export function batchCostRecord(
  cost: BatchCost,
  lot: string | null,
  formula: { id: string; title: string },
): BatchCostRecord {
  const perKg = money(cost.perFinishedKg);
  return {
    lot,
    formula,
    lines: cost.lines.map(lineRecord),
    total: cost.total.toString(),
    totalText: moneyText(cost.total),
    complete: cost.complete,
    latestPriced: cost.latestPriced,
    unpriced: cost.unpriced,
    finishedGrams: cost.finishedGrams.toString(),
    finishedText: formatMass(cost.finishedGrams, 'metric'),
    finishedBasis: cost.finishedBasis,
    perFinishedKg: perKg.exact,
    perFinishedKgText: perKg.text,
    portion: cost.portion
      ? {
          grams: cost.portion.grams.toString(),
          weightText: formatMass(cost.portion.grams, 'metric'),
          count: cost.portion.count,
          cost: cost.portion.cost.toString(),
          costText: moneyText(cost.portion.cost),
        }
      : null,
  };
}
