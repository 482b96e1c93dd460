import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import { readRow } from '../db/read-row.ts';
import { jsonAt, type Dialect } from '../db/dialect-sql.ts';
import { sitesOfPersonJson, type SiteWithSiteRole } from '../sites/site-repository.ts';
import { hashPassword, verifyPassword } from '../auth/passwords.ts';
import type { Person, Role } from '../../shared/api/person.ts';

interface PersonRow {
  id: number;
  username: string;
  display_name: string;
  email: string | null;
  role: Role;
  active: number;
  demo: number;
  created_at: string;
  updated_at: string;
  password_hash: string;
  sessions_valid_from: string | null;
  role_everywhere: number;
}

function toPerson(row: PersonRow): Person {
  return {
    id: row.id,
    username: row.username,
    displayName: row.display_name,
    email: row.email,
    role: row.role,
    roleEverywhere: row.role_everywhere !== 0,
    active: row.active === 1,
    demo: row.demo === 1,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

/** A signed-in person as a session sees them: who, and since when their sessions count. */
export interface SessionPerson {
  person: Person;
  /** Sessions signed in before this time (ISO) have ended: a password changed then. */
  sessionsValidFrom: string | null;
  /** Every site with the person's own role there, when read with the session (resolveSite). */
  sites?: readonly SiteWithSiteRole[];
}

/** A stored session's row, with its person's read in the same statement. */
export interface SessionRow {
  data: string | null;
  expires: string | null;
  /** Undefined when the session names no person, or one that is not in the table. */
  person?: SessionPerson;
}

/** What it takes to add a person. */
export interface NewPerson {
  username: string;
  displayName: string;
  email?: string | null;
  role: Role;
  password: string;
  demo?: boolean;
}

/** People and their passwords: plain objects in, plain objects out. */
/** A session and its person, joined on the person id the session's JSON keeps. */
const findSessionSql = (dialect: Dialect) =>
  `SELECT s.data AS session_data, s.expires AS session_expires, p.*,
          ${sitesOfPersonJson(dialect, 'p.id')} AS sites_json
     FROM "Sessions" s LEFT JOIN people p ON p.id = ${jsonAt(dialect, 's.data', ['personId'], 'integer')}
    WHERE s.sid = ?`;
const FIND_SESSION_SQL = { sqlite: findSessionSql('sqlite'), postgres: findSessionSql('postgres') };

export class PeopleRepository {
  constructor(private readonly db: Database) {}

  /** Everyone, active first, then by name. */
  async list(): Promise<Person[]> {
    const rows = await this.db.sequelize.query<PersonRow>(
      'SELECT * FROM people ORDER BY active DESC, display_name, id',
      {
        type: QueryTypes.SELECT,
      },
    );
    return rows.map(toPerson);
  }

  async findById(id: number, transaction?: Transaction): Promise<Person | undefined> {
    const [row] = await this.db.sequelize.query<PersonRow>('SELECT * FROM people WHERE id = ?', {
      replacements: [id],
      type: QueryTypes.SELECT,
      transaction,
    });
    return row ? toPerson(row) : undefined;
  }

  async findByUsername(username: string, transaction?: Transaction): Promise<Person | undefined> {
    const [row] = await this.db.sequelize.query<PersonRow>(
      'SELECT * FROM people WHERE username = ?',
      {
        replacements: [username],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    return row ? toPerson(row) : undefined;
  }

  /** How many people there are, for "is this the first admin". */
  async count(): Promise<number> {
    const [row] = await this.db.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM people', {
      type: QueryTypes.SELECT,
    });
    return row.n;
  }

  /**
   * A person and their stored password hash, for checking a password (server/auth/sign-ins.ts);
   * undefined for an unknown username. Read afresh every time.
   */
  async credentials(
    username: string,
  ): Promise<{ person: Person; passwordHash: string } | undefined> {
    // Every HTTP Basic request asks this: one plain read (readRow), not Sequelize's query path.
    const row = await readRow<PersonRow>(
      this.db.sequelize,
      'SELECT * FROM people WHERE username = ?',
      [username],
    );
    return row ? { person: toPerson(row), passwordHash: row.password_hash } : undefined;
  }

  /**
   * The person a username and password belong to, when the password is right and the person is
   * active; otherwise undefined (without saying which part was wrong). For someone signed in
   * already confirming their password, and for the command line: people signing in go through
   * SignIns, which limits their attempts.
   */
  async authenticate(username: string, password: string): Promise<Person | undefined> {
    const account = await this.credentials(username);
    const ok = await verifyPassword(password, account?.passwordHash, 'account');
    return ok && account?.person.active ? account.person : undefined;
  }

  async add(person: NewPerson, transaction?: Transaction): Promise<Person> {
    const now = new Date().toISOString();
    const hash = await hashPassword(person.password);
    await this.db.sequelize.query(
      `INSERT INTO people (username, display_name, email, role, password_hash, active, demo, created_at, updated_at)
       VALUES (?, ?, ?, ?, ?, 1, ?, ?, ?)`,
      {
        replacements: [
          person.username,
          person.displayName,
          person.email ?? null,
          person.role,
          hash,
          person.demo ? 1 : 0,
          now,
          now,
        ],
        transaction,
      },
    );
    const [row] = await this.db.sequelize.query<PersonRow>(
      'SELECT * FROM people WHERE username = ?',
      {
        replacements: [person.username],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    return toPerson(row);
  }

  /** Changes name, e-mail, role or active state; returns the person as they are now. */
  async update(
    id: number,
    changes: {
      displayName?: string;
      email?: string | null;
      role?: Role;
      roleEverywhere?: boolean;
      active?: boolean;
    },
    transaction?: Transaction,
  ): Promise<Person | undefined> {
    const sets: string[] = [];
    const values: unknown[] = [];
    if (changes.displayName !== undefined) {
      sets.push('display_name = ?');
      values.push(changes.displayName);
    }
    if (changes.email !== undefined) {
      sets.push('email = ?');
      values.push(changes.email);
    }
    if (changes.role !== undefined) {
      sets.push('role = ?');
      values.push(changes.role);
    }
    if (changes.roleEverywhere !== undefined) {
      sets.push('role_everywhere = ?');
      values.push(changes.roleEverywhere ? 1 : 0);
    }
    if (changes.active !== undefined) {
      sets.push('active = ?');
      values.push(changes.active ? 1 : 0);
    }
    if (sets.length > 0) {
      await this.db.sequelize.query(
        `UPDATE people SET ${sets.join(', ')}, updated_at = ? WHERE id = ?`,
        {
          replacements: [...values, new Date().toISOString(), id],
          transaction,
        },
      );
    }
    return this.findById(id, transaction);
  }

  /**
   * The person a session belongs to, with the time their sessions must have started to still
   * count (moved to now by a password reset); null when every session counts.
   */
  async findForSession(id: number): Promise<SessionPerson | undefined> {
    // Every signed-in request asks this: one plain read (readRow), not Sequelize's query path.
    const row = await readRow<PersonRow>(this.db.sequelize, 'SELECT * FROM people WHERE id = ?', [
      id,
    ]);
    return row ? { person: toPerson(row), sessionsValidFrom: row.sessions_valid_from } : undefined;
  }

  /**
   * A session's row and its person in one read (every signed-in request asks this): one trip to
   * SQLite instead of two, and both read afresh, so a sign-out, deactivation, role change or new
   * password made by any server process on this database shows on the next request.
   */
  async findSession(sid: string): Promise<SessionRow | undefined> {
    const row = await readRow<
      PersonRow & {
        session_data: string | null;
        session_expires: string | null;
        sites_json: string;
      }
    >(this.db.sequelize, FIND_SESSION_SQL[this.db.dialect], [sid]);
    if (!row) return undefined;
    return {
      data: row.session_data,
      expires: row.session_expires,
      ...(row.id === null
        ? {}
        : {
            person: {
              person: toPerson(row),
              sessionsValidFrom: row.sessions_valid_from,
              sites: JSON.parse(row.sites_json) as SiteWithSiteRole[],
            },
          }),
    };
  }

  /** Sets a password and ends the person's sessions signed in before now; returns the cut-off. */
  async setPassword(id: number, password: string, transaction?: Transaction): Promise<string> {
    const hash = await hashPassword(password);
    const now = new Date().toISOString();
    await this.db.sequelize.query(
      // A new password ends every session signed in with the old one.
      'UPDATE people SET password_hash = ?, updated_at = ?, sessions_valid_from = ? WHERE id = ?',
      {
        replacements: [hash, now, now, id],
        transaction,
      },
    );
    return now;
  }

  /** How many active admins there are, so the last one is never demoted or deactivated. */
  async activeAdmins(transaction?: Transaction): Promise<number> {
    const [row] = await this.db.sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM people WHERE role = 'admin' AND role_everywhere = 1 AND active = 1",
      {
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    return row.n;
  }
}
