/**
 * The product label sizes printed: thermal labels, width × height in inches, and a letter or A4
 * sheet of the small label. Apart from the label's drawing so the router can name them without
 * loading pdfkit.
 */
export const LABEL_SIZES = ['4x6', '2x1', 'letter', 'a4'] as const;

/** One of {@link LABEL_SIZES}. */
export type LabelSize = (typeof LABEL_SIZES)[number];

/** Small labels on a sheet: letter paper 4 across and 10 down, A4 3 across and 11 down. */
export const SHEET_COUNTS: Readonly<Record<'letter' | 'a4', number>> = { letter: 40, a4: 33 };
