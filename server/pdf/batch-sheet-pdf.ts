import type { BatchSummary } from '../../shared/api/batch-record.ts';
import { criticalFailures, type PresentedResult } from '../../shared/index.ts';
import { drawQrCode, qrMatrix, QUIET_ZONE_MODULES } from './qr-code.ts';
import { finishSheet, openSheet } from './sheet-document.ts';
import { hold } from './sheet-hold.ts';
import { factGrid, type Fact } from './sheet-facts.ts';
import { bulletList, numberedSteps } from './sheet-lists.ts';
import { INK, SMALL, type SheetLayout } from './sheet-layout.ts';
import { checkBlocks, heading, signOffLines, weighTable } from './sheet-sections.ts';
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
/** Widest the QR code may be, quiet zone included, points (about 25 mm). */
const QR_SIDE = 72;
/** The most facts in the header's row beside the QR code. */
const HEADER_FACTS = 6;
const REFUSAL = 'REFUSED: a critical limit is failed. Do not make this batch.';

/** The first 12 hex digits of a revision: enough to tell revisions apart on paper. */
export function shortRevision(revision: string): string {
  return revision.slice(0, 12);
}

/**
 * The record's facts: status, people (the reviewer with the moment of the sign-off), and the
 * start and ready days unless the hold prints the same days a little further down.
 */
function recordFacts(record: SheetRecord, result: PresentedResult): Fact[] {
  const schedule = result.critical ? undefined : result.schedule;
  const holdSays = schedule?.start === record.startedOn && schedule?.ready === record.readyOn;
  return [
    { label: 'Status', value: statusInWords(record.status) },
    { label: 'Operator', value: record.operator.displayName },
    ...(holdSays
      ? []
      : [
          { label: 'Started', value: dayInWords(record.startedOn) },
          { label: 'Ready', value: record.readyOn ? dayInWords(record.readyOn) : '—' },
        ]),
    record.signedOff
      ? {
          label: 'Signed off',
          value: record.signedOff.by.displayName,
          note: `${momentInWords(record.signedOff.at)}, reviewer, as recorded`,
        }
      : { label: 'Signed off', value: 'not yet' },
  ];
}

/**
 * Title, lot code with its QR code beside them, the formula and its revision, and a row of facts:
 * the record's, then the batch's inputs (what it was worked out from).
 */
