import type { PresentedPlan, PresentedPlanBatch } from '../../shared/index.ts';
import { figureRows, groupLines } from './batch-sheet.ts';
import { textTable } from './text-table.ts';

function heading(text: string): string[] {
  return ['', text.toUpperCase()];
}

/** A part applied to another, and the day it goes on, in words. */
function appliedWords(part: { formula: { title: string }; date: string }): string {
  return `${part.formula.title} on ${part.date}, when it comes out of its hold`;
}

/** One batch of the plan, compactly: what it is for, when, the batch, what to weigh, checks. */
function batchLines(batch: PresentedPlanBatch): string[] {
  const { result } = batch;
  const out = [
    '',
    `${batch.formula.title} (${batch.formula.id} · ${batch.formula.kind})`,
    ...batch.purposes.map((purpose) => `  For: ${purpose}`),
    `  When: ${batch.rule}`,
    ...(batch.goesOn ?? []).map((on) => `  Goes on: ${appliedWords(on)}`),
    ...(batch.gets ?? []).map((part) => `  Gets: ${appliedWords(part)}`),
    ...figureRows(result.inputs),
  ];
  for (const group of result.groups) out.push(...groupLines(group).slice(1));
  if (result.portions) {
    const p = result.portions;
    out.push(`  Portions: ${p.sentence}`);
  }
  for (const check of result.checks) {
    out.push(`  ${check.verdict.padEnd(4)}  ${check.label}: ${check.sentence}`);
  }
  return out;
}

function titleOf(plan: PresentedPlan, id: string): string {
  const batch = plan.batches.find((b) => b.formula.id === id);
  if (!batch) return id;
  const on = (batch.goesOn ?? []).map((part) => part.formula.title);
  return `${batch.formula.title} (${batch.formula.kind})${on.length ? `, goes on ${on.join(' and ')}` : ''}`;
}

/**
 * A plan as text: the days at a glance, then each day's production sheet with its batches
 * (compact batch sheets: what each is for, when and why, what to weigh, the checks), the pull
 * list, the allergens, warnings and cautions.
 */
export function renderPlanSheet(plan: PresentedPlan): string {
  const days = plan.days.length === 1 ? '1 day' : `${plan.days.length} days`;
  const batches = plan.batches.length === 1 ? '1 batch' : `${plan.batches.length} batches`;
  const out: string[] = [
    `${plan.assembly.title} × ${plan.count} for service on ${plan.serviceDate}`,
    `${plan.assembly.id} · planned ${plan.today} · ${plan.units === 'us' ? 'US' : 'metric'} units · ${batches} over ${days}`,
    ...heading('Days'),
    ...textTable(
      plan.days.map((day) => [day.date, day.formulas.map((id) => titleOf(plan, id)).join('; ')]),
      ['left', 'left'],
    ),
  ];
  for (const day of plan.days) {
    out.push('', `==== ${day.date}: start ${day.formulas.join(', ')} ====`);
    for (const id of day.formulas) {
      const batch = plan.batches.find((b) => b.formula.id === id);
      if (batch) out.push(...batchLines(batch));
    }
  }
  const trimmed = plan.pullList.some((item) => item.beforeTrim);
  out.push(
    ...heading('Pull list'),
    ...textTable(
      [
        ['', 'amount', ...(trimmed ? ['before trimming'] : []), 'for'],
        ...plan.pullList.map((item) => [
          item.name,
          item.amount,
          ...(trimmed ? [item.beforeTrim?.amount ?? ''] : []),
          item.usedBy.join(', '),
        ]),
      ],
      ['left', 'right', ...(trimmed ? (['right'] as const) : []), 'left'],
    ),
    ...heading('Allergens'),
    `  ${plan.allergens.length ? plan.allergens.join(', ') : 'none of the nine major allergens'}`,
  );
  if (plan.warnings.length)
    out.push(...heading('Warnings'), ...plan.warnings.map((w) => `  ! ${w}`));
  out.push(
    ...heading('Cautions'),
    ...plan.cautions.map((c) => `  - ${c.text}${c.source ? ` [${c.source}]` : ''}`),
    '',
    plan.rounding,
  );
  return out.join('\n') + '\n';
}
