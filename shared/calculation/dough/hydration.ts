import type { Decimal } from '../../decimal.ts';
import { HUNDRED, ZERO, dec, sum } from '../../decimal.ts';
import { WATER_CONTENT } from '../../reference/water-content.ts';
import type { DoughLine } from './dough-line.ts';

/**
 * Water in 100 g of a line's ingredient, or undefined when the formula does not count it: the
 * ingredient's own water_pct wins over the published figure for its `food`. A yeast line
 * converted to another kind no longer is the food the formula described, so it counts as fresh
 * yeast when converted to fresh and is not counted when converted to a dry yeast (about 5 %
 * water, not in the table).
 */
export function waterContentOfLine(line: DoughLine): Decimal | undefined {
  const ingredient = line.ingredient;
  if (!ingredient) return undefined;
  const declared =
    ingredient.water_pct !== undefined
      ? dec(ingredient.water_pct)
      : ingredient.food !== undefined
        ? WATER_CONTENT[ingredient.food].waterPct
        : undefined;
  if (declared === undefined) return undefined;
  if (line.yeast !== undefined && line.yeast !== ingredient.yeast) {
    return line.yeast === 'fresh' ? WATER_CONTENT['yeast-fresh'].waterPct : undefined;
  }
  return declared;
}

/**
 * Effective hydration, % of flour: the water carried by every line that declares a water content
 * (water_pct, or the published figure for its food), over the flour.
 * @param lines the overall formula's lines, percentages of total flour
 */
export function effectiveHydration(lines: readonly DoughLine[]): Decimal {
  return sum(
    lines.map((line) => {
      const water = waterContentOfLine(line);
      return water === undefined ? ZERO : line.percent.times(water).div(HUNDRED);
    }),
  );
}

/**
 * Hydration from plain water only (lines whose food is 'water'), % of flour: the figure most
 * bakers mean by "hydration".
 * @param lines the overall formula's lines, percentages of total flour
 */
export function plainWaterHydration(lines: readonly DoughLine[]): Decimal {
  return effectiveHydration(lines.filter((line) => line.ingredient?.food === 'water'));
}
