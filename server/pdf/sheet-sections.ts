import type { PresentedCheck, PresentedFigure, PresentedGroup } from '../../shared/index.ts';
import { OVERALL_FORMULA_TITLE } from '../../shared/calculation/dough/calculate-dough.ts';
import { BODY, INK, SMALL, TICK, type Column, type Row, type SheetLayout } from './sheet-layout.ts';

/** A section heading, kept on a page with at least `keep` points of what follows it. */
export function heading(layout: SheetLayout, text: string, keep = 48): void {
  layout.gap(3);
  layout.ensure(15 + keep);
  layout.draw(
    text.toUpperCase(),
    { weight: 'semibold', size: 10, color: INK.rust },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.gap(12);
  layout.rule(INK.rust, 0.8);
  layout.gap(3.5);
}

/** A heading inside a section (a weigh group, "Figures"). */
export function subheading(layout: SheetLayout, text: string, keep = 40): void {
  layout.gap(4);
  layout.ensure(14 + keep);
  layout.draw(text, { weight: 'semibold', size: BODY + 0.5 }, layout.left, layout.y, layout.width);
  layout.gap(14);
}

/** Label, value and note rows: the batch's inputs, figures to work to. */
export function figureTable(layout: SheetLayout, figures: readonly PresentedFigure[]): void {
  layout.table(
    [{ width: 3.2 }, { width: 1.6, align: 'right' }, { width: 5 }],
    undefined,
    figures.map((f) => ({
      cells: [
        f.label,
        { text: f.value, style: { weight: 'semibold' } },
        { text: f.note ?? '', style: { color: INK.muted, size: SMALL } },
      ],
    })),
  );
}

/**
 * One weigh table: a box to tick, the ingredient, its percentage and the amount; curing-salt
 * lines on a warm band with the words "curing salt" (and, in US units, the grams beside);
 * the total under a rule. The header row repeats when the table runs onto another page.
 */
export function weighTable(layout: SheetLayout, group: PresentedGroup): void {
  const hasPercent = group.lines.some((line) => line.percent !== undefined);
  const hasGrams = group.lines.some((line) => line.gramsShown !== undefined);
  const columns: Column[] = [
    { width: TICK + 14, fixed: true, align: 'center' },
    { width: 6 },
    ...(hasPercent ? [{ width: 3, align: 'right' } as const] : []),
    { width: 2, align: 'right' },
    ...(hasGrams ? [{ width: 2, align: 'right' } as const] : []),
  ];
  const head = { size: SMALL, color: INK.muted };
  const header: Row = {
    cells: [
      { text: '', style: head },
      // The group's title heads the ingredient column: a line saved on a sheet pinned by the work.
      { text: group.title, style: { weight: 'semibold', size: BODY + 0.5 } },
      ...(hasPercent ? [{ text: `% of ${group.percentOf ?? 'total'}`, style: head }] : []),
      { text: 'Weigh', style: head },
      ...(hasGrams ? [{ text: 'in grams', style: head }] : []),
    ],
  };
  // The overall formula of a dough with a preferment is there to read, not to weigh again.
  const weighed = group.title !== OVERALL_FORMULA_TITLE;
  const rows: Row[] = group.lines.map((line) => {
    const salt = line.role === 'curing-salt';
    const tag = [salt ? 'CURING SALT: weigh on a scale that reads 0.1 g' : '', line.note ?? '']
      .filter(Boolean)
      .join(' · ');
    return {
      fill: salt ? INK.rustTint : undefined,
      cells: [
        weighed ? 'tick-box' : '',
        {
          text: line.name,
          sub: tag
            ? {
                text: tag,
                style: {
                  size: SMALL,
                  weight: salt ? 'semibold' : 'regular',
                  color: salt ? INK.rust : INK.muted,
                },
              }
            : undefined,
        },
        ...(hasPercent ? [line.percent ?? ''] : []),
        { text: line.amount, style: { weight: 'semibold', size: BODY + 0.5 } },
        ...(hasGrams
          ? [{ text: line.gramsShown ?? '', style: { weight: 'semibold' } } as const]
          : []),
      ],
    };
  });
  if (group.total) {
    rows.push({
      strong: true,
      ruleAbove: true,
      keepWithPrevious: true,
      cells: [
        '',
        {
          text: `${group.total.label} (total)`,
          sub: group.total.note
            ? {
                text: group.total.note,
                style: { size: SMALL, weight: 'regular', color: INK.muted },
              }
            : undefined,
        },
        ...(hasPercent ? [group.total.percent ?? ''] : []),
        group.total.amount,
        ...(hasGrams ? [''] : []),
      ],
    });
  }
  layout.gap(4);
  layout.table(columns, header, rows, {
    continued: () => subheading(layout, `${group.title} (continued)`, 0),
  });
}

/** Colours of a verdict; the word is always printed too. */
const VERDICT_INK = {
  PASS: { text: INK.pass, fill: INK.passTint },
  WARN: { text: INK.warn, fill: INK.warnTint },
  FAIL: { text: INK.white, fill: INK.fail },
} as const;

const BADGE = 44;

/** The height of one check's block in a width. */
function checkHeight(layout: SheetLayout, check: PresentedCheck, width: number): number {
  const text = width - BADGE - 10;
  return Math.max(
    17,
    layout.measure(checkLabel(check), { weight: 'semibold' }, text) +
      layout.measure(check.sentence, {}, text) +
      layout.measure(`Source: ${check.source}`, { size: SMALL }, text),
  );
}

function checkLabel(check: PresentedCheck): string {
  return `${check.label}${check.critical ? ' · critical limit' : ''}`;
}

/** Draws one check's block at x in a width, from the flow's line, without moving it. */
function drawCheck(layout: SheetLayout, check: PresentedCheck, x: number, width: number): void {
  const text = width - BADGE - 10;
  const ink = VERDICT_INK[check.verdict];
  if (!layout.counting)
    layout.doc.roundedRect(x, layout.y, BADGE, 17, 3).fillColor(ink.fill).fill();
  layout.draw(
    check.verdict,
    { weight: 'semibold', color: ink.text, align: 'center', size: BODY },
    x,
    layout.y + 3.5,
    BADGE,
  );
  let y = layout.y;
  const at = x + BADGE + 10;
  y += layout.draw(checkLabel(check), { weight: 'semibold' }, at, y, text);
  y += layout.draw(check.sentence, {}, at, y, text);
  layout.draw(`Source: ${check.source}`, { size: SMALL, color: INK.muted }, at, y, text);
}

/**
 * Limit checks: PASS, FAIL or WARN in words on a coloured badge, each with its sentence and
 * source; two side by side, a pair kept whole on a page.
 */
export function checkBlocks(layout: SheetLayout, checks: readonly PresentedCheck[]): void {
  const gutter = 16;
  const half = (layout.width - gutter) / 2;
  for (let i = 0; i < checks.length; i += 2) {
    const pair = checks.slice(i, i + 2);
    // A check alone on its row takes the whole width.
    const width = checks.length === 1 ? layout.width : half;
    const height = Math.max(...pair.map((check) => checkHeight(layout, check, width)));
    layout.ensure(height);
    pair.forEach((check, n) => drawCheck(layout, check, layout.left + n * (half + gutter), width));
    layout.gap(height + 5);
  }
}

/** A line to write on after a label: "Weighed by ________". */
function writeOnLine(layout: SheetLayout, label: string, x: number, width: number): void {
  const labelWidth = layout.widthOf(label, {}) + 6;
  layout.draw(label, {}, x, layout.y, labelWidth);
  layout.doc
    .moveTo(x + labelWidth, layout.y + 11)
    .lineTo(x + width, layout.y + 11)
    .lineWidth(0.7)
    .strokeColor(INK.text)
    .stroke();
}

/**
 * The lines a cook and a checker sign on paper ("Weighed by ____ Date ____"), each with a date,
 * kept together at the end of the sheet: side by side, or stacked on the right beside `aside`,
 * a note in small print (how the amounts were rounded). `recorded` is a sign-off already in the
 * record, printed under the lines.
 */
export function signOffLines(
  layout: SheetLayout,
  labels: readonly string[],
  { recorded, aside }: { recorded?: string; aside?: string } = {},
): void {
  const rowHeight = 20;
  const asideWidth = aside ? layout.width * 0.6 : 0;
  const asideStyle = { size: SMALL, color: INK.muted } as const;
  const asideHeight = aside ? layout.measure(aside, asideStyle, asideWidth) : 0;
  // The lines: stacked beside the note, or side by side across the page.
  const x = aside ? layout.left + asideWidth + 20 : layout.left;
  const width = layout.right - x;
  const recordedStyle = { weight: 'semibold', color: INK.pass } as const;
  const recordedHeight = recorded ? layout.measure(recorded, recordedStyle, width) + 2 : 0;
  const linesHeight = (aside ? rowHeight * labels.length : rowHeight) + recordedHeight;
  layout.ensure(Math.max(asideHeight, linesHeight) + 12);
  // The labels say what is signed: a rule sets the lines apart, without a heading.
  layout.gap(6);
  layout.rule(INK.rust, 0.8);
  layout.gap(6);
  const top = layout.y;
  if (aside) layout.draw(aside, asideStyle, layout.left, top, asideWidth);
  const gutter = 24;
  const each = aside ? width : (width - gutter * (labels.length - 1)) / labels.length;
  labels.forEach((label, i) => {
    layout.y = aside ? top + i * rowHeight : top;
    const at = aside ? x : x + i * (each + gutter);
    writeOnLine(layout, label, at, each * 0.62 - 10);
    writeOnLine(layout, 'Date', at + each * 0.62, each * 0.38);
  });
  const linesEnd = top + linesHeight - recordedHeight;
  if (recorded) layout.draw(recorded, recordedStyle, x, linesEnd, width);
  layout.y = top + Math.max(asideHeight, linesHeight) + 4;
}
