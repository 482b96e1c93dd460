import { Decimal } from '../decimal.ts';
import type { YeastKind } from '../formula/formula-types.ts';

/**
 * How much of each kind of yeast replaces 1 g of fresh (compressed) yeast, by weight. A set of
 * factors always has fresh = 1; converting goes through the fresh-yeast equivalent.
 */
export interface YeastFactors {
  /** Which set this is, in words, for notes on converted lines. */
  readonly name: string;
  readonly source: string;
  readonly perGramFresh: Readonly<Record<YeastKind, Decimal>>;
}

/**
 * The published set, and the default: active dry = 0.40 × fresh, instant = 0.33 × fresh.
 * source: professional bread-baking text, section "Yeast conversions: fresh to dry" (title and
 * edition not confirmed)
 */
export const PUBLISHED_YEAST_FACTORS: YeastFactors = {
  name: 'published set (active dry 0.40, instant 0.33 × fresh)',
  source:
    'professional bread-baking text, "Yeast conversions: fresh to dry" (title and edition not confirmed)',
  perGramFresh: {
    fresh: new Decimal(1),
    'active-dry': new Decimal('0.40'), // source: bread-baking text, "Yeast conversions: fresh to dry"
    instant: new Decimal('0.33'), // source: bread-baking text, "Yeast conversions: fresh to dry"
  },
};

/**
 * The other widely used set: active dry = ½ × fresh, instant = ⅓ × fresh, as quoted among
 * pizza and bread bakers (common practice, no source).
 * It gives 25 % more active dry yeast than {@link PUBLISHED_YEAST_FACTORS}.
 */
export const COMMON_YEAST_FACTORS: YeastFactors = {
  name: 'common set (active dry 1/2, instant 1/3 × fresh)',
  source: 'common practice, no source',
  perGramFresh: {
    fresh: new Decimal(1),
    'active-dry': new Decimal('0.5'), // common practice, no source
    // An exact third, not 0.33: this set is quoted as a fraction (30 g fresh → 10 g instant).
    instant: new Decimal(1).div(3), // common practice, no source
  },
};

/** The factors used unless a caller passes others. */
export const DEFAULT_YEAST_FACTORS: YeastFactors = PUBLISHED_YEAST_FACTORS;

/** How each kind of yeast is called on a batch sheet. */
export const YEAST_KIND_LABEL: Readonly<Record<YeastKind, string>> = {
  fresh: 'fresh yeast',
  'active-dry': 'active dry yeast',
  instant: 'instant yeast',
};
