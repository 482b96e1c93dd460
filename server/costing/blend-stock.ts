import type { BlendTrimRecord } from '../../shared/api/cost-record.ts';
import { pricePerKg, isReceivedUnit, baseMeasureOf } from '../../shared/costing/stock-measure.ts';
import { Decimal, ZERO } from '../../shared/decimal.ts';
import { catalogueNow } from './catalogue-now.ts';
import type { CostRepository } from './cost-repository.ts';

/**
 * The trims on hand for a least-cost blend: every catalogue item with a fat that is stocked by
 * weight and has a lot on hand, with how much (the lots added up) and its latest price a
 * kilogram (null when it never came with one). An item of kind `fat` is fat added as such.
 */
export async function stockTrims(
  repo: CostRepository,
  folder: string,
  today: string,
): Promise<BlendTrimRecord[]> {
  const catalogue = await catalogueNow(folder);
  const items = (catalogue?.items ?? []).filter(
    (item) => item.fat !== undefined && baseMeasureOf(item.unit) === 'g',
  );
  const lots = await repo.onHand(items.map((item) => item.key));
  const trims: BlendTrimRecord[] = [];
  for (const item of items) {
    const onHand = lots
      .filter((lot) => lot.item === item.key)
      .reduce((total, lot) => total.plus(new Decimal(lot.remaining)), ZERO);
    if (!onHand.greaterThan(ZERO)) continue;
    const price = await repo.latestPrice(item.key, today);
    const perKg =
      price && isReceivedUnit(price.unit) && baseMeasureOf(price.unit) === 'g'
        ? pricePerKg(price.unit, new Decimal(price.unit_cost)).toString()
        : null;
    trims.push({
      name: item.formula_names?.[0] ?? item.name,
      item: item.key,
      fat: String(item.fat),
      pricePerKg: perKg,
      onHandGrams: onHand.toString(),
      fatAsSuch: item.kind === 'fat',
    });
  }
  return trims;
}
