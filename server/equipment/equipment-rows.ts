import { QueryTypes, type Transaction } from 'sequelize';
import { siteCondition, type SiteScope } from '../sites/site-scope.ts';
import type {
  Calibration,
  CalibrationOutcome,
  EquipmentControl,
  EquipmentDeviation,
  EquipmentKind,
  EquipmentReading,
} from '../../shared/api/equipment.ts';
import type { Deviation, DeviationKind } from '../../shared/api/process-record.ts';
import type { Database } from '../db/database.ts';

/** An equipment row as stored. */
export interface EquipmentRow {
  readonly id: number;
  readonly name: string;
  readonly kind: EquipmentKind;
  readonly control: EquipmentControl;
  readonly active: boolean;
  readonly createdAt: string;
}

/** A period, ISO times, both ends included. */
export interface Period {
  readonly from: string;
  readonly to: string;
}

const person = (id: number | null, name: string | null) =>
  id === null ? null : { id, displayName: name ?? '' };

/** A reading with who took it and the deviation it opened (a correction: its original's). */
const READINGS = `SELECT r.id, r.taken_at, r.value, r.entered_as, r.recorded_by, r.recorded_at,
    p.display_name AS by_name,
    (SELECT MIN(d.id) FROM deviations d WHERE d.reading_id = COALESCE(r.corrects_id, r.id)) AS deviation_id
  FROM readings r LEFT JOIN people p ON p.id = r.recorded_by`;

/** The equipment's readings that stand (a corrected one gives way to its correction). */
const STANDING_READINGS = `${READINGS}
  WHERE r.equipment_id = ? AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = r.id)`;

interface ReadingRow {
  id: number;
  taken_at: string;
  value: string;
  entered_as: string | null;
  recorded_by: number | null;
  recorded_at: string;
  by_name: string | null;
  deviation_id: number | null;
}

const readingOf = (row: ReadingRow): EquipmentReading => ({
  id: row.id,
  at: row.taken_at,
  value: row.value,
  enteredAs: row.entered_as,
  by: person(row.recorded_by, row.by_name),
  recordedAt: row.recorded_at,
  deviationId: row.deviation_id,
});

const CALIBRATION_COLUMNS = `SELECT c.id, c.checked_at, c.reading, c.outcome, c.note, c.recorded_by, c.recorded_at,
    p.display_name AS by_name
  FROM calibrations c LEFT JOIN people p ON p.id = c.recorded_by`;

/** A thermometer's ice-point checks that stand. */
const CALIBRATIONS = `${CALIBRATION_COLUMNS}
  WHERE c.equipment_id = ? AND NOT EXISTS (SELECT 1 FROM calibrations x WHERE x.corrects_id = c.id)`;

interface CalibrationRow {
  id: number;
  checked_at: string;
  reading: string;
  outcome: CalibrationOutcome;
  note: string | null;
  recorded_by: number | null;
  recorded_at: string;
  by_name: string | null;
}

const calibrationOf = (row: CalibrationRow): Calibration => ({
  id: row.id,
  at: row.checked_at,
  reading: row.reading,
  outcome: row.outcome,
  note: row.note,
  by: person(row.recorded_by, row.by_name),
  recordedAt: row.recorded_at,
});

interface DeviationRow {
  id: number;
  kind: string;
  what: string;
  opened_at: string;
  opened_by: number | null;
  by_name: string | null;
  reading_id: number | null;
  closed: number | boolean;
}

/**
 * Reads equipment, its readings, calibrations and deviations: raw SQL over the 007 tables, inside
 * a write transaction when one is given (so a write answers with what it wrote).
 */
export class EquipmentRows {
  constructor(private readonly db: Database) {}

  private select<T extends object>(
    sql: string,
    values: unknown[],
    transaction?: Transaction,
  ): Promise<T[]> {
    return this.db.sequelize.query<T>(sql, {
      replacements: values,
      type: QueryTypes.SELECT,
      ...(transaction ? { transaction } : {}),
    });
  }

  /**
   * Every piece of equipment, or one by id; with a site, that site's only (the reminder job works
   * for the whole group and gives none).
   */
  async equipment(
    id?: number,
    transaction?: Transaction,
    site?: SiteScope,
  ): Promise<EquipmentRow[]> {
    const where = [
      ...(id === undefined ? [] : [{ sql: 'id = ?', values: [id] }]),
      siteCondition(site, 'site_id'),
    ].filter((part) => part.sql);
    const rows = await this.select<{
      id: number;
      name: string;
      kind: EquipmentKind;
      control: string;
      active: number;
      created_at: string;
    }>(
      `SELECT id, name, kind, control, active, created_at FROM equipment
       ${where.length ? `WHERE ${where.map((part) => part.sql).join(' AND ')}` : ''} ORDER BY id`,
      where.flatMap((part) => part.values),
      transaction,
    );
    return rows.map((row) => ({
      id: row.id,
      name: row.name,
      kind: row.kind,
      control: JSON.parse(row.control) as EquipmentControl,
      active: row.active === 1,
      createdAt: row.created_at,
    }));
  }

