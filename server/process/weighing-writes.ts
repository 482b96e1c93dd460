import { QueryTypes, type Transaction } from 'sequelize';
import type { Decimal } from '../../shared/decimal.ts';
import { QuantityError, type Formula } from '../../shared/index.ts';
import type {
  StageName,
  Weighing,
  WeighingAnswer,
  WeighingRequest,
} from '../../shared/api/process-record.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { stagesFor } from '../../shared/process/weighing-stages.ts';
import { sheetLines } from '../../shared/process/weights-as-weighed.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { insertRow } from '../db/insert-row.ts';
import { formulaAtRevision } from '../formulas/formula-at-revision.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { AppError, conflict, notFound } from '../http/app-error.ts';
import { recordedBatch, type RecordedBatch } from './recorded-batch.ts';
import { refuseOnReleased } from './released.ts';
import { batchWeighings, standingWeighings, weighingById } from './weighing-rows.ts';
import { judgeWeighings } from './weights-verdict.ts';

/** What weighing works with. */
export interface WeighingDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly history: FormulaHistory;
}

/** A correction of one weighing: the weight as it really was, and why. */
export interface WeighingCorrection {
  readonly weight: string;
  readonly reason: string;
}

/** How far ahead of the server's clock a stage's time may be (a scale's clock runs fast). */
const FUTURE_SLACK_MS = 5 * 60_000;

/** A weighing that cannot be recorded: 422 naming the field at fault. */
function badWeighing(field: string, message: string): AppError {
  return new AppError(422, 'bad-weighing', `${field}: ${message}`, [{ field, message }]);
}

/** Grams of a weight typed with its unit; 422 naming the field when it is not a weight above 0. */
function gramsOf(text: string, field: string): Decimal {
  let grams: Decimal;
  try {
    grams = parseMass(text);
  } catch (error) {
    if (error instanceof QuantityError) throw badWeighing(field, error.message);
    throw error;
  }
  if (grams.isZero()) throw badWeighing(field, 'a weight must be more than 0');
  return grams;
}

/** The formula a batch was calculated from, at its revision. */
export async function formulaOf(history: FormulaHistory, batch: RecordedBatch): Promise<Formula> {
  const at = await formulaAtRevision(history, batch.formulaId, batch.formulaRevision);
  if (!at)
    throw conflict(
      'formula-unavailable',
      `the formula ${batch.formulaId} is no longer kept at the revision this batch was calculated from`,
    );
  return at.formula;
}

/** Weighing needs a batch that is under way: started, not thrown away. */
function mustBeUnderWay(batch: RecordedBatch): void {
  if (batch.status === 'planned')
    throw conflict(
      'not-started',
      `batch ${batch.lotCode} is planned: start it with what is really there before weighing`,
    );
  if (batch.status === 'discarded')
    throw conflict('discarded', `batch ${batch.lotCode} was discarded`);
}

interface NewRow {
  readonly kind: Weighing['kind'];
  readonly name: string;
  readonly plannedGrams: string | null;
  readonly grams: Decimal;
  readonly weighedAt: string;
  readonly correctsId: number | null;
  readonly reason: string | null;
}

async function insertWeighing(
  db: Database,
  t: Transaction,
  batchId: number,
  row: NewRow,
  by: ChangeOptions,
  at: string,
): Promise<number> {
  const { lastId } = await insertRow(
    db,
    t,
    `INSERT INTO weighings (batch_id, kind, name, planned_grams, grams, weighed_at, recorded_by,
       recorded_at, corrects_id, reason)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [
      batchId,
      row.kind,
      row.name,
      row.plannedGrams,
      row.grams.toString(),
      row.weighedAt,
      by.actor.id,
      at,
      row.correctsId,
      row.reason,
    ],
  );
  return lastId;
}

/** The rows a request asks for, checked against the sheet and the formula's stages. */
function rowsOf(
  request: WeighingRequest,
  batch: RecordedBatch,
  formula: Formula,
  now: string,
): NewRow[] {
  const sheet = sheetLines(batch.result);
  const rows: NewRow[] = (request.lines ?? []).map((line, i) => {
    const planned = sheet.get(line.name);
    if (!planned)
      throw badWeighing(
        `lines.${i}.name`,
        `"${line.name}" is not a line of this batch's sheet (${[...sheet.keys()].join(', ')})`,
      );
    return {
      kind: 'line',
      name: line.name,
      plannedGrams: planned.toString(),
      grams: gramsOf(line.weight, `lines.${i}.weight`),
      weighedAt: now,
      correctsId: null,
      reason: null,
    };
  });
  const names = rows.map((row) => row.name);
  const twice = names.find((name, i) => names.indexOf(name) !== i);
  if (twice) throw badWeighing('lines', `"${twice}" is given twice`);
  if (request.stage) {
    const allowed = stagesFor(formula);
    if (!allowed.includes(request.stage.name))
      throw badWeighing(
        'stage.name',
        allowed.length
          ? `a ${formula.title} batch records the stages ${allowed.join(', ')}, not ${request.stage.name}`
          : `a ${formula.kind} batch records no stage weights`,
      );
    rows.push({
      kind: 'stage',
      name: request.stage.name,
      plannedGrams: null,
      grams: gramsOf(request.stage.weight, 'stage.weight'),
      weighedAt: stageTime(request.stage.at, now),
      correctsId: null,
      reason: null,
    });
  }
  if (rows.length === 0) throw badWeighing('(body)', 'give lines, a stage, or both');
  return rows;
}

