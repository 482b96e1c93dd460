import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { after, describe, it } from 'node:test';
import { QueryTypes, Sequelize } from 'sequelize';
import { migrate, openDatabase } from '../database.ts';

/** Rows in each site-owned table as a kitchen had them before sites (migrations up to 020). */
const BEFORE_SITES = [
  `INSERT INTO people (username, display_name, role, password_hash, created_at, updated_at)
   VALUES ('ada', 'Ada', 'cook', 'x', '2026-01-01', '2026-01-01')`,
  `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status,
     operator_id, started_on, recorded_at, updated_at, units, inputs, result, checks_passed)
   VALUES ('260101-QB-01', 'quillmoor-belly', 'r1', 'Belly', 'cure', 'done', 1, '2026-01-01',
     '2026-01-01T10:00:00Z', '2026-01-01T10:00:00Z', 'metric', '{}', '{}', 1)`,
  `INSERT INTO plans (assembly_id, assembly_title, count, service_date, made_at)
   VALUES ('pit-bun', 'Pit bun', 24, '2026-01-03', '2026-01-01T10:00:00Z')`,
  `INSERT INTO equipment (name, kind, control, created_at)
   VALUES ('Walk-in', 'cooler', 'cold-holding', '2026-01-01')`,
  `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, quantity, unit, amount,
     remaining, decision, received_at, received_on, person_id)
   VALUES ('R260101-01', 'pork-belly', 'Pork belly', 'Farm', 'F1', '10', 'kg', '10000', '10000',
     'accepted', '2026-01-01T08:00:00Z', '2026-01-01', 1)`,
  `INSERT INTO refusals (at, person_id, formula_id, inputs, failed)
   VALUES ('2026-01-01T09:00:00Z', 1, 'quillmoor-belly', '{}', '[]')`,
];

describe('migration 021: sites', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-021-'));
  after(() => rmSync(dir, { recursive: true, force: true }));

  /** A database as an install before sites left it, with one row in each site-owned table. */
  async function databaseBeforeSites(file: string): Promise<void> {
    const sequelize = new Sequelize({ dialect: 'sqlite', storage: file, logging: false });
    await migrate(sequelize, '020-sign-in-attempts');
    for (const sql of BEFORE_SITES) await sequelize.query(sql);
    await sequelize.close();
  }

  it('should give every existing row the main site, named after the kitchen setting', async () => {
    const file = path.join(dir, 'named.sqlite');
    await databaseBeforeSites(file);
    const kept = process.env.LARDER_KITCHEN;
    process.env.LARDER_KITCHEN = 'Quillmoor Smokehouse';
    const db = await openDatabase(file);
    if (kept === undefined) delete process.env.LARDER_KITCHEN;
    else process.env.LARDER_KITCHEN = kept;
    try {
      const sites = await db.sequelize.query<{ id: number; key: string; name: string }>(
        'SELECT id, key, name FROM sites',
        { type: QueryTypes.SELECT },
      );
      assert.deepEqual(
        sites.map((s) => [s.key, s.name]),
        [['main', 'Quillmoor Smokehouse']],
      );
      for (const table of ['batches', 'plans', 'equipment', 'receipts', 'refusals']) {
        const rows = await db.sequelize.query<{ site_id: number }>(`SELECT site_id FROM ${table}`, {
          type: QueryTypes.SELECT,
        });
        assert.deepEqual(
          rows.map((r) => r.site_id),
          [sites[0].id],
          `${table} belongs to the main site`,
        );
      }
      const [person] = await db.sequelize.query<{ role: string; role_everywhere: number }>(
        'SELECT role, role_everywhere FROM people',
        { type: QueryTypes.SELECT },
      );
      assert.deepEqual({ ...person }, { role: 'cook', role_everywhere: 1 });
    } finally {
      await db.close();
    }
  });

  it('should name the main site "Main kitchen" when the kitchen has no name set', async () => {
    const file = path.join(dir, 'unnamed.sqlite');
    await databaseBeforeSites(file);
    const kept = process.env.LARDER_KITCHEN;
    delete process.env.LARDER_KITCHEN;
    const db = await openDatabase(file);
    if (kept !== undefined) process.env.LARDER_KITCHEN = kept;
    try {
      const [site] = await db.sequelize.query<{ name: string }>('SELECT name FROM sites', {
        type: QueryTypes.SELECT,
      });
      assert.equal(site.name, 'Main kitchen');
    } finally {
      await db.close();
    }
  });
});
