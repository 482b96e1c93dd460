import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { after, describe, it } from 'node:test';
import { QueryTypes, Sequelize } from 'sequelize';
import { freshPostgresDatabase, testPostgresUrl } from '../../../tests/helpers/test-database.ts';
import { migrate, openDatabase, type Database } from '../database.ts';
import { connectPostgres } from '../postgres-database.ts';

/**
 * A group's rows as migration 021 left them: a walk-in with a reading, a plan, and a second
 * site. Ids are given, so the same statements serve both databases.
 */
const BEFORE = [
  `INSERT INTO people (id, username, display_name, role, password_hash, created_at, updated_at)
   VALUES (1, 'ada', 'Ada', 'cook', 'x', '2026-01-01', '2026-01-01')`,
  `INSERT INTO sites (id, key, name, created_at) VALUES (2, 'harbour', 'Harbour', '2026-01-01')`,
  `INSERT INTO equipment (id, name, kind, control, created_at)
   VALUES (7, 'Walk-in', 'cooler', '{}', '2026-01-01')`,
  `INSERT INTO readings (id, equipment_id, control, taken_at, value, source, recorded_by, recorded_at)
   VALUES (3, 7, 'log', '2026-01-01T08:00:00Z', '3', 'console', 1, '2026-01-01T08:00:00Z')`,
  `INSERT INTO plans (id, assembly_id, assembly_title, count, service_date, made_at)
   VALUES (4, 'pit-bun', 'Pit bun', 24, '2026-01-03', '2026-01-01T10:00:00Z')`,
];

describe('migration 022: names unique within a site', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-022-'));
  after(() => rmSync(dir, { recursive: true, force: true }));

  /** A database migrated to 021 with BEFORE's rows: a SQLite file, or one on the test cluster. */
  async function databaseAt021(t: { after(fn: () => unknown): void }): Promise<string> {
    const adminUrl = testPostgresUrl();
    const location = adminUrl
      ? await freshPostgresDatabase(t, adminUrl)
      : path.join(dir, `${Math.random().toString(36).slice(2)}.sqlite`);
    const sequelize = adminUrl
      ? await connectPostgres(location)
      : new Sequelize({ dialect: 'sqlite', storage: location, logging: false });
    await migrate(sequelize, '021-sites');
    for (const sql of BEFORE) await sequelize.query(sql);
    await sequelize.close();
    return location;
  }

  const rows = <T extends object>(db: Database, sql: string) =>
    db.sequelize.query<T>(sql, { type: QueryTypes.SELECT });

  it('should keep every row and id, and the readings of the equipment', async (t) => {
    const db = await openDatabase(await databaseAt021(t));
    try {
      const [walkIn] = await rows<{ id: number; name: string; site_id: number }>(
        db,
        'SELECT id, name, site_id FROM equipment',
      );
      assert.deepEqual({ ...walkIn }, { id: 7, name: 'Walk-in', site_id: 1 });
      const [reading] = await rows<{ equipment_id: number }>(
        db,
        'SELECT equipment_id FROM readings',
      );
      assert.equal(reading.equipment_id, 7);
      const [plan] = await rows<{ id: number; count: number }>(db, 'SELECT id, count FROM plans');
      assert.deepEqual({ ...plan }, { id: 4, count: 24 });
    } finally {
      await db.close();
    }
  });

  it('should take a name or a plan again at another site, never twice at one', async (t) => {
    const db = await openDatabase(await databaseAt021(t));
    try {
      await db.sequelize.query(
        `INSERT INTO equipment (id, name, kind, control, created_at, site_id)
         VALUES (8, 'Walk-in', 'cooler', '{}', '2026-01-02', 2)`,
      );
      await db.sequelize.query(
        `INSERT INTO plans (id, assembly_id, assembly_title, count, service_date, made_at, site_id)
         VALUES (5, 'pit-bun', 'Pit bun', 24, '2026-01-03', '2026-01-02T10:00:00Z', 2)`,
      );
      // Case-blind at a site, as the name was across the group before.
      await assert.rejects(
        db.sequelize.query(
          `INSERT INTO equipment (id, name, kind, control, created_at, site_id)
           VALUES (9, 'WALK-IN', 'cooler', '{}', '2026-01-02', 2)`,
        ),
        /unique|duplicate/i,
      );
      await assert.rejects(
        db.sequelize.query(
          `INSERT INTO plans (id, assembly_id, assembly_title, count, service_date, made_at, site_id)
           VALUES (6, 'pit-bun', 'Pit bun', 24, '2026-01-03', '2026-01-02T11:00:00Z', 1)`,
        ),
        /unique|duplicate/i,
      );
      // A reading naming no equipment is still refused: the foreign keys hold after the copy.
      await assert.rejects(
        db.sequelize.query(
          `INSERT INTO readings (id, equipment_id, control, taken_at, value, source, recorded_at)
           VALUES (10, 99, 'log', '2026-01-02T08:00:00Z', '3', 'console', '2026-01-02T08:00:00Z')`,
        ),
        /foreign key/i,
      );
    } finally {
      await db.close();
    }
  });
});
