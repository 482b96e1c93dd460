import { Decimal, HUNDRED, dec } from '../../decimal.ts';
import {
  contentError,
  contentWarning,
  type ContentProblem,
} from '../../formula/formula-problem.ts';
import type { DoughFormula, DoughIngredient } from '../../formula/formula-types.ts';
import { WATER_CONTENT } from '../../reference/water-content.ts';
import { parseMass } from '../../units/mass.ts';
import { QuantityError } from '../../units/quantity-error.ts';
import { parseTemperature, parseTemperatureDifference } from '../../units/temperature.ts';
import { findIngredient, flourPercent, nameKey } from './bakers-percent.ts';
import { prefermentShare } from './preferment.ts';

/**
 * The range a desired dough temperature must fall in to be taken as meant; outside it the number
 * or the scale is almost certainly wrong. common practice, no source (straight doughs are mixed to
 * about 24–27 °C; cold-fermented and rye doughs sit further out, but inside this range).
 */
const DDT_MIN_C = new Decimal(10);
const DDT_MAX_C = new Decimal(40);

function pct(value: Decimal): string {
  return `${value.toString()} %`;
}

function reason(error: unknown): string {
  return error instanceof QuantityError ? error.reason : String(error);
}

function checkFlour(formula: DoughFormula): ContentProblem[] {
  const flours = formula.ingredients.filter((ingredient) => ingredient.flour === true);
  if (flours.length === 0) {
    return [
      contentError(
        ['ingredients'],
        'No ingredient is marked as flour. Mark each flour with "flour: true": the flours make ' +
          '100 % and every other ingredient is a percentage of them.',
      ),
    ];
  }
  const total = flourPercent(formula.ingredients);
  if (total.equals(HUNDRED)) return [];
  const list = flours.map((flour) => `${flour.name} ${flour.pct} %`).join(', ');
  return [
    contentError(
      ['ingredients'],
      `The flours add up to ${pct(total)} (${list}), but they must add up to exactly 100 %.`,
    ),
  ];
}

function checkNames(formula: DoughFormula): ContentProblem[] {
  const seen = new Set<string>();
  const problems: ContentProblem[] = [];
  formula.ingredients.forEach((ingredient, index) => {
    const key = nameKey(ingredient.name);
    if (seen.has(key)) {
      problems.push(
        contentError(
          ['ingredients', index, 'name'],
          `"${ingredient.name}" is listed twice. Give each ingredient its own name ` +
            '(capitals do not count as a difference), or add the two amounts together.',
        ),
      );
    }
    seen.add(key);
  });
  return problems;
}

function checkWaterContent(formula: DoughFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  formula.ingredients.forEach((ingredient, index) => {
    if (ingredient.food === undefined || ingredient.water_pct === undefined) return;
    const published = WATER_CONTENT[ingredient.food].waterPct;
    problems.push(
      contentWarning(
        ['ingredients', index, 'water_pct'],
        `"${ingredient.name}" gives both food (${ingredient.food}) and water_pct. The hydration ` +
          `counts water_pct (${ingredient.water_pct} %), not the published ${pct(published)}; ` +
          'remove one of the two.',
      ),
    );
  });
  return problems;
}

