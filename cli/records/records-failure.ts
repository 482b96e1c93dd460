import { FORMULA_REFUSALS, type PlanRefusal } from '../../shared/index.ts';
import type { PlanAlreadyRecorded } from '../../shared/api/plan-record.ts';
import type { RecordsFailure } from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';

/** What a larder verb does with the records; each says its failures in its own words. */
export type RecordsVerb =
  | 'record'
  | 'list'
  | 'show'
  | 'users'
  | 'backup'
  | 'reading'
  | 'report'
  | 'trace'
  | 'recall'
  | 'receive'
  | 'stock';

/** A failure of record keeping, from this machine's records or a server's answer. */
export interface RecordsFailureFacts {
  readonly kind: RecordsFailure;
  readonly code: string;
  readonly message: string;
  readonly details: readonly unknown[];
}

/** What is not there: the formula of a batch being recorded (exit 3), else what was asked for (2). */
const NOT_FOUND_EXIT: Readonly<Record<RecordsVerb, number>> = {
  record: EXIT.formula,
  list: EXIT.usage,
  show: EXIT.usage,
  users: EXIT.usage,
  backup: EXIT.usage,
  reading: EXIT.usage,
  report: EXIT.usage,
  trace: EXIT.usage,
  recall: EXIT.usage,
  receive: EXIT.usage,
  stock: EXIT.usage,
};

/** Whether a refusal is a formula file's fault: its errors, or a plan refused over one. */
function formulaAtFault({ code, details }: RecordsFailureFacts): boolean {
  if (code === 'invalid-formula') return true;
  const reason = (details[0] as { reason?: unknown } | undefined)?.reason;
  return code === 'plan-refused' && FORMULA_REFUSALS.includes(reason as PlanRefusal);
}

/** The exit code of a failure: a refused batch 4, a formula at fault 3, else as the verb says. */
function exitCodeOf(failure: RecordsFailureFacts, verb: RecordsVerb): number {
  if (failure.code === 'critical-limit') return EXIT.critical;
  if (formulaAtFault(failure)) return EXIT.formula;
  // A site named with --site is the command line's, whatever the verb.
  if (failure.kind === 'not-found' && failure.code !== 'no-such-site') return NOT_FOUND_EXIT[verb];
  return EXIT.usage;
}

/** A detail as a line under the message: a check's or problem's sentence, else its JSON. */
function lineOf(detail: unknown): string {
  return typeof detail === 'object' && detail && 'sentence' in detail
    ? String(detail.sentence)
    : JSON.stringify(detail);
}

/**
 * Failures whose message already says all its details do: a refused batch, a bad logger file, a
 * cure without the size its hold goes by.
 */
const SAID_IN_FULL = new Set(['critical-limit', 'bad-log', 'hold-size-needed']);

/** A plan recorded before: its lots, one a line, and how to record new batches all the same. */
function alreadyRecordedLines(details: readonly unknown[]): string[] {
  const batches = (details[0] as Partial<PlanAlreadyRecorded> | undefined)?.batches ?? [];
  return [
    ...batches.map((b) => `  lot ${b.lotCode} · ${b.formula.id} · ${b.status}`),
    'give --again to record new batches for it as well',
  ];
}

/** What `larder receive` is missing, in its own options. */
const RECEIVE_HINTS: Readonly<Record<string, string>> = {
  'decision-needed':
    'give --refuse, or --accept with --cause, --restored, --prevention and --disposition',
  'action-needed': 'give --cause, --restored, --prevention and --disposition',
  'establishment-needed': 'give --establishment',
  'temperature-needed': 'give --temperature',
  'frozen-needed': 'give --frozen solid or --frozen thawed',
  'note-needed': 'give --note saying why',
};

/**
 * The one place record keeping's failures become the command's: the exit code and the lines
 * under the message. A refused batch's message already names every failed check, a refused
 * logger file's the line at fault; a plan recorded before lists the lots it has.
 */
export function cliErrorOf(failure: RecordsFailureFacts, verb: RecordsVerb): CliError {
  const hint = verb === 'receive' ? RECEIVE_HINTS[failure.code] : undefined;
  if (hint) return new CliError(failure.message, exitCodeOf(failure, verb), [hint]);
  const details =
    failure.code === 'plan-already-recorded'
      ? alreadyRecordedLines(failure.details)
      : SAID_IN_FULL.has(failure.code)
        ? []
        : failure.details.map(lineOf);
  return new CliError(failure.message, exitCodeOf(failure, verb), details);
}

/** The verbs that act as a person, and how each asks for them. */
const WHO = {
  record: 'say who is recording',
  list: 'say who is reading',
  show: 'say who is reading',
  reading: 'say who took the reading',
  report: 'say who is producing the report',
  trace: 'say who is reading',
  recall: 'say who is producing the recall report',
  receive: 'say who is receiving the delivery',
  stock: 'say who is reading',
} as const;

/** A verb that acts as a person: recording, or reading a server's log. */
export type PersonVerb = keyof typeof WHO;

/**
 * The person a verb needs is not given: set LARDER_USER and LARDER_PASSWORD (to sign in to the
 * server at `url`, when it is one).
 */
export function personNeeded(verb: PersonVerb, url?: string): CliError {
  return new CliError(
    `${WHO[verb]}: set LARDER_USER and LARDER_PASSWORD${url ? ` to sign in to the server at ${url}` : ''}`,
    EXIT.usage,
  );
}
