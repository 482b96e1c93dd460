import type { PresentedPlanBatch } from './plan-types';

/** The number of days in words: "1 day", "8 days". */
function days(n: number): string {
  return `${n} ${n === 1 ? 'day' : 'days'}`;
}

/**
 * When a batch of a plan is made, in a cook's words, from its start, hold and lead days: "Made on
 * the day of service.", "Made 1 day before service.", "Cures 8 days, then 2 days to finish before
 * service." The core's own account of the rule (with the formula's keys) stays for whoever checks
 * it, folded away.
 */
export function whenInWords(
  batch: Pick<PresentedPlanBatch, 'holdDays' | 'leadDays' | 'goesOn'>,
): string {
  const forWhat = batch.goesOn?.length ? 'before it goes on' : 'before service';
  if (batch.holdDays > 0) {
    const finish =
      batch.leadDays === 0
        ? `ready the day it is needed`
        : `then ${days(batch.leadDays)} to finish ${forWhat}`;
    return `Cures ${days(batch.holdDays)}, ${finish}.`;
  }
  if (batch.leadDays === 0)
    return batch.goesOn?.length ? 'Made the day it goes on.' : 'Made on the day of service.';
  return `Made ${days(batch.leadDays)} ${forWhat}.`;
}

/**
 * A note of the calculation in a cook's words where the core's is a textbook's: the dough's loss
 * allowance says what it does, not which of two conventions it follows. Any other note as it is.
 */
export function plainNote(note: string | undefined): string | undefined {
  if (note === undefined) return undefined;
  if (/loss taken out of the mixed dough/.test(note)) {
    const from = /^from the formula/.test(note) ? 'from the formula: ' : '';
    return `${from}extra dough is mixed so every piece still weighs out after what is lost in mixing and dividing`;
  }
  return note;
}
