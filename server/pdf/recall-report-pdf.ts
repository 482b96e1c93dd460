import type { RecallReport, TraceNode } from '../../shared/api/trace-record.ts';
import { lotAmountWords } from '../../shared/presentation/lot-amount.ts';
import {
  CUT_WORDS,
  batchStatusWords,
  lotFacts,
  lotName,
  searchWords,
  useWords,
} from '../../shared/presentation/trace-words.ts';
import { finishSheet, openSheet } from './sheet-document.ts';
import { INK, SMALL, type SheetLayout } from './sheet-layout.ts';
import { pageHead } from './plan-sheet-pdf.ts';
import { heading } from './sheet-sections.ts';
import { dayInWords, momentInWords } from './sheet-words.ts';

const header = (text: string) => ({ text, style: { size: SMALL, color: INK.muted } });

/** The head: what was searched, who produced the report and when, and the caution. */
function head(layout: SheetLayout, report: RecallReport): void {
  pageHead(
    layout,
    'LARDERBOOK · RECALL REPORT',
    `Recall: ${searchWords(report.searched)}`,
    `${report.kitchen} · produced by ${report.producedBy}, ${momentInWords(report.producedAt)} · ${report.totals.batches} affected batch(es)`,
  );
  layout.paragraph(report.caution, { weight: 'semibold', color: INK.warn });
  if (report.elsewhere) layout.paragraph(report.elsewhere, { weight: 'semibold', color: INK.warn });
}

/** The lots recalled, each with its facts. */
function recalledLots(layout: SheetLayout, report: RecallReport): void {
  heading(layout, 'Lots recalled');
  for (const lot of report.recalled)
    layout.paragraph(`${lotName(lot)} — ${lotFacts(lot)}`, { weight: 'semibold' });
}

/** Every affected batch once, with each use that links it to the recall. */
function batchTable(layout: SheetLayout, report: RecallReport): void {
  heading(layout, 'Affected batches');
  if (!report.batches.length) {
    layout.paragraph('No batch used the recalled lots.');
    return;
  }
  layout.table(
    [
      { width: 36, fixed: true, align: 'right' },
      { width: 4 },
      { width: 2.4 },
      { width: 4 },
      { width: 7.6 },
    ],
    { cells: ['Level', 'Batch', 'Status', 'Days', 'Made with'].map(header) },
    report.batches.map((batch) => ({
      cells: [
        String(batch.level),
        { text: batch.lotCode, style: { weight: 'semibold' }, sub: { text: batch.formula.title } },
        batchStatusWords(batch.status),
        [
          `started ${dayInWords(batch.startedOn)}`,
          ...(batch.readyOn ? [`ready ${dayInWords(batch.readyOn)}`] : []),
          ...(batch.serviceDay ? [`service ${dayInWords(batch.serviceDay)}`] : []),
        ].join('\n'),
        batch.uses.map((use) => `${use.from}: ${useWords(use)}`).join('\n'),
      ],
    })),
    { continued: () => heading(layout, 'Affected batches, continued') },
  );
}

/** Totals and what is still on hand. */
function totals(layout: SheetLayout, report: RecallReport): void {
  heading(layout, 'Totals');
  const amounts = (list: RecallReport['totals']['received']) =>
    list.map((t) => lotAmountWords(t.amount, t.measure)).join(' + ') || 'none';
  const statuses = Object.entries(report.totals.byStatus)
    .map(([status, n]) => `${n} ${batchStatusWords(status)}`)
    .join(', ');
  layout.paragraph(
    `${report.totals.batches} batch(es)${statuses ? ` (${statuses})` : ''}. Received: ${amounts(report.totals.received)}; used straight from the recalled lots: ${amounts(report.totals.used)}${report.totals.usedElsewhere ? `; used straight from them at another site of the group: ${amounts(report.totals.usedElsewhere)}` : ''}.`,
  );
  heading(layout, 'Still on hand');
  const { lots, batches } = report.onHand;
  if (!lots.length && !batches.length)
    layout.paragraph(
      'Nothing of the recalled lots is left, and no affected batch is still being made or waiting for a service. Check what was sent out or served with the people who took it.',
    );
  for (const lot of lots)
    layout.paragraph(
      `Received lot ${lot.lotCode}: ${lotAmountWords(lot.remaining, lot.measure)} left`,
      {
        weight: 'semibold',
      },
    );
  if (batches.length)
    layout.paragraph(
      `Batches still in the kitchen or for a service to come: ${batches.join(', ')}`,
      {
        weight: 'semibold',
      },
    );
}

/**
 * The most lines of the tree a PDF prints: the table above lists every batch already, and a
 * longer tree makes a report that takes long to write and longer to read.
 */
const TREE_LINES = 300;

/** The tree forward, one lot a line, indented by level, to {@link TREE_LINES} lines. */
function tree(layout: SheetLayout, report: RecallReport): void {
  heading(layout, 'Where it went, level by level');
  let lines = 0;
  const line = (node: TraceNode): void => {
    if (lines++ < TREE_LINES) {
      const use = node.use ? ` — ${useWords(node.use)}` : '';
      const cut = node.cut ? ` (${CUT_WORDS[node.cut]})` : '';
      const away = node.elsewhere
        ? ` (and ${node.elsewhere.map((a) => lotAmountWords(a.amount, a.measure)).join(' + ')} at another site)`
        : '';
      layout.paragraph(
        `${lotName(node.lot)}${use}${cut}${away}`,
        node.level === 0 ? { weight: 'semibold' } : {},
        { indent: Math.min(node.level, 8) * 14, after: 2 },
      );
    }
    node.children.forEach(line);
  };
  report.tree.roots.forEach(line);
  if (lines > TREE_LINES)
    layout.paragraph(
      `The tree goes on for ${lines - TREE_LINES} more line(s): every batch is in the table above and in the CSV, and the whole tree on the Trace screen.`,
      { color: INK.muted },
    );
}

/**
 * A recall report on paper: what was searched, who produced it and when, the caution, the lots
 * recalled, every affected batch with its amounts and days, totals, what is still on hand, and
 * the tree level by level. A4, in the sheets' own font, "page N of M" in every footer.
 */
export function renderRecallReportPdf(report: RecallReport): Promise<Buffer> {
  const words = searchWords(report.searched);
  const layout = openSheet({
    title: `Recall report, ${report.kitchen}`,
    subject: `Recall: ${words}`,
    units: 'metric',
    created: report.producedAt.slice(0, 10),
    lot: `recall of ${words}`,
    running: `Recall: ${words}`,
  });
  head(layout, report);
  recalledLots(layout, report);
  batchTable(layout, report);
  totals(layout, report);
  tree(layout, report);
  return finishSheet(layout, `recall of ${words}`);
}
