import type { BatchFormula } from '../../formula/formula-types.ts';
import { estimateHold, type HoldMeasures } from '../cure/hold-time.ts';
import { addDays } from '../dates.ts';
import { daysInWords, leadDaysOf } from './lead-days.ts';
import { PlanError } from './plan-error.ts';

/** When a batch starts and is ready, counted back from service, with the rule in words. */
export interface PlannedDates {
  readonly start: string;
  readonly ready: string;
  readonly holdDays: number;
  readonly leadDays: number;
  readonly rule: string;
}

/**
 * Counts a batch's start back from the service day: start = service − (hold + lead days), and
 * ready = start + hold. The hold is a cure's own rule (estimateHold, with the sizes the
 * components give); the other kinds have none. Lead days are the formula's, else the kitchen's
 * default (lead-days.ts).
 * @throws PlanError 'needs-size' when a cure's hold rule needs a size nobody gave
 */
export function plannedDates(
  formula: BatchFormula,
  sizes: HoldMeasures,
  serviceDate: string,
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
  const start = addDays(serviceDate, -(holdDays + lead.days));
  const ready = addDays(start, holdDays);
  const leadWords =
    lead.days === 0
      ? `made on the day of service (lead 0 days: ${lead.source})`
      : `${daysInWords(lead.days)} before service (lead days: ${lead.source})`;
  const dates =
    holdDays > 0
      ? `start ${start}, ready ${ready}, service ${serviceDate}`
      : `start ${start}, service ${serviceDate}`;
  return {
    start,
    ready,
    holdDays,
    leadDays: lead.days,
    rule: `${holdWords}${leadWords}: ${dates}`,
  };
}
