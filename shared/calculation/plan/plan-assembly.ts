import { Decimal } from '../../decimal.ts';
import type { AssemblyFormula } from '../../formula/formula-types.ts';
import { CAUTIONS, allergenCaution } from '../../reference/cautions.ts';
import type { Allergen } from '../../formula/formula-types.ts';
import { collectAllergens } from '../allergens.ts';
import { BatchError } from '../batch-error.ts';
import { checkProblem } from '../../presentation/check-figures.ts';
import { dayWords } from '../../presentation/date-words.ts';
import {
  criticalFailures,
  failsCriticalLimit,
  type CalcResult,
  type Caution,
} from '../calc-result.ts';
import { calculate } from '../calculate.ts';
import { addDays, daysBetween, isIsoDate } from '../dates.ts';
import { parseBatchOptions } from '../parse-batch-options.ts';
import { startWindow } from '../start-window.ts';
import type { FormulaLibrary } from './check-assembly-library.ts';
import { plannedSize } from './plan-batch-size.ts';
import { datesOfNeeds, type NeedDates } from './need-dates.ts';
import type { PlannedDates } from './plan-dates.ts';
import { PlanError } from './plan-error.ts';
import { collectNeeds, type Need } from './plan-needs.ts';
import type { PlanBatch, PlanDay, PlanOptions, PlanResult } from './plan-types.ts';
import { pullItemsOf, sumPullList } from './pull-list.ts';

/** Most units one plan makes: beyond this a count is a typo. */
export const MAX_PLAN_COUNT = 100_000;

function checkOptions({ count, serviceDate, today }: PlanOptions): void {
  if (!Number.isInteger(count) || count < 1 || count > MAX_PLAN_COUNT) {
    throw new PlanError(
      `the count must be a whole number from 1 to ${MAX_PLAN_COUNT}, not ${count}`,
      'bad-input',
    );
  }
  for (const [what, date] of [
    ['service date', serviceDate],
    ['today', today],
  ] as const) {
    if (!isIsoDate(date)) {
      throw new PlanError(
        `the ${what} must be a date written YYYY-MM-DD, not "${date}"`,
        'bad-input',
      );
    }
  }
  // Every batch starts between today and the service day, so a service day inside the start
  // window keeps every start inside it too (past starts are refused by refusePastStarts).
  const { latest } = startWindow(today);
  if (serviceDate > latest) {
    throw new PlanError(
      `the service date ${dayWords(serviceDate)} is more than a year ahead: plan for a day up ` +
        `to ${dayWords(latest)} (a year from today, ${dayWords(today)})`,
      'bad-input',
    );
  }
}

/** Refuses a plan any of whose batches would have to start before today. */
function refusePastStarts(
  dated: readonly { need: Need; dates: PlannedDates }[],
  { today, serviceDate }: PlanOptions,
): void {
  const late = dated
    .filter(({ dates }) => dates.start < today)
    .sort((a, b) => a.dates.start.localeCompare(b.dates.start));
  if (late.length === 0) return;
  // A part applied to another counts back from the day it goes on, so days are counted start to
  // service rather than as its own hold and lead days.
  const needed = ({ start }: PlannedDates) => daysBetween(start, serviceDate);
  const longest = Math.max(...dated.map(({ dates }) => needed(dates)));
  const { need, dates } = late[0];
  // People read it (the console shows it as it is): the formula by its title, days in words.
  throw new PlanError(
    `${need.formula.title} must start ${dayWords(dates.start)}, already past; plan for a later ` +
      `date (for service on ${dayWords(serviceDate)} it needs ${needed(dates)} days; ` +
      `the earliest service this plan can make is ${dayWords(addDays(today, longest))})`,
    'past-start',
    need.formula.id,
  );
}

function calculateNeed(need: Need, batch: PlanBatch['batch'], today: string): CalcResult {
  const { formula } = need;
  let result: CalcResult;
  try {
    result = calculate(formula, parseBatchOptions(batch, formula, { today }));
  } catch (error) {
    if (error instanceof BatchError) {
      throw new PlanError(`${formula.title}: ${error.message}`, 'bad-batch', formula.id);
    }
    throw error;
  }
  if (failsCriticalLimit(result)) {
    throw new PlanError(
      `${formula.title} is refused, and the plan with it: ` +
        criticalFailures(result.checks).map(checkProblem).join('; '),
      'critical-limit',
      formula.id,
    );
  }
  return result;
}

