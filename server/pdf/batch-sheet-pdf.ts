import type { BatchSummary } from '../../shared/api/batch-record.ts';
import { addDays, criticalFailures, type PresentedResult } from '../../shared/index.ts';
import { drawQrCode, qrMatrix, QUIET_ZONE_MODULES } from './qr-code.ts';
import { finishSheet, openSheet } from './sheet-document.ts';
import { BODY, INK, SMALL, TICK, type SheetLayout } from './sheet-layout.ts';
import {
  bulletList,
  checkBlock,
  figureTable,
  heading,
  signOffLines,
  subheading,
  weighTable,
} from './sheet-sections.ts';
import { statusInWords } from '../../shared/workflow/batch-status.ts';
import { dayInWords, kindWords, momentInWords } from './sheet-words.ts';
import { optionsInWords } from '../../shared/presentation/option-words.ts';

/** The parts of a recorded batch its sheet prints beside the result. */
export type SheetRecord = Pick<
  BatchSummary,
  'lotCode' | 'formula' | 'status' | 'operator' | 'startedOn' | 'readyOn' | 'signedOff'
>;

/** What a plain calculation's sheet may say about where it came from. */
export interface SheetSource {
  /** The formula file's revision (its sha-256) the calculation was made from. */
  readonly revision?: string;
}

/** The lot code of a sheet, or words for a calculation that was not recorded. */
export const NO_LOT = 'not recorded';
/** Widest the QR code may be, quiet zone included, points (about 27 mm). */
const QR_SIDE = 76;
const REFUSAL = 'REFUSED: a critical limit is failed. Do not make this batch.';

/** The first 12 hex digits of a revision: enough to tell revisions apart on paper. */
export function shortRevision(revision: string): string {
  return revision.slice(0, 12);
}

/** Label over value, side by side along a row: the record's facts. */
function facts(layout: SheetLayout, pairs: readonly [string, string][], width: number): void {
  const cell = width / pairs.length;
  pairs.forEach(([label, value], i) => {
    const x = layout.left + i * cell;
    layout.draw(
      label.toUpperCase(),
      { size: 7, color: INK.muted, weight: 'semibold' },
      x,
      layout.y,
      cell - 8,
    );
    layout.draw(value, { size: BODY }, x, layout.y + 10, cell - 8);
  });
  layout.gap(26);
}

/** Title, formula, lot code with its QR code, and the record's facts. */
function header(
  layout: SheetLayout,
  result: PresentedResult,
  record: SheetRecord | undefined,
  revision: string | undefined,
): void {
  const top = layout.y;
  const textWidth = layout.width - QR_SIDE - 16;
  layout.draw(
    'LARDERBOOK · BATCH SHEET',
    { size: 7.5, weight: 'semibold', color: INK.rust },
    layout.left,
    top,
    textWidth,
  );
  layout.y = top + 13;
  layout.y += layout.draw(
    record?.formula.title ?? result.formula.title,
    { size: 18, weight: 'semibold' },
    layout.left,
    layout.y,
    textWidth,
  );
  const formula = [
    result.formula.id,
    revision ? `revision ${shortRevision(revision)}` : 'revision not recorded',
    kindWords(result.formula.kind),
    result.units === 'us' ? 'US units' : 'metric units',
  ].join(' · ');
  layout.y +=
    layout.draw(formula, { size: SMALL, color: INK.muted }, layout.left, layout.y + 2, textWidth) +
    10;
  layout.draw('Lot', { size: 11, color: INK.muted }, layout.left, layout.y + 3, 30);
  if (record) {
    layout.draw(
      record.lotCode,
      { size: 16, weight: 'semibold', color: INK.rust },
      layout.left + 26,
      layout.y,
      textWidth - 26,
    );
  } else {
    layout.draw(
      `${NO_LOT}: a calculation, not a recorded batch`,
      { size: 11 },
      layout.left + 26,
      layout.y + 3,
      textWidth - 26,
    );
  }
  layout.gap(26);
  if (record) {
    const qrModule = QR_SIDE / (qrMatrix(record.lotCode).length + 2 * QUIET_ZONE_MODULES);
    drawQrCode(layout.doc, record.lotCode, layout.right - QR_SIDE, top - 4, qrModule);
    layout.draw(
      record.lotCode,
      { size: 7, color: INK.muted, align: 'center' },
      layout.right - QR_SIDE,
      top + QR_SIDE - 6,
      QR_SIDE,
    );
    layout.y = Math.max(layout.y, top + QR_SIDE + 6);
    facts(
      layout,
      [
        ['Status', statusInWords(record.status)],
        ['Operator', record.operator.displayName],
        ['Started', dayInWords(record.startedOn)],
        ['Ready', record.readyOn ? dayInWords(record.readyOn) : '—'],
        ['Signed off', record.signedOff ? record.signedOff.by.displayName : 'not yet'],
      ],
      layout.width,
    );
  } else if (result.schedule && !result.critical) {
    facts(
      layout,
      [
        ['Start', dayInWords(result.schedule.start)],
        ['Ready', dayInWords(result.schedule.ready)],
      ],
      layout.width * 0.4,
    );
  }
  layout.rule(INK.text, 0.8);
  layout.gap(6);
}

