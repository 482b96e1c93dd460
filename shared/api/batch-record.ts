/**
 * The batch record as the API sends it: one definition for the server, the command line and the
 * console. Types only, built from the core's own declarations (no runtime code), so the console
 * can import it without the rest of the core.
 */
import type { RawBatchOptions } from '../calculation/batch-input.ts';
import type { FormulaKind } from '../formula/formula-types.ts';
import type { PresentedCheck, PresentedResult } from '../presentation/presented-result.ts';
import type { UnitSystem } from '../units/scale-amount.ts';

/** Where a batch is: planned → in progress → curing/proofing → done, or discarded with a reason. */
export type BatchStatus = 'planned' | 'in-progress' | 'curing' | 'proofing' | 'done' | 'discarded';

/** Someone named on a batch: its operator, its reviewer, who changed it. */
export interface PersonRef {
  readonly id: number;
  readonly displayName: string;
}

/** One thing that happened to a batch; batches are never changed without one. */
export interface BatchEvent {
  readonly type: 'recorded' | 'status' | 'sign-off' | 'note';
  /** ISO timestamp. */
  readonly at: string;
  readonly by: PersonRef | null;
  readonly from: BatchStatus | null;
  readonly to: BatchStatus | null;
  /** Why: the discard reason, a status note, the reviewer's note. */
  readonly reason: string | null;
}

/** One turn (overhaul) of a curing batch, as the cook recorded it: one a day at most. */
export interface BatchTurn {
  /** The kitchen's calendar day it was turned on, YYYY-MM-DD. */
  readonly on: string;
  /** When it was recorded (ISO timestamp). */
  readonly at: string;
  readonly by: PersonRef;
  readonly note: string | null;
}

/** A batch without its full result: what the log lists and the CSV export writes. */
export interface BatchSummary {
  /** Readable and unique, YYMMDD-XX-NN: start date, formula initials, the day's sequence. */
  readonly lotCode: string;
  /** The formula as it was when the batch was calculated; revision is the file's sha-256. */
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  /** The formula's kind: an assembly's batch is its parts put together. */
  readonly kind: FormulaKind;
  readonly status: BatchStatus;
  readonly operator: PersonRef;
  /** ISO date the batch starts (the calculation's start). */
  readonly startedOn: string;
  /** ISO date it is ready, when the calculation gave one. */
  readonly readyOn: string | null;
  readonly recordedAt: string;
  readonly updatedAt: string;
  readonly units: UnitSystem;
  /** The batch options it was calculated from, as sent (the start date filled in). */
  readonly inputs: RawBatchOptions;
  /** Whether no limit check failed. A failed critical limit is never recorded at all. */
  readonly checksPassed: boolean;
  /** Cures only: the exact ingoing sodium nitrite, ppm of green weight, as a decimal string. */
  readonly nitritePpm: string | null;
  readonly signedOff: { readonly by: PersonRef; readonly at: string } | null;
  readonly discardReason: string | null;
  readonly notes: string | null;
}

/** A recorded batch with the result computed when it was recorded, and its events when read alone. */
export interface Batch extends BatchSummary {
  /** The presented result: what the cook's sheet showed, exact values as strings. */
  readonly result: PresentedResult;
  /** Oldest first; present on a single batch, absent in lists. */
  readonly events?: readonly BatchEvent[];
  /** Its turns, oldest first; present on a single batch, absent in lists. */
  readonly turns?: readonly BatchTurn[];
}

/**
 * One batch as GET /api/batches lists it: the summary and, for a cure, the ceiling its own
 * 'nitrite-max' check held it to and that check's verdict (limits are data and may differ between
 * revisions). The full result is GET /api/batches/:lot.
 */
export interface BatchListItem extends BatchSummary {
  /** The batch's 'nitrite-max' check as recorded; null when it has no ingoing nitrite figure. */
  readonly nitriteMax: Pick<PresentedCheck, 'limit' | 'status'> | null;
  /**
   * A batch still curing: turn (or overhaul) it every this many days from its start, as its
   * formula said when it was calculated; null when it is not curing or has no such rule.
   */
  readonly flipEveryDays: number | null;
  /** A batch still curing: its latest turn (day, when, by whom); null when not curing or never turned. */
  readonly lastTurn: Omit<BatchTurn, 'note'> | null;
}

/** GET /api/batches: one keyset page of the log, newest first unless sorted otherwise. */
export interface BatchPage {
  readonly items: readonly BatchListItem[];
  /** Cursor of the page after this one; null on the last page. */
  readonly next: string | null;
  /** Cursor of the page before this one; null on the first page. */
  readonly prev: string | null;
  /**
   * How many batches match the filters, on every page: exact when totalExact; otherwise the
   * server stopped counting there and more match (shown as "1000+").
   */
  readonly total: number;
  readonly totalExact: boolean;
}
