import { Decimal, ZERO, fraction, sum } from '../../decimal.ts';
import type {
  AssemblyComponent,
  AssemblyFormula,
  BatchFormula,
} from '../../formula/formula-types.ts';
import { parseMass } from '../../units/mass.ts';
import type { HoldMeasures } from '../cure/hold-time.ts';
import { referenceFromFinished } from '../yields.ts';
import { assemblyLibraryIssues, type FormulaLibrary } from './check-assembly-library.ts';
import { checkAssemblyFormula } from './check-assembly-formula.ts';
import { componentSizes, quantityKeyOf } from './component-quantity.ts';
import { PlanError } from './plan-error.ts';

/**
 * Everything the plan needs of one formula, added up over every component (at any depth) that
 * names it: portions (blend), pieces (dough) and finished grams (slices and amounts).
 */
export interface Need {
  readonly formula: BatchFormula;
  readonly purposes: string[];
  /** Blend portions of the formula's portion weight. */
  portions: Decimal;
  /** Dough pieces of the formula's piece weight. */
  pieces: Decimal;
  /** Finished grams: cure slices and amounts, and amounts of any kind. */
  grams: Decimal;
  /** The largest sizes any component gives, for a cure's hold rule: the longest hold wins. */
  sizes: HoldMeasures;
  /** Whether some component serves it as it is (not applied to another part). */
  served: boolean;
  /** The formula ids of the parts it is applied to (on:), each once. */
  goesOn: string[];
}

/** Plain text of an exact decimal: "240", "27215.5422". */
const text = (value: Decimal): string => value.toString();

/** "1 piece", "2 pieces": a count with its noun. */
function counted(count: Decimal | number, one: string, many: string): string {
  return `${count.toString()} ${new Decimal(count).equals(1) ? one : many}`;
}

/** The assembly's own problems (this file, then against the library) as a refusal. */
function refuseIfInvalid(assembly: AssemblyFormula, library: FormulaLibrary): void {
  const own = checkAssemblyFormula(assembly).find((p) => p.severity === 'error');
  if (own) {
    throw new PlanError(
      `${assembly.id} has errors: ${own.message}`,
      'invalid-assembly',
      assembly.id,
    );
  }
  const [issue] = assemblyLibraryIssues(assembly, library);
  if (issue) {
    const component = Number(issue.path[1]) + 1;
    throw new PlanError(
      `${assembly.id}, component ${component} (${issue.formula}): ${issue.message}`,
      issue.reason,
      issue.formula,
    );
  }
}

function larger(a: Decimal | undefined, b: Decimal | undefined): Decimal | undefined {
  if (!a) return b;
  if (!b) return a;
  return Decimal.max(a, b);
}

/** What a component asks of its formula: words for the batch sheet and numbers to add up. */
interface Demand {
  readonly words: string;
  readonly portions: Decimal;
  readonly pieces: Decimal;
  readonly grams: Decimal;
}

/**
 * The green weight, grams, of one cure at one level of an assembly for `units` units: its
 * finished grams there (parts applied to it by pct counted too) carried back through its yields.
 * Only this level counts, so a rub goes on the brisket of the part it is applied to, not on
 * brisket served plain elsewhere in the plan.
 * @param trail the ids already being worked out, to refuse parts that go on each other
 */
function greenAtLevel(
  id: string,
  components: readonly AssemblyComponent[],
  library: FormulaLibrary,
  units: Decimal,
  trail: readonly string[],
): Decimal {
  const formula = library.get(id);
  if (formula?.kind !== 'cure') return ZERO;
  const finished = sum(
    components
      .filter((component) => component.formula === id)
      .map((component) => demandOf(component, formula, library, units, components, trail).grams),
  );
  return referenceFromFinished(finished, formula.yields);
}

