/**
 * The shapes the batches API answers with, mirroring server/batches/batch.ts (the source of
 * truth). That file is not imported because its types come through shared/index.ts, which would
 * pull the whole core into the console's type check; calculation types are imported, as types
 * only, from the shared files that declare them.
 */
import type { BatchInput } from '../../../shared/calculation/batch-input.ts';
import type { FormulaKind } from '../../../shared/formula/formula-types.ts';
import type { PresentedResult } from '../../../shared/presentation/presented-result.ts';

export type { FormulaKind } from '../../../shared/formula/formula-types.ts';
export type {
  PresentedCheck,
  PresentedResult,
} from '../../../shared/presentation/presented-result.ts';

/** Batch options as typed: every value a string with its unit ("4.26 kg", "26C"). */
export type RawBatchOptions = Partial<Record<keyof BatchInput, string>>;

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

/** A batch without its full result: what the log lists and the CSV export writes. */
export interface BatchSummary {
  /** YYMMDD-XX-NN: start date, formula initials, the day's sequence. */
  readonly lotCode: string;
  /** The formula as it was when the batch was calculated; revision is the file's sha-256. */
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly kind: FormulaKind;
  readonly status: BatchStatus;
  readonly operator: PersonRef;
  /** YYYY-MM-DD the batch starts. */
  readonly startedOn: string;
  /** YYYY-MM-DD it is ready, when the calculation gave one. */
  readonly readyOn: string | null;
  readonly recordedAt: string;
  readonly updatedAt: string;
  readonly units: 'metric' | 'us';
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

/** A recorded batch with the result computed when recorded, and its events when read alone. */
export interface Batch extends BatchSummary {
  /** The presented result: what the cook's sheet showed, exact values as strings. */
  readonly result: PresentedResult;
  /** Oldest first; present on a single batch, absent in lists. */
  readonly events?: readonly BatchEvent[];
}

/** GET /api/batches: one keyset page of the log, newest first unless sorted otherwise. */
export interface BatchPage {
  readonly items: readonly Batch[];
  /** Cursor of the page after this one; null on the last page. */
  readonly next: string | null;
  /** Cursor of the page before this one; null on the first page. */
  readonly prev: string | null;
  /** How many batches match the filters, on every page. */
  readonly total: number;
}

/** One formula as GET /api/formulas lists it. */
export interface FormulaListItem {
  /** Null for a file whose id cannot be read. */
  readonly id: string | null;
  readonly title: string | null;
  readonly kind: FormulaKind | 'assembly' | null;
  readonly file: string;
  readonly revision: string;
  /** Whether the file reads as a formula that can be calculated. */
  readonly valid: boolean;
  /** Whether another file already claims this id (the API uses the first). */
  readonly duplicate: boolean;
}

/** The parts of a parsed formula (GET /api/formulas/:id) the record form looks at. */
export interface FormulaFacts {
  readonly id: string;
  readonly title: string;
  readonly kind: FormulaKind;
  /** Cures: dry, brine or pump. */
  readonly method?: 'dry' | 'brine' | 'pump';
  /** Doughs: a preferment takes its own temperature. */
  readonly preferment?: unknown;
  /** Blends: the two trimmings, by key. */
  readonly components?: readonly { readonly key: string; readonly name: string }[];
}

/** GET /api/formulas/:id, the fields used here. */
export interface FormulaDetail {
  readonly id: string;
  readonly revision: string;
  readonly formula: FormulaFacts | null;
  readonly valid: boolean;
}

/** POST /api/formulas/:id/preview. */
export interface PreviewAnswer {
  readonly id: string;
  readonly saved: boolean;
  readonly revision: string;
  readonly result: PresentedResult;
}

/** One failed critical check, as a 422 'critical-limit' refusal lists it. */
export interface RefusedCheck {
  readonly check: string;
  readonly label: string;
  readonly value: string;
  readonly limit: string;
  readonly rule: string;
  readonly source: string;
  /** The check in one plain sentence. */
  readonly sentence: string;
}
