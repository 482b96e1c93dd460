import { Decimal, HUNDRED } from '../../decimal.ts';
import type { BlendComponent, BlendFormula } from '../../formula/formula-types.ts';

/**
 * Fat % from a fat or chemical-lean figure: chemical lean is everything that is not fat, so
 * fat = 100 − lean ("CL 90" is 10 % fat).
 * source: common practice, no source (the schema's definition of chemical lean: 100 minus fat)
 * @throws RangeError when neither is given (the schema requires one)
 */
export function fatFrom(value: { fat?: number; lean?: number }, what: string): Decimal {
  if (value.fat !== undefined) return new Decimal(value.fat);
  if (value.lean !== undefined) return HUNDRED.minus(new Decimal(value.lean));
  throw new RangeError(`${what} gives neither fat nor lean`);
}

/** A component's fat %, from its fat or its chemical lean. */
export function componentFat(component: BlendComponent): Decimal {
  return fatFrom(component, `component "${component.key}"`);
}

/** The formula's own target fat %, from target.fat or 100 − target.lean. */
export function formulaTargetFat(formula: BlendFormula): Decimal {
  return fatFrom(formula.target, 'the target');
}

/** Prints a percentage without trailing zeros: "15 %", "12.5 %". */
export function formatPercent(percent: Decimal): string {
  return `${percent.toString()} %`;
}

/** A component's line name: "beef chuck trim (15 % fat)". */
export function componentLabel(component: BlendComponent): string {
  return `${component.name} (${formatPercent(componentFat(component))} fat)`;
}

/**
 * The message for a target that the two fats cannot make, lower fat first:
 * "20 % fat cannot be made from trimmings at 15 % and 18 % fat".
 */
export function unreachableMessage(fatA: Decimal, fatB: Decimal, target: Decimal): string {
  const low = Decimal.min(fatA, fatB);
  const high = Decimal.max(fatA, fatB);
  const between = low.equals(high)
    ? 'both trimmings have the same fat'
    : `the target must lie between ${formatPercent(low)} and ${formatPercent(high)}`;
  return (
    `${formatPercent(target)} fat cannot be made from trimmings at ${formatPercent(low)} and ` +
    `${formatPercent(high)} fat: ${between}`
  );
}
