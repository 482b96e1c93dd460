import assert from 'node:assert/strict';
import type { Decimal } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult } from '../calc-result.ts';

/**
 * The own Pearson-square example: lean 90/10 (10 % fat) and 50/50 (50 % fat) trims, 20 % fat
 * wanted.
 */
export function we25(extra: Partial<BlendFormula> = {}): BlendFormula {
  return {
    formula: 1,
    id: 'house-grind',
    title: 'House grind',
    kind: 'blend',
    species: 'beef',
    components: [
      { key: 'lean', name: 'lean 90/10 trim', fat: 10 },
      { key: 'fat', name: '50/50 trim', fat: 50 },
    ],
    target: { fat: 20 },
    ...extra,
  };
}

/** The value of a figure by its label. */
export function figure(result: CalcResult, label: string): Decimal {
  const found = result.figures.find((f) => f.label === label);
  assert.ok(found, `no figure "${label}"`);
  return found.value as Decimal;
}

/** The grams of each line of a group, to 0.001 g. */
export function grams(result: CalcResult, group: string): string[] {
  const found = result.groups.find((g) => g.title === group);
  assert.ok(found, `no group "${group}"`);
  return found.lines.map((line) => line.grams.toFixed(3));
}

/** An assert.throws validator for a BatchError with this option and message. */
export function batchError(
  option: string | undefined,
  pattern: RegExp,
): (error: unknown) => boolean {
  return (error) => {
    assert.ok(error instanceof BatchError, `not a BatchError: ${String(error)}`);
    assert.equal(error.option, option);
    assert.match(error.message, pattern);
    return true;
  };
}
