import type { RecallReport, TraceAnswer, TraceNode } from '../../shared/api/trace-record.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { lotAmountWords } from '../../shared/presentation/lot-amount.ts';
import {
  CUT_WORDS,
  batchStatusWords,
  lotFacts,
  lotName,
  searchWords,
} from '../../shared/presentation/trace-words.ts';
import { textTable } from './text-table.ts';

/** One node's line: its name, the use linking it ("4000 g on 6 Dec 2026"), its facts. */
function nodeLine(node: TraceNode): string {
  const use = node.use
    ? `: ${lotAmountWords(node.use.amount, node.use.measure)} on ${dayWords(node.use.usedOn)}`
    : '';
  const cut = node.cut ? ` — ${CUT_WORDS[node.cut]}` : ` · ${lotFacts(node.lot)}`;
  return `${lotName(node.lot)}${use}${cut}`;
}

/** A tree drawn with box lines, one lot a line: the roots flush left, each level indented. */
export function treeLines(roots: readonly TraceNode[]): string[] {
  const lines: string[] = [];
  const walk = (node: TraceNode, lead: string, branch: string): void => {
    lines.push(`${lead}${branch}${nodeLine(node)}`);
    const under = lead + (branch === '├─ ' ? '│  ' : branch === '└─ ' ? '   ' : '');
    node.children.forEach((child, i) =>
      walk(child, under, i === node.children.length - 1 ? '└─ ' : '├─ '),
    );
  };
  for (const root of roots) walk(root, '', '');
  return lines;
}

/** A trace one way for a terminal: a heading, the tree, and a line when nothing is linked. */
export function traceText(title: string, trace: TraceAnswer, none: string): string {
  const linked = trace.roots.some((root) => root.children.length > 0);
  return [
    `${title}:`,
    ...treeLines(trace.roots),
    ...(linked ? [] : [`  ${none}`]),
    ...(trace.incomplete ? ['  Some branches stop short (see above): check those records.'] : []),
    '',
  ].join('\n');
}

/** A recall report in short, for a terminal: the head, a line per batch, totals, on hand, caution. */
export function recallText(report: RecallReport): string {
  const header = ['level', 'lot', 'product', 'status', 'started', 'ready', 'service', 'made with'];
  const rows = report.batches.map((b) => [
    String(b.level),
    b.lotCode,
    b.formula.title,
    batchStatusWords(b.status),
    dayWords(b.startedOn),
    b.readyOn ? dayWords(b.readyOn) : '',
    b.serviceDay ? dayWords(b.serviceDay) : '',
    b.uses.map((u) => `${u.from} ${lotAmountWords(u.amount, u.measure)}`).join(', '),
  ]);
  const amounts = (list: RecallReport['totals']['used']) =>
    list.map((t) => lotAmountWords(t.amount, t.measure)).join(' + ') || 'none';
  const { lots, batches } = report.onHand;
  return [
    `Recall of ${searchWords(report.searched)}, ${report.kitchen}: produced by ${report.producedBy}`,
    '',
    'Lots recalled:',
    ...report.recalled.map((lot) => `  ${lotName(lot)} · ${lotFacts(lot)}`),
    '',
    report.batches.length
      ? textTable(
          [header, ...rows],
          header.map((_, i) => (i === 0 ? 'right' : 'left')),
        ).join('\n')
      : '  No batch used the recalled lots.',
    '',
    `${report.totals.batches} affected batch(es). Received ${amounts(report.totals.received)}; used straight from the recalled lots ${amounts(report.totals.used)}.`,
    `Still on hand: ${
      [
        ...lots.map((l) => `${l.lotCode} (${lotAmountWords(l.remaining, l.measure)} left)`),
        ...batches,
      ].join(', ') || 'nothing of the recalled lots, and no affected batch still in the kitchen'
    }.`,
    '',
    report.caution,
    'Write it whole with --pdf FILE or --csv FILE.',
    '',
  ].join('\n');
}
