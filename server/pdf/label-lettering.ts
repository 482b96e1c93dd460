import { LEAST_LETTER_POINTS } from '../../shared/labels/label-lettering.ts';
import type { SheetLayout } from './sheet-layout.ts';

/**
 * The x-height of the sheet's regular font as a share of its size, as pdfkit reads it from the
 * font (Fira Sans: 527 thousandths of an em); 0.5 if it cannot be read.
 */
function xHeightShare(layout: SheetLayout): number {
  const font = (layout.doc as unknown as { _font?: { xHeight?: number } })._font;
  return font?.xHeight ? font.xHeight / 1000 : 0.5;
}

/**
 * The least type size, points, whose lower-case letters stand 1/16 inch tall in the label's
 * font, rounded up to half a point: 4.5 ÷ 0.527 = 8.54, so 9 points of Fira Sans. Every word a
 * label must carry is set at least this large (shared/labels/label-lettering.ts says which rules
 * ask it, and where they were read).
 */
export function leastTypeSize(layout: SheetLayout): number {
  return Math.ceil((LEAST_LETTER_POINTS / xHeightShare(layout)) * 2) / 2;
}
