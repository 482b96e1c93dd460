import type { SafeHandlingInstructions } from '../../shared/labels/product-label.ts';
import { leastTypeSize } from './label-lettering.ts';
import { drawPicture } from './label-pictures.ts';
import { INK, type SheetLayout, type TextStyle } from './sheet-layout.ts';

/** Room between the border and what is inside it, points (our own). */
const PADDING = 5;
/** Gap between two statements, points (our own). */
const BETWEEN = 3;

/**
 * The type sizes of the instructions: the statements at the least size whose lower-case letters
 * stand 1/16 inch tall (leastTypeSize: 9 points in Fira Sans), the heading 2 points
 * larger and semibold. See SHI_LAYOUT for which rules were read, and where.
 */
export function shiSizes(layout: SheetLayout): { body: TextStyle; heading: TextStyle } {
  const body = leastTypeSize(layout);
  return {
    body: { size: body, color: INK.black },
    heading: { size: body + 2, weight: 'semibold', color: INK.black },
  };
}

/** Layout of the box in a width: the picture's side and the statements' text width. */
function columns(layout: SheetLayout, width: number) {
  const { body } = shiSizes(layout);
  const picture = Math.round((body.size ?? 9) * 2.6);
  const inner = width - 2 * PADDING;
  return { picture, inner, text: inner - picture - 4 };
}

/** The height the instructions take in a width, border and padding included. */
export function shiHeight(
  layout: SheetLayout,
  shi: SafeHandlingInstructions,
  width: number,
): number {
  const { body, heading } = shiSizes(layout);
  const { picture, inner, text } = columns(layout, width);
  let h = PADDING + layout.measure(shi.heading, heading, inner) + 2;
  h += layout.measure(shi.rationale, body, inner) + BETWEEN + 1;
  for (const statement of shi.statements)
    h += Math.max(picture, layout.measure(statement.text, body, text)) + BETWEEN;
  return h - BETWEEN + PADDING;
}

/**
 * Draws the safe handling instructions at (x, y) in a width: a black border round the whole, the
 * heading, the rationale statement, then each statement with its picture on its left, in black
 * on white. Returns the height drawn.
 */
export function drawSafeHandling(
  layout: SheetLayout,
  shi: SafeHandlingInstructions,
  x: number,
  y: number,
  width: number,
): number {
  const { body, heading } = shiSizes(layout);
  const { picture, inner, text } = columns(layout, width);
  const height = shiHeight(layout, shi, width);
  const doc = layout.doc;
  doc.rect(x, y, width, height).fillColor(INK.white).fill();
  doc.rect(x, y, width, height).lineWidth(1).strokeColor(INK.black).stroke();
  const left = x + PADDING;
  let at = y + PADDING;
  at += layout.draw(shi.heading, { ...heading, align: 'center' }, left, at, inner) + 2;
  at += layout.draw(shi.rationale, body, left, at, inner) + BETWEEN;
  doc
    .moveTo(left, at - 1)
    .lineTo(left + inner, at - 1)
    .lineWidth(0.5)
    .strokeColor(INK.black)
    .stroke();
  at += 1;
  for (const statement of shi.statements) {
    const textHeight = layout.measure(statement.text, body, text);
    const row = Math.max(picture, textHeight);
    drawPicture(doc, statement.picture, left, at + (row - picture) / 2, picture, INK.black);
    layout.draw(statement.text, body, left + picture + 4, at + (row - textHeight) / 2, text);
    at += row + BETWEEN;
  }
  return height;
}
