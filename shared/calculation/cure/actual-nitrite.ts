/**
 * The curing checks worked out again from what was actually weighed. CONTRACT STUB: the core
 * engineer replaces the body.
 */
import type { Decimal } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import type { LimitCheck } from '../calc-result.ts';

/** What was weighed for a cure: the green weight, each line by name, the pumped weight if any. */
export interface ActualCureWeights {
  readonly greenGrams: Decimal;
  /** Grams of each ingredient line, by its name on the sheet; a line not weighed is absent. */
  readonly lines: ReadonlyMap<string, Decimal>;
  /** Pump cures: the weight after pumping, from which the actual pick-up follows. */
  readonly pumpedGrams?: Decimal;
}

/**
 * The cure's limit checks (nitrite, nitrate, accelerator…) on the actual weights, with the same
 * ids and limits as the calculation's; a line not weighed counts at its calculated amount.
 * @param calculated the calculation's own grams per line, by name
 */
export function actualCureChecks(
  formula: CureFormula,
  calculated: ReadonlyMap<string, Decimal>,
  actual: ActualCureWeights,
): LimitCheck[] {
  void formula;
  void calculated;
  void actual;
  throw new Error('actualCureChecks is not built yet');
}
