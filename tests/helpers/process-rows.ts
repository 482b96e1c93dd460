import { QueryTypes } from 'sequelize';
import { insertNew } from '../../server/db/insert-row.ts';
import type { TestServer } from './test-server.ts';

/** Runs one INSERT on the test server's database (either kind); the new row's id. */
async function insert(server: TestServer, sql: string, values: unknown[]): Promise<number> {
  const { db } = server.context;
  return db.write((t) => insertNew(db, sql, values, t));
}

/** The id of a batch by its lot code, and of a demo person by username. */
export async function idOf(
  server: TestServer,
  table: 'batches' | 'people',
  key: string,
): Promise<number> {
  const column = table === 'batches' ? 'lot_code' : 'username';
  const [row] = await server.context.db.sequelize.query<{ id: number }>(
    `SELECT id FROM ${table} WHERE ${column} = ?`,
    { replacements: [key], type: QueryTypes.SELECT },
  );
  return row.id;
}

/** A reading row as written: against a batch's control or a piece of equipment. */
export interface ReadingRowToAdd {
  readonly batchId?: number;
  readonly equipmentId?: number;
  readonly control: string;
  readonly at: string;
  readonly value: string;
  readonly source: 'console' | 'command' | 'api' | 'logger';
  readonly by?: number | null;
  readonly enteredAs?: string | null;
  readonly corrects?: number | null;
  readonly reason?: string | null;
}

/** Writes readings straight into the table, the way the records keep them. */
export async function addReadings(
  server: TestServer,
  readings: readonly ReadingRowToAdd[],
): Promise<number[]> {
  const ids: number[] = [];
  for (const r of readings)
    ids.push(
      await insert(
        server,
        `INSERT INTO readings (batch_id, equipment_id, control, taken_at, value, entered_as, source,
           recorded_by, recorded_at, corrects_id, reason) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [
          r.batchId ?? null,
          r.equipmentId ?? null,
          r.control,
          r.at,
          r.value,
          r.enteredAs ?? null,
          r.source,
          r.by ?? null,
          r.at,
          r.corrects ?? null,
          r.reason ?? null,
        ],
      ),
    );
  return ids;
}

/** Writes any row: `columns` named, values in order; returns its id. */
export function addRow(
  server: TestServer,
  table: string,
  row: Readonly<Record<string, unknown>>,
): Promise<number> {
  const columns = Object.keys(row);
  return insert(
    server,
    `INSERT INTO ${table} (${columns.join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`,
    Object.values(row),
  );
}