/**
 * Every batch's cautions once each, keyed by id; a formula's own cautions (formula-1…) are kept
 * apart per formula, the allergen caution names every allergen of the plan, and the reminder
 * that local codes come first goes last.
 */
function unionCautions(batches: readonly PlanBatch[], allergens: readonly Allergen[]): Caution[] {
  const byKey = new Map<string, Caution>();
  const allergen = allergenCaution(allergens);
  for (const batch of batches) {
    for (const caution of batch.result.cautions) {
      if (caution.id === CAUTIONS.localCodes.id) continue;
      const own = caution.id.startsWith('formula-');
      const key = own ? `${batch.formula.id}/${caution.id}` : caution.id;
      if (byKey.has(key)) continue;
      if (allergen && caution.id === allergen.id) byKey.set(key, allergen);
      else byKey.set(key, own ? { ...caution, id: key, source: batch.formula.title } : caution);
    }
  }
  return [...byKey.values(), CAUTIONS.localCodes];
}

function groupByDay(batches: readonly PlanBatch[]): PlanDay[] {
  const days = new Map<string, PlanBatch[]>();
  for (const batch of batches) days.set(batch.start, [...(days.get(batch.start) ?? []), batch]);
  return [...days].map(([date, list]) => ({ date, batches: list }));
}

/**
 * Plans `count` units of an assembly for a service day: every batch it needs (one per formula,
 * added up over the components and the assemblies inside it), each sized by carrying yields and
 * losses back to raw weights and calculated by its kind's own calculator, with the day it must
 * start counted back from service (a part applied to another, such as a rub, from the day that
 * part comes out of its hold); one pull list of raw materials; the allergens and cautions of
 * everything. Pure: the caller reads the formulas.
 * @param library every formula that reads cleanly, by id (the assembly may be among them)
 * @throws PlanError naming the formula when the plan cannot be made: bad count or dates (a
 *   service day more than a year ahead among them), an
 *   assembly with errors, a missing or unfitting formula, assemblies that contain each other, a
 *   cure whose hold rule needs a size not given, a batch that would start before today, a batch
 *   its calculator cannot make, or one over a critical limit
 */
export function planAssembly(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
  options: PlanOptions,
): PlanResult {
  checkOptions(options);
  const needs = [...collectNeeds(assembly, library, new Decimal(options.count)).values()];
  const byId = datesOfNeeds(needs, options.serviceDate);
  const dated = needs.map((need) => ({ need, dates: byId.get(need.formula.id) as NeedDates }));
  refusePastStarts(dated, options);

  const warnings: string[] = [];
  const planned = dated.map(({ need, dates: { goesOn, ...dates } }) => {
    const size = plannedSize(need);
    const batch = { ...size.batch, start: dates.start };
    const result = calculateNeed(need, batch, options.today);
    warnings.push(...size.warnings, ...result.warnings.map((w) => `${need.formula.title}: ${w}`));
    const planBatch: PlanBatch = {
      formula: { id: need.formula.id, title: need.formula.title, kind: need.formula.kind },
      purposes: need.purposes,
      batch,
      result,
      ...dates,
      ...(goesOn.length ? { goesOn } : {}),
      materials: pullItemsOf(need.formula, result, size.green),
    };
    return planBatch;
  });
  const batches = planned.sort(
    (a, b) => a.start.localeCompare(b.start) || a.formula.title.localeCompare(b.formula.title),
  );
  const allergens = collectAllergens(batches.map((b) => b.result.allergens));
  const items = batches.flatMap((batch) => batch.materials);
  return {
    assembly: { id: assembly.id, title: assembly.title },
    count: options.count,
    serviceDate: options.serviceDate,
    today: options.today,
    batches,
    days: groupByDay(batches),
    pullList: sumPullList(items),
    allergens,
    cautions: unionCautions(batches, allergens),
    warnings,
  };
}
