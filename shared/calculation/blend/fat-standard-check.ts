import { type Decimal, ZERO } from '../../decimal.ts';
import {
  FAT_AS_SUCH_ALTERNATIVE,
  FAT_STANDARDS,
  type FatStandard,
  type FatStandardKey,
} from '../../reference/fat-standards.ts';
import type { Figure, LimitCheck } from '../calc-result.ts';
import { formatPercent } from './blend-fat.ts';

/**
 * Compares a blend's fat with the standard of identity the formula names. The standards are
 * labelling rules, not safety limits, so the check is never critical: over the limit it fails,
 * and the product must be sold under another name, but the batch is not refused.
 * @param standard the formula's `standard`
 * @param fatPercent the blend's fat %, computed back from the amounts
 */
export function fatStandardCheck(standard: FatStandardKey, fatPercent: Decimal): LimitCheck {
  const rule = FAT_STANDARDS[standard];
  return {
    id: `fat-standard-${rule.key}`,
    label: 'Fat',
    value: fatPercent,
    unit: 'percent',
    limit: rule.maxFatPercent,
    comparison: 'at-most',
    status: fatPercent.greaterThan(rule.maxFatPercent) ? 'fail' : 'pass',
    critical: false,
    rule: `${rule.product}: standard of identity (labelling, not safety)`,
    source: rule.source,
  };
}

/**
 * Checks the fat added as such against a standard that forbids it (ground beef, 9 CFR
 * 319.15(a)): any at all fails, and critically, since a batch made to be ground beef must not be
 * made with it. None for a standard that allows it.
 * @param fatAsSuchPercent the share of the meat that is fat added as such, %
 */
export function fatAsSuchCheck(
  standard: FatStandardKey,
  fatAsSuchPercent: Decimal,
): LimitCheck | undefined {
  const rule = FAT_STANDARDS[standard];
  if (!rule.forbidsFatAsSuch) return undefined;
  const other = FAT_STANDARDS[FAT_AS_SUCH_ALTERNATIVE];
  return {
    id: `fat-as-such-${rule.key}`,
    label: 'Fat added as such',
    value: fatAsSuchPercent,
    unit: 'percent',
    limit: ZERO,
    comparison: 'at-most',
    status: fatAsSuchPercent.greaterThan(0) ? 'fail' : 'pass',
    critical: true,
    rule: `${rule.name}, which takes no fat added as such (${other.name} may, ${other.section})`,
    source: rule.source,
  };
}

/** The figure of the name a product may carry. */
function soldAs(value: string, note: string): Figure {
  return { label: 'May be sold as', kind: 'text', value, note };
}

/** "not as ground beef: over 30 % fat", noted with the rule's section. */
function overFat(rule: FatStandard): Figure {
  return soldAs(`not as ${rule.name}: over ${formatPercent(rule.maxFatPercent)} fat`, rule.section);
}

/**
 * The name the product may carry under the formula's standard, as a figure: the standard's own
 * name when the blend meets it; hamburger when only the fat added as such keeps it from being
 * ground beef; otherwise no standard name, with the reason.
 * @param hasFatAsSuch whether the batch takes any component marked as fat as such
 */
export function productName(
  standard: FatStandardKey,
  fatPercent: Decimal,
  hasFatAsSuch: boolean,
): Figure {
  const rule = FAT_STANDARDS[standard];
  if (fatPercent.greaterThan(rule.maxFatPercent)) return overFat(rule);
  if (hasFatAsSuch && rule.forbidsFatAsSuch) {
    const other = FAT_STANDARDS[FAT_AS_SUCH_ALTERNATIVE];
    if (fatPercent.greaterThan(other.maxFatPercent)) return overFat(other);
    return soldAs(
      other.name,
      `not ${rule.name}: fat added as such (${rule.section}, ${other.section})`,
    );
  }
  return soldAs(rule.name, rule.section);
}
