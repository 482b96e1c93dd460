import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import type { Role } from '../../shared/api/person.ts';
import { REMINDER_KINDS, type ReminderKind } from './reminder-schedule.ts';

/** Which reminders a person gets. */
export type ReminderChoices = Readonly<Record<ReminderKind, boolean>>;

/**
 * What each role gets until they choose: cooks and admins run the cures, so all three;
 * reviewers answer for food safety, so only a batch held past its ready day.
 */
export const DEFAULT_CHOICES: Readonly<Record<Role, ReminderChoices>> = {
  admin: { flip: true, ready: true, overdue: true },
  cook: { flip: true, ready: true, overdue: true },
  reviewer: { flip: false, ready: false, overdue: true },
};

/** Someone a reminder goes to. */
export interface Recipient {
  readonly id: number;
  readonly username: string;
  readonly displayName: string;
  readonly email: string;
}

interface PrefsRow {
  flip: number;
  ready: number;
  overdue: number;
}

/** The column of a kind; only ever one of these three names reaches the SQL. */
function column(kind: ReminderKind): string {
  if (!REMINDER_KINDS.includes(kind)) throw new Error(`unknown reminder kind ${String(kind)}`);
  return kind;
}

/** Each person's reminder choices; without a row of their own, the defaults of their role apply. */
export class ReminderPrefsRepository {
  constructor(private readonly db: Database) {}

  /** A person's choices, and whether they made them (false: their role's defaults). */
  async get(person: {
    id: number;
    role: Role;
  }): Promise<{ choices: ReminderChoices; chosen: boolean }> {
    const [row] = await this.db.sequelize.query<PrefsRow>(
      'SELECT flip, ready, overdue FROM reminder_prefs WHERE person_id = ?',
      { replacements: [person.id], type: QueryTypes.SELECT },
    );
    if (!row) return { choices: DEFAULT_CHOICES[person.role], chosen: false };
    return {
      choices: { flip: row.flip === 1, ready: row.ready === 1, overdue: row.overdue === 1 },
      chosen: true,
    };
  }

  /** Stores a person's choices inside the caller's transaction. */
  async set(
    transaction: Transaction,
    personId: number,
    choices: ReminderChoices,
    at: string,
  ): Promise<void> {
    await this.db.sequelize.query(
      `INSERT INTO reminder_prefs (person_id, flip, ready, overdue, updated_at) VALUES (?, ?, ?, ?, ?)
       ON CONFLICT (person_id) DO UPDATE SET flip = excluded.flip, ready = excluded.ready,
         overdue = excluded.overdue, updated_at = excluded.updated_at`,
      {
        replacements: [
          personId,
          choices.flip ? 1 : 0,
          choices.ready ? 1 : 0,
          choices.overdue ? 1 : 0,
          at,
        ],
        transaction,
      },
    );
  }

  /**
   * Everyone who gets a kind of reminder: active, with an e-mail address, and wanting it (by
   * their own choice, or their role's default).
   */
  async recipients(transaction: Transaction, kind: ReminderKind): Promise<Recipient[]> {
    const name = column(kind);
    const byRole = (Object.keys(DEFAULT_CHOICES) as Role[])
      .map((role) => `WHEN '${role}' THEN ${DEFAULT_CHOICES[role][kind] ? 1 : 0}`)
      .join(' ');
    return this.db.sequelize.query<Recipient>(
      `SELECT p.id, p.username, p.display_name AS displayName, p.email
       FROM people p LEFT JOIN reminder_prefs r ON r.person_id = p.id
       WHERE p.active = 1 AND p.email IS NOT NULL AND p.email <> ''
         AND COALESCE(r.${name}, CASE p.role ${byRole} ELSE 0 END) = 1
       ORDER BY p.id`,
      { type: QueryTypes.SELECT, transaction },
    );
  }
}
