import { andSite } from '../sites/site-scope.ts';
import { QueryTypes, type Transaction } from 'sequelize';
import type { BatchTurn } from '../../shared/api/batch-record.ts';
import { statusInWords } from '../../shared/workflow/batch-status.ts';
import { appendChange } from '../audit/append-change.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { jsonObjectText, type Dialect } from '../db/dialect-sql.ts';
import { conflict, notFound } from '../http/app-error.ts';
import { kitchenTime } from '../process/kitchen-clock.ts';
import { refuseOnReleased } from '../process/released.ts';
import { localDate } from '../reminders/reminder-schedule.ts';
import type { ChangeOptions } from './batch.ts';
import type { CurrentRow } from './batch-writes.ts';

interface TurnRow {
  turned_on: string;
  recorded_at: string;
  person_id: number;
  person_name: string | null;
  note: string | null;
}

const TURN_COLUMNS = `t.turned_on, t.recorded_at, t.person_id, p.display_name AS person_name, t.note
  FROM batch_turns t LEFT JOIN people p ON p.id = t.person_id`;

function toTurn(row: TurnRow): BatchTurn {
  return {
    on: row.turned_on,
    at: row.recorded_at,
    by: { id: row.person_id, displayName: row.person_name ?? `person ${row.person_id}` },
    note: row.note,
  };
}

/**
 * A curing batch's latest turn as a list item carries it, picked by the database from the turns'
 * (batch, day) index: one seek a curing batch, none for the rest (`b` is batches).
 */
export function lastTurnColumn(dialect: Dialect): string {
  return `CASE WHEN b.status = 'curing' THEN (
    SELECT ${jsonObjectText(
      dialect,
      `'on', t.turned_on, 'at', t.recorded_at, 'id', t.person_id,
      'name', (SELECT display_name FROM people WHERE id = t.person_id)`,
    )}
    FROM batch_turns t WHERE t.batch_id = b.id ORDER BY t.turned_on DESC LIMIT 1
  ) END AS last_turn`;
}

/** The last_turn column (lastTurnColumn) as a list item's lastTurn. */
export function lastTurnOf(json: string | null | undefined): Omit<BatchTurn, 'note'> | null {
  if (!json) return null;
  const row = JSON.parse(json) as { on: string; at: string; id: number; name: string | null };
  return {
    on: row.on,
    at: row.at,
    by: { id: row.id, displayName: row.name ?? `person ${row.id}` },
  };
}

/** A batch's turns, oldest first, read inside the caller's transaction when given. */
export async function turnsOf(
  db: Database,
  batchId: number,
  transaction?: Transaction,
): Promise<BatchTurn[]> {
  const rows = await db.sequelize.query<TurnRow>(
    `SELECT ${TURN_COLUMNS} WHERE t.batch_id = ? ORDER BY t.turned_on, t.id`,
    { replacements: [batchId], type: QueryTypes.SELECT, ...(transaction ? { transaction } : {}) },
  );
  return rows.map(toTurn);
}

/**
 * Records that a curing batch was turned today — the kitchen's calendar day at `options.at` —
 * by the person making the change, with an audit entry, in the caller's write.
 * @throws AppError 404 no such lot; 409 'discarded', 'released', 'not-curing' (only a cure
 *   curing is turned), 'already-turned' (naming who turned it today and when)
 */
export async function recordTurn(
  db: Database,
  audit: AuditRepository,
  t: Transaction,
  lot: string,
  note: string | null,
  options: ChangeOptions,
): Promise<void> {
  const at = options.at ?? new Date().toISOString();
  const day = localDate(new Date(at));
  // At the change's site only: another site's batch is not found.
  const site = andSite(options.site, 'site_id');
  const [batch] = await db.sequelize.query<Pick<CurrentRow, 'id' | 'status'>>(
    `SELECT id, status FROM batches WHERE lot_code = ?${site.sql}`,
    { replacements: [lot, ...site.values], type: QueryTypes.SELECT, transaction: t },
  );
  if (!batch) throw notFound(`no batch with lot code ${lot}`);
  if (batch.status === 'discarded')
    throw conflict('discarded', `batch ${lot} was discarded: there is nothing to turn`);
  await refuseOnReleased(db, t, { id: batch.id, lotCode: lot });
  if (batch.status !== 'curing')
    throw conflict(
      'not-curing',
      `batch ${lot} is ${statusInWords(batch.status).toLowerCase()}, not curing: only a cure that is curing is turned`,
      [{ status: batch.status }],
    );
  const [already] = await db.sequelize.query<TurnRow>(
    `SELECT ${TURN_COLUMNS} WHERE t.batch_id = ? AND t.turned_on = ?`,
    { replacements: [batch.id, day], type: QueryTypes.SELECT, transaction: t },
  );
  if (already) {
    const turn = toTurn(already);
    throw conflict(
      'already-turned',
      `batch ${lot} was already turned today, by ${turn.by.displayName} at ${kitchenTime(turn.at, at)}`,
      [{ turn }],
    );
  }
  await insertTurn(db, t, { lot, day, at, personId: options.actor.id, note });
  await appendChange(audit, t, options, 'batch-turn', lot, { on: day, ...(note ? { note } : {}) });
}

/**
 * Writes one turn as it is given, unchecked: one already on that day is kept. Recording goes
 * through {@link recordTurn}; the demo's history, written as it happened, comes straight here.
 */
export async function insertTurn(
  db: Database,
  t: Transaction,
  turn: { lot: string; day: string; at: string; personId: number; note: string | null },
): Promise<void> {
  await db.sequelize.query(
    `INSERT INTO batch_turns (batch_id, turned_on, recorded_at, person_id, note)
     SELECT id, ?, ?, ?, ? FROM batches WHERE lot_code = ?
     ON CONFLICT (batch_id, turned_on) DO NOTHING`,
    { replacements: [turn.day, turn.at, turn.personId, turn.note, turn.lot], transaction: t },
  );
}
