import type { BatchFormula } from '../../formula/formula-types.ts';

/**
 * Days between a sub-batch being ready and service when the formula gives no `lead_days`. These
 * are the kitchen's own rule (common practice, no source), not food-safety figures:
 * - a cure: 1 day after the hold, for rinsing, drying, smoking, resting and slicing;
 * - a dough with a preferment: 1 day, the preferment being mixed the evening before;
 * - any other dough, a blend, a mix: 0, made on the day of service.
 */
export const DEFAULT_LEAD_DAYS = {
  /** common practice, no source: the kitchen's own rule */
  cure: 1,
  /** common practice, no source: the kitchen's own rule */
  doughWithPreferment: 1,
  /** common practice, no source: the kitchen's own rule */
  other: 0,
} as const;

/** A formula's lead days and where they came from, in words. */
export interface LeadDays {
  readonly days: number;
  /** "the formula's own", or the default with what it is for. */
  readonly source: string;
}

/** A number of days in words: "1 day", "8 days". */
export function daysInWords(days: number): string {
  return days === 1 ? '1 day' : `${days} days`;
}

/**
 * The days between a formula's batch being ready and service: its own `lead_days`, else the
 * default for its kind ({@link DEFAULT_LEAD_DAYS}).
 */
export function leadDaysOf(formula: BatchFormula): LeadDays {
  if (formula.lead_days !== undefined) {
    // In a cook's words: the sheet never names a field of the formula file.
    return { days: formula.lead_days, source: "the formula's own" };
  }
  const rule = "the kitchen's own rule, common practice, no source";
  switch (formula.kind) {
    case 'cure':
      return {
        days: DEFAULT_LEAD_DAYS.cure,
        source: `default for a cure: ${daysInWords(DEFAULT_LEAD_DAYS.cure)} after the hold for smoking, resting and slicing (${rule})`,
      };
    case 'dough':
      return formula.preferment
        ? {
            days: DEFAULT_LEAD_DAYS.doughWithPreferment,
            source: `default for a dough with a preferment: the ${formula.preferment.name} is mixed the evening before (${rule})`,
          }
        : {
            days: DEFAULT_LEAD_DAYS.other,
            source: `default for a dough without a preferment: made on the day (${rule})`,
          };
    case 'blend':
    case 'mix':
      return {
        days: DEFAULT_LEAD_DAYS.other,
        source: `default for a ${formula.kind}: made on the day (${rule})`,
      };
  }
}
