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

/** What the checks found: the checks themselves and warnings that have no limit to compare with. */
export interface NitriteCheckOutcome {
  readonly checks: LimitCheck[];
  readonly warnings: string[];
}

/**
 * Compares ingoing levels with the rule for the product and method. Every comparison uses the
 * unrounded value. Exceeding a ceiling fails a critical limit; falling short of the usual minimum
 * warns; missing a required accelerator fails the rule without refusing the batch.
 */
export function checkIngoingLevels(rule: NitriteRule, levels: IngoingLevels): NitriteCheckOutcome {
  const checks: LimitCheck[] = [
    {
      id: 'nitrite-max',
      label: byFormula('Ingoing sodium nitrite', levels.basis?.nitrite),
      value: levels.nitrite,
      unit: 'ppm',
      limit: rule.maxPpm,
      comparison: 'at-most',
      status: levels.nitrite.greaterThan(rule.maxPpm) ? 'fail' : 'pass',
      critical: true,
      rule: rule.rule,
      source: rule.source,
    },
    {
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
    },
  ];
  if (rule.acceleratorPpm) {
    checks.push({
      id: 'accelerator-required',
      label: byFormula('Sodium ascorbate or erythorbate', levels.basis?.accelerator),
      value: levels.accelerator,
      unit: 'ppm',
      limit: rule.acceleratorPpm,
      comparison: 'at-least',
      status: levels.accelerator.lessThan(rule.acceleratorPpm) ? 'fail' : 'pass',
      critical: false,
      rule: `${rule.rule} (required)`,
      source: rule.source,
    });
  }
  const warnings: string[] = [];
  if (!levels.nitrate.isZero()) {
    if (rule.maxNitratePpm) {
      checks.push({
        id: 'nitrate-max',
        label: byFormula('Ingoing sodium nitrate', levels.basis?.nitrate),
        value: levels.nitrate,
        unit: 'ppm',
        limit: rule.maxNitratePpm,
        comparison: 'at-most',
        status: levels.nitrate.greaterThan(rule.maxNitratePpm) ? 'fail' : 'pass',
        critical: true,
        rule: rule.maxNitratePpm.isZero() ? `${rule.rule}: nitrate not permitted` : rule.rule,
        source: '9 CFR 424.21(c)',
      });
    } else {
      warnings.push(
        `This cure carries sodium nitrate (${levels.nitrate.toFixed(1)} ppm). Larderbook holds no nitrate limit for a ${rule.rule}: check it against 9 CFR 424.21(c) by hand.`,
      );
    }
  }
  return { checks, warnings };
}
