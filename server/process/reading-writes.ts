import { QueryTypes, type Transaction } from 'sequelize';
import type {
  ReadingAnswer,
  ReadingRequest,
  ReadingSource,
} from '../../shared/api/process-record.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { insertRow } from '../db/insert-row.ts';
import { AppError, conflict, notFound } from '../http/app-error.ts';
import { judgeAndOpen, type Judgement, type ProcessDeps } from './judge-and-open.ts';
import { refuseOnReleased } from './released.ts';
import type { ProcessBatch } from './process-repository.ts';
import {
  controlNamed,
  readingTime,
  readingValue,
  refuseReadingsOn,
  type ParsedValue,
} from './reading-input.ts';

/** A correction as POST /api/readings/:id/correction takes it. */
export interface CorrectionRequest {
  readonly value: string;
  readonly at?: string;
  /** Why: required, and kept beside the correction. */
  readonly reason: string;
}

/** One reading row to insert. */
export interface NewReading extends ParsedValue {
  readonly control: string;
  readonly at: string;
  readonly source: ReadingSource;
  readonly correctsId?: number;
  readonly reason?: string;
}

/** Rows per INSERT: a logger file's points go in a few statements, not thousands. */
const ROWS_PER_INSERT = 500;

/** Inserts readings in the caller's write, in order; returns the id of the last. */
export async function insertReadings(
  deps: ProcessDeps,
  t: Transaction,
  batchId: number,
  readings: readonly NewReading[],
  by: ChangeOptions,
): Promise<number> {
  const recordedAt = by.at ?? new Date().toISOString();
  let last = 0;
  for (let from = 0; from < readings.length; from += ROWS_PER_INSERT) {
    const chunk = readings.slice(from, from + ROWS_PER_INSERT);
    const { lastId } = await insertRow(
      deps.db,
      t,
      `INSERT INTO readings (batch_id, control, taken_at, value, entered_as, source, recorded_by,
         recorded_at, corrects_id, reason)
       VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
      chunk.flatMap((r) => [
        batchId,
        r.control,
        r.at,
        r.value,
        r.enteredAs,
        r.source,
        by.actor.id,
        recordedAt,
        r.correctsId ?? null,
        r.reason ?? null,
      ]),
    );
    last = lastId;
  }
  return last;
}

/** The answer to one reading written: the reading, its control's state, the deviation it opened. */
async function answerOf(
  deps: ProcessDeps,
  t: Transaction,
  batch: ProcessBatch,
  readingId: number,
  judgement: Judgement,
): Promise<ReadingAnswer> {
  const reading = judgement.readings.find((r) => r.id === readingId)!;
  const state = judgement.controls.find((c) => c.control.id === reading.control)!.state;
  const opened = judgement.opened.find((o) => o.control === reading.control) ?? judgement.opened[0];
  const deviation = opened
    ? ((await deps.process.deviations(batch.id, t)).find((d) => d.id === opened.id) ?? null)
    : null;
  return {
    reading,
    state,
    deviation: deviation && (({ key: _key, ...d }) => d)(deviation),
  };
}

/**
 * Records one reading at a batch's control, judges the batch again at once and opens a
 * deviation for each new miss, all in one write.
 * @throws AppError 404 no such lot; 409 not-started, discarded or released; 422 unknown-control,
 *   bad-reading, bad-time
 */
export async function addReading(
  deps: ProcessDeps,
  lot: string,
  request: ReadingRequest,
  source: ReadingSource,
  by: ChangeOptions,
): Promise<ReadingAnswer> {
  const now = by.at ?? new Date().toISOString();
  const found = await deps.process.batch(lot);
  const controls = await deps.process.controlsOf(found);
  const control = controlNamed(controls, request.control, lot);
  const parsed = readingValue(request.value, control);
  const at = readingTime(request.at, now);
  return deps.db.write(async (t) => {
    const batch = await deps.process.batch(lot, t);
    refuseReadingsOn(lot, batch.status);
    await refuseOnReleased(deps.db, t, batch);
    const id = await insertReadings(
      deps,
      t,
      batch.id,
      [{ ...parsed, control: control.id, at, source }],
      by,
    );
    const judgement = await judgeAndOpen(deps, t, batch, controls, now, by, 'readings');
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'reading-add',
        subject: lot,
        detail: {
          reading: id,
          control: control.id,
          at,
          value: parsed.value,
          enteredAs: parsed.enteredAs,
          source,
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
    return answerOf(deps, t, batch, id, judgement);
  });
}

interface StoredReading {
  id: number;
  lot_code: string;
  control: string;
  taken_at: string;
  value: string;
  entered_as: string | null;
  corrected_by: number | null;
}

/**
 * Corrects a reading: a new reading replaces it, the old one stays (marked correctedBy). A reading
 * corrected once is not corrected again; its correction is. Judged again at once.
 * @throws AppError 404 no such batch reading; 409 already-corrected, released; 422 bad-reading,
 *   bad-time,
 *   reason-needed
 */
export async function correctReading(
  deps: ProcessDeps,
  readingId: number,
  request: CorrectionRequest,
  source: ReadingSource,
  by: ChangeOptions,
): Promise<ReadingAnswer> {
  const now = by.at ?? new Date().toISOString();
  const reason = request.reason.trim();
  if (!reason)
    throw new AppError(422, 'reason-needed', 'say why the reading is corrected', [
      { field: 'reason', message: 'is needed' },
    ]);
  const stored = async (t?: Transaction): Promise<StoredReading> => {
    const [row] = await deps.db.sequelize.query<StoredReading>(
      `SELECT r.id, b.lot_code, r.control, r.taken_at, r.value, r.entered_as,
         (SELECT c.id FROM readings c WHERE c.corrects_id = r.id) AS corrected_by
       FROM readings r JOIN batches b ON b.id = r.batch_id WHERE r.id = ?`,
      { replacements: [readingId], type: QueryTypes.SELECT, ...(t ? { transaction: t } : {}) },
    );
    if (!row) throw notFound(`no batch reading ${readingId}`);
    return row;
  };
  const old = await stored();
  const found = await deps.process.batch(old.lot_code);
  const controls = await deps.process.controlsOf(found);
  const control = controlNamed(controls, old.control, old.lot_code);
  const parsed = readingValue(request.value, control);
  const at = request.at === undefined ? old.taken_at : readingTime(request.at, now);
  return deps.db.write(async (t) => {
    const current = await stored(t);
    if (current.corrected_by !== null)
      throw conflict(
        'already-corrected',
        'this reading was corrected already; correct the correction instead',
        [{ correctedBy: current.corrected_by }],
      );
    const batch = await deps.process.batch(old.lot_code, t);
    await refuseOnReleased(deps.db, t, batch);
    const id = await insertReadings(
      deps,
      t,
      batch.id,
      [{ ...parsed, control: control.id, at, source, correctsId: readingId, reason }],
      by,
    );
    const judgement = await judgeAndOpen(deps, t, batch, controls, now, by, 'readings');
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'reading-correct',
        subject: batch.lotCode,
        detail: {
          reading: readingId,
          correction: id,
          control: control.id,
          reason,
          from: { at: current.taken_at, value: current.value, enteredAs: current.entered_as },
          to: { at, value: parsed.value, enteredAs: parsed.enteredAs },
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
    return answerOf(deps, t, batch, id, judgement);
  });
}
