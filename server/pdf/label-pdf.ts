import type { ProductLabel } from '../../shared/labels/product-label.ts';
import { SHORTEN_ADDRESS_WORDS, TOO_FULL_WORDS } from '../../shared/labels/label-lettering.ts';
import { leastTypeSize } from './label-lettering.ts';
import { STICKER_GOES_WITH, STICKER_WORDS } from '../../shared/labels/lot-date-sticker.ts';
import { drawSafeHandling, shiHeight } from './label-safe-handling.ts';
import { labelSizeRefusal, type LabelSize } from '../../shared/labels/label-sizes.ts';
import { CELL, labelQr, labelSheet, smallLabel, type SheetGrid } from './label-small.ts';
import { finishLabel, openLabel, type PageSize } from './sheet-document.ts';
import { INK, type SheetLayout, type TextStyle } from './sheet-layout.ts';
import { dayInWords } from './sheet-words.ts';

/** Points in an inch (PDF user space). source: ISO 32000-1:2008, 8.3.2.3 (1/72 inch) */
const POINTS_PER_INCH = 72;
/** Points in a millimetre. source: ISO 32000-1:2008, 8.3.2.3, with 1 in = 25.4 mm (NIST SP 811, B.8) */
const POINTS_PER_MM = POINTS_PER_INCH / 25.4;

/**
 * Small labels on a sheet. Letter paper, 8.5 × 11 in (ANSI/ASME Y14.1, from memory): 4 × 10 cells
 * of 2 × 1 in leave 1/4 in at the sides and 1/2 in at the top and bottom. A4, 210 × 297 mm
 * (ISO 216): 3 × 11 cells; a fourth column would leave 3.4 mm at the sides, less than most
 * printers can print to (common practice, no source).
 */
const SHEETS: Readonly<Record<'letter' | 'a4', SheetGrid>> = {
  letter: { paper: [8.5 * POINTS_PER_INCH, 11 * POINTS_PER_INCH], columns: 4, rows: 10 },
  a4: { paper: [210 * POINTS_PER_MM, 297 * POINTS_PER_MM], columns: 3, rows: 11 },
};

const PAGES: Record<LabelSize, PageSize> = {
  '4x6': {
    size: [4 * POINTS_PER_INCH, 6 * POINTS_PER_INCH],
    margins: { top: 14, bottom: 14, left: 14, right: 14 },
  },
  '2x1': { size: [CELL.width, CELL.height], margins: { top: 4, bottom: 4, left: 4, right: 4 } },
  letter: { size: SHEETS.letter.paper, margins: { top: 4, bottom: 4, left: 4, right: 4 } },
  a4: { size: SHEETS.a4.paper, margins: { top: 4, bottom: 4, left: 4, right: 4 } },
};

/**
 * A label whose content does not fit its size, or a size too small for what the product must
 * carry; the route answers it in words, knowing it by its
 * name (the route does not load pdfkit to compare classes).
 */
export class LabelTooFullError extends Error {
  override readonly name = 'LabelTooFullError';
}

/** Draws a text in the flow and moves past it. */
function line(layout: SheetLayout, text: string, style: TextStyle, after = 2): void {
  layout.y += layout.draw(text, style, layout.left, layout.y, layout.width) + after;
}

/** One line or block of text and how it is set. */
type Fact = readonly [string, TextStyle];

/** The height of lines set one under the other in a width. */
function heightOf(layout: SheetLayout, lines: readonly Fact[], width: number, gap = 0): number {
  return lines.reduce((h, [text, style]) => h + layout.measure(text, style, width) + gap, 0);
}

/** The kitchen's name and address at the foot of the label: their height and how to draw them. */
interface KitchenFoot {
  readonly height: number;
  /** How much lower the foot would be with the address on the name's line, points. */
  readonly oneLineSaves: number;
  draw(y: number): void;
}

