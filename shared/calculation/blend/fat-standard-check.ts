import type { Decimal } from '../../decimal.ts';
import { FAT_STANDARDS, type FatStandardKey } from '../../reference/fat-standards.ts';
import type { LimitCheck } from '../calc-result.ts';

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