function header(
  layout: SheetLayout,
  result: PresentedResult,
  record: SheetRecord | undefined,
  revision: string | undefined,
): void {
  const top = layout.y;
  const textWidth = layout.width - (record ? QR_SIDE + 14 : 0);
  layout.y += layout.draw(
    record?.formula.title ?? result.formula.title,
    { size: 16, weight: 'semibold' },
    layout.left,
    layout.y,
    textWidth,
  );
  const formula = [
    'Batch sheet',
    result.formula.id,
    revision ? `revision ${shortRevision(revision)}` : 'revision not recorded',
    kindWords(result.formula.kind),
    result.units === 'us' ? 'US units' : 'metric units',
  ].join(' · ');
  // The formula's line goes beside the lot when both fit on one line, under it when not.
  const lot = record
    ? { text: record.lotCode, style: { size: 15, weight: 'semibold', color: INK.rust } as const }
    : { text: `${NO_LOT}: a calculation, not a recorded batch`, style: { size: 11 } };
  const formulaStyle = { size: SMALL, color: INK.muted } as const;
  const lotEnd = 26 + layout.widthOf(lot.text, lot.style) + 16;
  const beside = lotEnd + layout.widthOf(formula, formulaStyle) <= textWidth;
  if (!beside) {
    layout.y += layout.draw(formula, formulaStyle, layout.left, layout.y + 1, textWidth) + 6;
  } else layout.y += 3;
  layout.draw('Lot', { size: 11, color: INK.muted }, layout.left, layout.y + 3, 30);
  layout.draw(lot.text, lot.style, layout.left + 26, layout.y + (record ? 0 : 3), textWidth - 26);
  if (beside) {
    const x = layout.left + lotEnd;
    layout.draw(formula, formulaStyle, x, layout.y + 6, textWidth - lotEnd);
  }
  layout.gap(24);
  if (record) {
    const qrModule = QR_SIDE / (qrMatrix(record.lotCode).length + 2 * QUIET_ZONE_MODULES);
    // No caption under it: the lot code is printed large beside it.
    drawQrCode(layout.doc, record.lotCode, layout.right - QR_SIDE, top - 4, qrModule);
  }
  // The facts sit beside the QR code, under the lot; the inputs are figures, so in semibold.
  // When they are too many for one row there, the inputs follow under the QR code.
  const own = record ? recordFacts(record, result) : [];
  const inputs = result.inputs.map((input) => ({ ...input, strong: true }));
  const together = own.length + inputs.length <= HEADER_FACTS;
  factGrid(layout, together ? [...own, ...inputs] : own, {
    perRow: HEADER_FACTS,
    width: textWidth,
  });
  if (record) layout.y = Math.max(layout.y, top + QR_SIDE - 2);
  if (!together) factGrid(layout, inputs, { perRow: HEADER_FACTS });
  layout.rule(INK.text, 0.8);
  layout.gap(4);
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

/** Checks, warnings and portions: what to verify once the batch is made. */
function check(layout: SheetLayout, result: PresentedResult, title: string): void {
  heading(layout, title, 60);
  checkBlocks(layout, result.checks);
  for (const warning of result.warnings) {
    layout.paragraph(`Warning: ${optionsInWords(warning)}`, {
      color: INK.warn,
      weight: 'semibold',
    });
  }
  if (result.critical) return;
  if (result.portions) {
    const p = result.portions;
    layout.paragraph(`Portions: ${p.sentence}`, {
      weight: 'semibold',
    });
  }
}

/**
 * The body of a batch's sheet, in the order the work is done: the batch, weigh (a box to tick
 * beside every line), mix and apply (with the formula's note, the figures and the yields to
 * expect), hold, check; then allergens and cautions. A refused result prints no amounts.
 * @param options.inputs whether to print the inputs (a batch sheet has them in its header) Shared by the batch sheet and each day of a plan's sheets.
 */
export function batchBody(
  layout: SheetLayout,
  result: PresentedResult,
  { inputs = true }: { inputs?: boolean } = {},
): void {
  // The batch's inputs need no heading: each is labelled.
  if (inputs) {
    layout.gap(4);
    factGrid(layout, result.inputs, { perRow: 5, strong: true });
  }
  const refused = result.critical;
  // The work's steps are numbered: 1 · Weigh, 2 · Mix and apply…
  let step = 0;
  const numbered = (words: string): string => `${++step} · ${words}`;
  if (!refused) {
    heading(layout, numbered('Weigh'), 90);
    for (const group of result.groups) weighTable(layout, group);
    // The figures to work to, and the weights to expect after each step: one row of facts.
    const worked: Fact[] = [
      ...result.figures,
      ...(result.yields ?? []).map((y) => ({
        label: `Expected after ${y.step}`,
        value: y.amount,
        note: `yield ${y.percent}`,
      })),
    ];
    if (result.steps.length || worked.length) {
      // An assembly's parts are put together, not mixed.
      heading(
        layout,
        numbered(result.formula.kind === 'assembly' ? 'Put together' : 'Mix and apply'),
      );
      numberedSteps(layout, result.steps);
      if (worked.length) {
        layout.gap(4);
        factGrid(layout, worked, { perRow: 4, strong: true });
      }
    }
    // The formula's own note is an instruction for the work: it goes with the steps.
    if (result.notes) layout.paragraph(`Note: ${result.notes.trim()}`, { weight: 'semibold' });
    if (result.schedule) {
      heading(layout, numbered('Hold'));
      hold(layout, result.schedule);
    }
  }
  if (result.checks.length || result.warnings.length || (!refused && result.portions))
    check(layout, result, refused ? 'Check' : numbered('Check'));
  if (result.allergens.length) {
    heading(layout, 'Allergens', 20);
    layout.paragraph(`Contains: ${result.allergens.join(', ')}`, {
      weight: 'semibold',
    });
  }
  heading(layout, 'Cautions');
  bulletList(layout, result.cautions, { columns: 2 });
  if (refused && result.notes) layout.paragraph(`Note: ${result.notes.trim()}`);
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
  batchBody(layout, result, { inputs: false });
  if (refused) {
    layout.gap(6);
    layout.paragraph(REFUSAL, { weight: 'semibold', color: INK.fail, size: 11 });
  }
  // How the amounts were rounded goes beside the lines to sign; a sign-off already recorded is
  // in the header's facts.
  signOffLines(layout, refused ? ['Checked by'] : ['Weighed by', 'Checked by'], {
    aside: result.rounding,
  });
  return finishSheet(layout, lot);
}
