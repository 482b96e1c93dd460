import type { FormulaRevision } from '../../../../shared/api/formula-api.ts';

/** What the formula's history knows of one revision: its record, or whether it is on disk now. */
export type RevisionFacts = Partial<Omit<FormulaRevision, 'revision'>> & {
  readonly current?: boolean;
};

const MADE: Readonly<Record<string, string>> = {
  save: 'edited in the console',
  create: 'created in the console',
  upload: 'uploaded in the console',
};

/**
 * The formula revision a batch was made from, in a cook's words: "the formula as edited in the
 * console by Rosa on 3 Dec 2026", "the formula as changed in the files, found on 3 Dec 2026";
 * never its hash. Says whether the formula has changed since.
 * @param facts the revision as the formula's history has it; null when it is no longer kept
 * @param day an ISO timestamp in words ("3 Dec 2026")
 */
export function revisionWords(facts: RevisionFacts | null, day: (iso: string) => string): string {
  if (!facts) return 'an earlier version of the formula, no longer kept';
  const since = facts.current ? 'still its current version' : 'it has changed since';
  const made = facts.source ? MADE[facts.source] : undefined;
  if (made) {
    const by = facts.author ? ` by ${facts.author.displayName}` : '';
    const on = facts.at ? ` on ${day(facts.at)}` : '';
    return `the formula as ${made}${by}${on} (${since})`;
  }
  if (facts.source === 'disk' && facts.at)
    return `the formula as changed in the files, found on ${day(facts.at)} (${since})`;
  return facts.current
    ? 'the formula as it is in the files now'
    : 'the formula as changed in the files (it has changed since)';
}
