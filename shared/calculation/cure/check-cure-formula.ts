import { Decimal } from '../../decimal.ts';
import {
  contentError,
  contentWarning,
  type ContentProblem,
  type FormulaPath,
} from '../../formula/formula-problem.ts';
import type { CureFormula, CureIngredient, HoldRule } from '../../formula/formula-types.ts';
import { nitriteRuleFor } from '../../reference/nitrite-limits.ts';
import { checkProblem } from '../../presentation/check-figures.ts';
import { BatchError } from '../batch-error.ts';
import { isCriticalFailure } from '../calc-result.ts';
import { calculateCure } from './calculate-cure.ts';

const SUBSTANCES = ['nitrite', 'nitrate', 'salt', 'accelerator'] as const;
const HOLD_RATES: readonly (keyof HoldRule)[] = [
  'days_per_cm',
  'days_per_inch',
  'days_per_kg',
  'days_per_lb',
  'days',
];
const BRINE_KEYS_BY_METHOD = {
  dry: [],
  brine: ['water_pct'],
  pump: ['pump_pct', 'cover_pct', 'cover_pickup_pct', 'extra_pct'],
} as const;
/** A notional batch for checking the formula's own levels: 1 kg, the levels do not depend on size. */
const SAMPLE_GREEN_GRAMS = new Decimal(1000);

/**
 * Checks a cure formula beyond its schema: a product and method the rules know, brine keys that
 * fit the method, ingredient make-ups that add up, one hold rate, and — on a notional batch —
 * every critical limit met (an error) and the usual ranges (warnings).
 */
export function checkCureFormula(formula: CureFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  if (!nitriteRuleFor(formula.product, formula.method)) {
    problems.push(
      contentError(
        ['method'],
        `a ${formula.product} product takes its cure mixed in: use method "dry"`,
      ),
    );
    return problems;
  }
  problems.push(
    ...checkBrineKeys(formula),
    ...checkCover(formula),
    ...checkIngredients(formula.ingredients, ['ingredients']),
    ...checkIngredients(formula.cover_brine ?? [], ['cover_brine']),
    ...checkHold(formula.hold),
  );
  if (problems.some((p) => p.severity === 'error')) return problems;
  return [...problems, ...checkLevels(formula)];
}

function checkBrineKeys(formula: CureFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const allowed: readonly string[] = BRINE_KEYS_BY_METHOD[formula.method];
  for (const key of Object.keys(formula.brine ?? {})) {
    if (!allowed.includes(key)) {
      problems.push(
        contentError(['brine', key], `"${key}" does not apply to the ${formula.method} method`),
      );
    }
  }
  if (formula.method === 'brine' && formula.brine?.water_pct === undefined) {
    problems.push(
      contentError(
        ['brine'],
        'a brine cure needs brine: { water_pct: … }, the water as % of green weight',
      ),
    );
  }
  if (formula.method === 'pump' && formula.brine?.pump_pct === undefined) {
    problems.push(
      contentError(
        ['brine'],
        'a pump cure needs brine: { pump_pct: … }, the brine injected as % of green weight',
      ),
    );
  }
  return problems;
}

/**
 * A cover brine's keys: its own make-up and a measured pick-up belong to a pump cure with a
 * cover; a pick-up cannot be more than the cover brine itself, and the make-up must leave water.
 */
function checkCover(formula: CureFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const cover = formula.brine?.cover_pct ?? 0;
  const pickup = formula.brine?.cover_pickup_pct;
  if (formula.cover_brine && formula.method !== 'pump') {
    problems.push(
      contentError(['cover_brine'], `"cover_brine" does not apply to the ${formula.method} method`),
    );
  } else if (formula.cover_brine && cover === 0) {
    problems.push(
      contentError(
        ['cover_brine'],
        'a cover brine make-up needs a cover: give brine: { cover_pct: … }, % of green weight',
      ),
    );
  }
  if (pickup !== undefined && formula.method === 'pump' && pickup > cover) {
    problems.push(
      contentError(
        ['brine', 'cover_pickup_pct'],
        `a pick-up of ${pickup} % cannot be more than the cover brine (cover_pct ${cover} %)`,
      ),
    );
  }
  const coverShare = (formula.cover_brine ?? []).reduce((total, i) => total + i.pct, 0);
  if (coverShare >= 100) {
    problems.push(
      contentError(
        ['cover_brine'],
        `the cover brine's ingredients come to ${coverShare} % of it, leaving no water`,
      ),
    );
  }
  return problems;
}

function checkIngredients(
  ingredients: readonly CureIngredient[],
  at: FormulaPath,
): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const names = new Set<string>();
  ingredients.forEach((ingredient, i) => {
    const name = ingredient.name.trim().toLowerCase();
    if (names.has(name))
      problems.push(contentError([...at, i, 'name'], `"${ingredient.name}" is listed twice`));
    names.add(name);
    const declared = SUBSTANCES.reduce((total, key) => total + (ingredient[key] ?? 0), 0);
    if (declared > 100) {
      problems.push(
        contentError(
          [...at, i],
          `"${ingredient.name}" declares ${declared} % of nitrite, nitrate, salt and accelerator together; that is more than 100 %`,
        ),
      );
    }
  });
  return problems;
}

function checkHold(hold: HoldRule | undefined): ContentProblem[] {
  if (!hold) return [];
  const rates = HOLD_RATES.filter((key) => hold[key] !== undefined);
  if (rates.length > 1)
    return [
      contentError(['hold'], `give one of ${HOLD_RATES.join(', ')}, not ${rates.join(' and ')}`),
    ];
  if (rates.length === 0)
    return [contentError(['hold'], `say how long: one of ${HOLD_RATES.join(', ')}`)];
  return [];
}

function checkLevels(formula: CureFormula): ContentProblem[] {
  let result;
  try {
    result = calculateCure(formula, { meat: SAMPLE_GREEN_GRAMS });
  } catch (error) {
    // A formula whose own brine cannot be made (e.g. a pump % too low for its salt) fails here.
    if (error instanceof BatchError) return [contentError(['brine'], error.message)];
    throw error;
  }
  const problems: ContentProblem[] = [];
  for (const check of result.checks) {
    if (check.status === 'pass') continue;
    // The same rule that refuses a batch refuses the formula: any failed critical check.
    problems.push(
      isCriticalFailure(check)
        ? { ...contentError(['ingredients'], checkProblem(check)), criticalLimit: true }
        : contentWarning(['ingredients'], checkProblem(check)),
    );
  }
  return problems;
}
