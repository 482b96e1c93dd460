import { QueryTypes, type Transaction } from 'sequelize';
import type { AuditAction, AuditEvent } from '../../shared/api/audit-event.ts';
import type { Database } from '../db/database.ts';

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
  at: string;
  actor_id: number | null;
  actor_name: string | null;
  action: AuditAction;
  subject: string | null;
  detail: string | null;
  ip: string | null;
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

  /** The newest entries first, `limit` at a time, before the entry with id `before`. */
  async list(options: {
    limit: number;
    before?: number;
    action?: AuditAction;
  }): Promise<AuditEvent[]> {
    const where: string[] = [];
    const values: unknown[] = [];
    if (options.before !== undefined) {
      where.push('id < ?');
      values.push(options.before);
    }
    if (options.action) {
      where.push('action = ?');
      values.push(options.action);
    }
    const rows = await this.db.sequelize.query<AuditRow>(
      `SELECT * FROM audit_events ${where.length ? `WHERE ${where.join(' AND ')}` : ''} ORDER BY id DESC LIMIT ?`,
      { replacements: [...values, options.limit], type: QueryTypes.SELECT },
    );
    return rows.map((row) => ({
      id: row.id,
      at: row.at,
      actorId: row.actor_id,
      actorName: row.actor_name,
      action: row.action,
      subject: row.subject,
      detail: row.detail === null ? null : (JSON.parse(row.detail) as unknown),
      ip: row.ip,
    }));
  }
}
