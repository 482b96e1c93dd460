import { plannedDates, type PlannedDates } from './plan-dates.ts';
import { PlanError } from './plan-error.ts';
import type { Need } from './plan-needs.ts';
import type { AppliedPart } from './plan-types.ts';

/** A need's dates, and for a part applied to others, what it goes on and when. */
export interface NeedDates extends PlannedDates {
  readonly goesOn: readonly AppliedPart[];
}

/**
 * The dates of every need, by formula id. A part served as it is counts back from service; a
 * part applied to another counts back from the day that part comes out of its hold (its ready
 * day), when it goes on; a part both served and applied, or applied to several, starts by the
 * earliest of those days, so it is there for its first use.
 * @throws PlanError 'cycle' when parts go on each other across the plan's assemblies, and
 *   whatever plannedDates throws
 */
export function datesOfNeeds(needs: readonly Need[], serviceDate: string): Map<string, NeedDates> {
  const byId = new Map(needs.map((need) => [need.formula.id, need]));
  const dated = new Map<string, NeedDates>();
  const datesOf = (need: Need, trail: readonly string[]): NeedDates => {
    const known = dated.get(need.formula.id);
    if (known) return known;
    if (trail.includes(need.formula.id)) {
      throw new PlanError(
        `${[...trail, need.formula.id].join(' goes on ')} goes round in a circle: a part cannot go on a part that goes on it`,
        'cycle',
        need.formula.id,
      );
    }
    const goesOn: AppliedPart[] = [];
    const options: PlannedDates[] = [];
    if (need.served) options.push(plannedDates(need.formula, need.sizes, serviceDate));
    for (const id of need.goesOn) {
      const base = byId.get(id);
      // collectNeeds only lets a part go on a part of the same assembly, so it is always there.
      if (!base) continue;
      const date = datesOf(base, [...trail, need.formula.id]).ready;
      const { title } = base.formula;
      goesOn.push({ formula: { id, title }, date });
      options.push(plannedDates(need.formula, need.sizes, serviceDate, { title, date }));
    }
    const earliest = options.reduce((a, b) => (b.start < a.start ? b : a));
    const dates = { ...earliest, goesOn };
    dated.set(need.formula.id, dates);
    return dates;
  };
  for (const need of needs) datesOf(need, []);
  return dated;
}