/** The time a stage was weighed: now, or a time given that is not ahead of the clock. */
function stageTime(at: string | undefined, now: string): string {
  if (at === undefined) return now;
  const ms = Date.parse(at);
  if (Number.isNaN(ms)) throw badWeighing('stage.at', `"${at}" is not a date and time`);
  if (ms > Date.parse(now) + FUTURE_SLACK_MS)
    throw badWeighing('stage.at', `${at} is still to come`);
  return new Date(ms).toISOString();
}

/**
 * Records lines and a stage weight as weighed, in one write with its audit entry, then judges the
 * batch's standing weights (see judgeWeighings): a line or stage already weighed is corrected, not
 * weighed again.
 * @throws AppError 404 no such lot, 409 'not-started'/'discarded'/'released'/'already-weighed',
 *   422 'bad-weighing' naming the field (a name not on the sheet, a stage the formula has not)
 */
export async function addWeighings(
  deps: WeighingDeps,
  lot: string,
  request: WeighingRequest,
  by: ChangeOptions,
): Promise<WeighingAnswer> {
  const at = by.at ?? new Date().toISOString();
  const seen = await recordedBatch(deps.db, lot);
  const formula = await formulaOf(deps.history, seen);
  return deps.db.write(async (t) => {
    const batch = await recordedBatch(deps.db, lot, t);
    if (batch.formulaRevision !== seen.formulaRevision)
      throw conflict('batch-changed', `batch ${batch.lotCode} changed meanwhile; weigh again`);
    mustBeUnderWay(batch);
    await refuseOnReleased(deps.db, t, batch);
    const rows = rowsOf(request, batch, formula, at);
    const before = standingWeighings(await batchWeighings(deps.db, batch.id, t));
    for (const row of rows) {
      const earlier = before.find((w) => w.kind === row.kind && w.name === row.name);
      if (earlier)
        throw conflict(
          'already-weighed',
          `${row.name} was weighed already (${earlier.grams} g): correct that weighing, with the reason`,
          [{ weighing: earlier.id, name: row.name }],
        );
    }
    const ids: number[] = [];
    for (const row of rows) ids.push(await insertWeighing(deps.db, t, batch.id, row, by, at));
    return answer(deps, t, batch, formula, ids, by, {
      lines: rows.filter((r) => r.kind === 'line').map((r) => ({ name: r.name, grams: r.grams })),
      ...(request.stage ? { stage: { name: request.stage.name as StageName } } : {}),
    });
  });
}

/**
 * Corrects one standing weighing with a new row that names it (corrects_id) and says why; the
 * old row stays. The batch's weights are judged again, as after any weighing.
 * @throws AppError 404 no such weighing, 409 'already-corrected' (correct the newer one), 'released'
 */
export async function correctWeighing(
  deps: WeighingDeps,
  id: number,
  correction: WeighingCorrection,
  by: ChangeOptions,
): Promise<WeighingAnswer> {
  const at = by.at ?? new Date().toISOString();
  const grams = gramsOf(correction.weight, 'weight');
  const lotOf = await deps.db.sequelize.query<{ lot_code: string }>(
    'SELECT b.lot_code FROM weighings w JOIN batches b ON b.id = w.batch_id WHERE w.id = ?',
    { replacements: [id], type: QueryTypes.SELECT },
  );
  if (!lotOf[0]) throw notFound(`no weighing ${id}`);
  const seen = await recordedBatch(deps.db, lotOf[0].lot_code);
  const formula = await formulaOf(deps.history, seen);
  return deps.db.write(async (t) => {
    const old = await weighingById(deps.db, id, t);
    if (!old) throw notFound(`no weighing ${id}`);
    if (old.correctedBy !== null)
      throw conflict(
        'already-corrected',
        `weighing ${id} was corrected already by weighing ${old.correctedBy}: correct that one`,
        [{ weighing: old.correctedBy }],
      );
    const batch = await recordedBatch(deps.db, seen.lotCode, t);
    mustBeUnderWay(batch);
    await refuseOnReleased(deps.db, t, batch);
    const row: NewRow = {
      kind: old.kind,
      name: old.name,
      plannedGrams: old.plannedGrams,
      grams,
      weighedAt: old.weighedAt,
      correctsId: old.id,
      reason: correction.reason.trim(),
    };
    const newId = await insertWeighing(deps.db, t, batch.id, row, by, at);
    return answer(deps, t, batch, formula, [newId], by, {
      corrects: old.id,
      name: old.name,
      from: old.grams,
      grams: grams.toString(),
      reason: row.reason,
    });
  });
}

/** Judges the batch after a write, audits it, and answers with the weighings written. */
async function answer(
  deps: WeighingDeps,
  t: Transaction,
  batch: RecordedBatch,
  formula: Formula,
  ids: readonly number[],
  by: ChangeOptions,
  detail: object,
): Promise<WeighingAnswer> {
  const all = await batchWeighings(deps.db, batch.id, t);
  const outcome = await judgeWeighings(deps, t, batch, formula, all, by);
  const nitrite = outcome.verdict.actualNitritePpm?.toString() ?? null;
  if (by.audit !== false)
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'weighing-add',
        subject: batch.lotCode,
        detail: {
          ...JSON.parse(JSON.stringify(detail)),
          weighings: ids,
          ...(nitrite === null ? {} : { actualNitritePpm: nitrite }),
          ...(outcome.deviations.length ? { deviations: outcome.deviations.map((d) => d.id) } : {}),
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
  return {
    weighings: all.filter((w) => ids.includes(w.id)),
    actualNitritePpm: nitrite,
    deviation: outcome.deviations[0] ?? null,
    deviations: outcome.deviations,
    messages: outcome.messages,
  };
}
