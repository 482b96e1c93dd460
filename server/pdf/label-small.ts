import type { ProductLabel } from '../../shared/labels/product-label.ts';
import { drawQrCode, qrMatrix, QUIET_ZONE_MODULES } from './qr-code.ts';
import { INK, type SheetLayout } from './sheet-layout.ts';
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
 * The 2 × 1 in label, for small packs, in a box (the page of a thermal label, or a cell of a
 * sheet): the product's name, the lot code with its QR code, the packed-on day, the use-by day
 * when it has one, and the net weight when given (the words' sources: factsOf in label-pdf.ts;
 * "Packed" is "Packed on" shortened, our own). It carries no ingredient statement, allergens or
 * kitchen: it goes on a pack that carries the 4 × 6 label or a carton that does. It has no room
 * for the safe handling instructions, so a product that must carry them is not printed on it
 * (shared/labels/label-sizes.ts). Its words are set at 6 to 8 points, under the 1/16 inch least of
 * the words a label must carry (shared/labels/label-lettering.ts): it is not that label, but a
 * mark of the lot and days on a pack that, or whose carton, carries the 4 × 6 label.
 */
export function smallLabel(layout: SheetLayout, label: ProductLabel, box: Box, inset = 4): void {
  const side = box.height - 2 * inset;
  // The QR code's own quiet zone is margin enough on the left.
  labelQr(layout, label.lotCode, box.x + 1, box.y + inset, side);
  const x = box.x + side + 2;
  const width = box.x + box.width - inset - x;
  let y = box.y + inset;
  const product = [7, 6.5, 6].find(
    (size) => layout.measure(label.product, { size, weight: 'semibold' }, width) <= 2 * size * 1.3,
  );
  y += layout.draw(label.product, { size: product ?? 6, weight: 'semibold' }, x, y, width) + 1;
  y += layout.draw(`Lot ${label.lotCode}`, { size: 8, weight: 'semibold' }, x, y, width) + 1;
  y += layout.draw(`Packed ${dayInWords(label.packedOn)}`, { size: 6 }, x, y, width);
  if (label.useBy.mark)
    y += layout.draw(
      `Use by ${dayInWords(label.useBy.mark.useBy)}`,
      { size: 6, weight: 'semibold' },
      x,
      y,
      width,
    );
  if (label.net) layout.draw(label.net.text, { size: 6 }, x, y, width);
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
 * Draws a sheet of identical small labels, the grid centred on the paper, each cell outlined in
 * a light rule to cut along, with a line in the top margin saying how many labels the sheet holds.
 */
export function labelSheet(layout: SheetLayout, label: ProductLabel, grid: SheetGrid): void {
  const [paperWidth, paperHeight] = grid.paper;
  const left = (paperWidth - grid.columns * CELL.width) / 2;
  const top = (paperHeight - grid.rows * CELL.height) / 2;
  const count = grid.columns * grid.rows;
  layout.draw(
    `${count} labels, 2 × 1 in (${grid.columns} across, ${grid.rows} down) · lot ${label.lotCode}`,
    { size: 7, color: INK.muted },
    left,
    Math.max(4, top - 12),
    grid.columns * CELL.width,
  );
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
