import type { LotUse, TraceCut, TraceSearch, TracedLot } from '../api/trace-record.ts';
import { dayWords } from './date-words.ts';
import { lotAmountWords } from './lot-amount.ts';

/** What was searched for: "supplier lot 4471 from Hollin Farm", "lot R261203-01". */
export function searchWords(search: TraceSearch): string {
  if ('lot' in search) return `lot ${search.lot}`;
  return `supplier lot ${search.supplierLot}${search.supplier ? ` from ${search.supplier}` : ''}`;
}

/** A batch's status as a cook says it: "in progress". */
export function batchStatusWords(status: string): string {
  return status.replace(/-/g, ' ');
}

/** The name of a lot: its item or product, and its code: "Pork belly R261201-01". */
export function lotName(lot: TracedLot): string {
  return `${lot.kind === 'receipt' ? lot.itemName : lot.formula.title} ${lot.lotCode}`;
}

/**
 * An establishment number as the facts of a lot say it: as typed when it already reads as the
 * mark of inspection does ("EST. 38214"), else named ("est. P-4821"), never "est. EST. 38214".
 */
export function establishmentWords(establishment: string): string {
  return /^est\b/i.test(establishment.trim()) ? establishment.trim() : `est. ${establishment}`;
}

/**
 * The facts of a lot after its name. A received lot: "Hollin Farm lot 4471 · est. M1234 ·
 * received 1 Dec 2026 · 2.000 kg left"; a batch: "curing · started 3 Dec 2026 · ready 10 Dec 2026 ·
 * for service 8 Dec 2026".
 */
export function lotFacts(lot: TracedLot): string {
  if (lot.kind === 'receipt')
    return [
      `${lot.supplier} lot ${lot.supplierLot}`,
      ...(lot.establishment ? [establishmentWords(lot.establishment)] : []),
      `received ${dayWords(lot.receivedOn)}`,
      ...(lot.useBy ? [`use by ${dayWords(lot.useBy)}`] : []),
      lot.decision === 'refused'
        ? 'refused at the door'
        : lot.emptiedOn
          ? `used up ${dayWords(lot.emptiedOn)}`
          : `${lotAmountWords(lot.remaining, lot.measure)} left`,
    ].join(' · ');
  return [
    batchStatusWords(lot.status),
    `started ${dayWords(lot.startedOn)}`,
    ...(lot.readyOn ? [`ready ${dayWords(lot.readyOn)}`] : []),
    ...(lot.serviceDay ? [`for service ${dayWords(lot.serviceDay)}`] : []),
  ].join(' · ');
}

/** How much was used and when: "6.000 kg on 1 Dec 2026". */
export function useWords(use: LotUse): string {
  return `${lotAmountWords(use.amount, use.measure)} on ${dayWords(use.usedOn)}`;
}

/** Why a branch stops, in words. */
export const CUT_WORDS: Readonly<Record<TraceCut, string>> = {
  'shown-above': 'shown in full above',
  cycle: 'listed among its own ingredients: a record to correct',
  depth: 'goes deeper than a trace follows',
};
