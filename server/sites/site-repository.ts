import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import { jsonArrayText, jsonObject, type Dialect } from '../db/dialect-sql.ts';
import { readRows } from '../db/read-row.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import type { SiteRole } from '../../shared/api/site.ts';

/** A site as stored. */
export interface Site {
  readonly id: number;
  readonly key: string;
  readonly name: string;
  readonly createdAt: string;
}

/** A site of the install with one person's role there (null: they have none, and cannot see it). */
export interface SiteWithRole extends Site {
  readonly role: Role | null;
}

interface SiteRow {
  id: number;
  key: string;
  name: string;
  created_at: string;
  site_role: Role | null;
}

const toSite = (row: SiteRow): Site => ({
  id: row.id,
  key: row.key,
  name: row.name,
  createdAt: row.created_at,
});

/** Every site, first made first, with one person's role at each (joined on the person id). */
const SITES_FOR_PERSON = `SELECT s.id, s.key, s.name, s.created_at, r.role AS site_role
  FROM sites s LEFT JOIN site_roles r ON r.site_id = s.id AND r.person_id = ?
  ORDER BY s.id`;

/**
 * The role a person has at one site: their role there when site_roles gives one, else their
 * role at every site when they have one, else none.
 */
export function roleAt(person: Person, siteRole: Role | null): Role | null {
  return siteRole ?? (person.roleEverywhere === false ? null : person.role);
}

/** A site with the role site_roles gives one person there (null: none of its own). */
export interface SiteWithSiteRole extends Site {
  readonly siteRole: Role | null;
}

/**
 * Every site with the site_roles role of the person whose id is the SQL `personId`, as one JSON
 * text column: the session's statement reads it with the person, so a cookie-signed request
 * needs no second read to choose its site (still read afresh on every request).
 */
export function sitesOfPersonJson(dialect: Dialect, personId: string): string {
  const site = jsonObject(
    dialect,
    `'id', site.id, 'key', site.key, 'name', site.name, 'createdAt', site.created_at, 'siteRole', site_role.role`,
  );
  return `(SELECT ${jsonArrayText(dialect, site, ' ORDER BY site.id')}
      FROM sites site LEFT JOIN site_roles site_role
        ON site_role.site_id = site.id AND site_role.person_id = ${personId})`;
}

/** Each site with the role a person has there (roleAt). */
export function withRoles(person: Person, sites: readonly SiteWithSiteRole[]): SiteWithRole[] {
  return sites.map(({ siteRole, ...site }) => ({ ...site, role: roleAt(person, siteRole) }));
}

/** The sites of the group and people's roles at each. Plain objects in, plain objects out. */
export class SiteRepository {
  constructor(private readonly db: Database) {}

  /**
   * Every site with the person's role there: one small read, made on every request (a role
   * given or taken away holds from the next request, in every server process).
   */
  async forPerson(person: Person): Promise<SiteWithRole[]> {
    const rows = await readRows<SiteRow>(this.db.sequelize, SITES_FOR_PERSON, [person.id]);
    return withRoles(
      person,
      rows.map((row) => ({ ...toSite(row), siteRole: row.site_role })),
    );
  }

  /** How many sites the install has. */
  async count(): Promise<number> {
    const rows = await readRows<{ n: number | string }>(
      this.db.sequelize,
      'SELECT COUNT(*) AS n FROM sites',
      [],
    );
    // PostgreSQL's COUNT is a bigint, which comes back as text.
    return Number(rows[0]?.n ?? 0);
  }

  /** Every site, first made first. */
  async list(transaction?: Transaction): Promise<Site[]> {
    const rows = await this.db.sequelize.query<SiteRow>(
      'SELECT id, key, name, created_at FROM sites ORDER BY id',
      { type: QueryTypes.SELECT, transaction },
    );
    return rows.map(toSite);
  }

  /** One site by key, or undefined. */
  async byKey(key: string, transaction?: Transaction): Promise<Site | undefined> {
    return (await this.list(transaction)).find((site) => site.key === key);
  }

  /** Adds a site; the caller holds the write and has checked the key is free. */
  async add(key: string, name: string, transaction: Transaction): Promise<Site> {
    await this.db.sequelize.query('INSERT INTO sites (key, name, created_at) VALUES (?, ?, ?)', {
      replacements: [key, name, new Date().toISOString()],
      transaction,
    });
    const site = await this.byKey(key, transaction);
    if (!site) throw new Error(`site ${key} was not stored`);
    return site;
  }

  /** Renames a site; the key stays (it is in people's links and scripts). */
  async rename(id: number, name: string, transaction: Transaction): Promise<void> {
    await this.db.sequelize.query('UPDATE sites SET name = ? WHERE id = ?', {
      replacements: [name, id],
      transaction,
    });
  }

  /** Each person's roles at single sites, by person id, sites in the order they were made. */
  async rolesOfPeople(transaction?: Transaction): Promise<Map<number, SiteRole[]>> {
    const rows = await this.db.sequelize.query<{ person_id: number; key: string; role: Role }>(
      `SELECT r.person_id, s.key, r.role FROM site_roles r JOIN sites s ON s.id = r.site_id
        ORDER BY r.person_id, s.id`,
      { type: QueryTypes.SELECT, transaction },
    );
    const roles = new Map<number, SiteRole[]>();
    for (const row of rows) {
      const list = roles.get(row.person_id) ?? [];
      list.push({ key: row.key, role: row.role });
      roles.set(row.person_id, list);
    }
    return roles;
  }

  /** Puts a person's roles at single sites to exactly `roles` (sites by id); the caller holds the write. */
  async setRoles(
    personId: number,
    roles: readonly { siteId: number; role: Role }[],
    transaction: Transaction,
  ): Promise<void> {
    await this.db.sequelize.query('DELETE FROM site_roles WHERE person_id = ?', {
      replacements: [personId],
      transaction,
    });
    for (const { siteId, role } of roles)
      await this.db.sequelize.query(
        'INSERT INTO site_roles (person_id, site_id, role) VALUES (?, ?, ?)',
        { replacements: [personId, siteId, role], transaction },
      );
  }
}
