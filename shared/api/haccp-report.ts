/**
 * The HACCP records report of a period as `larder report --json` prints it and the PDF and CSV
 * are made from: every batch started or with process records in the period, whole, and the
 * period's refused calculations, equipment logs and calibrations. Types only.
 */
import type { PersonRef } from './batch-record.ts';
import type { Deviation, Reading, Verification, Weighing } from './process-record.ts';

/** A data logger's readings at one control, summed up: a logger writes one a minute. */
export interface LoggerSummary {
  /** Standing logger readings (a corrected one is counted as its correction, listed by hand). */
  readonly count: number;
  /** ISO times of the first and last. */
  readonly first: string;
  readonly last: string;
  /** Lowest and highest, canonical unit, decimal strings. */
  readonly min: string;
  readonly max: string;
  /** Every logger reading the judging called a miss, oldest first. */
  readonly missed: readonly Reading[];
}

/** One control of a batch in the report: its limit and source, and what was read at it. */
export interface ReportControl {
  readonly id: string;
  readonly title: string;
  /** The critical limit in words: "21 °C or below"; "not in the formula" for a control since removed. */
  readonly limit: string;
  readonly source: string;
  /** The canonical unit of its values (°C, s, g, pH, aw). */
  readonly unit: string;
  /** Where it stands now, in words ("met", "missed: …"). */
  readonly state: string;
  readonly logger: LoggerSummary | null;
  /** Every reading entered by hand (console, command, API), corrected ones included. */
  readonly readings: readonly Reading[];
}

/** One batch, whole: its controls and readings, weights, deviations, actions and release. */
export interface ReportBatch {
  readonly lotCode: string;
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly status: string;
  readonly startedOn: string;
  readonly startedAt: string | null;
  readonly operator: PersonRef | null;
  readonly plannedBy: PersonRef | null;
  readonly startedBy: PersonRef | null;
  readonly controls: readonly ReportControl[];
  readonly weighings: readonly Weighing[];
  readonly deviations: readonly Deviation[];
  /** Every verification, oldest first (a batch is released by the standing one). */
  readonly verifications: readonly Verification[];
}

/** A calculation refused over a critical limit. */
export interface ReportRefusal {
  readonly at: string;
  readonly by: PersonRef | null;
  readonly formula: string;
  readonly revision: string | null;
  /** The inputs as given, e.g. "meat=4kg; thickness=4cm". */
  readonly inputs: string;
  /** The limits that refused it, in words. */
  readonly failed: string;
  readonly lotCode: string | null;
}

/** A thermometer check. */
export interface ReportCalibration {
  readonly id: number;
  readonly checkedAt: string;
  readonly reading: string;
  readonly outcome: string;
  readonly note: string | null;
  readonly by: PersonRef | null;
  readonly corrects: number | null;
  readonly reason: string | null;
}

/** One piece of equipment's log in the period. */
export interface ReportEquipment {
  readonly name: string;
  readonly kind: string;
  readonly logger: LoggerSummary | null;
  readonly readings: readonly Reading[];
  readonly calibrations: readonly ReportCalibration[];
  readonly deviations: readonly Deviation[];
}

/** A delivery at the door in the period: its temperature against its limit, and what was done. */
export interface ReportReceipt {
  readonly lotCode: string;
  readonly item: string;
  readonly itemName: string;
  readonly supplier: string;
  readonly supplierLot: string;
  readonly establishment: string | null;
  readonly receivedAt: string;
  readonly by: PersonRef | null;
  /** °C, exact decimal string, or null. */
  readonly temperatureC: string | null;
  readonly limit: string;
  readonly limitSource: string | null;
  /** What was found against the limit, in words. */
  readonly found: string;
  readonly decision: string;
  readonly note: string | null;
  /** The deviation a delivery taken in over its limit opened, with its corrective action. */
  readonly deviations: readonly Deviation[];
}

/** The report's head: whose, which period, who produced it and when. */
export interface ReportHead {
  readonly kitchen: string;
  /** The period, YYYY-MM-DD, both days included, in the kitchen's time zone. */
  readonly from: string;
  readonly to: string;
  readonly timeZone: string;
  readonly producedBy: string;
  /** ISO time. */
  readonly producedAt: string;
}

/** The whole report as JSON. */
export interface HaccpReport extends ReportHead {
  readonly batches: readonly ReportBatch[];
  readonly refusals: readonly ReportRefusal[];
  readonly equipment: readonly ReportEquipment[];
  /** Every delivery received or refused in the period, oldest first. */
  readonly receiving: readonly ReportReceipt[];
}
