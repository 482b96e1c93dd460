import type { LabelSizeView, ProductLabelView } from '../../../../shared/api/product-label-view.ts';

/** What a small size prints: the lot and date sticker, not the package label. */
const STICKER_ABOUT =
  'A lot and date sticker: the product, lot, packed-on and use-by days and how to keep it. ' +
  'It is not the package label: it goes with the full label on the pack or carton.';

/**
 * The sizes a product label prints at, as the API names them, with a cook's words for each and
 * what it prints (the small sizes are lot and date stickers: shared/labels/lot-date-sticker.ts).
 */
export const LABEL_SIZE_CHOICES = [
  {
    size: '4x6',
    words: '4 × 6 in, the full label',
    about: 'The package label: everything the package must say, for the pack or its carton.',
  },
  { size: '2x1', words: '2 × 1 in, lot and date sticker', about: STICKER_ABOUT },
  { size: 'letter', words: 'Letter sheet, 40 stickers', about: STICKER_ABOUT },
  { size: 'a4', words: 'A4 sheet, 33 stickers', about: STICKER_ABOUT },
] as const;

/** One of the label sizes. */
export type LabelSizeChoice = (typeof LABEL_SIZE_CHOICES)[number]['size'];

/** What a label is asked for with: its size, the package's net weight and the packed-on day. */
export interface LabelAsk {
  readonly size: LabelSizeChoice;
  /** "340 g", "12 oz"; empty for none. */
  readonly net: string;
  /** YYYY-MM-DD; empty for today. */
  readonly packed: string;
}

/** The query of a label request: only what is given. */
function query(ask: LabelAsk, withSize: boolean): string {
  const params = new URLSearchParams();
  if (withSize) params.set('size', ask.size);
  if (ask.net.trim()) params.set('net', ask.net.trim());
  if (ask.packed) params.set('packed', ask.packed);
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** The address of a batch's label content, for the preview. */
export function labelContentUrl(lot: string, ask: LabelAsk): string {
  return `/api/batches/${encodeURIComponent(lot)}/label${query(ask, false)}`;
}

/** The address of a batch's label PDF at the size asked for. */
export function labelPdfUrl(lot: string, ask: LabelAsk): string {
  return `/api/batches/${encodeURIComponent(lot)}/label.pdf${query(ask, true)}`;
}

/** Why the API refuses a size for this product, in its words, by size (none once it can print). */
export function refusedSizes(sizes: readonly LabelSizeView[] = []): ReadonlyMap<string, string> {
  return new Map(sizes.flatMap((view) => (view.refused ? [[view.size, view.refused]] : [])));
}

/**
 * What stops the label printing, in words, or null: a size too small for what this product must
 * carry (as the label's content says), or a 4 × 6 label without the net weight it declares —
 * given by the cook, or worked out by the label itself (one unit of an assembly).
 */
export function labelProblem(
  ask: LabelAsk,
  view?: Pick<ProductLabelView, 'sizes' | 'net'>,
): string | null {
  const refused = refusedSizes(view?.sizes).get(ask.size);
  if (refused) return `${refused}.`;
  if (ask.size === '4x6' && !ask.net.trim() && !view?.net)
    return 'Give the net weight of the package: a 4 × 6 label declares it.';
  return null;
}