function checkPreferment(formula: DoughFormula): ContentProblem[] {
  const preferment = formula.preferment;
  if (!preferment) return [];
  const problems: ContentProblem[] = [];
  const seen = new Set<string>();
  const matched: {
    entry: { name: string; pct: number };
    index: number;
    ingredient: DoughIngredient;
  }[] = [];
  preferment.ingredients.forEach((entry, index) => {
    const key = nameKey(entry.name);
    const ingredient = findIngredient(formula.ingredients, entry.name);
    if (seen.has(key)) {
      problems.push(
        contentError(
          ['preferment', 'ingredients', index, 'name'],
          `"${entry.name}" is listed twice in the ${preferment.name}; list it once with the whole amount.`,
        ),
      );
    } else if (!ingredient) {
      problems.push(
        contentError(
          ['preferment', 'ingredients', index, 'name'],
          `The ${preferment.name} uses "${entry.name}", which is not in the overall formula. The ` +
            'overall formula holds the whole batch, preferment included, so add it there (or fix the name).',
        ),
      );
    } else {
      matched.push({ entry, index, ingredient });
    }
    seen.add(key);
  });

  const flourTotal = matched
    .filter(({ ingredient }) => ingredient.flour === true)
    .reduce((total, { entry }) => total.plus(dec(entry.pct)), new Decimal(0));
  if (!flourTotal.equals(HUNDRED)) {
    problems.push(
      contentError(
        ['preferment', 'ingredients'],
        flourTotal.isZero()
          ? `The ${preferment.name} has no flour from the overall formula; its flours must add up to 100 % of its own flour.`
          : `The flours in the ${preferment.name} add up to ${pct(flourTotal)}, but they must add up to exactly 100 % of its own flour.`,
      ),
    );
  }

  for (const { entry, index, ingredient } of matched) {
    const needed = prefermentShare(preferment, entry.pct);
    const overall = dec(ingredient.pct);
    if (needed.greaterThan(overall)) {
      problems.push(
        contentError(
          ['preferment', 'ingredients', index, 'pct'],
          `The ${preferment.name} needs more ${ingredient.name} than the whole batch has: ` +
            `${entry.pct} % of its flour, which is ${preferment.flour_pct} % of the total flour, comes to ` +
            `${pct(needed)} of the total flour, but the overall formula has ${pct(overall)}.`,
        ),
      );
    }
  }
  return problems;
}

function checkPieceAndTemperatures(formula: DoughFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  if (formula.piece !== undefined) {
    try {
      if (!parseMass(formula.piece).greaterThan(0)) {
        problems.push(
          contentError(['piece'], `The piece weight "${formula.piece}" must be more than 0.`),
        );
      }
    } catch (error) {
      problems.push(
        contentError(
          ['piece'],
          `The piece weight "${formula.piece}" is not a weight: ${reason(error)}.`,
        ),
      );
    }
  }
  if (formula.ddt) {
    try {
      const target = parseTemperature(formula.ddt.target);
      if (target.lessThan(DDT_MIN_C) || target.greaterThan(DDT_MAX_C)) {
        problems.push(
          contentError(
            ['ddt', 'target'],
            `The desired dough temperature "${formula.ddt.target}" is ${target.toFixed(1)} °C, outside ` +
              '10–40 °C. Check the number and the scale (°C or °F).',
          ),
        );
      }
    } catch (error) {
      problems.push(
        contentError(
          ['ddt', 'target'],
          `The desired dough temperature "${formula.ddt.target}" is not a temperature: ${reason(error)}.`,
        ),
      );
    }
    if (formula.ddt.friction !== undefined) {
      try {
        parseTemperatureDifference(formula.ddt.friction);
      } catch (error) {
        problems.push(
          contentError(
            ['ddt', 'friction'],
            `The friction factor "${formula.ddt.friction}" is not a temperature rise: ${reason(error)}.`,
          ),
        );
      }
    }
  }
  return problems;
}

/**
 * Checks what the JSON schema cannot: at least one flour, flours adding up to exactly 100 %,
 * unique ingredient names, a preferment that only uses (and never more than) what the overall
 * formula holds with its flours at 100 %, a readable piece weight, desired dough temperature and
 * friction factor, and no ingredient giving both food and water_pct.
 * @returns the problems found, each with its path in the formula; empty when all is well
 */
export function checkDoughFormula(formula: DoughFormula): ContentProblem[] {
  return [
    ...checkFlour(formula),
    ...checkNames(formula),
    ...checkWaterContent(formula),
    ...checkPreferment(formula),
    ...checkPieceAndTemperatures(formula),
  ];
}
