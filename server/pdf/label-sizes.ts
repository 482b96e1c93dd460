/**
 * The product label sizes printed: thermal labels, width × height in inches, and a letter or A4
 * sheet of the small label. Apart from the label's drawing so the router can name them without
 * loading pdfkit.
 */
export const LABEL_SIZES = ['4x6', '2x1', 'letter', 'a4'] as const;

/** One of {@link LABEL_SIZES}. */
export type LabelSize = (typeof LABEL_SIZES)[number];