/** The refusal, in a red box that cannot be missed, with the checks that failed. */
function refusal(layout: SheetLayout, result: PresentedResult): void {
  const failed = criticalFailures(result.checks);
  const lines = [
    'No amounts are printed, so nothing is weighed from this sheet.',
    ...failed.map((check) => `${check.label}: ${check.sentence}`),
  ];
  const width = layout.width - 28;
  const height =
    24 + lines.reduce((total, line) => total + layout.measure(line, {}, width) + 3, 0) + 14;
  layout.gap(6);
  layout.ensure(height);
  layout.doc.rect(layout.left, layout.y, layout.width, height).fillColor(INK.failTint).fill();
  layout.doc.rect(layout.left, layout.y, 5, height).fillColor(INK.fail).fill();
  let y = layout.y + 9;
  y +=
    layout.draw(
      REFUSAL,
      { size: 14, weight: 'semibold', color: INK.fail },
      layout.left + 14,
      y,
      width,
    ) + 4;
  for (const line of lines) y += layout.draw(line, {}, layout.left + 14, y, width) + 3;
  layout.y += height + 6;
}

/** Hold: days, start and ready, and a box for each turn with its date. */
function hold(layout: SheetLayout, schedule: NonNullable<PresentedResult['schedule']>): void {
  layout.ensure(60);
  const days = `${schedule.days} ${schedule.days === 1 ? 'day' : 'days'}`;
  layout.draw(days, { size: 15, weight: 'semibold' }, layout.left, layout.y, 90);
  const start = `Start ${dayInWords(schedule.start)}`;
  const ready = `ready ${dayInWords(schedule.ready)}`;
  const x = layout.left + 90;
  layout.draw(start, { size: 11 }, x, layout.y + 3, 200);
  const arrowX = x + layout.doc.widthOfString(start) + 8;
  const arrowY = layout.y + 10;
  layout.doc
    .moveTo(arrowX, arrowY)
    .lineTo(arrowX + 18, arrowY)
    .moveTo(arrowX + 14, arrowY - 3.5)
    .lineTo(arrowX + 18, arrowY)
    .lineTo(arrowX + 14, arrowY + 3.5)
    .lineWidth(1)
    .strokeColor(INK.text)
    .stroke();
  layout.draw(ready, { size: 11, weight: 'semibold' }, arrowX + 26, layout.y + 3, 200);
  layout.gap(24);
  layout.paragraph(schedule.rule, { color: INK.muted, size: SMALL });
  const every = schedule.flipEveryDays;
  if (!every) return;
  layout.paragraph(`Turn every ${every} ${every === 1 ? 'day' : 'days'}; tick each turn:`);
  const turns: number[] = [];
  for (let day = every; day < schedule.days; day += every) turns.push(day);
  const step = 92;
  const perRow = Math.max(1, Math.floor(layout.width / step));
  turns.forEach((day, i) => {
    if (i % perRow === 0) {
      if (i) layout.gap(18);
      layout.ensure(18);
    }
    const x = layout.left + (i % perRow) * step;
    layout.tickBox(x, layout.y + 1);
    layout.draw(
      `day ${day}, ${dayInWords(addDays(schedule.start, day))}`,
      { size: SMALL },
      x + TICK + 5,
      layout.y + 1,
      step - TICK - 8,
    );
  });
  if (turns.length) layout.gap(20);
}

