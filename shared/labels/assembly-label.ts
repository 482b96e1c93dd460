import type { Catalogue } from '../catalogue/catalogue-types.ts';
import type { FormulaLibrary } from '../calculation/plan/check-assembly-library.ts';
import { collectNeeds, type Need } from '../calculation/plan/plan-needs.ts';
import { type Decimal, ONE, ZERO, sum } from '../decimal.ts';
import type { AssemblyFormula, BatchFormula, Formula } from '../formula/formula-types.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import { dayWords } from '../presentation/date-words.ts';
import { parseMass } from '../units/mass.ts';
import { allergenStatement } from './allergen-statement.ts';
import {
  entryText,
  ingredientStatement,
  type StatementIngredient,
} from './ingredient-statement.ts';
import { labelIngredients } from './label-ingredients.ts';
import { useByOf, type UseBy } from './label-keeping.ts';
import { netWeight } from './net-weight.ts';
import {
  labelAllergens,
  labelOf,
  type ProductLabel,
  type ProductLabelInput,
} from './product-label.ts';
import { assemblySafeHandling } from './safe-handling.ts';

/** One batch a part of an assembly batch was made from, as its label needs it. */
export interface PartBatch {
  /** The batch's formula, at the revision it was calculated from. */
  readonly formula: BatchFormula;
  /** Its recorded result: the weights its batch sheet printed. */
  readonly result: PresentedResult;
  /** How much of it went into the assembly batch, grams. */
  readonly grams: Decimal;
  /** The day it was made (ISO date): a cure's, the day it came out of its hold. */
  readonly madeOn: string;
}

/** What an assembly batch's label is worked out from. */
export interface AssemblyLabelInput extends Omit<ProductLabelInput, 'formula' | 'result'> {
  /** The assembly's formula, at the revision the batch was recorded from. */
  readonly assembly: AssemblyFormula;
  /** Every assembly inside it (a part that is itself an assembly), by id. */
  readonly assemblies?: ReadonlyMap<string, AssemblyFormula>;
  /** The batches each part was made from, by the part's formula id, at any depth. */
  readonly parts: ReadonlyMap<string, readonly PartBatch[]>;
  /** Formulas' titles by id, to name a part no batch is recorded for; its id otherwise. */
  readonly titles?: ReadonlyMap<string, string>;
}

/** An assembly batch whose label cannot be worked out, with the reason in a cook's words. */
export class AssemblyLabelError extends Error {
  override readonly name = 'AssemblyLabelError';
}

/** One part's weight in one unit, grams: its portions, pieces and finished grams added up. */
function unitGrams(need: Need): Decimal {
  const { formula } = need;
  const portion = formula.kind === 'blend' && formula.portion ? parseMass(formula.portion) : ZERO;
  const piece = formula.kind === 'dough' && formula.piece ? parseMass(formula.piece) : ZERO;
  return need.portions.times(portion).plus(need.pieces.times(piece)).plus(need.grams);
}

/**
 * What a part is made of, as the batches it came from hold it: each batch's ingredients (as its
 * own label lists them) in the share of it that went in, so two batches of the grind are added
 * up in the proportion used.
 */
function partIngredients(
  batches: readonly PartBatch[],
  catalogue: Catalogue | undefined,
): StatementIngredient[] {
  return batches.flatMap((batch) => {
    const lines = labelIngredients(batch.formula, batch.result, catalogue);
    const total = sum(lines.map((line) => line.grams));
    if (total.isZero()) return [];
    return lines.map((line) => ({ ...line, grams: line.grams.times(batch.grams).div(total) }));
  });
}

/**
 * The part formulas the assembly names, at the revisions its batches were made from (the first
 * batch recorded for each), with the assemblies inside it; refuses an assembly batch some of
 * whose parts have no batch recorded.
 */
function partLibrary(input: AssemblyLabelInput): FormulaLibrary {
  const library = new Map<string, Formula>(input.assemblies ?? []);
  library.set(input.assembly.id, input.assembly);
  for (const [id, batches] of input.parts) if (batches[0]) library.set(id, batches[0].formula);
  const missing = [input.assembly, ...library.values()]
    .flatMap((formula) => (formula.kind === 'assembly' ? formula.components : []))
    .map((component) => component.formula)
    .filter((id, i, ids) => ids.indexOf(id) === i && !library.has(id));
  if (missing.length > 0) {
    const names = missing.map((id) => input.titles?.get(id) ?? id);
    throw new AssemblyLabelError(
      `record the batches this ${input.assembly.title} was made from first: its label lists ` +
        `what went into each part, and none is recorded for ${names.join(', ')}`,
    );
  }
  return library;
}

