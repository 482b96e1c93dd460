import { dayWords } from '../../../../shared/presentation/date-words.ts';

// The server writes this note on every batch it records from a plan (server/plans/record-plan.ts)
// and finds a plan's batches again by it, so the stored text keeps its ids and ISO day.
const PLAN_NOTE = /^plan: (\S+) ×(\d+) for (\d{4}-\d{2}-\d{2})$/;

/**
 * A batch's notes as a cook reads them: the note of a batch recorded from a plan becomes
 * "Recorded from the plan for 120 × Smokehouse burger, for the service on 18 Dec 2026";
 * any other note comes back as it was written.
 * @param titleOf the title of a formula by its id, or undefined when it is not known
 */
export function notesInWords(notes: string, titleOf: (id: string) => string | undefined): string {
  const plan = PLAN_NOTE.exec(notes.trim());
  if (!plan) return notes;
  const [, assembly, count, serviceDate] = plan;
  const title = titleOf(assembly) ?? 'a menu item';
  return `Recorded from the plan for ${count} × ${title}, for the service on ${dayWords(serviceDate)}`;
}
