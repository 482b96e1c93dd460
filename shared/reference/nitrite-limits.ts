import { Decimal, MILLION } from '../decimal.ts';
import type { CureMethod, CureProduct } from '../formula/formula-types.ts';

/** A level above which we warn without refusing, and why, in words a cook reads. */
export interface NitriteWarning {
  readonly ppm: Decimal;
  /** The case the warning is about, printed as the check's rule. */
  readonly rule: string;
  readonly source: string;
}

/** The rule on ingoing sodium nitrite (and nitrate) for one product class and cure method. */
export interface NitriteRule {
  /** The class in words, as printed beside the check. */
  readonly rule: string;
  /** Ceiling on ingoing sodium nitrite, ppm of green weight: the critical limit. */
  readonly maxPpm: Decimal;
  /** The regulation's own words for the nitrite ceiling where it states a ratio. */
  readonly basis?: string;
  readonly source: string;
  /** Ascorbate or erythorbate the rule requires, ppm of green weight, when it requires any. */
  readonly acceleratorPpm?: Decimal;
  /** Ceiling on ingoing sodium or potassium nitrate, ppm; 0 where nitrate is not permitted. */
  readonly maxNitratePpm: Decimal;
  /** The regulation's own words for the nitrate ceiling. */
  readonly nitrateBasis?: string;
  /** A level of nitrite that is within the ceiling yet worth a warning. */
  readonly warnAbove?: NitriteWarning;
}

const BACON_RULE = '9 CFR 424.22(b); USDA FSIS fact sheet "Bacon and Food Safety"';
const CURING_AGENT_TABLE = '9 CFR 424.21(c); USDA FSIS Directive 7620.3, ch. 3';
// Nitrate is listed only for "cured meat products other than bacon". source: 9 CFR 424.21(c)
const NO_NITRATE = new Decimal(0);

/**
 * "n oz to 100 lb" as ppm by weight: 100 lb = 1 600 oz, so n / 1 600 × 1 000 000, exactly.
 * source: NIST SP 811 (1 lb = 16 oz); ppm by mass
 */
function ouncesPer100Pounds(ounces: string): Decimal {
  return new Decimal(ounces).div(1600).times(MILLION);
}

/**
 * "n lb to 100 gal pickle" as ingoing ppm at a 10 % pump. The handbook works the nitrite entry,
 * "2 lb to 100 gal pickle at 10 percent pump level", as 200 ppm ingoing; the same pickle and pump
 * with n lb carries n/2 of that.
 * source: USDA FSIS Directive 7620.3, ch. 3, "Nitrite used in cured, pickled products" (200 ppm)
 */
function poundsPer100GallonsPickle(pounds: string): Decimal {
  return new Decimal(pounds).div(2).times(200);
}

// text read: 9 CFR 424.21(c) curing-agent table, nitrite: "2 lb to 100 gal pickle at 10 percent
// pump level; 1 oz to 100 lb meat or poultry product (dry cure); ¼ oz to 100 lb chopped meat …
// The use of nitrites, nitrates or combination shall not result in more than 200 ppm of nitrite,
// calculated as sodium nitrite in finished product"; nitrate, "Cured meat products other than
// bacon": "7 lb to 100 gal pickle; 3½ oz to 100 lb meat or poultry product (dry cure); 2¾ oz to
// 100 lb chopped meat or poultry" (eCFR wording, https://www.ecfr.gov/current/title-9/section-424.21,
// as quoted verbatim in public documentation). The chopped-meat figures match the University of
// Georgia National Center for Home Food Preservation, "Nitrates and Nitrites" (2.75 oz nitrate,
// 0.25 oz nitrite per 100 lb chopped meat).
const PICKLE_NITRITE = '2 lb per 100 gal pickle at 10 % pump';
const PICKLE_NITRATE = '7 lb per 100 gal pickle, at 10 % pump';

/**
 * A dry cure that stays on the meat (equilibrium, bagged) keeps all of it: the 625 ppm ceiling
 * allows for cure lost from long rubs, while the same table caps nitrite in the finished product
 * at 200 ppm. source: 9 CFR 424.21(c)
 */
const KEPT_DRY_CURE: NitriteWarning = {
  ppm: new Decimal(200),
  rule: 'a dry cure that stays on the meat (equilibrium or bagged), which loses none of it: the 625 ppm ceiling allows for cure lost from long rubs, but nitrite in the finished product may not exceed 200 ppm',
  source: '9 CFR 424.21(c), nitrite in finished product',
};

/**
 * US federal limits on ingoing sodium nitrite and nitrate by product and method. Where the
 * regulation states a ratio, the ceiling is that ratio exactly (¼ oz per 100 lb is 156.25 ppm; the
 * handbook prints 156). Comminuted products take their cure mixed in, so only the dry method
 * applies to them.
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
    // source: 9 CFR 424.21(c) nitrite "1 oz to 100 lb (dry cure)", nitrate "3½ oz to 100 lb (dry cure)"
    dry: {
      rule: 'dry-cured product other than bacon',
      maxPpm: ouncesPer100Pounds('1'),
      basis: '1 oz per 100 lb, dry cure',
      source: CURING_AGENT_TABLE,
      maxNitratePpm: ouncesPer100Pounds('3.5'),
      nitrateBasis: '3½ oz per 100 lb, dry cure',
      warnAbove: KEPT_DRY_CURE,
    },
    // source: 9 CFR 424.21(c) pickle rates; FSIS 7620.3 ch. 3 holds immersion-cured products to the
    // pickle figure (200 ppm)
    brine: {
      rule: 'immersion-cured product other than bacon',
      maxPpm: poundsPer100GallonsPickle('2'),
      basis: PICKLE_NITRITE,
      source: CURING_AGENT_TABLE,
      maxNitratePpm: poundsPer100GallonsPickle('7'),
      nitrateBasis: PICKLE_NITRATE,
    },
    // source: 9 CFR 424.21(c) "2 lb to 100 gal pickle at 10 percent pump level", nitrate "7 lb to 100 gal pickle"
    pump: {
      rule: 'pumped product other than bacon',
      maxPpm: poundsPer100GallonsPickle('2'),
      basis: PICKLE_NITRITE,
      source: CURING_AGENT_TABLE,
      maxNitratePpm: poundsPer100GallonsPickle('7'),
      nitrateBasis: PICKLE_NITRATE,
    },
  },
  comminuted: {
    // source: 9 CFR 424.21(c) nitrite "¼ oz to 100 lb chopped meat" (FSIS 7620.3 ch. 3 prints 156),
    // nitrate "2¾ oz to 100 lb chopped meat"
    dry: {
      rule: 'comminuted (ground or chopped) product',
      maxPpm: ouncesPer100Pounds('0.25'),
      basis: '¼ oz per 100 lb chopped meat',
      source: CURING_AGENT_TABLE,
      maxNitratePpm: ouncesPer100Pounds('2.75'),
      nitrateBasis: '2¾ oz per 100 lb chopped meat',
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
