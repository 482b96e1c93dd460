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
  process: number | null;
}

/**
 * Who gets process alerts (a reading overdue, a cooling stage near its deadline, a deviation
 * opened) until they choose: admins and cooks, who are at the smoker and the chiller. Reviewers
 * see deviations on the records they review.
 */
export const PROCESS_ALERT_DEFAULTS: Readonly<Record<Role, boolean>> = {
  admin: true,
  cook: true,
  reviewer: false,
};

/** The SQL of a role's default for a choice, as a CASE over p.role. */
function byRole(defaults: Readonly<Record<Role, boolean>>): string {
  return (Object.keys(defaults) as Role[])
    .map((role) => `WHEN '${role}' THEN ${defaults[role] ? 1 : 0}`)
    .join(' ');
}

/** The column of a kind; only ever one of these three names reaches the SQL. */
function column(kind: ReminderKind): string {
  if (!REMINDER_KINDS.includes(kind)) throw new Error(`unknown reminder kind ${String(kind)}`);
  return kind;
}

/**
 * The people with a role at site ?: their role there (site_roles), else their role at every
 * site; a person with neither is not joined. The recipients' queries select from it as `p`, so a
 * role's default choice is the default of the role at the record's site.
 */
const PEOPLE_AT_SITE = `(SELECT p.id, p.username, p.display_name, p.email, p.active,
    COALESCE(sr.role, CASE WHEN p.role_everywhere = 1 THEN p.role END) AS role
  FROM people p LEFT JOIN site_roles sr ON sr.person_id = p.id AND sr.site_id = ?
  WHERE sr.role IS NOT NULL OR p.role_everywhere = 1)`;

/** Each person's reminder choices; without a row of their own, the defaults of their role apply. */
export class ReminderPrefsRepository {
  constructor(private readonly db: Database) {}

  /** A person's choices, and whether they made them (false: their role's defaults). */
  async get(person: {
    id: number;
    role: Role;
  }): Promise<{ choices: ReminderChoices; chosen: boolean; processAlerts: boolean }> {
    const [row] = await this.db.sequelize.query<PrefsRow>(
      'SELECT flip, ready, overdue, process FROM reminder_prefs WHERE person_id = ?',
      { replacements: [person.id], type: QueryTypes.SELECT },
    );
    const processDefault = PROCESS_ALERT_DEFAULTS[person.role];
    if (!row)
      return {
        choices: DEFAULT_CHOICES[person.role],
        chosen: false,
        processAlerts: processDefault,
      };
    return {
      choices: { flip: row.flip === 1, ready: row.ready === 1, overdue: row.overdue === 1 },
      chosen: true,
      processAlerts: row.process === null ? processDefault : row.process === 1,
    };
  }

  /** Stores whether a person gets process alerts, inside the caller's transaction. */
  async setProcessAlerts(
    transaction: Transaction,
    person: { id: number; role: Role },
    wanted: boolean,
    at: string,
  ): Promise<void> {
    const defaults = DEFAULT_CHOICES[person.role];
    // A person who never chose keeps their role's reminder defaults beside this choice.
    await this.db.sequelize.query(
      `INSERT INTO reminder_prefs (person_id, flip, ready, overdue, process, updated_at)
       VALUES (?, ?, ?, ?, ?, ?)
       ON CONFLICT (person_id) DO UPDATE SET process = excluded.process, updated_at = excluded.updated_at`,
      {
        replacements: [
          person.id,
          defaults.flip ? 1 : 0,
          defaults.ready ? 1 : 0,
          defaults.overdue ? 1 : 0,
          wanted ? 1 : 0,
          at,
        ],
        transaction,
      },
    );
  }

  /**
   * Everyone with a role at the site who gets process alerts: active, with an e-mail address,
   * and wanting them (by their own choice, or the default of their role there).
   */
  async processAlertRecipients(transaction: Transaction, siteId: number): Promise<Recipient[]> {
    return this.db.sequelize.query<Recipient>(
      `SELECT p.id, p.username, p.display_name AS "displayName", p.email
       FROM ${PEOPLE_AT_SITE} p LEFT JOIN reminder_prefs r ON r.person_id = p.id
       WHERE p.active = 1 AND p.email IS NOT NULL AND p.email <> ''
         AND COALESCE(r.process, CASE p.role ${byRole(PROCESS_ALERT_DEFAULTS)} ELSE 0 END) = 1
       ORDER BY p.id`,
      { replacements: [siteId], type: QueryTypes.SELECT, transaction },
    );
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
   * Everyone with a role at the site who gets a kind of reminder: active, with an e-mail address,
   * and wanting it (by their own choice, or the default of their role there).
   */
  async recipients(
    transaction: Transaction,
    kind: ReminderKind,
    siteId: number,
  ): Promise<Recipient[]> {
    const name = column(kind);
    const defaults = Object.fromEntries(
      (Object.keys(DEFAULT_CHOICES) as Role[]).map((role) => [role, DEFAULT_CHOICES[role][kind]]),
    ) as Record<Role, boolean>;
    return this.db.sequelize.query<Recipient>(
      `SELECT p.id, p.username, p.display_name AS "displayName", p.email
       FROM ${PEOPLE_AT_SITE} p LEFT JOIN reminder_prefs r ON r.person_id = p.id
       WHERE p.active = 1 AND p.email IS NOT NULL AND p.email <> ''
         AND COALESCE(r.${name}, CASE p.role ${byRole(defaults)} ELSE 0 END) = 1
       ORDER BY p.id`,
      { replacements: [siteId], type: QueryTypes.SELECT, transaction },
    );
  }
}
