/**
 * A formula's `controls:` checked beyond its schema: a known rule or an own limit with its source,
 * units that fit the measure, unique ids, the meat's lethality template, the cured cooling option
 * on a cure of enough nitrite.
 */
import { Decimal } from '../decimal.ts';
import { BatchError } from '../calculation/batch-error.ts';
import { calculateCure } from '../calculation/cure/calculate-cure.ts';
import {
  contentError,
  contentWarning,
  type ContentProblem,
  type FormulaPath,
} from '../formula/formula-problem.ts';
import type { CureFormula, Formula, FormulaSpecies } from '../formula/formula-types.ts';
import { parseDuration } from '../units/duration.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { controlTemplate, controlTemplateKeys } from './control-templates.ts';
import type { ControlTemplate, FormulaControl, Measure } from './control-types.ts';
import { canonicalUnit } from './reading-value.ts';
import { checkOwnLimit } from './check-own-limit.ts';

/** Templates for cooking meat other than poultry, and for poultry. */
const MEAT_LETHALITY = new Set([
  'fsis-lethality-instant',
  'fsis-lethality-table',
  'fsis-lethality-table-7log',
  'food-code-cook-comminuted',
  'food-code-cook-whole-muscle',
]);
const POULTRY_LETHALITY = new Set([
  'fsis-poultry-uncured',
  'fsis-poultry-cured',
  'food-code-cook-poultry',
]);
/** Templates judged on the product itself, not the room or unit around it. */
const PRODUCT_ONLY = new Set([
  ...MEAT_LETHALITY,
  ...POULTRY_LETHALITY,
  'fsis-cooling-option-1',
  'fsis-cooling-option-2',
  'fsis-cooling-cured',
  'food-code-cooling',
]);

const MEASURE_WORDS: Readonly<Record<Measure, string>> = {
  'internal-temperature': 'a temperature',
  'chamber-temperature': 'a temperature',
  time: 'a time',
  weight: 'a weight',
  ph: 'a pH',
  'water-activity': 'a water activity',
};

/** A notional batch for the formula's own nitrite: the level does not depend on size. */
const SAMPLE_GREEN_GRAMS = new Decimal(1000);

function speciesOf(formula: Formula): FormulaSpecies | undefined {
  return formula.kind === 'cure' || formula.kind === 'blend' ? formula.species : undefined;
}

/** Whether the formula may hold poultry, and whether it holds only other meat. */
function meatOf(species: FormulaSpecies | undefined): { poultry: boolean; redMeat: boolean } {
  if (species === undefined) return { poultry: false, redMeat: false };
  const list = Array.isArray(species) ? species : [species];
  const poultry = list.includes('poultry') || list.includes('mixed');
  return { poultry, redMeat: !poultry };
}

function checkSpeciesFit(
  formula: Formula,
  template: ControlTemplate,
  at: FormulaPath,
): ContentProblem[] {
  const { poultry, redMeat } = meatOf(speciesOf(formula));
  if (poultry && MEAT_LETHALITY.has(template.key)) {
    return [
      contentWarning(
        at,
        `this formula may hold poultry, but "${template.key}" is for meat other than poultry; ` +
          'poultry needs a poultry rule (fsis-poultry-uncured, fsis-poultry-cured or ' +
          'food-code-cook-poultry), which asks for a higher temperature',
      ),
    ];
  }
  if (redMeat && POULTRY_LETHALITY.has(template.key)) {
    return [
      contentWarning(
        at,
        `"${template.key}" is for poultry, and this formula's meat is not poultry; its records ` +
          'would be judged against the poultry limit, not the one for its meat',
      ),
    ];
  }
  return [];
}

/** The formula's own ingoing nitrite on a notional batch, or null when it cannot be worked. */
function formulaNitritePpm(formula: CureFormula): Decimal | null {
  try {
    const result = calculateCure(formula, { meat: SAMPLE_GREEN_GRAMS });
    return result.checks.find((check) => check.id === 'nitrite-max')?.value ?? null;
  } catch (error) {
    // The cure's own checks report a formula whose batch cannot be made.
    if (error instanceof BatchError) return null;
    throw error;
  }
}

