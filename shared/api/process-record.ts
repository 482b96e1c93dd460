/**
 * A batch's process record as the API sends it: the HACCP side of a batch — what was weighed,
 * the readings at each control and what they say, deviations and their corrective actions,
 * verification and release. Types only, shared by the server, the command and the console.
 *
 * Records are never edited in place: a correction is a new entry whose `corrects` names the
 * entry it replaces; the replaced one stays, marked `correctedBy`.
 */
import type { ControlState, Measure, ResolvedControl } from '../process/control-types.ts';
import type { RawBatchOptions } from '../calculation/batch-input.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import type { PersonRef } from './batch-record.ts';

/** Who wrote an entry and when; the reason is given only for a correction. */
export interface EntryStamp {
  readonly id: number;
  readonly by: PersonRef | null;
  /** ISO timestamp the entry was written. */
  readonly recordedAt: string;
  /** The entry this one corrects, and why. */
  readonly corrects: number | null;
  readonly reason: string | null;
  /** The entry that replaced this one; null while it stands. */
  readonly correctedBy: number | null;
}

/** Where a reading came from. */
export type ReadingSource = 'console' | 'command' | 'api' | 'logger';

/** One reading at a control (or of a piece of equipment). */
export interface Reading extends EntryStamp {
  readonly control: string;
  /** ISO time it was taken. */
  readonly at: string;
  /** Canonical unit (°C, s, g, pH, aw), decimal string. */
  readonly value: string;
  /** As it was entered, e.g. "158 °F"; null when entered in the canonical unit. */
  readonly enteredAs: string | null;
  readonly source: ReadingSource;
}

/** A control on a batch: the formula's control, its readings, and where it stands now. */
export interface BatchControl {
  readonly control: ResolvedControl;
  readonly state: ControlState;
  /** Every reading, oldest first, corrected ones included (marked correctedBy). */
  readonly readings: readonly Reading[];
}

/** A line weighed ("line") or the product weighed after a step ("stage"). */
export interface Weighing extends EntryStamp {
  readonly kind: 'line' | 'stage';
  /** The ingredient line's name, or the stage: green, pumped, cured, smoked, cooked, sliced. */
  readonly name: string;
  /** What the calculation said, grams; null for a stage. */
  readonly plannedGrams: string | null;
  readonly grams: string;
  /** ISO time it was weighed. */
  readonly weighedAt: string;
}

/** The stage weights a batch can record, in the order of the work. */
export type StageName = 'green' | 'pumped' | 'cured' | 'smoked' | 'cooked' | 'sliced';

/** A stage weight over the weight before it, as a percent, beside what the formula expects. */
export interface ActualYield {
  readonly stage: StageName;
  /** The stage it is compared with; null for the batch's own weight as calculated (green, total). */
  readonly from: StageName | null;
  /** The standing weight of the stage, grams. */
  readonly grams: string;
  /** stage ÷ from × 100, exact. */
  readonly percent: string;
  /** The formula's yields over the same steps (pumped: 100 + the pump target); null when none. */
  readonly planned: string | null;
}

/** POST /api/batches/:lot/weighings: lines by their name on the sheet, and/or one stage. */
export interface WeighingRequest {
  /** Weights with their unit: "1.25 kg", "2 lb 3 oz". */
  readonly lines?: readonly { readonly name: string; readonly weight: string }[];
  readonly stage?: { readonly name: StageName; readonly weight: string; readonly at?: string };
}

/** The answer to weighings or a correction: what was written and what it means for the batch. */
export interface WeighingAnswer {
  readonly weighings: readonly Weighing[];
  /** Ingoing nitrite on the actual weights (cures, once a line is weighed); null otherwise. */
  readonly actualNitritePpm: string | null;
  /** The first deviation this opened (see `deviations`); null when none. */
  readonly deviation: Deviation | null;
  /** Every deviation this opened: an actual nitrite over its limit, a pump over its target. */
  readonly deviations: readonly Deviation[];
  /** What the weights say, in a cook's words, a deviation first: figure, limit, what to do. */
  readonly messages: readonly string[];
}

/** The planned calculation of a batch that has since been started on what was really there. */
export interface PlannedCalculation {
  readonly revision: string;
  readonly startedOn: string;
  readonly readyOn: string | null;
  readonly inputs: RawBatchOptions;
  readonly nitritePpm: string | null;
  readonly checksPassed: boolean;
  readonly result: PresentedResult;
}

/** POST /api/batches/:lot/start: the batch options as really there (green weight, start…). */
export interface StartRequest {
  readonly batch: RawBatchOptions;
}

/** A calculation refused over a critical limit, as GET /api/refusals lists it. */
export interface Refusal {
  readonly id: number;
  /** ISO time it was refused. */
  readonly at: string;
  readonly by: PersonRef | null;
  readonly formula: string;
  readonly revision: string | null;
  readonly inputs: RawBatchOptions;
  /** The failed checks in words: "critical limit exceeded: ingoing sodium nitrite …". */
  readonly failed: readonly string[];
  /** The planned batch a refused start was for; null for a new record. */
  readonly lotCode: string | null;
}

