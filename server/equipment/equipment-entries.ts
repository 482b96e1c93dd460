import type { CalibrationRequest, EquipmentReadingRequest } from '../../shared/api/equipment.ts';
import type { ReadingSource } from '../../shared/api/process-record.ts';
import { evaluateControl } from '../../shared/process/evaluate-control.ts';
import { icePointCheck } from '../../shared/process/ice-point.ts';
import { parseReadingValue } from '../../shared/process/reading-value.ts';
import { readTemperature } from '../../shared/units/temperature.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { AppError, conflict } from '../http/app-error.ts';
import { kitchenClock } from '../process/kitchen-clock.ts';
import { openDeviation } from '../process/deviation-writes.ts';
import { equipmentIn, type EquipmentDeps } from './equipment-writes.ts';
import { resolvedOf } from './equipment-view.ts';
import type { EquipmentRow } from './equipment-rows.ts';
import { insertNew } from '../db/insert-row.ts';

/** How far ahead of the server's clock a time may be: a kitchen clock a little fast. */
const FUTURE_SLACK_MS = 5 * 60_000;

/** Who records, from where, when by the server's clock. */
export type EntryBy = ChangeOptions & { readonly at: string };

const badValue = (field: string, message: string): AppError =>
  new AppError(422, 'bad-value', message, [{ field, message }]);

/** The time an entry was taken: the one given (not in the future), or now. */
function takenAt(at: string | undefined, by: EntryBy): string {
  if (at === undefined) return by.at;
  const ms = Date.parse(at);
  if (Number.isNaN(ms) || !/^\d{4}-\d{2}-\d{2}T/.test(at))
    throw badValue('at', `“${at}” is not a date and time such as 2026-12-03T14:30:00+01:00`);
  if (ms > Date.parse(by.at) + FUTURE_SLACK_MS)
    throw badValue('at', 'The time is in the future: give the time the reading was taken.');
  return new Date(ms).toISOString();
}

/** 409 when a piece of equipment is retired or of the wrong kind for the entry. */
function refuseUnless(row: EquipmentRow, thermometer: boolean): void {
  if (!row.active)
    throw conflict('retired', `${row.name} is retired: bring it back into use before logging it.`);
  if (thermometer && row.kind !== 'thermometer')
    throw conflict('not-a-thermometer', `${row.name} is not a thermometer: log a reading instead.`);
  if (!thermometer && row.kind === 'thermometer')
    throw conflict(
      'thermometer',
      `${row.name} is a thermometer: record its ice-point check instead of a reading.`,
    );
}

/**
 * Records a reading of a piece of equipment. It is judged on its own by the limit in force
 * (evaluateControl); out of the limit opens a deviation once, keyed `equipment <id>/<time>`,
 * which a corrective action closes (POST /api/deviations/:id/action).
 */
export async function recordEquipmentReading(
  { db, audit, rows }: EquipmentDeps,
  id: number,
  request: EquipmentReadingRequest,
  source: ReadingSource,
  by: EntryBy,
): Promise<{ readingId: number; deviationId: number | null }> {
  const at = takenAt(request.at, by);
  return db.write(async (t) => {
    const row = await equipmentIn(rows, id, t);
    refuseUnless(row, false);
    const control = resolvedOf(row);
    let value: string;
    try {
      value = parseReadingValue(request.value, control.measure).toString();
    } catch (error) {
      if (error instanceof QuantityError) throw badValue('value', error.message);
      throw error;
    }
    const fahrenheit = enteredInFahrenheit(request.value);
    const readingId = await insertNew(
      db,
      `INSERT INTO readings (equipment_id, control, taken_at, value, entered_as, source, recorded_by, recorded_at)
       VALUES (?, 'log', ?, ?, ?, ?, ?, ?)`,
      [id, at, value, fahrenheit ? request.value.trim() : null, source, by.actor.id, by.at],
      t,
    );
    if (by.audit !== false)
      await audit.append(
        {
          actor: by.actor,
          action: 'reading-add',
          subject: row.name,
          detail: { equipment: id, reading: readingId, at, value: request.value.trim() },
          ...(by.ip === undefined ? {} : { ip: by.ip }),
        },
        t,
      );
    const state = evaluateControl(control, [{ at, value }], kitchenClock(by.at));
    const [miss] = state.misses;
    if (!miss) return { readingId: readingId, deviationId: null };
    const what = `${row.name}: ${miss.what}`;
    const deviationId = await openDeviation(
      db,
      audit,
      t,
      {
        batchId: null,
        equipmentId: id,
        subject: row.name,
        control: 'log',
        kind: 'reading',
        what,
        readingId: readingId,
        key: `equipment ${id}/${at}`,
      },
      by,
    );
    return { readingId: readingId, deviationId };
  });
}

/** Whether a reading was written in °F (kept as entered beside its °C value). */
function enteredInFahrenheit(text: string): boolean {
  try {
    return readTemperature(text).scale === 'F';
  } catch {
    return false;
  }
}

/**
 * Records a thermometer's ice-point check. Outside ±1 °C (±2 °F) of the ice point it cannot be
 * 'ok': it must be adjusted or retired (422 `ice-point` with words). A retired thermometer is
 * marked out of use in the same write.
 */
export async function recordCalibration(
  { db, audit, rows }: EquipmentDeps,
  id: number,
  request: CalibrationRequest,
  by: EntryBy,
): Promise<number> {
  const at = takenAt(request.at, by);
  let check;
  try {
    check = icePointCheck(request.reading);
  } catch (error) {
    if (error instanceof QuantityError) throw badValue('reading', error.message);
    throw error;
  }
  if (!check.passes && request.outcome === 'ok')
    throw new AppError(
      422,
      'ice-point',
      `The thermometer ${check.words}: it cannot be passed as it is. Adjust it and check it again, or retire it.`,
      [{ field: 'outcome', message: check.words }],
    );
  const note = request.note?.trim() || null;
  return db.write(async (t) => {
    const row = await equipmentIn(rows, id, t);
    refuseUnless(row, true);
    const calibrationId = await insertNew(
      db,
      `INSERT INTO calibrations (equipment_id, checked_at, reading, outcome, note, recorded_by, recorded_at)
       VALUES (?, ?, ?, ?, ?, ?, ?)`,
      [id, at, check.celsius.toString(), request.outcome, note, by.actor.id, by.at],
      t,
    );
    const ip = by.ip === undefined ? {} : { ip: by.ip };
    if (by.audit !== false)
      await audit.append(
        {
          actor: by.actor,
          action: 'calibration-add',
          subject: row.name,
          detail: {
            equipment: id,
            calibration: calibrationId,
            reading: request.reading.trim(),
            outcome: request.outcome,
            passes: check.passes,
          },
          ...ip,
        },
        t,
      );
    if (request.outcome === 'retired') {
      await db.sequelize.query('UPDATE equipment SET active = 0 WHERE id = ?', {
        replacements: [id],
        transaction: t,
      });
      if (by.audit !== false)
        await audit.append(
          {
            actor: by.actor,
            action: 'equipment-change',
            subject: row.name,
            detail: {
              equipment: id,
              active: { from: true, to: false },
              reason: `Retired at its ice-point check: ${check.words}.`,
            },
            ...ip,
          },
          t,
        );
    }
    return calibrationId;
  });
}