function checkCuredCooling(
  formula: Formula,
  template: ControlTemplate,
  at: FormulaPath,
): ContentProblem[] {
  if (template.minNitritePpm === undefined) return [];
  if (formula.kind !== 'cure') {
    return [
      contentError(
        at,
        `"${template.key}" is for cured product with at least ${template.minNitritePpm} ppm ` +
          'ingoing nitrite; this formula is not a cure: use fsis-cooling-option-1 or -2',
      ),
    ];
  }
  const ppm = formulaNitritePpm(formula);
  if (ppm !== null && ppm.lessThan(template.minNitritePpm)) {
    return [
      contentError(
        at,
        `"${template.key}" needs at least ${template.minNitritePpm} ppm ingoing nitrite; this ` +
          `cure puts in ${ppm.toDecimalPlaces(1).toString()} ppm: use fsis-cooling-option-1 or -2`,
      ),
    ];
  }
  return [];
}

function checkRule(formula: Formula, control: FormulaControl, at: FormulaPath): ContentProblem[] {
  const rule = control.rule ?? '';
  const template = controlTemplate(rule);
  if (!template) {
    return [
      contentError(
        [...at, 'rule'],
        `"${rule}" is not a process control rule; use one of ${controlTemplateKeys().join(', ')}, ` +
          'or write a limit of your own with its source',
      ),
    ];
  }
  const problems: ContentProblem[] = [];
  if (control.source !== undefined) {
    problems.push(
      contentError([...at, 'source'], `the rule "${rule}" names its own source; leave source out`),
    );
  }
  if (canonicalUnit(control.measure) !== canonicalUnit(template.measure)) {
    problems.push(
      contentError(
        [...at, 'measure'],
        `"${rule}" is a limit on temperature; it cannot judge ${MEASURE_WORDS[control.measure]}`,
      ),
    );
  } else if (PRODUCT_ONLY.has(rule) && control.measure !== 'internal-temperature') {
    problems.push(
      contentError(
        [...at, 'measure'],
        `"${rule}" is judged on the product's own temperature: use measure: internal-temperature`,
      ),
    );
  }
  return [
    ...problems,
    ...checkSpeciesFit(formula, template, [...at, 'rule']),
    ...checkCuredCooling(formula, template, [...at, 'rule']),
  ];
}

function checkEvery(every: string | undefined, at: FormulaPath): ContentProblem[] {
  if (every === undefined) return [];
  try {
    if (parseDuration(every).isZero()) return [contentError(at, 'how often cannot be 0')];
    return [];
  } catch (error) {
    if (error instanceof QuantityError) return [contentError(at, error.message)];
    throw error;
  }
}

/** Every problem of the formula's process controls. */
export function checkControls(formula: Formula): ContentProblem[] {
  const controls = formula.controls ?? [];
  if (formula.kind === 'assembly' && controls.length > 0) {
    return [
      contentError(
        ['controls'],
        'an assembly is put together from batches that carry their own controls, so no reading ' +
          'is taken against it: put the controls on the formulas it is built from',
      ),
    ];
  }
  const problems: ContentProblem[] = [];
  const ids = new Set<string>();
  controls.forEach((control, i) => {
    const at: FormulaPath = ['controls', i];
    if (ids.has(control.id)) {
      problems.push(contentError([...at, 'id'], `the control id "${control.id}" is used twice`));
    }
    ids.add(control.id);
    problems.push(...checkEvery(control.every, [...at, 'every']));
    if (control.rule !== undefined && control.limit !== undefined) {
      problems.push(contentError(at, 'give a rule or a limit of your own, not both'));
    } else if (control.rule !== undefined) {
      problems.push(...checkRule(formula, control, at));
    } else if (control.limit !== undefined) {
      problems.push(...checkOwnLimit(control, at));
    } else {
      problems.push(
        contentError(
          at,
          'say what limit it is held to: a rule, or a limit of your own with its source',
        ),
      );
    }
  });
  return problems;
}
