// Lists on a sheet: bulleted (cautions) and numbered (a formula's steps), in two columns where
// that saves lines.
import { BODY, INK, SMALL, type SheetLayout } from './sheet-layout.ts';

const sum = (list: readonly number[]): number => list.reduce((total, h) => total + h, 0);

const BULLET_INDENT = 10;
const BULLET_GAP = 3;
/** A list's text: a little under the body size, never under 8.5 pt. */
const BULLET_STYLE = { size: BODY - 0.5 } as const;
const SOURCE_STYLE = { size: SMALL, color: INK.muted } as const;

type Bullet = { readonly text: string; readonly source?: string };

/**
 * Where a bullet's source goes: on the text's last line when it fits after it (returned: that
 * line's top and where the source starts), or under the text (undefined).
 */
function runIn(
  layout: SheetLayout,
  item: Bullet,
  width: number,
): { top: number; x: number } | undefined {
  if (!item.source) return undefined;
  const last = layout.lastLine(item.text, BULLET_STYLE, width);
  if (!last) return undefined;
  const x = last.width + 8;
  return x + layout.widthOf(sourceWords(item.source), SOURCE_STYLE) <= width
    ? { top: last.top, x }
    : undefined;
}

const sourceWords = (source: string): string => `Source: ${source}`;

/** The height of a bullet's text and source in a column's width. */
function bulletHeight(layout: SheetLayout, item: Bullet, width: number): number {
  const text = width - BULLET_INDENT;
  const under = item.source && !runIn(layout, item, text);
  return (
    layout.measure(item.text, BULLET_STYLE, text) +
    (under ? layout.measure(sourceWords(item.source ?? ''), SOURCE_STYLE, text) : 0) +
    BULLET_GAP
  );
}

/**
 * Draws one bullet at x in a column's width, from the flow's line; moves past it. Its source
 * follows on the text's last line when it fits there, to save a line.
 */
function drawBullet(layout: SheetLayout, item: Bullet, x: number, width: number): void {
  const text = width - BULLET_INDENT;
  const at = x + BULLET_INDENT;
  const inline = runIn(layout, item, text);
  layout.draw('•', { color: INK.rust }, x + 1, layout.y, BULLET_INDENT);
  const top = layout.y;
  layout.y += layout.draw(item.text, BULLET_STYLE, at, layout.y, text);
  if (item.source && inline) {
    const source = sourceWords(item.source);
    layout.draw(source, SOURCE_STYLE, at + inline.x, top + inline.top + 0.6, text - inline.x);
  } else if (item.source) {
    layout.y += layout.draw(sourceWords(item.source), SOURCE_STYLE, at, layout.y, text);
  }
  layout.gap(BULLET_GAP);
}

/** Where a list is best split into two columns: the first item of the second. */
function balancedSplit(heights: readonly number[]): number {
  const total = heights.reduce((sum, h) => sum + h, 0);
  let best = heights.length;
  let tallest = total;
  let first = 0;
  heights.forEach((height, i) => {
    first += height;
    const taller = Math.max(first, total - first);
    if (taller < tallest) [best, tallest] = [i + 1, taller];
  });
  return best;
}

/**
 * A bulleted list, each item kept whole; `source` is printed under the text, in grey. With
 * `columns: 2`, a list that fits the rest of the page is set in two balanced columns: short
 * items then leave less of each line empty. A list too long for that runs down the page.
 */
export function bulletList(
  layout: SheetLayout,
  items: readonly Bullet[],
  { columns = 1 }: { columns?: 1 | 2 } = {},
): void {
  if (columns === 2 && items.length > 1) {
    const gutter = 14;
    const width = (layout.width - gutter) / 2;
    const heights = items.map((item) => bulletHeight(layout, item, width));
    const split = balancedSplit(heights);
    const tallest = Math.max(sum(heights.slice(0, split)), sum(heights.slice(split)));
    if (tallest <= layout.room) {
      const top = layout.y;
      items.slice(0, split).forEach((item) => drawBullet(layout, item, layout.left, width));
      layout.y = top;
      const x = layout.left + width + gutter;
      items.slice(split).forEach((item) => drawBullet(layout, item, x, width));
      layout.y = top + tallest;
      return;
    }
  }
  for (const item of items) {
    layout.ensure(bulletHeight(layout, item, layout.width) - BULLET_GAP);
    drawBullet(layout, item, layout.left, layout.width);
  }
}

const STEP_INDENT = 20;
const STEP_GAP = 1;

/**
 * The formula's steps, numbered. Short steps are set in two balanced columns (read down the
 * first, then the second) when that saves lines and fits the rest of the page.
 */
export function numberedSteps(layout: SheetLayout, steps: readonly string[]): void {
  const gutter = 16;
  const half = (layout.width - gutter) / 2;
  const stepHeight = (text: string, width: number): number =>
    layout.measure(text, {}, width - STEP_INDENT) + STEP_GAP;
  const drawStep = (text: string, i: number, x: number, width: number): void => {
    layout.draw(`${i + 1}.`, { weight: 'semibold', color: INK.rust }, x, layout.y, 18);
    layout.y += layout.draw(text, {}, x + STEP_INDENT, layout.y, width - STEP_INDENT) + STEP_GAP;
  };
  const whole = steps.reduce((total, text) => total + stepHeight(text, layout.width), 0);
  const heights = steps.map((text) => stepHeight(text, half));
  const split = balancedSplit(heights);
  const tallest = Math.max(sum(heights.slice(0, split)), sum(heights.slice(split)));
  if (steps.length > 1 && tallest < whole && tallest <= layout.room) {
    const top = layout.y;
    steps.slice(0, split).forEach((text, i) => drawStep(text, i, layout.left, half));
    layout.y = top;
    const x = layout.left + half + gutter;
    steps.slice(split).forEach((text, i) => drawStep(text, split + i, x, half));
    layout.y = top + tallest;
    return;
  }
  steps.forEach((text, i) => {
    layout.ensure(stepHeight(text, layout.width) - STEP_GAP);
    drawStep(text, i, layout.left, layout.width);
  });
}
