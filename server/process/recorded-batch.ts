import { QueryTypes, type Transaction } from 'sequelize';
import type { PresentedResult, RawBatchOptions } from '../../shared/index.ts';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type { NewBatch } from '../batches/batch.ts';
import { lotCodeOf } from '../batches/read-batches.ts';
import type { Database } from '../db/database.ts';
import { RecordsError } from '../records/records-error.ts';

/** What weighing and starting a batch read of it. */
export interface RecordedBatch {
  readonly id: number;
  readonly lotCode: string;
  readonly status: BatchStatus;
  readonly kind: NewBatch['kind'];
  readonly formulaId: string;
  readonly formulaRevision: string;
  readonly operatorId: number;
  readonly startedOn: string;
  readonly readyOn: string | null;
  readonly inputs: RawBatchOptions;
  readonly result: PresentedResult;
  readonly nitritePpm: string | null;
  readonly checksPassed: boolean;
  readonly signedOff: boolean;
}

interface Row {
  id: number;
  lot_code: string;
  status: BatchStatus;
  kind: NewBatch['kind'];
  formula_id: string;
  formula_revision: string;
  operator_id: number;
  started_on: string;
  ready_on: string | null;
  inputs: string;
  result: string;
  nitrite_ppm: string | null;
  checks_passed: number;
  signed_off_at: string | null;
}

/**
 * The batch with this lot code (either case), read inside the caller's transaction when given.
 * @throws RecordsError 'not-found'
 */
export async function recordedBatch(
  db: Database,
  lot: string,
  transaction?: Transaction,
): Promise<RecordedBatch> {
  const code = lotCodeOf(lot);
  const [row] = await db.sequelize.query<Row>(
    `SELECT id, lot_code, status, kind, formula_id, formula_revision, operator_id, started_on,
       ready_on, inputs, result, nitrite_ppm, checks_passed, signed_off_at
     FROM batches WHERE lot_code = ?`,
    { replacements: [code], type: QueryTypes.SELECT, ...(transaction ? { transaction } : {}) },
  );
  if (!row) throw new RecordsError('not-found', 'not-found', `no batch with lot code ${code}`);
  return {
    id: row.id,
    lotCode: row.lot_code,
    status: row.status,
    kind: row.kind,
    formulaId: row.formula_id,
    formulaRevision: row.formula_revision,
    operatorId: row.operator_id,
    startedOn: row.started_on,
    readyOn: row.ready_on,
    inputs: JSON.parse(row.inputs) as RawBatchOptions,
    result: JSON.parse(row.result) as PresentedResult,
    nitritePpm: row.nitrite_ppm,
    checksPassed: row.checks_passed === 1,
    signedOff: row.signed_off_at !== null,
  };
}