/**
 * The kitchen's name and address, for the foot of the label, at the least lettering allowed: on
 * one line when they fit it, the name in semibold, else the address on a line of its own.
 * source: 9 CFR 317.2(c)(3), "The name and place of business of the manufacturer, packer, or
 * distributor for whom the product is prepared" (read at foodcompliance.com)
 */
function kitchenFoot(layout: SheetLayout, label: ProductLabel, least: number): KitchenFoot {
  const { name, address } = label.kitchen;
  const named: TextStyle = { size: least, weight: 'semibold' };
  const placed: TextStyle = { size: least };
  const line = layout.measure(name, named, layout.width);
  const after = layout.widthOf(name, named) + least * 0.75;
  if (!address || after + layout.widthOf(address, placed) <= layout.width)
    return {
      height: line,
      oneLineSaves: 0,
      draw: (y) => {
        layout.draw(name, named, layout.left, y, layout.width);
        if (address) layout.draw(address, placed, layout.left + after, y, layout.width - after);
      },
    };
  const nameHeight = layout.measure(name, named, layout.width);
  const height = nameHeight + layout.measure(address, placed, layout.width);
  return {
    height,
    oneLineSaves: height - line,
    draw: (y) => {
      layout.draw(name, named, layout.left, y, layout.width);
      layout.draw(address, placed, layout.left, y + nameHeight, layout.width);
    },
  };
}

/**
 * The net weight, the lot, the packed-on and use-by days, each on a line of its own. Where each
 * fixed word comes from: "Net wt" — 9 CFR 317.2(h) and 21 CFR 101.105(a), from memory (see
 * shared/labels/net-weight.ts); "Use by" — the Food Code asks for "the date or day by which the
 * food shall be consumed on the premises, sold, or discarded" (FDA Food Code 2022, 3-501.17(A),
 * read as quoted in shared/labels/date-mark.ts) and names no words for the label, so "Use by" is
 * common practice, no source; "Lot" and "Packed on" — common practice, no source (a lot code and
 * a packing date are what a recall asks for, FSIS Directive 8080.1, from memory). Every size is
 * above the least lettering allowed (9 points in the shipped font).
 */
function factsOf(label: ProductLabel): Fact[] {
  return [
    ...(label.net ? [[label.net.text, { size: 13, weight: 'semibold' }] as Fact] : []),
    [`Lot ${label.lotCode}`, { size: 12, weight: 'semibold' }],
    [`Packed on ${dayInWords(label.packedOn)}`, { size: 9.5 }],
    ...(label.useBy.mark
      ? [[`Use by ${dayInWords(label.useBy.mark.useBy)}`, { size: 11, weight: 'semibold' }] as Fact]
      : []),
  ];
}

/** Gap under each fact, points (our own). */
const FACT_GAP = 3;
/** Gap under each paragraph of the statement, points (our own). */
const STATEMENT_GAP = 3;

/**
 * Why the 4 × 6 label cannot hold a label's content, in a cook's words, and what to do when
 * something can be done: the kitchen's address on the name's line, when that would make room.
 * @param short how much more room the statement needs, points
 */
function tooFullWords(foot: KitchenFoot, short: number): string {
  return foot.oneLineSaves >= short
    ? `${TOO_FULL_WORDS}: ${SHORTEN_ADDRESS_WORDS}`
    : TOO_FULL_WORDS;
}

/**
 * The 4 × 6 in label: the product's name, the ingredient statement and what it contains, then
 * the net weight, the lot code, the packed-on and use-by days beside the lot's QR code, the keep
 * statement on a dark band, the safe handling instructions in their box when the product needs
 * them, and the kitchen at the foot. No word the label must carry is set with lower-case letters
 * under 1/16 inch (leastTypeSize): the statement is set as large as the label allows, from one
 * point above that size down to it, and a label whose content does not fit even so is refused,
 * never set smaller.
 */
