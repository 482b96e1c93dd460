/**
 * The lot and date sticker: what the small labels (2 × 1 in, alone or on a letter or A4 sheet)
 * carry. A product label's whole content does not fit 2 square inches at the least lettering the
 * rules allow (label-lettering.ts): the 4 × 6 label sets the ingredient statement alone in
 * several lines of 9 point type across 4 inches, where a 2 × 1 in label holds five or six short
 * lines. So a small label does not claim to be the package label. It is a sticker for the inner
 * packs of a carton, or a pack that also carries the 4 × 6 label, as kitchens mark inner packs with
 * a small date and lot sticker under a full label on the outer (common practice, no source): the
 * product's name, the lot, the packed-on and use-by days and the keep statement, every word at
 * that least lettering, and the lot's QR code only where room is left.
 */

/** What the small labels are called, in a cook's words. */
export const STICKER_WORDS = 'lot and date sticker';

/** What a sticker goes with, in a cook's words: it is not the package label. */
export const STICKER_GOES_WITH = 'Goes with the full label on the pack or carton';

/** Why a sticker is refused, in a cook's words: its words do not fit at the least lettering. */
export const STICKER_TOO_FULL_WORDS =
  "the product's name, lot and days do not fit on a 2 × 1 in lot and date sticker with " +
  'letters no smaller than the labelling rules allow (1/16 in)';
