/**
 * The safe handling instructions of raw and not-ready-to-eat meat and poultry, word for word, and
 * the layout rules a label drawing them keeps.
 *
 * Where the words were read:
 * - 9 CFR 381.125(b), (b)(1)(i) and the start of (b)(2) (poultry), as in the 2019 CFR at
 *   legalfix.com/CFR/2019/title-9/chapter-iii/part-381/section-381.125;
 * - 9 CFR 381.125(b)(3)(i) to (iv) and (b)(4), with the graphic illustration each statement
 *   asks for, in a transcript of 9 CFR Ch. III (1-1-06 edition) on scribd.com ("Container Date
 *   Marking … 9cfr381.126-127"), amended at 59 FR 14540, Mar. 28, 1994;
 * - the heading and the rationale statement as FSIS gives the label's text ("Safe Handling
 *   Label Text", fsis.usda.gov, archived at cybercemetery.unt.edu), which says the label is
 *   described in 9 CFR parts 317 and 381; the same rationale words are quoted as the
 *   regulation's in barnardhealth.us ("Terminology", food processing).
 * - The meat rule, 9 CFR 317.2(l), was made by the same final rule, Mandatory Safe Handling
 *   Statements on Labeling of Raw Meat and Poultry Products (59 FR, March 28, 1994, FR Doc
 *   94-7217, read at govinfo.gov: it makes "safe handling instructions mandatory on all raw meat
 *   and poultry product labeling", with "a rationale statement" and statements on storage,
 *   cross-contamination, cooking and leftovers). That 317.2(l) carries the same words, and its
 *   paragraph numbers (l)(1) to (l)(3), are from memory: re-check against eCFR. The text of
 *   317.2(l) itself could not be read (the 2004 CFR page and the 1994 rule were found, but not
 *   as far as paragraph (l)).
 * - FSIS Directive 7235.1, Mandatory Safe Handling Statements on Labeling of Raw and Partially
 *   Cooked Meat and Poultry Products (May 11, 1994; read at foodcompliance.com): "Sections 317.2
 *   and 381.125 of the MPI Regulations require specific safe handling instructions to be provided
 *   on the labeling of all meat and meat products of cattle, swine, sheep, goat, or equine, and
 *   poultry products" (VI.A), so one set of words serves meat and poultry; and the messages need
 *   not be set out as a table, but "the order of the information needs to remain the same"
 *   (Attachment 2, D.1).
 */

/** The heading. source: 9 CFR 381.125(b)(2) (read, 2019 CFR); 9 CFR 317.2(l)(2), from memory */
export const SHI_HEADING = 'Safe Handling Instructions';

/**
 * The rationale statement, printed under the heading.
 * source: 9 CFR 317.2(l)(2) and 381.125(b)(2), from memory as to the paragraph; words as FSIS
 * gives them in "Safe Handling Label Text"
 */
export const SHI_RATIONALE =
  'This product was prepared from inspected and passed meat and/or poultry. Some food products may contain bacteria that could cause illness if the product is mishandled or cooked improperly. For your protection, follow these safe handling instructions.';

/** The picture the regulation asks for beside each statement; we draw our own. */
export type ShiPicture = 'refrigerator' | 'hands' | 'skillet' | 'thermometer';

/** One handling statement and the picture beside it. */
export interface ShiStatement {
  readonly text: string;
  readonly picture: ShiPicture;
}

/**
 * The four handling statements, in the regulation's order, each with its picture.
 * source: 9 CFR 381.125(b)(3)(i)–(iv) (read, 1-1-06 edition transcript): "(i) Keep refrigerated
 * or frozen. Thaw in refrigerator or microwave. … (A graphic illustration of a refrigerator
 * shall be displayed next to the statement.); (ii) Keep raw meat and poultry separate from other
 * foods. Wash working surfaces (including cutting boards), utensils, and hands after touching raw
 * meat or poultry. (A graphic illustration of soapy hands under a faucet …); (iii) Cook
 * thoroughly. (… a skillet …); and (iv) Keep hot foods hot. Refrigerate leftovers immediately or
 * discard. (… a thermometer …)"; the same for meat, 9 CFR 317.2(l)(3), from memory.
 * The regulation lets a part of (i) that conflicts with the product's own handling be left out
 * ("instructions to cook without thawing"); Larderbook prints every word.
 */
export const SHI_STATEMENTS: readonly ShiStatement[] = [
  {
    text: 'Keep refrigerated or frozen. Thaw in refrigerator or microwave.',
    picture: 'refrigerator',
  },
  {
    text: 'Keep raw meat and poultry separate from other foods. Wash working surfaces (including cutting boards), utensils, and hands after touching raw meat or poultry.',
    picture: 'hands',
  },
  { text: 'Cook thoroughly.', picture: 'skillet' },
  {
    text: 'Keep hot foods hot. Refrigerate leftovers immediately or discard.',
    picture: 'thermometer',
  },
];

/** Points in an inch (PDF user space). source: ISO 32000-1:2008, 8.3.2.3 (1/72 inch) */
const POINTS_PER_INCH = 72;

/**
 * The layout rules a label drawing the instructions keeps.
 *
 * Read in the text (9 CFR 381.125(b)(1)(i), 2019 CFR): "lettering no smaller than one-sixteenth
 * of an inch in size", "prominently placed with such conspicuousness … as to render it likely to
 * be read and understood by the ordinary individual", on the label; (b)(2): "under the heading
 * 'Safe Handling Instructions' which shall be set in typ[e]…" (the excerpt breaks off there);
 * (b)(3): a picture next to each statement.
 *
 * Read as quoted, not in the regulation itself (a summary of the safe handling label rules at
 * documentine.com gives the words without naming the paragraph): "under the heading 'Safe Handling
 * Instructions' which shall be set in type size larger than the print size of the rationale
 * statement and handling statements. The safe handling information shall be set off by a border
 * and shall be one color"; barnardhealth.us sums up the same as "set off by border", "one-color
 * printing on single-color, contrasting background", "type no smaller than 1/16 in, except
 * heading, which must be larger". That the background is of one contrasting colour is from that
 * summary only.
 *
 * Our own reading, no source: "lettering" is measured as the height of a lower-case letter (the
 * font's x-height), the strictest of the usual readings; the statements stay in the regulation's
 * order, the pictures on the left.
 */
export const SHI_LAYOUT = {
  /** The least height of a lower-case letter, points: 1/16 inch. */
  minLetterPoints: POINTS_PER_INCH / 16,
  /** A border round the whole (read as quoted, above). */
  border: true,
  /** Black type on white: "one color" (read as quoted), on one contrasting background. */
  oneColour: true,
} as const;
