import { Decimal } from '../decimal.ts';
import type { CureMethod, CureProduct } from '../formula/formula-types.ts';

/** The rule on ingoing sodium nitrite for one product class and cure method. */
export interface NitriteRule {
  /** The class in words, as printed beside the check. */
  readonly rule: string;
  /** Ceiling on ingoing sodium nitrite, ppm of green weight: the critical limit. */
  readonly maxPpm: Decimal;
  readonly source: string;
  /** Ascorbate or erythorbate the rule requires, ppm of green weight, when it requires any. */
  readonly acceleratorPpm?: Decimal;
  /** Ceiling on ingoing sodium nitrate, ppm; 0 where nitrate is not permitted; absent where we hold no figure. */
  readonly maxNitratePpm?: Decimal;
}

const BACON_RULE = '9 CFR 424.22(b); USDA FSIS fact sheet "Bacon and Food Safety"';
const CURING_AGENT_TABLE = '9 CFR 424.21(c); USDA FSIS Directive 7620.3, ch. 3';
// Nitrate is listed only for "cured meat products other than bacon". source: 9 CFR 424.21(c)
const NO_NITRATE = new Decimal(0);

/**
 * US federal limits on ingoing sodium nitrite by product and method. Each ceiling is the figure
 * printed in the rule (the handbook's 156 for ¼ oz per 100 lb, which is 156.25 by arithmetic).
 * Comminuted products take their cure mixed in, so only the dry method applies to them.
 */
export const NITRITE_RULES: Readonly<
  Record<CureProduct, Partial<Record<CureMethod, NitriteRule>>>
> = {
  bacon: {
    // source: 9 CFR 424.22(b) — dry-cured bacon 200 ppm
    dry: {
      rule: 'dry-cured bacon',
      maxPpm: new Decimal(200),
      source: BACON_RULE,
      maxNitratePpm: NO_NITRATE,
    },
    // source: 9 CFR 424.22(b) — immersion-cured bacon 120 ppm
    brine: {
      rule: 'immersion-cured bacon',
      maxPpm: new Decimal(120),
      source: BACON_RULE,
      maxNitratePpm: NO_NITRATE,
    },
    // source: 9 CFR 424.22(b) — pumped and/or massaged bacon 120 ppm with 550 ppm ascorbate/erythorbate
    pump: {
      rule: 'pumped bacon',
      maxPpm: new Decimal(120),
      source: BACON_RULE,
      acceleratorPpm: new Decimal(550),
      maxNitratePpm: NO_NITRATE,
    },
  },
  'whole-muscle': {
    // source: 9 CFR 424.21(c) "1 oz per 100 lb meat (dry cure)" = 625 ppm; FSIS 7620.3 ch. 3
    // nitrate: 3½ oz per 100 lb (dry cure) = 2187.5 ppm, same table
    dry: {
      rule: 'dry-cured product other than bacon',
      maxPpm: new Decimal(625),
      source: CURING_AGENT_TABLE,
      maxNitratePpm: new Decimal('2187.5'),
    },
    // source: 9 CFR 424.21(c), 200 ppm for pickle-cured (immersion) products; FSIS 7620.3 ch. 3
    brine: {
      rule: 'immersion-cured product other than bacon',
      maxPpm: new Decimal(200),
      source: CURING_AGENT_TABLE,
    },
    // source: 9 CFR 424.21(c), "2 lb to 100 gal pickle at 10 percent pump level", 200 ppm cap
    pump: {
      rule: 'pumped product other than bacon',
      maxPpm: new Decimal(200),
      source: CURING_AGENT_TABLE,
    },
  },
  comminuted: {
    // source: 9 CFR 424.21(c) "¼ oz per 100 lb chopped meat"; FSIS 7620.3 ch. 3 prints 156 ppm
    // nitrate: 2¾ oz per 100 lb chopped meat = 1718.75 ppm, same table
    dry: {
      rule: 'comminuted (ground or chopped) product',
      maxPpm: new Decimal(156),
      source: CURING_AGENT_TABLE,
      maxNitratePpm: new Decimal('1718.75'),
    },
  },
};

/**
 * The usual minimum: FSIS policy expects at least 120 ppm ingoing nitrite in cured "Keep
 * Refrigerated" products unless safety is assured another way (thermal process, pH, moisture).
 * source: USDA FSIS Directive 7620.3, ch. 3 introduction
 */
export const USUAL_MINIMUM_PPM = new Decimal(120);
export const USUAL_MINIMUM_SOURCE =
  'USDA FSIS Directive 7620.3, ch. 3 (policy for Keep Refrigerated cured products)';

/**
 * Above this much sodium nitrite in one ingredient we warn: kitchen curing salts hold about
 * 6 %; anything stronger is an industrial concentrate. (common practice, no source)
 */
export const CONCENTRATED_NITRITE_PCT = new Decimal(10);

/** The rule for a product and method, or undefined for a combination that does not exist. */
export function nitriteRuleFor(product: CureProduct, method: CureMethod): NitriteRule | undefined {
  return NITRITE_RULES[product][method];
}