/** What one component asks of its formula for `units` units, in words and numbers. */
function demandOf(
  component: AssemblyComponent,
  formula: BatchFormula,
  library: FormulaLibrary,
  units: Decimal,
  level: readonly AssemblyComponent[],
  trail: readonly string[] = [],
): Demand {
  const none = { portions: ZERO, pieces: ZERO, grams: ZERO };
  const key = quantityKeyOf(component);
  if (key === 'pct') {
    const on = component.on ?? '';
    if (trail.includes(formula.id)) {
      throw new PlanError(
        `${[...trail, formula.id].join(' goes on ')} goes round in a circle: a part cannot go on a part that goes on it`,
        'cycle',
        formula.id,
      );
    }
    const green = greenAtLevel(on, level, library, units, [...trail, formula.id]);
    const base = library.get(on);
    return {
      ...none,
      grams: fraction(new Decimal(component.pct ?? 0)).times(green),
      // Named by title, as everything a cook reads: the id only when there is no title.
      words: `${component.pct} % of the green weight of ${base?.title ?? on}`,
    };
  }
  if (key === 'portions' && formula.kind === 'blend') {
    const portions = units.times(component.portions ?? 0);
    return {
      ...none,
      portions,
      words: `${counted(component.portions ?? 0, 'portion', 'portions')} each = ${counted(portions, 'portion', 'portions')} of ${formula.portion}`,
    };
  }
  if (key === 'pieces' && formula.kind === 'dough') {
    const pieces = units.times(component.pieces ?? 0);
    return {
      ...none,
      pieces,
      words: `${counted(component.pieces ?? 0, 'piece', 'pieces')} each = ${counted(pieces, 'piece', 'pieces')} of ${formula.piece}`,
    };
  }
  if (key === 'slices') {
    const grams = units.times(component.slices ?? 0).times(parseMass(component.slice ?? ''));
    return {
      ...none,
      grams,
      words: `${counted(component.slices ?? 0, 'slice', 'slices')} of ${component.slice} each = ${text(grams)} g sliced`,
    };
  }
  const grams = units.times(parseMass(component.amount ?? ''));
  return { ...none, grams, words: `${component.amount} each = ${text(grams)} g` };
}

/** A fresh need of a formula, nothing added yet. */
function emptyNeed(formula: BatchFormula): Need {
  return {
    formula,
    purposes: [],
    portions: ZERO,
    pieces: ZERO,
    grams: ZERO,
    sizes: {},
    served: false,
    goesOn: [],
  };
}

/**
 * Adds what one component of an assembly asks of its batch formula to that formula's need.
 * @param level every component of the assembly the component is in (for a part applied to another)
 * @param where the assembly in words, for the purpose line
 */
export function addNeed(
  needs: Map<string, Need>,
  component: AssemblyComponent,
  formula: BatchFormula,
  library: FormulaLibrary,
  units: Decimal,
  level: readonly AssemblyComponent[],
  where: string,
): void {
  const demand = demandOf(component, formula, library, units, level);
  const need = needs.get(formula.id) ?? emptyNeed(formula);
  if (component.on === undefined) need.served = true;
  else if (!need.goesOn.includes(component.on)) need.goesOn.push(component.on);
  need.purposes.push(`${where}: ${demand.words}`);
  need.portions = need.portions.plus(demand.portions);
  need.pieces = need.pieces.plus(demand.pieces);
  need.grams = need.grams.plus(demand.grams);
  const sizes = componentSizes(component);
  const thicknessMm = larger(need.sizes.thicknessMm, sizes.thicknessMm);
  const largestPieceGrams = larger(need.sizes.largestPieceGrams, sizes.largestPieceGrams);
  need.sizes = {
    ...(thicknessMm ? { thicknessMm } : {}),
    ...(largestPieceGrams ? { largestPieceGrams } : {}),
  };
  needs.set(formula.id, need);
}

/** An assembly and its count in words: "Smokehouse burger › Bun (2 units)". */
export function whereIn(path: readonly AssemblyFormula[], units: Decimal): string {
  return `${path.map((a) => a.title).join(' › ')} (${counted(units, 'unit', 'units')})`;
}

/**
 * Walks an assembly, and the assemblies inside it, into what each formula is needed for: one
 * {@link Need} per formula, in the order first met. Nested assemblies multiply through (units ×
 * count); the same formula named twice is added up, so the kitchen makes one batch of it. A part
 * applied to another (on:, pct:) weighs pct of the green weight of that part at the same level.
 * @param units how many units of this assembly are wanted
 * @param trail the titles of the assemblies around this one, outermost first
 * @throws PlanError when an assembly has errors, names a missing or unfitting formula, or
 *   assemblies contain each other (or parts go on each other)
 */
export function collectNeeds(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
  units: Decimal,
  needs: Map<string, Need> = new Map(),
  trail: readonly AssemblyFormula[] = [],
): Map<string, Need> {
  if (trail.some((outer) => outer.id === assembly.id)) {
    const chain = [...trail, assembly].map((a) => a.id).join(' → ');
    throw new PlanError(
      `${chain} goes round in a circle: an assembly cannot contain itself`,
      'cycle',
      assembly.id,
    );
  }
  refuseIfInvalid(assembly, library);
  const path = [...trail, assembly];
  const where = whereIn(path, units);
  for (const component of assembly.components) {
    // refuseIfInvalid has made sure the formula is there and fits its quantity.
    const formula = library.get(component.formula);
    if (!formula) continue;
    if (formula.kind === 'assembly') {
      collectNeeds(formula, library, units.times(component.units ?? 1), needs, path);
      continue;
    }
    addNeed(needs, component, formula, library, units, assembly.components, where);
  }
  return needs;
}