function fourBySix(layout: SheetLayout, label: ProductLabel): void {
  const least = leastTypeSize(layout);
  const bottom = layout.doc.page.height - layout.doc.page.margins.bottom;
  const foot = kitchenFoot(layout, label, least);
  const footTop = bottom - foot.height;
  let floor = footTop - 5;
  const shi = label.instructions && shiHeight(layout, label.instructions, layout.width);
  if (shi) floor -= shi + 5;
  const title: Fact = [label.product, { size: 15, weight: 'semibold' }];
  const side = label.instructions ? 64 : 84;
  const facts = factsOf(label);
  const factsWidth = layout.width - side;
  const band = label.handling ? 18 : 0;
  // Under the statement: the rule, the block beside the QR code, and the band.
  const below =
    9 + Math.max(side, heightOf(layout, facts, factsWidth, FACT_GAP)) + (band ? 6 + band : 0);
  const statement = [label.ingredients.text, label.contains].filter(Boolean) as string[];
  const room = floor - layout.y - heightOf(layout, [title], layout.width) - 4 - below;
  const statementAt = (size: number) =>
    heightOf(
      layout,
      statement.map((text): Fact => [text, { size }]),
      layout.width,
      STATEMENT_GAP,
    );
  const size = [least + 1, least + 0.5, least].find((s) => statementAt(s) <= room);
  if (size === undefined)
    throw new LabelTooFullError(tooFullWords(foot, statementAt(least) - room));
  foot.draw(footTop);
  if (shi && label.instructions)
    drawSafeHandling(layout, label.instructions, layout.left, floor, layout.width);
  line(layout, title[0], title[1], 4);
  line(layout, label.ingredients.text, { size }, STATEMENT_GAP);
  if (label.contains) line(layout, label.contains, { size, weight: 'semibold' }, STATEMENT_GAP);
  layout.gap(3);
  layout.rule(INK.black, 0.8);
  layout.gap(6);
  const top = layout.y;
  let y = top;
  for (const [text, style] of facts)
    y += layout.draw(text, style, layout.left, y, factsWidth) + FACT_GAP;
  // The QR code's quiet zone is its own margin on the right. The code is not a word the label
  // must carry: the lot code is printed beside it in words.
  labelQr(layout, label.lotCode, layout.right - side + 4, top - 4, side);
  layout.y = Math.max(y, top + side - 4) + 6;
  if (label.handling) {
    layout.doc.rect(layout.left, layout.y, layout.width, band).fillColor(INK.black).fill();
    layout.draw(
      label.handling.toUpperCase(),
      { size: 12, weight: 'semibold', color: INK.white, align: 'center' },
      layout.left,
      layout.y + 3,
      layout.width,
    );
  }
}

/**
 * A product label as a PDF in the sheet's fonts (Fira Sans, shipped with the console), its lot
 * code in words and as a QR code: one page at a thermal label's size, the 4 × 6 in product label
 * or the 2 × 1 in lot and date sticker (label-small.ts), or a letter or A4 sheet of the sticker.
 * @throws LabelTooFullError when the 4 × 6 label or the sticker cannot hold its content at the
 *   least lettering allowed, or a sticker is asked for a product that must carry the safe handling
 *   instructions
 */
export async function renderLabelPdf(label: ProductLabel, size: LabelSize): Promise<Buffer> {
  const refusal = labelSizeRefusal(size, label.safeHandling.required);
  if (refusal) throw new LabelTooFullError(refusal);
  const layout = openLabel(
    {
      title: label.product,
      subject:
        size === '4x6'
          ? `Product label, lot ${label.lotCode}`
          : `${STICKER_WORDS.charAt(0).toUpperCase()}${STICKER_WORDS.slice(1)}, lot ${label.lotCode}. ${STICKER_GOES_WITH}.`,
      units: size === 'a4' ? 'metric' : 'us',
      created: label.packedOn,
      lot: label.lotCode,
    },
    PAGES[size],
  );
  if (size === '4x6') fourBySix(layout, label);
  else if (size === '2x1') smallLabel(layout, label, { x: 0, y: 0, ...CELL });
  else labelSheet(layout, label, SHEETS[size]);
  return finishLabel(layout);
}