  /** The latest standing reading. */
  async lastReading(equipmentId: number, t?: Transaction): Promise<EquipmentReading | null> {
    const [row] = await this.select<ReadingRow>(
      `${STANDING_READINGS} ORDER BY r.taken_at DESC, r.id DESC LIMIT 1`,
      [equipmentId],
      t,
    );
    return row ? readingOf(row) : null;
  }

  /** The latest standing ice-point check. */
  async lastCalibration(equipmentId: number, t?: Transaction): Promise<Calibration | null> {
    const [row] = await this.select<CalibrationRow>(
      `${CALIBRATIONS} ORDER BY c.checked_at DESC, c.id DESC LIMIT 1`,
      [equipmentId],
      t,
    );
    return row ? calibrationOf(row) : null;
  }

  /** The standing readings taken in a period, oldest first. */
  async readings(equipmentId: number, period: Period): Promise<EquipmentReading[]> {
    const rows = await this.select<ReadingRow>(
      `${STANDING_READINGS} AND r.taken_at >= ? AND r.taken_at <= ? ORDER BY r.taken_at, r.id`,
      [equipmentId, period.from, period.to],
    );
    return rows.map(readingOf);
  }

  /** One reading by id. */
  async reading(id: number): Promise<EquipmentReading | null> {
    const [row] = await this.select<ReadingRow>(
      `${READINGS} WHERE r.id = ? AND r.equipment_id IS NOT NULL`,
      [id],
    );
    return row ? readingOf(row) : null;
  }

  /** A deviation of a piece of equipment as the process record shows one, with no action yet. */
  async deviation(id: number): Promise<Deviation | null> {
    const [row] = await this.select<DeviationRow & { control: string | null }>(
      `SELECT d.id, d.kind, d.what, d.control, d.opened_at, d.opened_by, p.display_name AS by_name
       FROM deviations d LEFT JOIN people p ON p.id = d.opened_by WHERE d.id = ?`,
      [id],
    );
    if (!row) return null;
    return {
      id: row.id,
      control: row.control,
      kind: row.kind as DeviationKind,
      what: row.what,
      openedAt: row.opened_at,
      openedBy: person(row.opened_by, row.by_name),
      action: null,
      earlierActions: [],
    };
  }

  /** One ice-point check by id. */
  async calibration(id: number): Promise<Calibration | null> {
    const [row] = await this.select<CalibrationRow>(`${CALIBRATION_COLUMNS} WHERE c.id = ?`, [id]);
    return row ? calibrationOf(row) : null;
  }

  /** The ice-point checks of a period, oldest first. */
  async calibrations(equipmentId: number, period: Period): Promise<Calibration[]> {
    const rows = await this.select<CalibrationRow>(
      `${CALIBRATIONS} AND c.checked_at >= ? AND c.checked_at <= ? ORDER BY c.checked_at, c.id`,
      [equipmentId, period.from, period.to],
    );
    return rows.map(calibrationOf);
  }

  /** The deviations opened in a period, oldest first, with whether an action closed each. */
  async deviations(equipmentId: number, period: Period): Promise<EquipmentDeviation[]> {
    const rows = await this.select<DeviationRow>(
      `SELECT d.id, d.kind, d.what, d.opened_at, d.opened_by, p.display_name AS by_name, d.reading_id,
         EXISTS (SELECT 1 FROM corrective_actions a WHERE a.deviation_id = d.id) AS closed
       FROM deviations d LEFT JOIN people p ON p.id = d.opened_by
       WHERE d.equipment_id = ? AND d.opened_at >= ? AND d.opened_at <= ? ORDER BY d.opened_at, d.id`,
      [equipmentId, period.from, period.to],
    );
    return rows.map((row) => ({
      id: row.id,
      kind: row.kind,
      what: row.what,
      openedAt: row.opened_at,
      openedBy: person(row.opened_by, row.by_name),
      readingId: row.reading_id,
      // EXISTS is 0 or 1 on SQLite, a boolean on PostgreSQL.
      closed: Boolean(row.closed),
    }));
  }
}
