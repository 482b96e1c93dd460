import type { AuditEvent } from '../../../shared/api/audit-event.ts';
import { fieldsOf } from './audit-words';

/** What an entry was done to, as the log shows it: a link to its page when it has one. */
export interface AuditSubject {
  readonly text: string;
  /** The console's page of a lot or a formula; null for anything else. */
  readonly link: string | null;
}

// A lot code as the server makes them: 261203-CG-01 (server/batches/lot-code.ts).
const LOT_CODE = /^\d{6}-[A-Z0-9]{2,4}-\d{2,3}$/;
// Entries whose subject is a formula's id: its saves, and the plans made for a menu item.
const FORMULA_ACTIONS: ReadonlySet<string> = new Set([
  'formula-save',
  'formula-create',
  'formula-upload',
  'formula-disk-change',
  'plan-make',
  'plan-record',
]);

/**
 * The subject of an entry in words: a person by name, a lot or a formula with a link to its page,
 * anything else (a piece of equipment, a report's period) as written. A formula goes by its title
 * where the list of formulas has it; one since removed keeps its id.
 * @param event An audit entry.
 * @param titles The formulas' titles by id.
 * @returns The subject, or null when the entry has none.
 */
export function subjectOf(
  event: Pick<AuditEvent, 'action' | 'subject' | 'subjectDisplayName' | 'detail'>,
  titles: ReadonlyMap<string, string> = new Map(),
): AuditSubject | null {
  const subject = event.subject;
  if (!subject) return null;
  // The server names the subject only when it is a person.
  if (event.subjectDisplayName) return { text: event.subjectDisplayName, link: null };
  if (LOT_CODE.test(subject))
    return { text: `Lot ${subject}`, link: `/batches/${encodeURIComponent(subject)}` };
  const formula =
    FORMULA_ACTIONS.has(event.action) ||
    (event.action === 'calculation-refused' && fieldsOf(event.detail)['formula'] === subject);
  if (formula)
    return {
      text: titles.get(subject) ?? subject,
      link: `/formulas/${encodeURIComponent(subject)}`,
    };
  if (event.action === 'report-produce') return { text: subject.replace('..', ' to '), link: null };
  return { text: subject, link: null };
}

/**
 * Who did it, by name: the system for entries nobody made; for a failed or refused sign-in the
 * username that was tried, with the name of whoever has it.
 * @param event An audit entry.
 */
export function actorText(
  event: Pick<AuditEvent, 'action' | 'actorName' | 'actorDisplayName'>,
): string {
  if (event.action === 'sign-in-failed' || event.action === 'sign-in-throttled') {
    const tried = `someone trying “${event.actorName ?? ''}”`;
    return event.actorDisplayName ? `${tried}, the username of ${event.actorDisplayName}` : tried;
  }
  return event.actorDisplayName ?? event.actorName ?? 'the system';
}