/**
 * What happened to the product after a deviation (9 CFR 417.3(a)(4)). `unaffected` only closes a
 * deadline deviation opened before readings taken in time were entered: the server records it,
 * with the reason, when those readings show the limit was met; a person cannot choose it.
 */
export type Disposition =
  'recooked' | 'rechilled' | 'reworked' | 'diverted' | 'discarded' | 'unaffected';

/** The corrective action that closes a deviation, with the four things 9 CFR 417.3(a) asks. */
export interface CorrectiveAction extends EntryStamp {
  /** (a)(1) The cause of the deviation, identified and eliminated. */
  readonly cause: string;
  /** (a)(2) How the CCP is under control again. */
  readonly restored: string;
  /** (a)(3) Measures to prevent it happening again. */
  readonly prevention: string;
  /** (a)(4) What happened to the product, and how much of it, grams. */
  readonly disposition: Disposition;
  readonly dispositionGrams: string | null;
}

/** What missed a limit. */
export type DeviationKind = 'reading' | 'deadline' | 'nitrite' | 'pump' | 'check';

/** A missed critical limit: the batch is on hold until a corrective action closes it. */
export interface Deviation {
  readonly id: number;
  /** The control it concerns; null for a weighing or a check. */
  readonly control: string | null;
  readonly kind: DeviationKind;
  /** Words for a cook: "Chilling: 26.7 °C at 15:02, must be 21 °C or below by 14:32". */
  readonly what: string;
  /** ISO time it was opened. */
  readonly openedAt: string;
  /** Who did what opened it; null when the server found a deadline passed. */
  readonly openedBy: PersonRef | null;
  /** The standing corrective action; null while the deviation is open. */
  readonly action: CorrectiveAction | null;
  /** Earlier actions it replaced, oldest first. */
  readonly earlierActions: readonly CorrectiveAction[];
}

/** A reviewer's pre-shipment review of a batch's records (9 CFR 417.5(c)), which releases it. */
export interface Verification extends EntryStamp {
  readonly note: string | null;
}

/** GET /api/batches/:lot/process: the whole process record of one batch. */
export interface ProcessRecord {
  readonly lotCode: string;
  readonly controls: readonly BatchControl[];
  readonly weighings: readonly Weighing[];
  /** Ingoing nitrite, ppm, worked out again from the actual line weights; null until weighed. */
  readonly actualNitritePpm: string | null;
  /** Each stage weighed over the stage before it, beside the formula's yield; oldest stage first. */
  readonly actualYields: readonly ActualYield[];
  /** The calculation the batch was planned with, kept when it was started; null if never planned. */
  readonly planned: PlannedCalculation | null;
  readonly deviations: readonly Deviation[];
  /** Open deviations hold the batch: it cannot be marked done or released. */
  readonly onHold: boolean;
  /**
   * Any deviation ever opened that was a miss: kept as nonconforming with its disposition, never
   * dropped. A deadline deviation closed as unaffected (the readings, entered late, show it met)
   * does not count; it stays listed.
   */
  readonly nonconforming: boolean;
  readonly verification: Verification | null;
  /** Who planned it (recorded it as planned) and who started it, when they differ. */
  readonly plannedBy: PersonRef | null;
  readonly startedBy: PersonRef | null;
  readonly startedAt: string | null;
}

/** A reading as sent to POST /api/batches/:lot/readings. */
export interface ReadingRequest {
  readonly control: string;
  /** "71.5 °C", "160 °F", "6.2" (pH), "0.85" (aw), "12 kg"…; the measure's own unit when bare. */
  readonly value: string;
  /** ISO time it was taken; now when absent. */
  readonly at?: string;
}

/** The answer to a reading: the reading, the control's new state, the deviation it opened. */
export interface ReadingAnswer {
  readonly reading: Reading;
  readonly state: ControlState;
  readonly deviation: Deviation | null;
}

/** A measure in words for labels. */
export type MeasureWords = Readonly<Record<Measure, string>>;

/** One thing needing attention now, as GET /api/process/now lists it (most urgent first). */
export interface NowItem {
  readonly kind: 'reading-due' | 'stage-deadline' | 'deviation';
  readonly lotCode: string;
  readonly formulaTitle: string;
  /** The control's id and title; null for a deviation not tied to a control. */
  readonly control: string | null;
  readonly controlTitle: string | null;
  /** ISO time it is due (a reading, a stage's deadline) or was opened (a deviation). */
  readonly at: string;
  /** Words for a cook: "Chilling: must reach 21 °C by 14:32". */
  readonly what: string;
}

/** GET /api/process/now. */
export interface ProcessNow {
  readonly items: readonly NowItem[];
}
