import type { PresentedPlan, PresentedPlanBatch } from '../../shared/index.ts';
import { batchBody } from './batch-sheet-pdf.ts';
import { finishSheet, openSheet } from './sheet-document.ts';
import { INK, SMALL, TICK, type SheetLayout } from './sheet-layout.ts';
import { bulletList } from './sheet-lists.ts';
import { heading, signOffLines, subheading } from './sheet-sections.ts';
import { optionsInWords } from '../../shared/presentation/option-words.ts';
import { dayInWords, kindWords } from './sheet-words.ts';

/** "Smokehouse burger × 120" */
function planTitle(plan: PresentedPlan): string {
  return `${plan.assembly.title} × ${plan.count}`;
}

/** Each formula of the plan by its title, from its id: the pull list names formulas by id. */
function titleOf(plan: PresentedPlan): (id: string) => string {
  const titles = new Map(plan.batches.map((b) => [b.formula.id, b.formula.title]));
  return (id) => titles.get(id) ?? id;
}

/** The small rust label over a page's title, the title, a muted line under it and a rule. */
export function pageHead(layout: SheetLayout, label: string, title: string, line: string): void {
  layout.draw(
    label,
    { size: 7.5, weight: 'semibold', color: INK.rust },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.gap(13);
  layout.y += layout.draw(
    title,
    { size: 18, weight: 'semibold' },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.y +=
    layout.draw(line, { size: SMALL, color: INK.muted }, layout.left, layout.y + 2, layout.width) +
    10;
  layout.rule(INK.text, 0.8);
  layout.gap(6);
}

const header = (text: string) => ({ text, style: { size: SMALL, color: INK.muted } });

/** A part applied to another, and its day: "Beef rub, 16 Dec 2026". */
function appliedWords(part: { formula: { title: string }; date: string }): string {
  return `${part.formula.title}, ${dayInWords(part.date)}, when it comes out of its hold`;
}

/** What goes on a batch and what it goes on, one line each: "Goes on: …", "Gets: …". */
function appliedLines(batch: PresentedPlanBatch): string[] {
  return [
    ...(batch.goesOn ?? []).map((on) => `Goes on: ${appliedWords(on)}`),
    ...(batch.gets ?? []).map((part) => `Gets: ${appliedWords(part)}`),
  ];
}

/** The first page: every day and batch, the pull list, allergens, warnings and cautions. */
function overview(layout: SheetLayout, plan: PresentedPlan): void {
  pageHead(
    layout,
    'LARDERBOOK · PRODUCTION PLAN',
    planTitle(plan),
    `Service ${dayInWords(plan.serviceDate)} · planned ${dayInWords(plan.today)} · ${plan.units === 'us' ? 'US units' : 'metric units'} · one production sheet per day follows`,
  );
  if (plan.allergens.length) {
    layout.paragraph(`Contains: ${plan.allergens.join(', ')}`, {
      weight: 'semibold',
      size: 11,
    });
  }
  heading(layout, 'Schedule');
  layout.table(
    [{ width: 3 }, { width: 5 }, { width: 3 }, { width: 6 }],
    { cells: ['Start', 'Batch', 'Ready', 'For'].map(header) },
    plan.batches.map((batch) => ({
      cells: [
        { text: dayInWords(batch.start), style: { weight: 'semibold' } },
        batch.result.formula.title,
        dayInWords(batch.ready),
        [...batch.purposes, ...appliedLines(batch)].join('; '),
      ],
    })),
  );
  heading(layout, 'Pull list');
  // "Before trim" only when some raw material is trimmed: no empty column.
  const trimmed = plan.pullList.some((item) => item.beforeTrim);
  const title = titleOf(plan);
  layout.table(
    [
      { width: TICK + 14, fixed: true, align: 'center' },
      { width: 7 },
      { width: 3, align: 'right' },
      ...(trimmed ? [{ width: 3, align: 'right' as const }] : []),
      { width: 6 },
    ],
    {
      cells: ['', 'Raw material', 'Amount', ...(trimmed ? ['Before trim'] : []), 'Used by'].map(
        header,
      ),
    },
    plan.pullList.map((item) => ({
      cells: [
        'tick-box',
        item.name,
        item.amount,
        ...(trimmed ? [item.beforeTrim?.amount ?? ''] : []),
        // Titles hold commas of their own: a semicolon between them.
        item.usedBy.map(title).join('; '),
      ],
    })),
  );
  for (const warning of plan.warnings) {
    // A batch's warning starts with its formula's id: "pit-bun: …".
    const named = warning.replace(/^([a-z0-9-]+): /, (whole, id: string) => `${title(id)}: `);
    layout.paragraph(`Warning: ${optionsInWords(named)}`, {
      color: INK.warn,
      weight: 'semibold',
    });
  }
  heading(layout, 'Cautions');
  bulletList(layout, plan.cautions);
  layout.gap(6);
  layout.paragraph(plan.rounding, { size: SMALL, color: INK.muted });
}

/** One day's sheet: the batches that start on it, each in full, and lines to sign. */
function daySheet(
  layout: SheetLayout,
  plan: PresentedPlan,
  date: string,
  batches: readonly PresentedPlanBatch[],
  index: number,
): void {
  layout.newPage();
  pageHead(
    layout,
    `LARDERBOOK · PRODUCTION SHEET · DAY ${index + 1} OF ${plan.days.length}`,
    `Start ${dayInWords(date)}`,
    `${planTitle(plan)} for service ${dayInWords(plan.serviceDate)} · ${batches.length} ${batches.length === 1 ? 'batch' : 'batches'}: ${batches.map((b) => b.result.formula.title).join(', ')}`,
  );
  for (const batch of batches) {
    subheading(layout, `${batch.result.formula.title} · ${kindWords(batch.formula.kind)}`, 80);
    for (const purpose of batch.purposes) layout.paragraph(`For: ${purpose}`);
    for (const line of appliedLines(batch)) layout.paragraph(line, { weight: 'semibold' });
    layout.paragraph(`When: ${batch.rule}`, { size: SMALL, color: INK.muted });
    layout.paragraph(
      `Ready ${dayInWords(batch.ready)}. Lot code (from Larderbook, once recorded): ______________`,
      { size: SMALL, color: INK.muted },
    );
    batchBody(layout, batch.result);
    layout.gap(10);
  }
  signOffLines(layout, ['Weighed by', 'Checked by']);
}

/**
 * A plan on paper: an overview (schedule, pull list, allergens, cautions), then one production
 * sheet per start day with every batch that starts on it, as its batch sheet would print it.
 */
export function renderPlanSheetPdf(plan: PresentedPlan): Promise<Buffer> {
  const name = `plan for ${dayInWords(plan.serviceDate)}`;
  const layout = openSheet({
    title: `${planTitle(plan)}, service ${dayInWords(plan.serviceDate)}`,
    subject: `Production plan: ${planTitle(plan)} for ${dayInWords(plan.serviceDate)}`,
    units: plan.units,
    created: plan.today,
    lot: name,
    running: `Service ${dayInWords(plan.serviceDate)}`,
  });
  overview(layout, plan);
  plan.days.forEach((day, i) => {
    const starting = plan.batches.filter(
      (b) => b.start === day.date && day.formulas.includes(b.formula.id),
    );
    daySheet(layout, plan, day.date, starting, i);
  });
  return finishSheet(layout, name);
}
