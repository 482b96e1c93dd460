import type { QueryInterface } from 'sequelize';
import { mainSiteName } from '../../sites/main-site.ts';
import { runStatements } from './run-statements.ts';

/**
 * Sites: the kitchens of a group. An install gets one site, `main`, named after the kitchen's
 * name setting (LARDER_KITCHEN) when there is one, and every row that belongs to a kitchen —
 * batches, plans, equipment, deliveries received, refused calculations — is given it. What hangs
 * off those rows (readings, weighings, deviations, turns, the lots a batch used, calibrations)
 * belongs to its batch's, equipment's or delivery's site, so it carries no column of its own that
 * could disagree with its parent's.
 *
 * `site_id` is added NOT NULL with the default 1, the `main` site inserted first into the new
 * table (1 on both databases: an AUTOINCREMENT and an identity both start there), because SQLite
 * adds a NOT NULL column only with a default; every write names its site. No REFERENCES on it:
 * SQLite refuses a REFERENCES column with a default while foreign keys are on, and sites, like
 * everything here, are never deleted.
 *
 * People keep `role` as their role at every site; `role_everywhere = 0` says they have none there
 * (SQLite cannot make `role` nullable in place: people is the table every other one refers to),
 * and site_roles gives a role at one site, which wins over the group-wide one there.
 *
 * The site indexes serve a group's installs only: with a single site the server adds no site
 * condition to any query (every row is that site's), so the batch log's plans are 019's.
 */
export const name = '021-sites';

const SITE_OWNED = ['batches', 'plans', 'equipment', 'receipts', 'refusals'] as const;

function statements(siteName: string): string[] {
  return [
    `CREATE TABLE sites (
      id INTEGER PRIMARY KEY AUTOINCREMENT,
      key TEXT NOT NULL UNIQUE,
      name TEXT NOT NULL,
      created_at TEXT NOT NULL
    )`,
    // The name is ours or the kitchen's own setting, quoted as SQL text.
    `INSERT INTO sites (key, name, created_at) VALUES ('main', '${siteName.replaceAll("'", "''")}', '${new Date().toISOString()}')`,
    `CREATE TABLE site_roles (
      person_id INTEGER NOT NULL REFERENCES people(id),
      site_id INTEGER NOT NULL REFERENCES sites(id),
      role TEXT NOT NULL CHECK (role IN ('admin', 'cook', 'reviewer')),
      PRIMARY KEY (person_id, site_id)
    )`,
    'CREATE INDEX site_roles_site ON site_roles (site_id, person_id)',
    'ALTER TABLE people ADD COLUMN role_everywhere INTEGER NOT NULL DEFAULT 1',
    ...SITE_OWNED.map(
      (table) => `ALTER TABLE ${table} ADD COLUMN site_id INTEGER NOT NULL DEFAULT 1`,
    ),
    // The default order of each list, within one site.
    'CREATE INDEX batches_site ON batches (site_id, recorded_at, id)',
    'CREATE INDEX batches_site_status ON batches (site_id, status, recorded_at, id)',
    'CREATE INDEX plans_site ON plans (site_id, made_at, id)',
    'CREATE INDEX equipment_site ON equipment (site_id, id)',
    'CREATE INDEX receipts_site ON receipts (site_id, received_on, id)',
    'CREATE INDEX refusals_site ON refusals (site_id, at, id)',
  ];
}

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, statements(mainSiteName(process.env)));
}
