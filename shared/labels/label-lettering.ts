import { SHI_LAYOUT } from './safe-handling-text.ts';

/**
 * The least lettering of the words a product label must carry: the product's name, the
 * ingredient statement, the "Contains:" statement, the net weight, the lot, the packed-on and
 * use-by days, the keep statement and the kitchen's name and address, as well as the safe
 * handling instructions.
 *
 * What was read, and where:
 * - 21 CFR 101.2(c) (2003 CFR, GPO Access): everything on the principal display panel or the
 *   information panel "shall appear prominently and conspicuously, but in no case may the
 *   letter…"; the page broke off there. That the rest reads "…letters and/or numbers be less
 *   than one-sixteenth inch in height", with exemptions for small packages in 101.2(f), is from
 *   memory.
 * - How a letter's height is measured, "the height of the lower case letter 'o' or its
 *   equivalent when mixed upper and lower case letters are used": read in FDA's questions and
 *   answers on the net quantity statement (Food Labeling Guide, citing 21 CFR 101.105(h) and
 *   (i)); that 101.2(c) measures the same way is from memory.
 * - 9 CFR 317.2(b) (2004 CFR, GPO Access): every word the meat label must carry is to be
 *   "prominently placed … with such conspicuousness … as to render it likely to be read and
 *   understood by the ordinary individual"; no figure is given there. A 1/16 inch least for the
 *   meat and poultry label's other words (9 CFR 317.2, 381.116) is from memory; the safe handling
 *   instructions' own 1/16 inch was read (9 CFR 381.125(b)(1)(i), see safe-handling-text.ts).
 *
 * So one least height serves every required word: the safe handling instructions' own, 1/16 in,
 * as the height of a lower-case letter (the font's x-height). In the shipped font that is 9
 * points of type (server/pdf/label-lettering.ts). The net weight has a rule of its own that can
 * ask for more, by the area of the package's principal display panel (21 CFR 101.105(i), 9 CFR
 * 317.2(h)); the label does not know the package, so only this least is kept (the caution that
 * label approval is the kitchen's stands over the preview).
 */
export const LEAST_LETTER_POINTS: number = SHI_LAYOUT.minLetterPoints;

/** Why a 4 × 6 label is refused, in a cook's words: its content does not fit at that least. */
export const TOO_FULL_WORDS =
  'the ingredient statement does not fit on a 4 × 6 label beside everything else it must say, ' +
  'with letters no smaller than the labelling rules allow (1/16 in)';

/** What to do when the kitchen's address on its name's line would make the room. */
export const SHORTEN_ADDRESS_WORDS =
  "shorten the kitchen's address to fit on one line with its name";
