import type { BatchFormula } from '../../formula/formula-types.ts';
import { estimateHold, type HoldMeasures } from '../cure/hold-time.ts';
import { addDays } from '../dates.ts';
import { daysInWords, leadDaysOf } from './lead-days.ts';
import { PlanError } from './plan-error.ts';
import { dayWords } from '../../presentation/date-words.ts';

/** When a batch starts and is ready, counted back from service, with the rule in words. */
export interface PlannedDates {
  readonly start: string;
  readonly ready: string;
  readonly holdDays: number;
  readonly leadDays: number;
  readonly rule: string;
}

/** The part a batch is applied to, and the day it goes on: when that part comes out of its hold. */
export interface AppliedTo {
  readonly title: string;
  readonly date: string;
}

/**
 * Counts a batch's start back from the service day: start = service − (hold + lead days), and
 * ready = start + hold. The hold is a cure's own rule (estimateHold, with the sizes the
 * components give); the other kinds have none. Lead days are the formula's, else the kitchen's
 * default (lead-days.ts). A part applied to another counts back from the day it goes on instead.
 * @param appliedTo for a part applied to another: that part, and the day it goes on
 * @throws PlanError 'needs-size' when a cure's hold rule needs a size nobody gave
 */
export function plannedDates(
  formula: BatchFormula,
  sizes: HoldMeasures,
  serviceDate: string,
  appliedTo?: AppliedTo,
): PlannedDates {
  const lead = leadDaysOf(formula);
  let holdDays = 0;
  let holdWords = '';
  if (formula.kind === 'cure') {
    const hold = estimateHold(formula, sizes);
    if ('missing' in hold) {
      throw new PlanError(
        `${formula.id} cannot be dated: ${hold.missing.replace(/give --(\S+)/, 'give $1 in the assembly')}`,
        'needs-size',
        formula.id,
      );
    }
    holdDays = hold.days;
    holdWords = `hold ${daysInWords(hold.days)} (${hold.rule}; ${hold.source}), then `;
  }
  const until = appliedTo?.date ?? serviceDate;
  const start = addDays(until, -(holdDays + lead.days));
  const ready = addDays(start, holdDays);
  const use = appliedTo ? 'it goes on' : 'service';
  const leadWords =
    lead.days === 0
      ? `made on the day ${appliedTo ? 'it goes on' : 'of service'} (lead 0 days: ${lead.source})`
      : `${daysInWords(lead.days)} before ${use} (lead days: ${lead.source})`;
  const applied = appliedTo
    ? `; it goes on ${appliedTo.title} when it comes out of its hold, ${dayWords(appliedTo.date)}, for service ${dayWords(serviceDate)}`
    : `, service ${dayWords(serviceDate)}`;
  const dates = `start ${dayWords(start)}${holdDays > 0 ? `, ready ${dayWords(ready)}` : ''}${applied}`;
  return {
    start,
    ready,
    holdDays,
    leadDays: lead.days,
    rule: `${holdWords}${leadWords}: ${dates}`,
  };
}
