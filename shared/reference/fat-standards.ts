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
  /** The name the product may carry when it meets the standard: "ground beef". */
  readonly name: string;
  /** The rule's section, for a short note: "9 CFR 319.15(a)". */
  readonly section: string;
  /** Highest fat allowed, % by weight of the product. */
  readonly maxFatPercent: Decimal;
  /** Whether the standard forbids fat added as such (loose fat, not trimmings with their lean). */
  readonly forbidsFatAsSuch: boolean;
  readonly source: string;
}

// Text read for 9 CFR 319.15: the 1998 CFR edition as reproduced at
// https://docslib.org/doc/3680056/321-subpart-b-raw-meat-products-subpart-c-cooked-meats
// ("§ 319.15 Miscellaneous beef products. (a) Chopped beef, ground beef. "Chopped Beef" or
// "Ground Beef" shall consist of chopped fresh and/or frozen beef with or without seasoning a…",
// the excerpt ends there), and for the beef-fat wording of (a) and (b) secondary texts only:
// California Health & Safety Code § 111200(a), which defines hamburger in the words of 319.15(b)
// ("with or without the addition of beef fat as such … not more than 30-percent fat",
// https://california.public.law/codes/ca_health_and_safety_code_section_111200), and a glossary
// ("if Hamburger is being made, fat may be added …, where by law no fat is allowed to be added
// to Ground Beef", https://www.smartkitchen.com/resources/term/b/regular-fat-content).
// Re-check both paragraphs against eCFR before relying on them.

/** The fat standards, keyed as in a blend formula's `standard`. */
export const FAT_STANDARDS: Readonly<Record<FatStandardKey, FatStandard>> = {
  'ground-beef': {
    key: 'ground-beef',
    product: 'ground beef (chopped beef)',
    name: 'ground beef',
    section: '9 CFR 319.15(a)',
    // source: 9 CFR 319.15(a), USDA FSIS standard of identity for chopped beef/ground beef:
    // at most 30 % fat, no beef fat added as such. Read in training material quoting the rule;
    // re-check against eCFR.
    maxFatPercent: new Decimal(30),
    forbidsFatAsSuch: true,
    source:
      '9 CFR 319.15(a), USDA FSIS standard of identity for chopped beef/ground beef: at most 30 % ' +
      'fat, without beef fat added as such (wording as quoted in secondary texts)',
  },
  hamburger: {
    key: 'hamburger',
    product: 'hamburger',
    name: 'hamburger',
    section: '9 CFR 319.15(b)',
    // source: 9 CFR 319.15(b), USDA FSIS standard of identity for hamburger: at most 30 % fat,
    // with or without beef fat added as such. The 30 % read in training material quoting 319.15;
    // re-check against eCFR.
    maxFatPercent: new Decimal(30),
    forbidsFatAsSuch: false,
    source:
      '9 CFR 319.15(b), USDA FSIS standard of identity for hamburger: at most 30 % fat, with or ' +
      'without beef fat added as such (wording as quoted in California Health & Safety Code § 111200)',
  },
  'fresh-pork-sausage': {
    key: 'fresh-pork-sausage',
    product: 'fresh pork sausage',
    name: 'fresh pork sausage',
    section: '9 CFR 319.141',
    // source: 9 CFR 319.141, USDA FSIS standard of identity for fresh pork sausage, as stated in
    // The National Provisioner trade magazine, not the rule itself; re-check against eCFR.
    maxFatPercent: new Decimal(50),
    // Not read for added fat: only 319.15(a) is known to forbid it, so nothing is checked here.
    forbidsFatAsSuch: false,
    source:
      '9 CFR 319.141, USDA FSIS standard of identity for fresh pork sausage ' +
      '(as stated in The National Provisioner)',
  },
};

/** The standard a blend of beef with fat added as such may meet instead of ground beef. */
export const FAT_AS_SUCH_ALTERNATIVE: FatStandardKey = 'hamburger';
