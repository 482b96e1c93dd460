/**
 * The parts of an assembly one batch of it is made from, at its own level: what the plan works
 * out of each part (plan-needs.ts), kept to the assembly's own components.
 */
import { ZERO, type Decimal } from '../../decimal.ts';
import type { AssemblyFormula } from '../../formula/formula-types.ts';
import { parseMass } from '../../units/mass.ts';
import type { FormulaLibrary } from '../plan/check-assembly-library.ts';
import { addNeed, collectNeeds, whereIn, type Need } from '../plan/plan-needs.ts';

/** An assembly inside another, as one part of it: how many of its units go in. */
export interface AssemblyPart {
  readonly formula: AssemblyFormula;
  units: Decimal;
}

/**
 * The parts of an assembly at its own level, as a batch of it draws on them: one {@link Need}
 * per batch formula it names (added up as {@link collectNeeds} adds them, its purposes without
 * the assembly's name before them), and each assembly it holds with its units, not opened up.
 * @param units how many units of the assembly are made
 * @throws PlanError as {@link collectNeeds} does
 */
export function ownParts(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
  units: Decimal,
): { needs: Need[]; assemblies: AssemblyPart[] } {
  // The whole tree is walked once first: a part anywhere below that cannot be made refuses it.
  collectNeeds(assembly, library, units);
  const where = whereIn([assembly], units);
  const needs = new Map<string, Need>();
  const assemblies = new Map<string, AssemblyPart>();
  for (const component of assembly.components) {
    const formula = library.get(component.formula);
    if (!formula) continue;
    if (formula.kind === 'assembly') {
      const part = assemblies.get(formula.id) ?? { formula, units: ZERO };
      part.units = part.units.plus(units.times(component.units ?? 1));
      assemblies.set(formula.id, part);
      continue;
    }
    addNeed(needs, component, formula, library, units, assembly.components, where);
  }
  const own = (purpose: string): string => purpose.slice(where.length + 2);
  return {
    needs: [...needs.values()].map((need) => ({ ...need, purposes: need.purposes.map(own) })),
    assemblies: [...assemblies.values()],
  };
}

/**
 * The finished grams a need comes to: blend portions at the blend's portion weight and dough
 * pieces at the dough's piece weight, with the grams needed by weight (slices, amounts, shares).
 */
export function finishedGrams(need: Need): Decimal {
  const { formula } = need;
  if (formula.kind === 'blend' && formula.portion !== undefined)
    return need.portions.times(parseMass(formula.portion)).plus(need.grams);
  if (formula.kind === 'dough' && formula.piece !== undefined)
    return need.pieces.times(parseMass(formula.piece)).plus(need.grams);
  return need.grams;
}
