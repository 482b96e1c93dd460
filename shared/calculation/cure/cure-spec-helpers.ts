/** The small dry-cured bacon formula the cure specs start from. */
import { Decimal } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';

/** A decimal from a string or number. */
export const d = (value: string | number): Decimal => new Decimal(value);

/** A 6.25 % curing salt line without its percentage (common practice, no source). */
export const CURING_SALT = { name: 'curing salt', nitrite: 6.25, salt: 93.75 };

/** A dry-cured bacon at 2.32 % salt and 0.192 % curing salt, with the given changes. */
export function cure(overrides: Partial<CureFormula>): CureFormula {
  return {
    formula: 1,
    id: 'test-cure',
    title: 'Test cure',
    kind: 'cure',
    method: 'dry',
    product: 'bacon',
    ingredients: [
      { name: 'salt', pct: 2.32, salt: 100 },
      { ...CURING_SALT, pct: 0.192 },
    ],
    ...overrides,
  };
}
