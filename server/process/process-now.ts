import type { NowItem, ProcessNow } from '../../shared/api/process-record.ts';
import { judgeBatch } from './judge-batch.ts';
import { kitchenClock, kitchenTime } from './kitchen-clock.ts';
import type { ProcessRepository } from './process-repository.ts';
import type { SiteScope } from '../sites/site-scope.ts';

/** How far ahead a reading due soon is listed. common practice, no source */
export const DUE_SOON_MS = 15 * 60_000;

const byTime = (a: NowItem, b: NowItem): number => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0);

/**
 * GET /api/process/now: what needs attention now, most urgent first — open deviations (product
 * on hold), then readings overdue or due within 15 minutes and cooling stages with a deadline,
 * soonest first — for the batches being made (at the site, when one is given).
 */
export async function processNow(
  process: ProcessRepository,
  now: string,
  site?: SiteScope,
): Promise<ProcessNow> {
  const deviations: NowItem[] = [];
  for (const d of await process.openDeviations(site)) {
    const controls = await process.controls.of(d.formula_id, d.formula_revision);
    deviations.push({
      kind: 'deviation',
      lotCode: d.lot_code,
      formulaTitle: d.formula_title,
      control: d.control,
      controlTitle: controls.find((c) => c.id === d.control)?.title ?? null,
      at: d.opened_at,
      what: d.what,
    });
  }
  const soon = Date.parse(now) + DUE_SOON_MS;
  const due: NowItem[] = [];
  for (const batch of await process.beingMade(site)) {
    const controls = await process.controlsOf(batch);
    if (controls.length === 0) continue;
    const readings = await process.readings(batch.id);
    const judged = judgeBatch(controls, readings, batch.status, kitchenClock(now));
    for (const { control, state } of judged) {
      const base = {
        lotCode: batch.lotCode,
        formulaTitle: batch.formulaTitle,
        control: control.id,
        controlTitle: control.title,
      };
      if (state.stage) {
        due.push({
          ...base,
          kind: 'stage-deadline',
          at: state.stage.deadline,
          what: `${control.title}: ${state.summary}`,
        });
      } else if (state.nextDue && Date.parse(state.nextDue) <= soon) {
        const overdue = Date.parse(state.nextDue) < Date.parse(now);
        const when = kitchenTime(state.nextDue, now);
        due.push({
          ...base,
          kind: 'reading-due',
          at: state.nextDue,
          what: `${control.title}: reading ${overdue ? `overdue since ${when}` : `due by ${when}`}`,
        });
      }
    }
  }
  // Deviations first: they hold product, whatever else is due.
  return { items: [...deviations.sort(byTime), ...due.sort(byTime)] };
}
