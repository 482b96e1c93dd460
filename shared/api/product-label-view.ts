import type { LabelSize } from '../labels/label-sizes.ts';
import type { ShiPicture } from '../labels/safe-handling-text.ts';

/** One label size and, when this product cannot go on it, why, in a cook's words. */
export interface LabelSizeView {
  readonly size: LabelSize;
  readonly refused?: string;
}

/**
 * A product label's content as the API sends it for the console's preview: every text as it
 * prints (GET /api/batches/:lot/label).
 */
export interface ProductLabelView {
  readonly product: string;
  /** "Ingredients: pork, sea salt, … curing salt (salt, sodium nitrite)". */
  readonly ingredients: string;
  /** "Contains: milk, fish (anchovy)"; absent when no major allergen is in it. */
  readonly contains?: string;
  /** "Net wt 12 oz (340 g)"; absent when no net weight was given. */
  readonly net?: string;
  readonly lotCode: string;
  /** ISO date, day 1 of the date mark. */
  readonly packedOn: string;
  /** The use-by day (ISO date) and where its days come from, or why there is none. */
  readonly useBy: { readonly day: string; readonly source: string } | { readonly none: string };
  /** "Keep refrigerated" or "Keep frozen"; absent for a shelf-stable product or one not set. */
  readonly handling?: string;
  /** Whether the safe handling instructions are required, and why. */
  readonly safeHandling: { readonly required: boolean; readonly reason: string };
  /** The instructions word for word, when required. */
  readonly instructions?: {
    readonly heading: string;
    readonly rationale: string;
    readonly statements: readonly { readonly text: string; readonly picture: ShiPicture }[];
  };
  readonly kitchen: { readonly name: string; readonly address?: string };
  /** Where a net weight the label works out comes from, or why it cannot, in a cook's words. */
  readonly netNote?: string;
  /** Every size, in the order offered, each with why it is refused for this product, if it is. */
  readonly sizes: readonly LabelSizeView[];
}

/**
 * The preview's answer for a batch whose label cannot be worked out yet (an assembly before its
 * parts' batches are recorded): why, in a cook's words. The PDF route refuses with 409 instead.
 */
export interface LabelNotYet {
  readonly notYet: string;
}