/** Checks, warnings, yields and portions: what to verify once the batch is made. */
function check(layout: SheetLayout, result: PresentedResult, title: string): void {
  heading(layout, title, 60);
  for (const limit of result.checks) checkBlock(layout, limit);
  for (const warning of result.warnings) {
    layout.paragraph(`Warning: ${optionsInWords(warning)}`, {
      color: INK.warn,
      weight: 'semibold',
    });
  }
  if (result.critical) return;
  if (result.yields?.length) {
    subheading(layout, 'Yields');
    layout.table(
      [{ width: 3 }, { width: 2, align: 'right' }, { width: 3, align: 'right' }],
      {
        cells: ['After', 'Yield', 'Expected weight'].map((text) => ({
          text,
          style: { size: SMALL, color: INK.muted },
        })),
      },
      result.yields.map((y) => ({ cells: [y.step, y.percent, y.amount] })),
      { width: layout.width * 0.6 },
    );
    layout.gap(6);
  }
  if (result.portions) {
    const p = result.portions;
    layout.paragraph(`Portions: ${p.sentence}`, {
      weight: 'semibold',
    });
  }
}

/**
 * The body of a batch's sheet, in the order the work is done: the batch, weigh (a box to tick
 * beside every line), mix and apply, hold, check; then allergens, cautions and notes. A refused
 * result prints no amounts. Shared by the batch sheet and each day of a plan's sheets.
 */
export function batchBody(layout: SheetLayout, result: PresentedResult): void {
  heading(layout, 'The batch');
  figureTable(layout, result.inputs);
  const refused = result.critical;
  // The work's steps are numbered: 1 · Weigh, 2 · Mix and apply…
  let step = 0;
  const numbered = (words: string): string => `${++step} · ${words}`;
  if (!refused) {
    heading(layout, numbered('Weigh'), 90);
    for (const group of result.groups) weighTable(layout, group);
    if (result.steps.length || result.figures.length) {
      heading(layout, numbered('Mix and apply'));
      result.steps.forEach((text, i) => {
        layout.ensure(layout.measure(text, {}, layout.width - 20));
        layout.draw(
          `${i + 1}.`,
          { weight: 'semibold', color: INK.rust },
          layout.left,
          layout.y,
          18,
        );
        layout.y += layout.draw(text, {}, layout.left + 20, layout.y, layout.width - 20) + 4;
      });
      if (result.figures.length) {
        subheading(layout, 'Figures');
        figureTable(layout, result.figures);
      }
    }
    if (result.schedule) {
      heading(layout, numbered('Hold'));
      hold(layout, result.schedule);
    }
  }
  if (
    result.checks.length ||
    result.warnings.length ||
    (!refused && (result.yields?.length || result.portions))
  )
    check(layout, result, refused ? 'Check' : numbered('Check'));
  if (result.allergens.length) {
    heading(layout, 'Allergens', 20);
    layout.paragraph(`Contains: ${result.allergens.join(', ')}`, {
      weight: 'semibold',
    });
  }
  heading(layout, 'Cautions');
  bulletList(layout, result.cautions);
  if (result.notes) {
    heading(layout, 'Notes', 20);
    layout.paragraph(result.notes.trim());
  }
}

/**
 * The batch sheet as a PDF, in the order the work is done: the batch, weigh (a box to tick
 * beside every line), mix and apply, hold, check; then allergens, cautions with their sources,
 * notes, the rounding note and lines to sign. A refused result prints the refusal and no
 * amounts. A recorded batch carries its lot code, in words and as a QR code.
 * @param record the recorded batch, when there is one: lot code, status, people, dates
 * @param source for a plain calculation, the formula revision it was made from
 */
export function renderBatchSheetPdf(
  result: PresentedResult,
  record?: SheetRecord,
  source: SheetSource = {},
): Promise<Buffer> {
  const lot = record?.lotCode ?? NO_LOT;
  const title = record?.formula.title ?? result.formula.title;
  const layout = openSheet({
    title,
    subject: record ? `Batch sheet, lot ${lot}` : 'Batch sheet (not recorded)',
    units: result.units,
    created: record?.startedOn ?? result.schedule?.start ?? '2000-01-01',
    lot,
  });
  header(layout, result, record, record?.formula.revision ?? source.revision);
  const refused = result.critical;
  if (refused) refusal(layout, result);
  batchBody(layout, result);
  layout.gap(6);
  layout.paragraph(result.rounding, { size: SMALL, color: INK.muted });
  if (refused) layout.paragraph(REFUSAL, { weight: 'semibold', color: INK.fail, size: 11 });
  const signed = record?.signedOff;
  signOffLines(
    layout,
    refused ? ['Checked by'] : ['Weighed by', 'Checked by'],
    signed
      ? `Signed off by ${signed.by.displayName}, ${momentInWords(signed.at)} (reviewer, as recorded in Larderbook)`
      : undefined,
  );
  return finishSheet(layout, lot);
}
