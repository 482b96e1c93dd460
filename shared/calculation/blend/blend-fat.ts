import { Decimal, HUNDRED } from '../../decimal.ts';
import type { BlendComponent, BlendFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { Figure } from '../calc-result.ts';

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

/**
 * A component's line name: "beef chuck trim (15 % fat)", or "(18.5 % fat, measured)" when a fat
 * test for the batch replaced the formula's figure.
 */
export function componentLabel(component: BlendComponent, fat?: Decimal): string {
  if (fat === undefined) return `${component.name} (${formatPercent(componentFat(component))} fat)`;
  return `${component.name} (${formatPercent(fat)} fat, measured)`;
}

/**
 * The index of the component a batch option names by key, or a refusal listing the keys.
 * @param option the option, for the message: "on-hand"
 */
export function componentIndex(formula: BlendFormula, key: string, option: string): number {
  const keys = formula.components.map((c) => c.key);
  const index = keys.indexOf(key.trim().toLowerCase());
  if (index < 0) {
    const list = `${keys.slice(0, -1).join(', ')} and ${keys.at(-1)}`;
    throw new BatchError(
      `--${option} names "${key}", but this formula's trimmings are ${list}`,
      option,
    );
  }
  return index;
}

/** Each component's fat % for one batch, and the fat tests that replaced the formula's figure. */
export interface BatchFats {
  /** Fat %, in the formula's order. */
  readonly fats: readonly Decimal[];
  /** The measured fat, by component index, for the components a fat test was given for. */
  readonly measured: ReadonlyMap<number, Decimal>;
  /** One input per fat test, for the sheet. */
  readonly inputs: readonly Figure[];
}

/**
 * The fat of each component for a batch: the formula's figure (fat, or 100 − lean from a label
 * such as 80/20), unless the batch gives a fat test measured today for it, which replaces it for
 * this batch and is shown as such.
 * @throws BatchError when a fat test names an unknown component or the same one twice
 */
export function batchFats(formula: BlendFormula, batch: BatchInput): BatchFats {
  const measured = new Map<number, Decimal>();
  const inputs: Figure[] = [];
  for (const test of batch.fatTest ?? []) {
    const index = componentIndex(formula, test.key, 'fat-test');
    const component = formula.components[index];
    if (measured.has(index)) {
      throw new BatchError(`--fat-test names ${component.key} twice`, 'fat-test');
    }
    measured.set(index, test.fat);
    inputs.push({
      label: `Fat test: ${component.name}`,
      kind: 'percent',
      value: test.fat,
      note: `measured for this batch, instead of the formula's ${formatPercent(componentFat(component))}`,
    });
  }
  const fats = formula.components.map((c, i) => measured.get(i) ?? componentFat(c));
  return { fats, measured, inputs };
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
