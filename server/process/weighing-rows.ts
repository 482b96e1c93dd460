import { QueryTypes, type Transaction } from 'sequelize';
import { Decimal } from '../../shared/decimal.ts';
import type { StageName, Weighing } from '../../shared/api/process-record.ts';
import type { StandingWeights } from '../../shared/process/weights-as-weighed.ts';
import type { Database } from '../db/database.ts';

interface WeighingRow {
  id: number;
  kind: 'line' | 'stage';
  name: string;
  planned_grams: string | null;
  grams: string;
  weighed_at: string;
  recorded_by: number | null;
  by_name: string | null;
  recorded_at: string;
  corrects_id: number | null;
  reason: string | null;
  corrected_by: number | null;
}

function toWeighing(row: WeighingRow): Weighing {
  return {
    id: row.id,
    kind: row.kind,
    name: row.name,
    plannedGrams: row.planned_grams,
    grams: row.grams,
    weighedAt: row.weighed_at,
    by:
      row.recorded_by === null
        ? null
        : { id: row.recorded_by, displayName: row.by_name ?? `person ${row.recorded_by}` },
    recordedAt: row.recorded_at,
    corrects: row.corrects_id,
    reason: row.reason,
    correctedBy: row.corrected_by,
  };
}

const SELECT = `SELECT w.id, w.kind, w.name, w.planned_grams, w.grams, w.weighed_at, w.recorded_by,
    p.display_name AS by_name, w.recorded_at, w.corrects_id, w.reason,
    (SELECT MIN(c.id) FROM weighings c WHERE c.corrects_id = w.id) AS corrected_by
  FROM weighings w LEFT JOIN people p ON p.id = w.recorded_by`;

/** Every weighing of a batch, oldest first, corrected ones included (marked correctedBy). */
export async function batchWeighings(
  db: Database,
  batchId: number,
  transaction?: Transaction,
): Promise<Weighing[]> {
  const rows = await db.sequelize.query<WeighingRow>(
    `${SELECT} WHERE w.batch_id = ? ORDER BY w.id`,
    {
      replacements: [batchId],
      type: QueryTypes.SELECT,
      ...(transaction ? { transaction } : {}),
    },
  );
  return rows.map(toWeighing);
}

/** One weighing with the batch it belongs to; undefined when there is none. */
export async function weighingById(
  db: Database,
  id: number,
  transaction: Transaction,
): Promise<(Weighing & { batchId: number }) | undefined> {
  const [row] = await db.sequelize.query<WeighingRow & { batch_id: number }>(
    `${SELECT.replace('SELECT w.id,', 'SELECT w.batch_id, w.id,')} WHERE w.id = ?`,
    { replacements: [id], type: QueryTypes.SELECT, transaction },
  );
  return row ? { ...toWeighing(row), batchId: row.batch_id } : undefined;
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
