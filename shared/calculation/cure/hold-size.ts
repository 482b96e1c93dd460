import type { Decimal } from '../../decimal.ts';
import type { CureFormula, HoldRule } from '../../formula/formula-types.ts';
import { holdRuleOf } from './hold-time.ts';

/** A size of the batch a hold rule is reckoned on (keys of the batch options). */
export type HoldSize = 'thickness' | 'largestPiece';

/**
 * The size a hold rule is reckoned on: the thickness for days per cm or inch, the heaviest piece
 * for days per kg or pound; null for a fixed number of days. A rule's `min_days` is a floor under
 * what the size gives, never a hold of its own (formula.schema.json: "Never fewer days than
 * this"), and none of the rules' sources gives a hold without the size: a cure whose rule needs
 * one has no ready date until it is given.
 */
export function holdSizeOfRule(rule: HoldRule): HoldSize | null {
  if (rule.days_per_cm !== undefined || rule.days_per_inch !== undefined) return 'thickness';
  if (rule.days_per_kg !== undefined || rule.days_per_lb !== undefined) return 'largestPiece';
  return null;
}

/**
 * The size this cure's hold is reckoned on: by its own rule, or the default for its method and
 * brine; null when it holds for fixed days or has no rule.
 * @param strength the brine the batch is held in, % salt; otherwise the formula's own
 */
export function holdSizeOf(formula: CureFormula, strength?: Decimal): HoldSize | null {
  const chosen = holdRuleOf(formula, strength);
  return chosen ? holdSizeOfRule(chosen.rule) : null;
}
