import { QueryTypes, type Transaction } from 'sequelize';
import {
  PERSON_SUBJECTS,
  type AuditAction,
  type AuditEvent,
} from '../../shared/api/audit-event.ts';
import type { Database } from '../db/database.ts';
import { asUsername, equalsIgnoringCase } from '../db/dialect-sql.ts';

/** What to append: who did what to what. */
export interface AuditEntry {
  actor?: { id: number; username: string } | null;
  /** For failed sign-ins: the name that was tried. */
  actorName?: string;
  action: AuditAction;
  subject?: string;
  detail?: unknown;
  ip?: string;
}

interface AuditRow {
  id: number;
  actor_display_name: string | null;
  subject_display_name: string | null;
  at: string;
  actor_id: number | null;
  actor_name: string | null;
  action: AuditAction;
  subject: string | null;
  detail: string | null;
  ip: string | null;
}

/** Which entries to read: a page before an id, narrowed by action, person, subject and time. */
export interface AuditQuery {
  limit: number;
  before?: number;
  action?: AuditAction;
  /** The username of who did it (for a failed sign-in, the name that was tried). */
  actor?: string;
  /** What it was done to, exactly: a lot code, a formula id, a username. */
  subject?: string;
  /** From this instant (ISO 8601, UTC), inclusive. */
  from?: string;
  /** Before this instant (ISO 8601, UTC). */
  to?: string;
}

/** The append-only audit log: there is no update and no delete. */
export class AuditRepository {
  constructor(private readonly db: Database) {}

  /** Appends an entry: inside the caller's transaction, or as a write of its own. */
  async append(entry: AuditEntry, transaction?: Transaction): Promise<void> {
    if (!transaction) return this.db.write((own) => this.append(entry, own));
    await this.db.sequelize.query(
      'INSERT INTO audit_events (at, actor_id, actor_name, action, subject, detail, ip) VALUES (?, ?, ?, ?, ?, ?, ?)',
      {
        replacements: [
          new Date().toISOString(),
          entry.actor?.id ?? null,
          entry.actor?.username ?? entry.actorName ?? null,
          entry.action,
          entry.subject ?? null,
          entry.detail === undefined ? null : JSON.stringify(entry.detail),
          entry.ip ?? null,
        ],
        transaction,
      },
    );
  }

  /**
   * The newest entries first, `limit` at a time, before the entry with id `before`, narrowed by
   * the filters given. Each entry carries the display names of its actor and, when the subject
   * is a person, of its subject, as they are now.
   */
  async list(options: AuditQuery): Promise<AuditEvent[]> {
    const dialect = this.db.dialect;
    const where: string[] = [];
    const values: unknown[] = [];
    if (options.before !== undefined) {
      where.push('a.id < ?');
      values.push(options.before);
    }
    if (options.action) {
      where.push('a.action = ?');
      values.push(options.action);
    }
    if (options.actor) {
      where.push(equalsIgnoringCase(dialect, 'a.actor_name', '?'));
      values.push(options.actor);
    }
    if (options.subject) {
      where.push(equalsIgnoringCase(dialect, 'a.subject', '?'));
      values.push(options.subject);
    }
    // Instants are written by toISOString, so comparing the text compares the times.
    if (options.from) {
      where.push('a.at >= ?');
      values.push(options.from);
    }
    if (options.to) {
      where.push('a.at < ?');
      values.push(options.to);
    }
    const rows = await this.db.sequelize.query<AuditRow>(
      `SELECT a.*, actor.display_name AS actor_display_name,
         subject.display_name AS subject_display_name
       FROM audit_events a
       LEFT JOIN people actor ON actor.id = a.actor_id
         OR (a.actor_id IS NULL AND actor.username = ${asUsername(dialect, 'a.actor_name')})
       LEFT JOIN people subject ON subject.username = ${asUsername(dialect, 'a.subject')}
         AND a.action IN (${PERSON_SUBJECTS.map(() => '?').join(', ')})
       ${where.length ? `WHERE ${where.join(' AND ')}` : ''} ORDER BY a.id DESC LIMIT ?`,
      {
        replacements: [...PERSON_SUBJECTS, ...values, options.limit],
        type: QueryTypes.SELECT,
      },
    );
    return rows.map((row) => ({
      id: row.id,
      at: row.at,
      actorId: row.actor_id,
      actorName: row.actor_name,
      actorDisplayName: row.actor_display_name,
      action: row.action,
      subject: row.subject,
      subjectDisplayName: row.subject_display_name,
      detail: row.detail === null ? null : (JSON.parse(row.detail) as unknown),
      ip: row.ip,
    }));
  }
}
