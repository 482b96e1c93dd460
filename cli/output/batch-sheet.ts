import type { PresentedGroup, PresentedResult } from '../../shared/index.ts';
import { textTable } from './text-table.ts';

function heading(text: string): string[] {
  return ['', text.toUpperCase()];
}

/** Labelled figures as aligned rows: label, value, (note). */
export function figureRows(figures: PresentedResult['inputs']): string[] {
  return textTable(
    figures.map((f) => [f.label, f.value, f.note ? `(${f.note})` : '']),
    ['left', 'right', 'left'],
  );
}

/** One group of lines to weigh, with its heading, column titles and total. */
export function groupLines(group: PresentedGroup): string[] {
  const hasPercent = group.lines.some((line) => line.percent);
  const rows = group.lines.map((line) => [
    line.name,
    hasPercent ? (line.percent ?? '') : '',
    line.amount,
    [
      line.gramsShown ? `(${line.gramsShown})` : '',
      line.role === 'curing-salt' ? '← curing salt' : '',
      line.note ?? '',
    ]
      .filter(Boolean)
      .join(' '),
  ]);
  const table = [
    ['', hasPercent ? `% of ${group.percentOf ?? ''}`.trim() : '', 'weigh', ''],
    ...rows,
  ];
  if (group.total)
    table.push([
      group.total.label,
      group.total.percent ?? '',
      group.total.amount,
      `(${group.total.note ?? 'total'})`,
    ]);
  const lines = textTable(table, ['left', 'right', 'right', 'left']);
  if (group.total) {
    const width = Math.max(...lines.map((line) => line.length));
    lines.splice(lines.length - 1, 0, `  ${'-'.repeat(Math.min(width, 70) - 2)}`);
  }
  return [...heading(`Weigh: ${group.title}`), ...lines];
}

/** The batch sheet as text, in the order the work is done: weigh, method, hold, check. */
export function renderBatchSheet(result: PresentedResult): string {
  const out: string[] = [
    result.formula.title,
    `${result.formula.id} · ${result.formula.kind} · ${result.units === 'us' ? 'US' : 'metric'} units`,
  ];
  if (result.critical) {
    out.push('', '*** REFUSED: a critical limit is failed. Do not make this batch. ***');
  }
  out.push(...heading('Batch'), ...figureRows(result.inputs));
  // A refused batch gets no amounts to weigh, so nobody works from it by mistake.
  if (!result.critical) {
    for (const group of result.groups) out.push(...groupLines(group));
    if (result.steps.length)
      out.push(...heading('Method'), ...result.steps.map((step, i) => `  ${i + 1}. ${step}`));
    if (result.schedule) {
      const s = result.schedule;
      out.push(
        ...heading('Hold'),
        `  ${s.days} days: ${s.rule}`,
        `  Start ${s.start}  →  ready ${s.ready}`,
      );
      if (s.flipEveryDays)
        out.push(`  Turn every ${s.flipEveryDays === 1 ? 'day' : `${s.flipEveryDays} days`}.`);
    }
  }
  if (result.checks.length) {
    out.push(...heading('Check'));
    for (const check of result.checks) {
      out.push(
        `  ${check.verdict.padEnd(4)}  ${check.label}: ${check.sentence}`,
        `        source: ${check.source}`,
      );
    }
  }
  if (result.figures.length) out.push(...heading('Figures'), ...figureRows(result.figures));
  if (!result.critical && result.yields?.length) {
    out.push(
      ...heading('Yields'),
      ...textTable(
        result.yields.map((y) => [y.step, y.percent, y.amount]),
        ['left', 'right', 'right'],
      ),
    );
  }
  if (!result.critical && result.portions) {
    const p = result.portions;
    out.push(...heading('Portions'), `  ${p.sentence}`);
  }
  if (result.warnings.length)
    out.push(...heading('Warnings'), ...result.warnings.map((w) => `  ! ${w}`));
  out.push(
    ...heading('Cautions'),
    ...result.cautions.map((c) => `  - ${c.text}${c.source ? ` [${c.source}]` : ''}`),
  );
  if (result.notes)
    out.push(
      ...heading('Notes'),
      ...result.notes
        .trim()
        .split('\n')
        .map((line) => `  ${line}`),
    );
  out.push('', result.rounding);
  if (result.critical)
    out.push('', '*** REFUSED: a critical limit is failed. Do not make this batch. ***');
  return out.join('\n') + '\n';
}
