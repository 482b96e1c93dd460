/**
 * Costs as the API sends them (GET /api/batches/:lot/cost, /api/plans/:assembly/:day/cost,
 * /api/formulas/:id/costs) and the least-cost blend (/api/blends): one definition for the server
 * and the console. Money is the kitchen's currency, with no sign: `…Text` fields are rounded to
 * the cent, half-up, for showing; the others are the exact decimals, unrounded.
 */
import type { CostSource } from '../costing/batch-cost.ts';

/** One thing that went into a batch and what it cost. */
export interface CostLineRecord {
  readonly name: string;
  /** Its catalogue item, when it has one. */
  readonly item: string | null;
  /** How much went in, exact, in the item's base measure (grams, millilitres or a count). */
  readonly amount: string;
  /** The amount for a person: "10.000 kg", "250 g". */
  readonly amountText: string;
  readonly source: CostSource;
  /** The received lot or earlier batch it came from. */
  readonly lot: string | null;
  readonly cost: string | null;
  readonly costText: string | null;
  /** Why it has no price, when it has none. */
  readonly unpriced: string | null;
}

/** The cost of one batch, recorded or planned. */
export interface BatchCostRecord {
  /** The batch's lot code; null for a batch of a plan not recorded yet. */
  readonly lot: string | null;
  readonly formula: { readonly id: string; readonly title: string };
  readonly lines: readonly CostLineRecord[];
  readonly total: string;
  readonly totalText: string;
  /** Whether every line had a price: when false the total is only part of the cost. */
  readonly complete: boolean;
  /** Lines priced at their item's latest price, because no lot was recorded for them. */
  readonly latestPriced: readonly string[];
  readonly unpriced: readonly { readonly name: string; readonly reason: string }[];
  readonly finishedGrams: string;
  readonly finishedText: string;
  /** How the finished weight was found, in words. */
  readonly finishedBasis: string;
  readonly perFinishedKg: string | null;
  readonly perFinishedKgText: string | null;
  readonly portion: {
    readonly grams: string;
    readonly weightText: string;
    readonly count: number;
    readonly cost: string;
    readonly costText: string;
  } | null;
}

/** A plan's cost for a service. */
export interface PlanCostRecord {
  readonly assembly: string;
  readonly serviceDate: string;
  /** Units served; null when neither asked nor recorded with the batches. */
  readonly count: number | null;
  /** Whether the batches are recorded ones (priced from their lots) or the plan worked out now. */
  readonly recorded: boolean;
  readonly batches: readonly BatchCostRecord[];
  readonly total: string;
  readonly totalText: string;
  readonly complete: boolean;
  readonly perUnit: string | null;
  readonly perUnitText: string | null;
}

/** One batch on a formula's cost chart. */
export interface FormulaCostPoint {
  readonly lot: string;
  /** The day it started, YYYY-MM-DD. */
  readonly day: string;
  readonly perFinishedKg: string | null;
  readonly perFinishedKgText: string | null;
  readonly complete: boolean;
}

/** GET /api/formulas/:id/costs: cost per finished kilogram, one point a batch, oldest first. */
export interface FormulaCosts {
  readonly formula: string;
  readonly points: readonly FormulaCostPoint[];
  /** Whether older batches were left out (only the latest are charted). */
  readonly truncated: boolean;
}

/** A trim the least-cost blend may use. */
export interface BlendTrimRecord {
  readonly name: string;
  /** Its catalogue item, when it comes from stock. */
  readonly item: string | null;
  /** Fat, % by weight. */
  readonly fat: string;
  /** Price per kilogram; null when none of it was received with a price. */
  readonly pricePerKg: string | null;
  /** Grams on hand. */
  readonly onHandGrams: string;
  /** Fat added as such (not trimmings), which ground beef may not take. */
  readonly fatAsSuch: boolean;
}

/** GET /api/blends/trims: the trims on hand, from the lots in stock. */
export interface BlendTrims {
  readonly trims: readonly BlendTrimRecord[];
}

/** POST /api/blends/least-cost: the cheapest mix (a refusal is a 422 'blend-refused'). */
export interface LeastCostAnswer {
  readonly shares: readonly {
    readonly name: string;
    readonly fat: string;
    readonly grams: string;
    readonly weightText: string;
    readonly cost: string;
    readonly costText: string;
  }[];
  /** The blend's fat, %: the target, met exactly. */
  readonly fat: string;
  readonly batchGrams: string;
  /** The batch's weight for a person: "10.000 kg". */
  readonly batchText: string;
  readonly cost: string;
  readonly costText: string;
  readonly costPerKg: string;
  readonly costPerKgText: string;
  /** Trims the standard kept out (fat added as such in ground beef). */
  readonly leftOut: readonly string[];
  /** The standard it was blended under, in words ("ground beef, 9 CFR 319.15(a): at most 30 % fat"). */
  readonly standard: string | null;
}
