import type { Decimal } from '../decimal.ts';
import type { Allergen, FormulaKind } from '../formula/formula-types.ts';

/** What sort of number a figure is; the presenter picks unit and precision from it. */
export type FigureKind =
  | 'mass'
  | 'percent'
  | 'ppm'
  | 'temperature'
  | 'temperature-difference'
  | 'salinometer'
  | 'length'
  | 'count'
  | 'days'
  | 'text';

/** One labelled number: an echoed input or a derived figure such as brine strength. */
export interface Figure {
  readonly label: string;
  readonly kind: FigureKind;
  /** Grams for mass, °C for temperatures, mm for length; a string only for kind 'text'. */
  readonly value: Decimal | string;
  readonly note?: string;
}

/** The role of a line, which changes how it is weighed and printed. */
export type LineRole = 'curing-salt' | 'water' | 'ice' | 'preferment' | 'component' | 'ingredient';

/** One thing to weigh. */
export interface AmountLine {
  readonly name: string;
  /** Exact mass in grams. */
  readonly grams: Decimal;
  /** The line's percentage in the group's basis (of green weight, of flour, of base…). */
  readonly percent?: Decimal;
  readonly role: LineRole;
  readonly note?: string;
  /** An assembly's part: the id of the formula whose batch it is drawn from. */
  readonly part?: string;
}

/** A block of lines weighed together, e.g. "Cure mix" or "Final dough". */
export interface LineGroup {
  readonly title: string;
  /** What the percentages are of, e.g. "green weight"; absent when lines carry no percentage. */
  readonly percentOf?: string;
  readonly lines: readonly AmountLine[];
  /** Label of the total row; absent when a total would mean nothing. */
  readonly totalLabel?: string;
}

/** pass, or fail a critical limit, or fall outside the usual range (warn). */
export type CheckStatus = 'pass' | 'fail' | 'warn';

/** A figure compared with a limit from a regulation, standard or the usual practice. */
export interface LimitCheck {
  readonly id: string;
  readonly label: string;
  readonly value: Decimal;
  readonly unit: 'ppm' | 'percent';
  readonly limit: Decimal;
  /** The limit in the rule's own words where it states a ratio: "¼ oz per 100 lb chopped meat". */
  readonly limitBasis?: string;
  /** at-most: a ceiling; at-least: a floor. */
  readonly comparison: 'at-most' | 'at-least';
  readonly status: CheckStatus;
  /** Whether failing this check refuses the batch (a critical limit of the HACCP plan). */
  readonly critical: boolean;
  /** Which rule applies, in words: "dry-cured bacon". */
  readonly rule: string;
  readonly source: string;
}

/** A safety caution printed with the result. */
export interface Caution {
  readonly id: string;
  readonly text: string;
  readonly source?: string;
}

/** When a cure (or other held product) starts and is ready. */
export interface Schedule {
  /** ISO date, YYYY-MM-DD. */
  readonly start: string;
  readonly days: number;
  /** ISO date, YYYY-MM-DD. */
  readonly ready: string;
  /** The rule in words: "2 days per cm × 4 cm = 8 days". */
  readonly rule: string;
  readonly flipEveryDays?: number;
}

/** Weight through each process step. */
export interface YieldStage {
  readonly step: string;
  readonly percent: Decimal;
  /** Weight after this step, grams. */
  readonly grams: Decimal;
}

/** Pieces cut or divided from a batch. */
export interface Portions {
  readonly pieceGrams: Decimal;
  readonly count: number;
  readonly remainderGrams: Decimal;
  /**
   * The loss allowance, % of the batch, when the batch was scaled up by it: the remainder is
   * then that allowance (dough lost in mixing and dividing), not spare.
   */
  readonly lossPct?: Decimal;
}

/** The full, exact outcome of one batch calculation. Rounding happens only when presenting it. */
export interface CalcResult {
  /** The formula; an assembly's batch is its parts put together (assembly/calculate-assembly.ts). */
  readonly formula: { readonly id: string; readonly title: string; readonly kind: FormulaKind };
  /** The batch inputs as the calculation understood them. */
  readonly inputs: readonly Figure[];
  readonly groups: readonly LineGroup[];
  readonly steps: readonly string[];
  readonly figures: readonly Figure[];
  readonly checks: readonly LimitCheck[];
  readonly warnings: readonly string[];
  readonly cautions: readonly Caution[];
  readonly allergens: readonly Allergen[];
  readonly schedule?: Schedule;
  /** Cures: the size the hold is reckoned on, when it was not given (so there is no ready date). */
  readonly holdNeeds?: 'thickness' | 'largestPiece';
  readonly yields?: readonly YieldStage[];
  readonly portions?: Portions;
  readonly notes?: string;
}

/**
 * The one rule for refusing a batch: a critical check that failed, whatever it compares (a ceiling
 * exceeded or a required level not met). Works on calculated and presented checks alike.
 */
export function isCriticalFailure(check: {
  readonly critical: boolean;
  readonly status: CheckStatus;
}): boolean {
  return check.critical && check.status === 'fail';
}

/** The checks that refuse the batch, in their order. */
export function criticalFailures<
  T extends { readonly critical: boolean; readonly status: CheckStatus },
>(checks: readonly T[]): T[] {
  return checks.filter(isCriticalFailure);
}

/** Whether a result failed a critical limit and must be refused. */
export function failsCriticalLimit(result: CalcResult): boolean {
  return result.checks.some(isCriticalFailure);
}
