import type { PresentedCheck, PresentedFigure, PresentedGroup } from '../../shared/index.ts';
import { OVERALL_FORMULA_TITLE } from '../../shared/calculation/dough/calculate-dough.ts';
import { BODY, INK, SMALL, TICK, type Column, type Row, type SheetLayout } from './sheet-layout.ts';

/** A section heading, kept on a page with at least `keep` points of what follows it. */
export function heading(layout: SheetLayout, text: string, keep = 48): void {
  layout.gap(8);
  layout.ensure(22 + keep);
  layout.draw(
    text.toUpperCase(),
    { weight: 'semibold', size: 10.5, color: INK.rust },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.gap(15);
  layout.rule(INK.rust, 0.8);
  layout.gap(7);
}

/** A heading inside a section (a weigh group, "Figures"). */
export function subheading(layout: SheetLayout, text: string, keep = 40): void {
  layout.gap(6);
  layout.ensure(16 + keep);
  layout.draw(text, { weight: 'semibold', size: BODY + 0.5 }, layout.left, layout.y, layout.width);
  layout.gap(16);
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
      { text: 'Ingredient', style: head },
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
  subheading(layout, group.title, 60);
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

/** One limit check: PASS, FAIL or WARN in words on a coloured badge, its sentence and source. */
export function checkBlock(layout: SheetLayout, check: PresentedCheck): void {
  const badge = 44;
  const x = layout.left + badge + 10;
  const width = layout.right - x;
  const label = `${check.label}${check.critical ? ' · critical limit' : ''}`;
  const source = `Source: ${check.source}`;
  const height =
    layout.measure(label, { weight: 'semibold' }, width) +
    layout.measure(check.sentence, {}, width) +
    layout.measure(source, { size: SMALL }, width) +
    4;
  layout.ensure(height);
  const ink = VERDICT_INK[check.verdict];
  layout.doc.roundedRect(layout.left, layout.y, badge, 17, 3).fillColor(ink.fill).fill();
  layout.draw(
    check.verdict,
    { weight: 'semibold', color: ink.text, align: 'center', size: BODY },
    layout.left,
    layout.y + 3.5,
    badge,
  );
  let y = layout.y;
  y += layout.draw(label, { weight: 'semibold' }, x, y, width);
  y += layout.draw(check.sentence, {}, x, y, width);
  y += layout.draw(source, { size: SMALL, color: INK.muted }, x, y, width);
  layout.y = Math.max(y, layout.y + 17) + 8;
}

/** A bulleted list, each item kept whole; `source` is printed after the text, in grey. */
export function bulletList(
  layout: SheetLayout,
  items: readonly { readonly text: string; readonly source?: string }[],
): void {
  const indent = 12;
  for (const item of items) {
    const width = layout.width - indent;
    const source = item.source ? `Source: ${item.source}` : '';
    const sourceStyle = { size: SMALL, color: INK.muted };
    layout.ensure(
      layout.measure(item.text, {}, width) +
        (source ? layout.measure(source, sourceStyle, width) : 0),
    );
    layout.draw('•', { color: INK.rust }, layout.left + 2, layout.y, indent);
    layout.y += layout.draw(item.text, {}, layout.left + indent, layout.y, width);
    if (source) layout.y += layout.draw(source, sourceStyle, layout.left + indent, layout.y, width);
    layout.gap(4);
  }
}

/** A line to write on after a label: "Weighed by ________". */
function writeOnLine(layout: SheetLayout, label: string, x: number, width: number): void {
  const labelWidth = layout.doc.widthOfString(label) + 6;
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
 * kept together at the end of the sheet; `recorded` is a sign-off already in the record.
 */
export function signOffLines(
  layout: SheetLayout,
  labels: readonly string[],
  recorded?: string,
): void {
  const rowHeight = 30;
  layout.ensure(rowHeight * labels.length + 40 + (recorded ? 20 : 0));
  heading(layout, 'Sign-off', 0);
  const nameWidth = layout.width * 0.62;
  for (const label of labels) {
    layout.gap(8);
    writeOnLine(layout, label, layout.left, nameWidth - 16);
    writeOnLine(layout, 'Date', layout.left + nameWidth, layout.width - nameWidth);
    layout.gap(rowHeight - 8);
  }
  if (recorded) layout.paragraph(recorded, { weight: 'semibold', color: INK.pass });
}
