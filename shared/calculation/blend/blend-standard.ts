import { type Decimal, HUNDRED, sum } from '../../decimal.ts';
import type { BlendComponent, BlendFormula } from '../../formula/formula-types.ts';
import { FAT_AS_SUCH_ALTERNATIVE, FAT_STANDARDS } from '../../reference/fat-standards.ts';
import type { Figure, LimitCheck } from '../calc-result.ts';
import { formatPercent } from './blend-fat.ts';
import { fatAsSuchCheck, fatStandardCheck, productName } from './fat-standard-check.ts';

/** What the formula's standard of identity says about one batch. */
export interface StandardOutcome {
  readonly checks: LimitCheck[];
  readonly figures: Figure[];
  readonly warnings: string[];
}

/**
 * The checks of the formula's standard for one batch: the fat ceiling, fat added as such where
 * the standard forbids it (9 CFR 319.15(a)), and the name the product may carry. Nothing when
 * the formula names no standard.
 * @param parts every component with its grams in this batch
 * @param fatPercent the blend's fat %, computed back from the amounts
 */
export function standardOutcome(
  formula: BlendFormula,
  parts: readonly { component: BlendComponent; grams: Decimal }[],
  fatPercent: Decimal,
): StandardOutcome {
  if (!formula.standard) return { checks: [], figures: [], warnings: [] };
  const rule = FAT_STANDARDS[formula.standard];
  const meat = sum(parts.map((p) => p.grams));
  // A component the batch takes none of adds nothing, whatever it is.
  const asSuch = parts.filter((p) => p.component.fat_as_such && p.grams.greaterThan(0));
  const asSuchPercent = sum(asSuch.map((p) => p.grams))
    .times(HUNDRED)
    .div(meat);
  const checks = [fatStandardCheck(formula.standard, fatPercent)];
  const added = fatAsSuchCheck(formula.standard, asSuchPercent);
  if (added) checks.push(added);
  const warnings: string[] = [];
  if (added?.status === 'fail') {
    const other = FAT_STANDARDS[FAT_AS_SUCH_ALTERNATIVE];
    const names = asSuch.map((p) => p.component.name).join(' and ');
    const instead = fatPercent.greaterThan(other.maxFatPercent)
      ? `over ${formatPercent(other.maxFatPercent)} fat it may not be sold as ${other.name} either`
      : `it may be sold as ${other.name} (${other.section}) instead: make that the formula's standard`;
    warnings.push(
      `${names} is fat added as such, which ${rule.name} may not have (${rule.section}); ${instead}.`,
    );
  }
  return {
    checks,
    figures: [productName(formula.standard, fatPercent, asSuch.length > 0)],
    warnings,
  };
}
