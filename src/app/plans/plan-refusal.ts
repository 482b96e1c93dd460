import { ApiError } from '../core/api/api-error';
import { SOMETHING_WENT_WRONG } from '../core/api/message-of';
import type { BatchSummary } from '../batches/batch-types';
import type { PlanAlreadyRecorded, PlanRefusal } from './plan-types';

/** Why a plan was refused, ready for the screen. */
export interface PlanRefusalView {
  /** The headline: a critical limit, or a plan that cannot be made. */
  readonly title: string;
  /** The server's own words, naming the formula at fault. */
  readonly message: string;
  /** The reason in words, when the server gave one. */
  readonly reason: string | null;
  /** The id of the formula at fault, when one is. */
  readonly formula: string | null;
  /** Whether the fault is in a formula file (fix it in Formulas) rather than the count or day. */
  readonly formulaProblem: boolean;
  /** Whether a batch of the plan exceeds a critical limit: it must not be made. */
  readonly critical: boolean;
}

/** Each refusal of the plans API in words a cook reads. */
export const REASON_WORDS: Readonly<Record<PlanRefusal, string>> = {
  'bad-input': 'The count or the service day cannot be used.',
  'invalid-assembly': 'The assembly itself has errors.',
  'missing-formula': 'A part names a formula that is not in the library, or whose file has errors.',
  'wrong-kind': "A part's quantity does not fit the kind of formula it names.",
  'needs-size':
    "A cure's hold goes by a size (thickness or heaviest piece) the part does not give.",
  cycle: 'Assemblies contain each other.',
  'past-start': 'A batch would have to start before today: choose a later service day.',
  'bad-batch': 'A batch of the plan cannot be made as asked.',
  'critical-limit': 'A batch of the plan exceeds a critical limit, so it must not be made.',
};

/** One entry of a refusal's details, as the plans API sends it. */
interface RefusalDetail {
  readonly reason?: unknown;
  readonly formula?: unknown;
  readonly formulaProblem?: unknown;
}

/**
 * A failed plan request as the page shows it: the API's 422 'plan-refused' and 'critical-limit'
 * with their reason and formula, its 400 for a count or day, 404 for an assembly that is gone,
 * 422 'invalid-formula' and 'not-an-assembly'; anything else in plain words.
 */
export function refusalOf(error: unknown): PlanRefusalView {
  if (!(error instanceof ApiError)) {
    return {
      title: 'The plan could not be worked out.',
      message: SOMETHING_WENT_WRONG,
      reason: null,
      formula: null,
      formulaProblem: false,
      critical: false,
    };
  }
  const detail = (error.details.find((d) => d !== null && typeof d === 'object' && 'reason' in d) ??
    {}) as RefusalDetail;
  const code =
    typeof detail.reason === 'string' && detail.reason in REASON_WORDS
      ? (detail.reason as PlanRefusal)
      : null;
  const critical = error.code === 'critical-limit' || code === 'critical-limit';
  const formulaProblem =
    detail.formulaProblem === true ||
    error.code === 'invalid-formula' ||
    error.code === 'not-an-assembly';
  return {
    title: critical
      ? 'Refused: a batch of this plan exceeds a critical limit.'
      : error.status === 0
        ? 'The plan could not be worked out.'
        : 'This plan cannot be made.',
    message: sentence(error.message),
    reason: code ? REASON_WORDS[code] : null,
    formula: typeof detail.formula === 'string' ? detail.formula : null,
    formulaProblem,
    critical,
  };
}

/** The API's words as a sentence, ending with a full stop; a formula id leading it keeps its case. */
function sentence(text: string): string {
  const trimmed = text.trim();
  return /[.!?]$/.test(trimmed) ? trimmed : `${trimmed}.`;
}

/**
 * The batches already recorded for a plan's menu item and day, when recording was refused for
 * them (the API's 409 'plan-already-recorded'); null for any other failure.
 */
export function alreadyRecordedOf(error: unknown): readonly BatchSummary[] | null {
  if (!(error instanceof ApiError) || error.code !== 'plan-already-recorded') return null;
  const detail = error.details[0] as Partial<PlanAlreadyRecorded> | undefined;
  return Array.isArray(detail?.batches) ? detail.batches : [];
}
