import type { ProductLabel } from '../../shared/labels/product-label.ts';
import {
  STICKER_GOES_WITH,
  STICKER_TOO_FULL_WORDS,
  STICKER_WORDS,
} from '../../shared/labels/lot-date-sticker.ts';
import { leastTypeSize } from './label-lettering.ts';
import { drawQrCode, qrMatrix, QUIET_ZONE_MODULES } from './qr-code.ts';
import { LINE_GAP } from './sheet-measure.ts';
import { INK, type SheetLayout, type TextStyle } from './sheet-layout.ts';
import { dayInWords } from './sheet-words.ts';

/** A rectangle on the page, points from the top left. */
export interface Box {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/** Draws a QR code of a text filling a square of a side, quiet zone included. */
export function labelQr(
  layout: SheetLayout,
  text: string,
  x: number,
  y: number,
  side: number,
): void {
  const module = side / (qrMatrix(text).length + 2 * QUIET_ZONE_MODULES);
  drawQrCode(layout.doc, text, x, y, module);
}

/**
 * A sticker whose words do not fit its 2 × 1 in at the least lettering allowed; the route knows
 * it by its name, as it knows the 4 × 6 label's (label-pdf.ts).
 */
export class StickerTooFullError extends Error {
  override readonly name = 'LabelTooFullError';
}

/**
 * Space kept inside a sticker's edge, points: 4 at the sides, 3 at the top and foot (about 1 mm,
 * what a label printer's registration wanders by; common practice, no source). Six lines of 9
 * point type set solid fill the height that leaves.
 */
const INSET = { side: 4, end: 3 } as const;

/**
 * The least module of the QR code, points: 0.4 mm, as small as a phone's camera reads at a hand's
 * distance (common practice, no source). 72 points to the inch, 25.4 mm to the inch.
 * source: ISO 32000-1:2008, 8.3.2.3; NIST SP 811 (2008), B.8
 */
const LEAST_QR_MODULE = (0.4 * 72) / 25.4;

/**
 * The sticker's lines, top to bottom, each at the least lettering or, for the lot and use-by,
 * in semibold at it. The words are the 4 × 6 label's (label-pdf.ts, factsOf, names their
 * sources); the keep statement is the formula's, as the 4 × 6 label's band says it.
 */
function stickerLines(label: ProductLabel, least: number): [string, TextStyle][] {
  const strong: TextStyle = { size: least, weight: 'semibold' };
  return [
    [label.product, strong],
    [`Lot ${label.lotCode}`, strong],
    [`Packed on ${dayInWords(label.packedOn)}`, { size: least }],
    ...(label.useBy.mark
      ? [[`Use by ${dayInWords(label.useBy.mark.useBy)}`, strong] as [string, TextStyle]]
      : []),
    ...(label.handling ? [[label.handling, { size: least }] as [string, TextStyle]] : []),
  ];
}

/**
 * The lot and date sticker, 2 × 1 in, in a box (the page of a thermal label, or a cell of a
 * sheet): the product's name, the lot, the packed-on day, the use-by day when it has one and the
 * keep statement when the formula sets one, every word at the least lettering the rules allow
 * (leastTypeSize: 9 points of the shipped font), the lines set solid. It is not the package label
 * (shared/labels/lot-date-sticker.ts says why): no ingredients, allergens, net weight or kitchen.
 * The lot's QR code goes beside the lines under the name when they leave room for one with modules
 * of at least 0.4 mm; it is not a word the sticker must carry, the lot is printed in words.
 * @throws LabelTooFullError (StickerTooFullError) when the words do not fit at that size; they are
 *   never set smaller
 */
export function smallLabel(layout: SheetLayout, label: ProductLabel, box: Box): void {
  const least = leastTypeSize(layout);
  const x = box.x + INSET.side;
  const width = box.width - 2 * INSET.side;
  const room = box.height - 2 * INSET.end;
  // Set solid: a line's own height, without the gap under it (sheet-measure.ts).
  const solid = ([text, style]: [string, TextStyle]) =>
    layout.measure(text, style, width) - LINE_GAP;
  const [name, ...facts] = stickerLines(label, least);
  const nameHeight = solid(name);
  const factsHeight = facts.reduce((sum, fact) => sum + solid(fact), 0);
  if (nameHeight + factsHeight > room) throw new StickerTooFullError(STICKER_TOO_FULL_WORDS);
  let y = box.y + INSET.end;
  for (const line of [name, ...facts]) {
    layout.draw(line[0], line[1], x, y, width);
    y += solid(line);
  }
  const widest = Math.max(...facts.map(([text, style]) => layout.widthOf(text, style)));
  const side = Math.min(room - nameHeight, width - widest - 2);
  const modules = qrMatrix(label.lotCode).length + 2 * QUIET_ZONE_MODULES;
  // The code's own quiet zone is its margin from the words and the edge.
  if (side >= modules * LEAST_QR_MODULE)
    labelQr(layout, label.lotCode, x + width - side, box.y + box.height - INSET.end - side, side);
}

/** A sheet of small labels: its paper, points, and its grid of 2 × 1 in cells. */
export interface SheetGrid {
  readonly paper: readonly [number, number];
  readonly columns: number;
  readonly rows: number;
}

/** The small label's cell, points: 2 × 1 in at 72 points to the inch. source: ISO 32000-1:2008, 8.3.2.3 */
export const CELL = { width: 144, height: 72 } as const;

/**
 * Draws a sheet of identical lot and date stickers, the grid centred on the paper, each cell
 * outlined in a light rule to cut along, with a line in the top margin saying how many stickers
 * the sheet holds and that they go with the full label, at the stickers' own least lettering.
 * @throws LabelTooFullError when the sticker's words do not fit it
 */
export function labelSheet(layout: SheetLayout, label: ProductLabel, grid: SheetGrid): void {
  const [paperWidth, paperHeight] = grid.paper;
  const left = (paperWidth - grid.columns * CELL.width) / 2;
  const top = (paperHeight - grid.rows * CELL.height) / 2;
  const count = grid.columns * grid.rows;
  const head = `${count} ${STICKER_WORDS}s, 2 × 1 in, lot ${label.lotCode}. ${STICKER_GOES_WITH}.`;
  const style: TextStyle = { size: leastTypeSize(layout), color: INK.muted };
  const width = grid.columns * CELL.width;
  layout.draw(head, style, left, Math.max(4, top - layout.measure(head, style, width)), width);
  for (let row = 0; row < grid.rows; row++) {
    for (let column = 0; column < grid.columns; column++) {
      const box = {
        x: left + column * CELL.width,
        y: top + row * CELL.height,
        ...CELL,
      };
      layout.doc
        .rect(box.x, box.y, box.width, box.height)
        .lineWidth(0.3)
        .strokeColor(INK.rule)
        .stroke();
      smallLabel(layout, label, box);
    }
  }
}
