import type { Decimal } from '../../decimal.ts';
import type { LimitCheck } from '../calc-result.ts';
import {
  USUAL_MINIMUM_PPM,
  USUAL_MINIMUM_SOURCE,
  type NitriteRule,
} from '../../reference/nitrite-limits.ts';

/** Ingoing levels of one batch, ppm of green weight, unrounded. */
export interface IngoingLevels {
  readonly nitrite: Decimal;
  readonly nitrate: Decimal;
  readonly accelerator: Decimal;
  /** Which FSIS formula gave each level, in words, where the method has more than one. */
  readonly basis?: { readonly [K in 'nitrite' | 'nitrate' | 'accelerator']?: string };
}

/** A check's label with the formula its figure came by, when the method has more than one. */
function byFormula(label: string, basis: string | undefined): string {
  return basis ? `${label} (${basis})` : label;
}

/**
 * Compares ingoing levels with the rule for the product and method. Every comparison uses the
 * unrounded value. Exceeding a ceiling, or missing an accelerator the rule requires, fails a
 * critical limit (the batch is refused); falling short of the usual minimum, or a kept dry cure
 * above the finished-product cap, warns.
 */
export function checkIngoingLevels(rule: NitriteRule, levels: IngoingLevels): LimitCheck[] {
  const checks: LimitCheck[] = [
    ceiling(
      'nitrite-max',
      byFormula('Ingoing sodium nitrite', levels.basis?.nitrite),
      levels.nitrite,
      {
        limit: rule.maxPpm,
        basis: rule.basis,
        rule: rule.rule,
        source: rule.source,
      },
    ),
  ];
  const warn = rule.warnAbove;
  if (warn && levels.nitrite.greaterThan(warn.ppm)) {
    checks.push({
      id: 'nitrite-finished-product',
      label: byFormula('Ingoing sodium nitrite, finished-product cap', levels.basis?.nitrite),
      value: levels.nitrite,
      unit: 'ppm',
      limit: warn.ppm,
      comparison: 'at-most',
      status: 'warn',
      critical: false,
      rule: warn.rule,
      source: warn.source,
    });
  }
  checks.push({
    id: 'nitrite-min',
    label: byFormula('Ingoing sodium nitrite, usual minimum', levels.basis?.nitrite),
    value: levels.nitrite,
    unit: 'ppm',
    limit: USUAL_MINIMUM_PPM,
    comparison: 'at-least',
    status: levels.nitrite.lessThan(USUAL_MINIMUM_PPM) ? 'warn' : 'pass',
    critical: false,
    rule: 'cured products kept refrigerated',
    source: USUAL_MINIMUM_SOURCE,
  });
  if (rule.acceleratorPpm) {
    // A regulatory requirement, so a critical limit like the ceilings. source: 9 CFR 424.22(b)
    checks.push({
      id: 'accelerator-required',
      label: byFormula('Sodium ascorbate or erythorbate', levels.basis?.accelerator),
      value: levels.accelerator,
      unit: 'ppm',
      limit: rule.acceleratorPpm,
      comparison: 'at-least',
      status: levels.accelerator.lessThan(rule.acceleratorPpm) ? 'fail' : 'pass',
      critical: true,
      rule: rule.rule,
      source: rule.source,
    });
  }
  if (!levels.nitrate.isZero()) {
    checks.push(
      ceiling(
        'nitrate-max',
        byFormula('Ingoing sodium nitrate', levels.basis?.nitrate),
        levels.nitrate,
        {
          limit: rule.maxNitratePpm,
          basis: rule.nitrateBasis,
          rule: rule.maxNitratePpm.isZero() ? `${rule.rule}: nitrate not permitted` : rule.rule,
          source: '9 CFR 424.21(c)',
        },
      ),
    );
  }
  return checks;
}

/** A ceiling of the curing-agent rules: a critical limit, compared unrounded. */
function ceiling(
  id: string,
  label: string,
  value: Decimal,
  of: { limit: Decimal; basis?: string; rule: string; source: string },
): LimitCheck {
  return {
    id,
    label,
    value,
    unit: 'ppm',
    limit: of.limit,
    ...(of.basis ? { limitBasis: of.basis } : {}),
    comparison: 'at-most',
    status: value.greaterThan(of.limit) ? 'fail' : 'pass',
    critical: true,
    rule: of.rule,
    source: of.source,
  };
}
