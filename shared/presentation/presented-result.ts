import type { CheckStatus, LineRole } from '../calculation/calc-result.ts';
import type { FormulaKind } from '../formula/formula-types.ts';
import type { UnitSystem } from '../units/scale-amount.ts';

/**
 * A calculation ready to print or send as JSON: every number as the display text and, where it
 * matters, the exact decimal as a string (grams, ppm, °C, percent).
 */
export interface PresentedResult {
  readonly formula: { readonly id: string; readonly title: string; readonly kind: FormulaKind };
  readonly units: UnitSystem;
  readonly inputs: readonly PresentedFigure[];
  readonly groups: readonly PresentedGroup[];
  readonly steps: readonly string[];
  readonly figures: readonly PresentedFigure[];
  readonly checks: readonly PresentedCheck[];
  /** Whether a critical limit failed: the batch must not be made. */
  readonly critical: boolean;
  readonly warnings: readonly string[];
  readonly cautions: readonly {
    readonly id: string;
    readonly text: string;
    readonly source?: string;
  }[];
  /** The allergens as the law words them: "egg", "fish (anchovy)", "soybeans". */
  readonly allergens: readonly string[];
  readonly schedule?: {
    readonly start: string;
    readonly days: number;
    readonly ready: string;
    readonly rule: string;
    readonly flipEveryDays?: number;
  };
  /** Cures: the size the hold is reckoned on, when it was not given (so there is no schedule). */
  readonly holdNeeds?: 'thickness' | 'largestPiece';
  readonly yields?: readonly {
    readonly step: string;
    readonly percent: string;
    readonly amount: string;
    readonly grams: string;
  }[];
  readonly portions?: PresentedPortions;
  /** How amounts were rounded, in words. */
  readonly rounding: string;
  readonly notes?: string;
}

/** Pieces or portions cut from a batch, and what is over. */
export interface PresentedPortions {
  readonly piece: string;
  readonly count: number;
  readonly remainder: string;
  readonly remainderGrams: string;
  /** The portions in words, saying what the remainder is: "48 × 90.0 g; the other …". */
  readonly sentence: string;
}

export interface PresentedFigure {
  readonly label: string;
  readonly value: string;
  /** The exact value in base units (g, °C, mm, %, ppm); absent for text. */
  readonly exact?: string;
  readonly note?: string;
}

export interface PresentedLine {
  readonly name: string;
  /** What to weigh, rounded for the scale: "95.9 g", "2 lb 3.4 oz". */
  readonly amount: string;
  /** In US units, the gram figure printed beside a curing-salt line. */
  readonly gramsShown?: string;
  /** Exact grams. */
  readonly grams: string;
  readonly percent?: string;
  readonly role: LineRole;
  readonly note?: string;
  /** An assembly's part: the id of the formula whose batch it is drawn from. */
  readonly part?: string;
}

export interface PresentedGroup {
  readonly title: string;
  readonly percentOf?: string;
  readonly lines: readonly PresentedLine[];
  /** The printed lines added up, and the exact total. */
  readonly total?: {
    readonly label: string;
    /** The printed lines added up. */
    readonly amount: string;
    /** The exact total, grams. */
    readonly grams: string;
    /**
     * The exact total rounded as the total row is: the table's weight, printed the same wherever
     * it appears; differs from {@link amount} when the rounded lines add up to another figure.
     */
    readonly weight: string;
    /** Said beside the total when {@link weight} differs from {@link amount}, in words. */
    readonly note?: string;
    readonly percent?: string;
  };
}

export interface PresentedCheck {
  readonly id: string;
  readonly label: string;
  readonly value: string;
  readonly exact: string;
  readonly limit: string;
  readonly comparison: 'at-most' | 'at-least';
  readonly status: CheckStatus;
  /** PASS, FAIL or WARN: the status in words as well as colour. */
  readonly verdict: 'PASS' | 'FAIL' | 'WARN';
  readonly critical: boolean;
  /** The check as one sentence, saying it was compared unrounded. */
  readonly sentence: string;
  readonly rule: string;
  readonly source: string;
}
