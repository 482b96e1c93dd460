/**
 * The product label sizes printed, and which of them has room for the safe handling
 * instructions that raw and not-ready-to-eat meat and poultry must carry. Pure data and one rule,
 * so the API can refuse a size, and the console show it unavailable, without loading the PDF
 * stack.
 */

/**
 * The sizes, as the API names them: thermal labels, width × height in inches, and a letter or
 * A4 sheet of the 2 × 1 in label.
 */
export const LABEL_SIZES = ['4x6', '2x1', 'letter', 'a4'] as const;

/** One of {@link LABEL_SIZES}. */
export type LabelSize = (typeof LABEL_SIZES)[number];

/** Whether a text names one of the label sizes. */
export function isLabelSize(text: string): text is LabelSize {
  return (LABEL_SIZES as readonly string[]).includes(text);
}

/**
 * One label of each size, width and height in inches: a sheet's labels are its 2 × 1 in cells
 * (server/pdf/label-pdf.ts lays out 4 × 10 on letter paper and 3 × 11 on A4).
 */
export const LABEL_INCHES: Readonly<Record<LabelSize, readonly [number, number]>> = {
  '4x6': [4, 6],
  '2x1': [2, 1],
  letter: [2, 1],
  a4: [2, 1],
};

/**
 * The least area, square inches, the words of the safe handling instructions take at the least
 * lettering the rule allows, before the heading, the four pictures, the border or anything else
 * the label must say: the rationale statement and the four handling statements (556 characters)
 * set on one line in the shipped font, Fira Sans, at the size whose lower-case letters stand
 * 1/16 inch tall, are 2 167.6 points long; at that size, 8.54 points (4.5 points of x-height ÷
 * 527/1000 em), set solid, they cover 2 167.6 × 8.54 = 18 510 square points = 3.57 square inches
 * (5 184 square points to the square inch). tests/pdf/label-fit.spec.ts measures it again from
 * the font.
 * source: 9 CFR 381.125(b)(1)(i), "lettering no smaller than one-sixteenth of an inch in size"
 * (read, 2019 CFR; the same for meat, 9 CFR 317.2(l), from memory); lettering measured as the
 * height of a lower-case letter, our own reading (see SHI_LAYOUT in safe-handling-text.ts).
 * Measured as the height of a capital letter (689/1000 em), the words would still need 2.09
 * square inches, more than a 2 × 1 in label's 2.
 */
export const SHI_WORDS_LEAST_SQUARE_INCHES = 3.57;

/** A label's area, square inches. */
function squareInches(size: LabelSize): number {
  const [width, height] = LABEL_INCHES[size];
  return width * height;
}

/**
 * Whether one label of a size has room for the safe handling instructions: its area is at least
 * what their words take at the least lettering allowed ({@link SHI_WORDS_LEAST_SQUARE_INCHES}).
 * The 4 × 6 in label has; a 2 × 1 in label, alone or on a sheet, has not. Room enough is not a
 * layout: the 4 × 6 label's drawing still refuses a label whose content does not fit.
 */
export function holdsSafeHandling(size: LabelSize): boolean {
  return squareInches(size) >= SHI_WORDS_LEAST_SQUARE_INCHES;
}

/** What each size's labels are called in a cook's words. */
const SIZE_WORDS: Readonly<Record<LabelSize, string>> = {
  '4x6': 'A 4 × 6 in label',
  '2x1': 'A 2 × 1 in label',
  letter: 'The 2 × 1 in labels of a letter sheet',
  a4: 'The 2 × 1 in labels of an A4 sheet',
};

/**
 * Why a size cannot carry a product's label, in a cook's words, or undefined when it can: a
 * product that must carry the safe handling instructions cannot go on a label too small for them.
 * @param needsSafeHandling whether the product must carry the instructions (safe-handling.ts)
 * @param bigFits whether the 4 × 6 label holds this label, to send the cook to it
 */
export function labelSizeRefusal(
  size: LabelSize,
  needsSafeHandling: boolean,
  bigFits = true,
): string | undefined {
  if (!needsSafeHandling || holdsSafeHandling(size)) return undefined;
  const are = size === 'letter' || size === 'a4' ? 'are' : 'is';
  return (
    `${SIZE_WORDS[size]} ${are} too small for the safe handling instructions this raw or ` +
    `not-ready-to-eat product must carry${bigFits ? ': print the 4 × 6 in label' : ''}`
  );
}
