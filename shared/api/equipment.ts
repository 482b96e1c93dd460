/**
 * Equipment logs as the API sends them: coolers, freezers, smokers and hot-holding units logged
 * on a schedule (not per batch), and thermometers checked in ice water. Types only, shared by the
 * server and the console.
 */
import type { ControlState, FormulaControl } from '../process/control-types.ts';
import type { PersonRef } from './batch-record.ts';
import type { Deviation } from './process-record.ts';

/** What a piece of equipment is. */
export type EquipmentKind = 'cooler' | 'freezer' | 'smoker' | 'hot-holding' | 'thermometer';

/** Every kind, in the order a kitchen lists them. */
export const EQUIPMENT_KINDS: readonly EquipmentKind[] = [
  'cooler',
  'freezer',
  'smoker',
  'hot-holding',
  'thermometer',
];

/**
 * A piece of equipment's control as stored, in the formula's control syntax: a template `rule`
 * (cold-holding, hot-holding…) or an own `limit` with its `source`, and how often it is checked
 * (`every`). A thermometer's control is only `every`: how often it is checked in ice water.
 */
export type EquipmentControl = Partial<
  Pick<FormulaControl, 'measure' | 'rule' | 'limit' | 'source' | 'if_missed'>
> & { every: string };

/** One reading of a piece of equipment, with what it was judged to be when it was taken. */
export interface EquipmentReading {
  readonly id: number;
  /** ISO time it was taken. */
  readonly at: string;
  /** °C, decimal string. */
  readonly value: string;
  /** As it was entered, e.g. "38 °F"; null when entered in °C. */
  readonly enteredAs: string | null;
  readonly by: PersonRef | null;
  readonly recordedAt: string;
  /** The deviation it opened (out of the limit in force when it was taken); null when within. */
  readonly deviationId: number | null;
}

/** The ice-point check's outcome: still true, adjusted to read true, or taken out of use. */
export type CalibrationOutcome = 'ok' | 'adjusted' | 'retired';

/** One ice-point check of a thermometer. */
export interface Calibration {
  readonly id: number;
  /** ISO time it was checked. */
  readonly at: string;
  /** What it read in ice water, °C, decimal string. */
  readonly reading: string;
  readonly outcome: CalibrationOutcome;
  readonly note: string | null;
  readonly by: PersonRef | null;
  readonly recordedAt: string;
}

/** A piece of equipment as GET /api/equipment lists it. */
export interface Equipment {
  readonly id: number;
  readonly name: string;
  readonly kind: EquipmentKind;
  readonly control: EquipmentControl;
  /** The limit in words: "at or below 5 °C (41 °F), every 4 h · FDA Food Code…". */
  readonly limitWords: string;
  /** False once retired: no more readings or reminders. */
  readonly active: boolean;
  readonly createdAt: string;
  /** The latest standing reading; null for a thermometer or before the first. */
  readonly lastReading: EquipmentReading | null;
  /** The latest ice-point check (thermometers only). */
  readonly lastCalibration: Calibration | null;
  /**
   * The latest reading judged by the limit now in force (evaluateControl); null for a
   * thermometer. 'waiting' before the first reading, 'missed' when it is out of the limit.
   */
  readonly state: ControlState | null;
  /** ISO time the next reading (or ice-point check) is due; null once retired. */
  readonly nextDue: string | null;
  /** Whether nextDue has passed. */
  readonly overdue: boolean;
}

/** GET /api/equipment. */
export interface EquipmentList {
  /** Active first, the one due soonest first; retired ones last. */
  readonly equipment: readonly Equipment[];
}

/** POST /api/equipment. */
export interface EquipmentAddRequest {
  readonly name: string;
  readonly kind: EquipmentKind;
  readonly control: EquipmentControl;
}

/** PATCH /api/equipment/:id: any of these; `reason` is asked for a change of the limit. */
export interface EquipmentChangeRequest {
  readonly name?: string;
  readonly control?: EquipmentControl;
  readonly active?: boolean;
  readonly reason?: string;
}

/** POST /api/equipment/:id/readings. */
export interface EquipmentReadingRequest {
  /** "3.5 °C", "38 °F". */
  readonly value: string;
  /** ISO time it was taken; now when absent. */
  readonly at?: string;
}

/** The answer to a reading: the reading, the equipment now, the deviation it opened. */
export interface EquipmentReadingAnswer {
  readonly reading: EquipmentReading;
  readonly equipment: Equipment;
  readonly deviation: Deviation | null;
}

/** POST /api/equipment/:id/calibrations. */
export interface CalibrationRequest {
  /** What it read in ice water: "0.5 °C", "33 °F". */
  readonly reading: string;
  readonly outcome: CalibrationOutcome;
  readonly note?: string;
  /** ISO time it was checked; now when absent. */
  readonly at?: string;
}

/** The answer to a calibration: the check and the thermometer now. */
export interface CalibrationAnswer {
  readonly calibration: Calibration;
  readonly equipment: Equipment;
}

/** A deviation of a piece of equipment, with whether a corrective action closed it. */
export interface EquipmentDeviation {
  readonly id: number;
  readonly kind: string;
  readonly what: string;
  readonly openedAt: string;
  readonly openedBy: PersonRef | null;
  readonly readingId: number | null;
  /** Whether a corrective action closed it (POST /api/deviations/:id/action). */
  readonly closed: boolean;
}

/** GET /api/equipment/:id/log?from&to: what happened in a period, oldest first. */
export interface EquipmentLog {
  readonly equipment: Equipment;
  /** ISO times of the period. */
  readonly from: string;
  readonly to: string;
  readonly readings: readonly EquipmentReading[];
  readonly deviations: readonly EquipmentDeviation[];
  readonly calibrations: readonly Calibration[];
}