/**
 * The net weight of one unit: the parts' weights in one unit added up, when each is its weight
 * as packed; a dough is weighed as dough in its formula, before baking (which loses weight), so
 * with a dough part the cook gives the net weight.
 */
function unitNet(needs: readonly Need[], given: Decimal | undefined) {
  if (given) return { net: netWeight(given) };
  const doughs = needs.filter((need) => need.formula.kind === 'dough');
  if (doughs.length > 0)
    return {
      netNote:
        `one unit's weight is not worked out: ${doughs.map((d) => d.formula.title).join(', ')} ` +
        'is weighed as dough in its formula, before baking; weigh a unit and give its net weight',
    };
  const grams = sum(needs.map(unitGrams));
  if (!grams.greaterThan(ZERO)) return {};
  return {
    net: netWeight(grams),
    netNote:
      'the net weight of one unit by its formula, its parts added up; weigh a unit and give ' +
      'its net weight if it differs',
  };
}

/** The use-by day, counted from the earliest part when that was made before packing. */
function assemblyUseBy(input: AssemblyLabelInput, days: readonly string[]): UseBy {
  const useBy = useByOf(input.assembly.label, input.packedOn, days);
  const mark = useBy.mark;
  if (!mark || mark.dayOne >= input.packedOn) return useBy;
  return {
    mark: {
      ...mark,
      source:
        `${mark.source}; day 1 is ${dayWords(mark.dayOne)}, when its earliest part was made ` +
        '(FDA Food Code 2022, 3-501.17(C))',
    },
  };
}

/**
 * The label of an assembly batch (a burger, a pack of sliced bacon) from the batches its parts
 * were made from: the assembly's title as the product's name; each part a compound ingredient,
 * named by its formula's title, with its own ingredients in parentheses (heaviest first, as the
 * part's own label lists them), the parts in descending order of their weight in one unit (an
 * assembly inside it counted through, part by part); the allergens of every part; the safe
 * handling instructions when the unit is not ready to eat (assemblySafeHandling); the keep
 * statement and use-by day from the assembly's own `label`, counted from the earliest part's
 * day (Food Code 3-501.17(C)); the net weight the cook gives, or one unit's by its formula.
 * source: 21 CFR 101.4(a)(1), descending order of predominance by weight, and 101.4(b)(2)(i), a
 * multi-ingredient ingredient by its name "followed by a parenthetical listing of all ingredients
 * contained therein" (read as in ingredient-statement.ts); for meat and poultry 9 CFR 317.2(f),
 * the same, from memory
 * @throws AssemblyLabelError when a part has no batch recorded
 * @throws PlanError when the assembly, at its parts' revisions, cannot be worked through
 */
export function assemblyLabel(input: AssemblyLabelInput): ProductLabel {
  const library = partLibrary(input);
  const needs = [...collectNeeds(input.assembly, library, ONE).values()];
  const batches = needs.flatMap((need) => input.parts.get(need.formula.id) ?? []);
  const parts = needs.map((need) => {
    const own = ingredientStatement(
      partIngredients(input.parts.get(need.formula.id) ?? [], input.catalogue),
    );
    return {
      name: need.formula.title,
      grams: unitGrams(need),
      subIngredients: own.entries.map(entryText),
    };
  });
  const { net, netNote } = unitNet(needs, input.netGrams);
  return labelOf(
    {
      product: input.assembly.title,
      ingredients: ingredientStatement(parts),
      contains: allergenStatement(
        batches.flatMap((batch) => labelAllergens(batch.formula, input.catalogue)),
      ),
      net,
      netNote,
      useBy: assemblyUseBy(
        input,
        batches.map((batch) => batch.madeOn),
      ),
      storage: input.assembly.label?.storage,
      safeHandling: assemblySafeHandling(
        input.assembly,
        batches.map((batch) => batch.formula),
      ),
    },
    input,
  );
}
