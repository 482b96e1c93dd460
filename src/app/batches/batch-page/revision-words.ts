import type { FormulaRevision } from '../../../../shared/api/formula-api.ts';
import { revisionInWords } from '../../formulas/revision-words.ts';

/** What the formula's history knows of one revision: its record, or whether it is on disk now. */
export type RevisionFacts = Partial<Omit<FormulaRevision, 'revision'>> & {
  readonly current?: boolean;
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
  if (facts.source && facts.source !== 'disk') {
    const on = facts.at ? ` on ${day(facts.at)}` : '';
    const made = revisionInWords({ source: facts.source, author: facts.author ?? null });
    return `the formula as ${made}${on} (${since})`;
  }
  if (facts.source === 'disk' && facts.at)
    return `the formula as changed in the files, found on ${day(facts.at)} (${since})`;
  return facts.current
    ? 'the formula as it is in the files now'
    : 'the formula as changed in the files (it has changed since)';
}
