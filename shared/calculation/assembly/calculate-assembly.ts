import { materialLines } from '../../catalogue/formula-lines.ts';
import { Decimal, sum } from '../../decimal.ts';
import type { AssemblyFormula, BatchFormula } from '../../formula/formula-types.ts';
import { CAUTIONS, allergenCaution } from '../../reference/cautions.ts';
import { collectAllergens } from '../allergens.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { AmountLine, CalcResult } from '../calc-result.ts';
import type { FormulaLibrary } from '../plan/check-assembly-library.ts';
import { PlanError } from '../plan/plan-error.ts';
import { collectNeeds } from '../plan/plan-needs.ts';
import { PARTS_GROUP, UNITS_INPUT, UNIT_WEIGHT } from './assembly-words.ts';
import { finishedGrams, ownParts } from './own-parts.ts';

/** Every batch formula under an assembly, at any depth, each once. */
function formulasUnder(assembly: AssemblyFormula, library: FormulaLibrary): BatchFormula[] {
  return [...collectNeeds(assembly, library, new Decimal(1)).values()].map((need) => need.formula);
}

/** The finished grams of `units` units of an assembly: its parts at every depth added up. */
function assemblyGrams(assembly: AssemblyFormula, library: FormulaLibrary, units: Decimal) {
  return sum([...collectNeeds(assembly, library, units).values()].map(finishedGrams));
}

/**
 * One batch of an assembly: `count` units (burgers, packs) put together from batches of its
 * parts. Each part's finished weight is what the plan works out for that count (plan-needs.ts:
 * portions at the blend's portion weight, pieces at the dough's piece weight, slices and amounts
 * by weight, a part applied to another by its share of that part's green weight); an assembly
 * inside it counts by its own parts' weight. The allergens are every line's of every formula
 * under it; the assembly's own cautions are added by calculate(). Nothing is weighed from stock
 * and nothing is checked against a limit: each part was checked when its batch was made.
 * @param library every formula that reads cleanly, by id
 * @throws BatchError when no count is given, or a part cannot be worked out (a missing or
 *   unfitting formula, assemblies that contain each other)
 */
export function calculateAssembly(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
  batch: BatchInput,
): CalcResult {
  if (batch.count === undefined)
    throw new BatchError(
      `give --count: how many of ${assembly.title} were made, one unit as the formula serves it`,
      'count',
    );
  const count = new Decimal(batch.count);
  let parts: ReturnType<typeof ownParts>;
  let formulas: BatchFormula[];
  try {
    parts = ownParts(assembly, library, count);
    formulas = formulasUnder(assembly, library);
  } catch (error) {
    if (error instanceof PlanError) throw new BatchError(error.message);
    throw error;
  }
  const lines: AmountLine[] = [
    ...parts.needs.map((need) => ({
      name: need.formula.title,
      grams: finishedGrams(need),
      role: 'component' as const,
      part: need.formula.id,
      note: need.purposes.join('; '),
    })),
    ...parts.assemblies.map(({ formula, units }) => ({
      name: formula.title,
      grams: assemblyGrams(formula, library, units),
      role: 'component' as const,
      part: formula.id,
      note: `${units.toString()} ${units.equals(1) ? 'unit' : 'units'}`,
    })),
  ];
  const total = sum(lines.map((line) => line.grams));
  const allergens = collectAllergens(
    formulas.flatMap((formula) => materialLines(formula).map((line) => line.allergens)),
  );
  const allergen = allergenCaution(allergens);
  return {
    formula: { id: assembly.id, title: assembly.title, kind: 'assembly' },
    inputs: [{ label: UNITS_INPUT, kind: 'count', value: count }],
    groups: [{ title: PARTS_GROUP, lines, totalLabel: 'Total' }],
    steps: assembly.steps ?? [],
    figures: [
      { label: 'Total weight', kind: 'mass', value: total },
      { label: UNIT_WEIGHT, kind: 'mass', value: total.div(count) },
    ],
    checks: [],
    warnings: [],
    // The assembly's own cautions are added by calculate(), before the local-codes reminder.
    cautions: [...(allergen ? [allergen] : []), CAUTIONS.localCodes],
    allergens,
    ...(assembly.notes === undefined ? {} : { notes: assembly.notes }),
  };
}
