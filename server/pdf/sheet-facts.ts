import { BODY, INK, SMALL, type SheetLayout, type TextStyle } from './sheet-layout.ts';

/** One fact: a label over its value, and a note under it in small print. */
export interface Fact {
  readonly label: string;
  readonly value: string;
  readonly note?: string;
  /** The value in semibold, whatever the grid's default. */
  readonly strong?: boolean;
}

const LABEL: TextStyle = { size: 7, color: INK.muted, weight: 'semibold' };
const NOTE: TextStyle = { size: SMALL, color: INK.muted };
/** Space between a fact and the next, across and down, points. */
const GUTTER = 8;
const ROW_GAP = 3;
/** A note longer than this, in characters, is printed under the grid rather than in its cell. */
const LONG_NOTE = 80;

/** The width a fact needs to print each of its label, value and note on one line, points. */
function naturalWidth(layout: SheetLayout, fact: Fact, value: TextStyle): number {
  return (
    Math.max(
      layout.widthOf(fact.label.toUpperCase(), LABEL),
      layout.widthOf(fact.value, value),
      fact.note ? layout.widthOf(fact.note, NOTE) : 0,
      36,
    ) + GUTTER
  );
}

/**
 * Facts set label over value, side by side, as many to a row as `perRow`: the compact way to
 * print a record's status or a batch's inputs, where a table would spend a line on each. Each
 * fact of a single row takes a share of it by the width of its words, so nothing wraps unless
 * the row is full; several rows line up in equal columns. A row is kept whole on a page.
 * @param options.width the width of the rows, points (the text width by default)
 * @param options.strong values in semibold (figures to work to, not words about the record)
 */
export function factGrid(
  layout: SheetLayout,
  facts: readonly Fact[],
  {
    perRow,
    width = layout.width,
    strong = false,
  }: { perRow: number; width?: number; strong?: boolean },
): void {
  const styleOf = (fact: Fact): TextStyle => ({
    size: BODY,
    ...((fact.strong ?? strong) ? { weight: 'semibold' } : {}),
  });
  // A long note would make its cell a narrow tower: it follows the grid, across the width.
  const long = facts.filter((fact) => (fact.note?.length ?? 0) > LONG_NOTE);
  const shown = facts.map((fact) =>
    (fact.note?.length ?? 0) > LONG_NOTE ? { ...fact, note: 'see below' } : fact,
  );
  // One row shares its width by the facts' words; several rows line up in equal columns.
  const single = shown.length <= perRow;
  for (let start = 0; start < shown.length; start += perRow) {
    const row = shown.slice(start, start + perRow);
    const widths = row.map((fact) => (single ? naturalWidth(layout, fact, styleOf(fact)) : 1));
    const total = single ? widths.reduce((sum, w) => sum + w, 0) : perRow;
    const cells = row.map((fact, i) => {
      const cell = (width * widths[i]) / total;
      const inner = cell - GUTTER;
      const label = layout.measure(fact.label.toUpperCase(), LABEL, inner);
      const value = layout.measure(fact.value, styleOf(fact), inner);
      const note = fact.note ? layout.measure(fact.note, NOTE, inner) : 0;
      return { fact, cell, inner, label, value, height: label + value + note };
    });
    const height = Math.max(...cells.map((c) => c.height));
    layout.ensure(height);
    let x = layout.left;
    for (const { fact, cell, inner, label, value } of cells) {
      layout.draw(fact.label.toUpperCase(), LABEL, x, layout.y, inner);
      layout.draw(fact.value, styleOf(fact), x, layout.y + label, inner);
      if (fact.note) layout.draw(fact.note, NOTE, x, layout.y + label + value, inner);
      x += cell;
    }
    layout.gap(height + ROW_GAP);
  }
  for (const fact of long) {
    const text = `${fact.label}: ${fact.note ?? ''}`;
    const height = layout.measure(text, NOTE, width);
    layout.ensure(height);
    layout.draw(text, NOTE, layout.left, layout.y, width);
    layout.gap(height + ROW_GAP);
  }
}
