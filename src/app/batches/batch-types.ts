/**
 * The shapes the batches API answers with. The batch record itself is declared once, in
 * shared/api/batch-record.ts (types only), for the server and the console alike.
 */
import type { FormulaKind, HoldRule } from '../../../shared/formula/formula-types.ts';
import type { PresentedResult } from '../../../shared/presentation/presented-result.ts';

export type { RawBatchOptions } from '../../../shared/calculation/batch-input.ts';
export type {
  Batch,
  BatchEvent,
  BatchListItem,
  BatchPage,
  BatchStatus,
  BatchSummary,
  BatchTurn,
  PersonRef,
} from '../../../shared/api/batch-record.ts';
export type { FormulaKind } from '../../../shared/formula/formula-types.ts';
export type {
  PresentedCheck,
  PresentedResult,
} from '../../../shared/presentation/presented-result.ts';

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
  /** Cures: the formula's own hold rule, when it has one. */
  readonly hold?: HoldRule;
  /** Doughs: a preferment takes its own temperature. */
  readonly preferment?: unknown;
  /** Blends: the trimmings (two to five), by key. */
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
