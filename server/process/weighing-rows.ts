import { QueryTypes, type Transaction } from 'sequelize';
import { Decimal } from '../../shared/decimal.ts';
import type { StageName, Weighing } from '../../shared/api/process-record.ts';
import type { StandingWeights } from '../../shared/process/weights-as-weighed.ts';
import type { Database } from '../db/database.ts';
import { STAMP_COLUMNS, correctedByOf, toWeighing, type WeighingRow } from './process-rows.ts';

/** Every weighing of a batch with its recorder, oldest first (the table aliased `x`). */
export const WEIGHINGS_SQL = `SELECT ${STAMP_COLUMNS}, x.kind, x.name, x.planned_grams, x.grams,
  x.weighed_at FROM weighings x LEFT JOIN people rp ON rp.id = x.recorded_by
  WHERE x.batch_id = ? ORDER BY x.id`;

/** Every weighing of a batch, oldest first, corrected ones included (marked correctedBy). */
export async function batchWeighings(
  db: Database,
  batchId: number,
  transaction?: Transaction,
): Promise<Weighing[]> {
  const rows = await db.sequelize.query<WeighingRow>(WEIGHINGS_SQL, {
    replacements: [batchId],
    type: QueryTypes.SELECT,
    ...(transaction ? { transaction } : {}),
  });
  const correctedBy = correctedByOf(rows);
  return rows.map((row) => toWeighing(row, correctedBy));
}

/** One weighing with the batch it belongs to; undefined when there is none. */
export async function weighingById(
  db: Database,
  id: number,
  transaction: Transaction,
): Promise<(Weighing & { batchId: number }) | undefined> {
  const [row] = await db.sequelize.query<
    WeighingRow & { batch_id: number; corrected_by: number | null }
  >(
    `SELECT ${STAMP_COLUMNS}, x.kind, x.name, x.planned_grams, x.grams, x.weighed_at, x.batch_id,
       (SELECT MIN(c.id) FROM weighings c WHERE c.corrects_id = x.id) AS corrected_by
     FROM weighings x LEFT JOIN people rp ON rp.id = x.recorded_by WHERE x.id = ?`,
    { replacements: [id], type: QueryTypes.SELECT, transaction },
  );
  if (!row) return undefined;
  const correctedBy = new Map(row.corrected_by === null ? [] : [[row.id, row.corrected_by]]);
  return { ...toWeighing(row, correctedBy), batchId: row.batch_id };
}

/** The weighings that stand: none has corrected them. */
export function standingWeighings(weighings: readonly Weighing[]): Weighing[] {
  return weighings.filter((weighing) => weighing.correctedBy === null);
}

/** The standing weighings as the judging takes them: grams by line name and by stage. */
export function standingWeights(weighings: readonly Weighing[]): StandingWeights {
  const standing = standingWeighings(weighings);
  const of = (kind: Weighing['kind']) =>
    standing.filter((w) => w.kind === kind).map((w) => [w.name, new Decimal(w.grams)] as const);
  return {
    lines: new Map(of('line')),
    stages: new Map(of('stage') as (readonly [StageName, Decimal])[]),
  };
}
