import { Decimal } from '../decimal.ts';
import type { BlendFormula } from '../formula/formula-types.ts';

/** The legal fat standards a blend formula can name. */
export type FatStandardKey = NonNullable<BlendFormula['standard']>;

/**
 * A US standard of identity that caps a product's fat. These are labelling standards: a product
 * over the limit may not be sold under that name, but it is not unsafe to eat.
 */
export interface FatStandard {
  readonly key: FatStandardKey;
  /** The product the standard defines, as printed in a check: "ground beef". */
  readonly product: string;
  /** Highest fat allowed, % by weight of the product. */
  readonly maxFatPercent: Decimal;
  readonly source: string;
}

/** The fat standards, keyed as in a blend formula's `standard`. */
export const FAT_STANDARDS: Readonly<Record<FatStandardKey, FatStandard>> = {
  'ground-beef': {
    key: 'ground-beef',
    product: 'ground beef (chopped beef, hamburger)',
    // source: 9 CFR 319.15(a), USDA FSIS standard of identity for chopped beef/ground beef;
    // hamburger (319.15(b)) has the same 30 % ceiling (from memory). check-values S-5, REG
    // (secondary): known only through training material quoting the rule; re-check against eCFR.
    maxFatPercent: new Decimal(30),
    source:
      '9 CFR 319.15(a), USDA FSIS standard of identity for chopped beef/ground beef/hamburger ' +
      '(as quoted in training material; check against eCFR)',
  },
  'fresh-pork-sausage': {
    key: 'fresh-pork-sausage',
    product: 'fresh pork sausage',
    // source: 9 CFR 319.141, USDA FSIS standard of identity for fresh pork sausage, as stated in
    // The National Provisioner; check-values S-6, REG (secondary); re-check against eCFR.
    maxFatPercent: new Decimal(50),
    source:
      '9 CFR 319.141, USDA FSIS standard of identity for fresh pork sausage ' +
      '(as stated in The National Provisioner; check against eCFR)',
  },
};
