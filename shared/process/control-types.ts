/**
 * Process controls: what a formula says is monitored at a critical control point, the critical
 * limit it is held to, and what a set of readings says about it. Types only; the templates live
 * in control-templates.ts and the judging in evaluate-control.ts.
 *
 * Values inside are canonical: °C for temperatures, seconds for time, grams for weight, plain
 * numbers for pH and water activity, all as decimal strings where they cross a boundary.
 */

/** What is measured. Temperatures and time are the ones a cook meets every day. */
export type Measure =
  'internal-temperature' | 'chamber-temperature' | 'time' | 'weight' | 'ph' | 'water-activity';

/** The unit every value of a measure is kept in. */
export type CanonicalUnit = '°C' | 's' | 'g' | 'pH' | 'aw';

/** One stage of a cooling limit: from one temperature down to another within a time. */
export interface CoolingStage {
  /** °C the stage starts at (the first stage's `from` starts the clock). */
  readonly fromC: string;
  /** °C the product must reach. */
  readonly toC: string;
  /** Seconds allowed. */
  readonly withinS: string;
  /**
   * What the time is counted from: the moment this stage began (FSIS Appendix B, each stage
   * timed on its own) or the moment cooling began (Food Code §3-501.14, "within 6 hours total").
   */
  readonly countedFrom: 'stage-start' | 'cooling-start';
}

/** One row of a time-at-temperature table: at or above tempC for at least holdS seconds. */
export interface HoldRow {
  readonly tempC: string;
  /** "0" means reached instantly: one reading at or above tempC meets it. */
  readonly holdS: string;
}

/**
 * A critical limit. `at-most`/`at-least`/`between` judge every reading on its own (holding,
 * receiving, chamber, pH, water activity); `hold` is met once the product has stayed at or above
 * one row's temperature for that row's time (cooking, lethality); `cooling` is a staged cool.
 */
export type ControlLimit =
  | { readonly type: 'at-most'; readonly max: string }
  | { readonly type: 'at-least'; readonly min: string }
  | { readonly type: 'between'; readonly min: string; readonly max: string }
  | { readonly type: 'hold'; readonly rows: readonly HoldRow[] }
  | { readonly type: 'cooling'; readonly stages: readonly CoolingStage[] };

/** A named, sourced limit a formula refers to by its key instead of writing its own. */
export interface ControlTemplate {
  /** The key a formula writes: `rule: fsis-cooling-option-1`. */
  readonly key: string;
  /** A cook's name for it: "Chilling, FSIS option 1 (54 → 27 °C in 1½ h, → 4 °C in 5 h)". */
  readonly title: string;
  readonly measure: Measure;
  readonly limit: ControlLimit;
  /** The published work, section and edition the limit is taken from. */
  readonly source: string;
  /** What it applies to and what it needs, in words (e.g. "cured, ≥ 100 ppm ingoing nitrite"). */
  readonly appliesTo: string;
  /** Cured-product options only: the least ingoing sodium nitrite, ppm, the option relies on. */
  readonly minNitritePpm?: string;
  /** The corrective action a formula gets unless it writes its own. */
  readonly defaultAction: string;
}

/** A process control as a formula file writes it (`controls:`), before its rule is resolved. */
export interface FormulaControl {
  /** Unique within the formula: what readings are recorded against. */
  id: string;
  title: string;
  /** The step it belongs to, in the formula's words: "smoke", "chill". */
  step: string;
  measure: Measure;
  /** A template's key; or `limit` and `source` for the kitchen's own validated limit. */
  rule?: string;
  limit?: {
    max?: string;
    min?: string;
    /** With `min`: how long it must stay at or above, e.g. "17 s". */
    hold?: string;
    /** A cooling limit of the kitchen's own. */
    stages?: { from: string; to: string; within: string; counted_from?: 'stage' | 'start' }[];
  };
  source?: string;
  /** How often it is monitored, e.g. "30 min"; absent for a single check. */
  every?: string;
  /** The default corrective action when the limit is missed. */
  if_missed?: string;
}

/** A control with its rule resolved: what the records and the console work with. */
export interface ResolvedControl {
  readonly id: string;
  readonly title: string;
  readonly step: string;
  readonly measure: Measure;
  readonly unit: CanonicalUnit;
  readonly limit: ControlLimit;
  /** The template's key, or null for the kitchen's own limit. */
  readonly rule: string | null;
  readonly source: string;
  /** Seconds between readings; null for a single check. */
  readonly everyS: string | null;
  readonly ifMissed: string;
  /** Cured-product options only (see ControlTemplate). */
  readonly minNitritePpm?: string;
}

/** One reading as the judging sees it: corrected readings already replaced by their correction. */
export interface ReadingPoint {
  /** ISO timestamp with zone. */
  readonly at: string;
  /** Canonical unit, decimal string. */
  readonly value: string;
}

/** Where a control stands. */
export type ControlStatus =
  /** No reading yet. */
  | 'waiting'
  /** Readings so far keep to the limit; more are due (a cool in progress, holding). */
  | 'in-progress'
  /** The limit is met for good (lethality reached, cooling complete). */
  | 'met'
  /** The limit was missed: a reading outside it, or a deadline passed without a reading. */
  | 'missed';

/** What happened that missed the limit. */
export interface ControlMiss {
  readonly kind: 'reading' | 'deadline';
  /** ISO time of the reading, or of the deadline that passed. */
  readonly at: string;
  /** Words for a cook: "26.7 °C at 15:02; must be 21 °C or below by 14:32". */
  readonly what: string;
  /** A key that names this miss exactly, so it opens one deviation only: "stage-1", a reading's time. */
  readonly key: string;
}

/** The judgement of one control's readings at a moment. */
export interface ControlState {
  readonly status: ControlStatus;
  /** One line in a cook's words: "Stage 1: must reach 21 °C by 14:32". */
  readonly summary: string;
  /** A staged cool in progress (also after a miss, while it goes on): the stage, its target and deadline. */
  readonly stage: {
    /** 1 for the first stage, as in the miss key "stage-1". */
    readonly index: number;
    readonly toC: string;
    /** ISO time. */
    readonly deadline: string;
  } | null;
  /**
   * ISO time the next reading is due (last reading + every); null when none is: met, a single
   * check, a step that is over, a finished cool. Holding and an unfinished cool stay due after a
   * miss, since monitoring goes on.
   */
  readonly nextDue: string | null;
  /** Every miss, oldest first. */
  readonly misses: readonly ControlMiss[];
}
