import type { ProductLabel } from '../../shared/labels/product-label.ts';
import type { LabelSize } from './label-sizes.ts';
import { drawQrCode, qrMatrix, QUIET_ZONE_MODULES } from './qr-code.ts';
import { finishLabel, openLabel, type PageSize } from './sheet-document.ts';
import { INK, type SheetLayout, type TextStyle } from './sheet-layout.ts';
import { dayInWords } from './sheet-words.ts';

/** Points in an inch (PDF user space). source: ISO 32000-1:2008, 8.3.2.3 (1/72 inch) */
const POINTS_PER_INCH = 72;

const PAGES: Record<LabelSize, PageSize> = {
  '4x6': {
    size: [4 * POINTS_PER_INCH, 6 * POINTS_PER_INCH],
    margins: { top: 14, bottom: 14, left: 14, right: 14 },
  },
  '2x1': {
    size: [2 * POINTS_PER_INCH, 1 * POINTS_PER_INCH],
    margins: { top: 4, bottom: 4, left: 4, right: 4 },
  },
};

/** Smallest and largest size of the ingredient statement on a 4 × 6 label, points. */
const STATEMENT_SIZES = [8.5, 8, 7.5, 7, 6.5, 6] as const;

/** Draws a QR code of a text filling a square of a side, quiet zone included. */
function qr(layout: SheetLayout, text: string, x: number, y: number, side: number): void {
  const module = side / (qrMatrix(text).length + 2 * QUIET_ZONE_MODULES);
  drawQrCode(layout.doc, text, x, y, module);
}

/** Draws a text in the flow and moves past it. */
function line(layout: SheetLayout, text: string, style: TextStyle, after = 2): void {
  layout.y += layout.draw(text, style, layout.left, layout.y, layout.width) + after;
}

/** The kitchen's name and address, at the foot of the label; returns where it starts. */
function kitchenFoot(layout: SheetLayout, label: ProductLabel, bottom: number): number {
  const name = { size: 8.5, weight: 'semibold' } as const;
  const address = { size: 8 } as const;
  const lines = [
    { text: label.kitchen.name, style: name },
    ...(label.kitchen.address ? [{ text: label.kitchen.address, style: address }] : []),
  ];
  const heights = lines.map((l) => layout.measure(l.text, l.style, layout.width));
  let y = bottom - heights.reduce((a, b) => a + b, 0);
  const top = y;
  lines.forEach((l, i) => {
    layout.draw(l.text, l.style, layout.left, y, layout.width);
    y += heights[i];
  });
  return top;
}

/**
 * The 4 × 6 in label: the product's name, the ingredient statement and what it contains, the
 * net weight, the lot code with its QR code beside the packed-on and use-by days, "Keep
 * refrigerated" on a dark band, and the kitchen at the foot. The statement is set as large as
 * the label allows, from 8.5 down to 6 points.
 */
function fourBySix(layout: SheetLayout, label: ProductLabel): void {
  const bottom = layout.doc.page.height - layout.doc.page.margins.bottom;
  const footTop = kitchenFoot(layout, label, bottom);
  line(layout, label.product, { size: 15, weight: 'semibold' }, 6);
  const statement = [label.ingredients.text, label.contains].filter(Boolean) as string[];
  // The block under the statement: net weight, lot and days, the band; about 180 points.
  const below = 22 + 10 + 92 + 8 + 24 + 8;
  const room = footTop - layout.y - below;
  const size =
    STATEMENT_SIZES.find(
      (s) =>
        statement.reduce((h, text) => h + layout.measure(text, { size: s }, layout.width) + 3, 0) <=
        room,
    ) ?? STATEMENT_SIZES[STATEMENT_SIZES.length - 1];
  line(layout, label.ingredients.text, { size }, 3);
  if (label.contains) line(layout, label.contains, { size, weight: 'semibold' }, 3);
  layout.gap(5);
  layout.rule(INK.black, 0.8);
  layout.gap(6);
  if (label.net) line(layout, label.net.text, { size: 14, weight: 'semibold' }, 4);
  layout.rule(INK.black, 0.8);
  layout.gap(8);
  const top = layout.y;
  const side = 84;
  qr(layout, label.lotCode, layout.left - 4, top, side);
  const x = layout.left + side + 4;
  const width = layout.right - x;
  const muted = { size: 8, color: INK.muted } as const;
  const facts: [string, string, number][] = [
    ['Lot', label.lotCode, 14],
    ['Packed on', dayInWords(label.packedOn), 11],
    ['Use by', dayInWords(label.useBy.useBy), 11],
  ];
  let y = top + 2;
  for (const [name, value, size] of facts) {
    y += layout.draw(name, muted, x, y, width);
    y += layout.draw(value, { size, weight: 'semibold' }, x, y, width) + 3;
  }
  layout.y = Math.max(y, top + side) + 8;
  const band = 24;
  layout.doc.rect(layout.left, layout.y, layout.width, band).fillColor(INK.black).fill();
  layout.draw(
    label.handling.toUpperCase(),
    { size: 13, weight: 'semibold', color: INK.white, align: 'center' },
    layout.left,
    layout.y + 5,
    layout.width,
  );
  layout.y += band + 8;
}

/**
 * The 2 × 1 in label, for small packs: only the product's name, the lot code with its QR code,
 * the packed-on and use-by days and the net weight when given. It carries no ingredient
 * statement, allergens or kitchen: a pack this small needs the 4 × 6 label too, or a carton
 * that carries them.
 */
function twoByOne(layout: SheetLayout, label: ProductLabel): void {
  const { height, margins } = layout.doc.page;
  const side = height - margins.top - margins.bottom;
  qr(layout, label.lotCode, layout.left - 3, margins.top, side);
  const x = layout.left + side;
  const width = layout.right - x;
  let y = margins.top;
  const product = [7, 6.5, 6].find(
    (size) => layout.measure(label.product, { size, weight: 'semibold' }, width) <= 2 * size * 1.3,
  );
  y += layout.draw(label.product, { size: product ?? 6, weight: 'semibold' }, x, y, width) + 1;
  y += layout.draw(`Lot ${label.lotCode}`, { size: 8, weight: 'semibold' }, x, y, width) + 1;
  y += layout.draw(`Packed ${dayInWords(label.packedOn)}`, { size: 6 }, x, y, width);
  y += layout.draw(
    `Use by ${dayInWords(label.useBy.useBy)}`,
    { size: 6, weight: 'semibold' },
    x,
    y,
    width,
  );
  if (label.net) layout.draw(label.net.text, { size: 6 }, x, y, width);
}

/**
 * A product label as a one-page PDF at a thermal label's size, in the sheet's fonts, its lot
 * code in words and as a QR code. The safe handling instructions of raw meat and poultry are
 * not printed yet (their text is to be taken word for word from 9 CFR 317.2(l)).
 */
export function renderLabelPdf(label: ProductLabel, size: LabelSize): Promise<Buffer> {
  const layout = openLabel(
    {
      title: label.product,
      subject: `Product label, lot ${label.lotCode}`,
      units: 'us',
      created: label.packedOn,
      lot: label.lotCode,
    },
    PAGES[size],
  );
  if (size === '4x6') fourBySix(layout, label);
  else twoByOne(layout, label);
  return finishLabel(layout);
}
