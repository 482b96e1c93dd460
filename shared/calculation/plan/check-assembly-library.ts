import {
  contentError,
  type ContentProblem,
  type FormulaPath,
} from '../../formula/formula-problem.ts';
import type {
  AssemblyComponent,
  AssemblyFormula,
  CureFormula,
  Formula,
} from '../../formula/formula-types.ts';
import { closestWord } from '../../validation/closest-word.ts';
import { estimateHold, holdRuleOf } from '../cure/hold-time.ts';
import {
  KINDS_FOR,
  SIZE_KEYS,
  componentSizes,
  keysForKind,
  quantityKeysOf,
} from './component-quantity.ts';
import type { PlanRefusal } from './plan-error.ts';

/** The formulas an assembly can name, by id. */
export type FormulaLibrary = ReadonlyMap<string, Formula>;

/** One problem of an assembly against the other formulas, with the refusal it means for a plan. */
export interface LibraryIssue {
  readonly path: FormulaPath;
  readonly message: string;
  readonly reason: Extract<
    PlanRefusal,
    'missing-formula' | 'wrong-kind' | 'needs-size' | 'cycle' | 'invalid-assembly'
  >;
  /** The formula the component names. */
  readonly formula: string;
}

function article(kind: string): string {
  return /^[aeiou]/.test(kind) ? `an ${kind}` : `a ${kind}`;
}

/** Kinds as a list in words: "a blend", "a cure, a dough, a blend or a mix". */
function kindsInWords(kinds: readonly string[]): string {
  const words = kinds.map(article);
  return words.length > 1 ? `${words.slice(0, -1).join(', ')} or ${words.at(-1)}` : words[0];
}

/** What a cure's hold rule needs that the component does not give, in words; undefined if nothing. */
function missingSize(cure: CureFormula, component: AssemblyComponent): string | undefined {
  const rule = holdRuleOf(cure)?.rule;
  if (!rule) {
    return `${cure.id} has no hold rule, so its start day cannot be planned: add hold: to it`;
  }
  const estimate = estimateHold(cure, componentSizes(component));
  if (!('missing' in estimate)) return undefined;
  const { days_per_cm, days_per_inch } = rule;
  return days_per_cm !== undefined || days_per_inch !== undefined
    ? `${cure.id}'s hold rule goes by thickness: give thickness: here (e.g. thickness: 4 cm)`
    : `${cure.id}'s hold rule goes by the heaviest piece: give largest_piece: here (e.g. largest_piece: 2.5 kg)`;
}

/** The chain of assemblies from `start` that leads back to `target`, or undefined. */
function pathBack(
  start: string,
  target: string,
  library: FormulaLibrary,
  seen = new Set<string>(),
): string[] | undefined {
  if (start === target) return [start];
  if (seen.has(start)) return undefined;
  seen.add(start);
  const formula = library.get(start);
  if (formula?.kind !== 'assembly') return undefined;
  for (const component of formula.components) {
    const rest = pathBack(component.formula, target, library, seen);
    if (rest) return [start, ...rest];
  }
  return undefined;
}

function componentIssues(
  assembly: AssemblyFormula,
  component: AssemblyComponent,
  i: number,
  library: FormulaLibrary,
): LibraryIssue[] {
  const keys = quantityKeysOf(component);
  // Missing or doubled quantities are the file's own problem (checkAssemblyFormula).
  if (keys.length !== 1) return [];
  const [key] = keys;
  const id = component.formula;
  const issue = (
    path: FormulaPath,
    reason: LibraryIssue['reason'],
    message: string,
  ): LibraryIssue => ({ path: ['components', i, ...path], reason, message, formula: id });
  const target = library.get(id);
  if (!target) {
    const guess = closestWord(id, [...library.keys()]);
    return [
      issue(
        ['formula'],
        'missing-formula',
        `no formula "${id}" among the formulas (or its file has errors)${guess ? `; did you mean "${guess}"?` : ''}`,
      ),
    ];
  }
  if (!KINDS_FOR[key].includes(target.kind)) {
    return [
      issue(
        [key],
        'wrong-kind',
        `${id} is ${article(target.kind)}: ${key} ${key === 'amount' ? 'is' : 'are'} for ${kindsInWords(KINDS_FOR[key])}; ` +
          `give ${keysForKind(target.kind)}`,
      ),
    ];
  }
  const issues: LibraryIssue[] = [];
  if (key === 'portions' && target.kind === 'blend' && target.portion === undefined) {
    issues.push(
      issue(
        [key],
        'invalid-assembly',
        `${id} has no portion weight: add portion: to it, or give amount: here`,
      ),
    );
  }
  if (key === 'pieces' && target.kind === 'dough' && target.piece === undefined) {
    issues.push(
      issue(
        [key],
        'invalid-assembly',
        `${id} has no piece weight: add piece: to it, or give amount: here`,
      ),
    );
  }
  for (const size of SIZE_KEYS) {
    if (component[size] !== undefined && target.kind !== 'cure') {
      issues.push(
        issue(
          [size],
          'invalid-assembly',
          `${size} is the size of a cure's pieces; ${id} is ${article(target.kind)}`,
        ),
      );
    }
  }
  const base = component.on === undefined ? undefined : library.get(component.on);
  if (base && base.kind !== 'cure') {
    issues.push(
      issue(
        ['on'],
        'wrong-kind',
        `${id} goes on ${base.id}, ${article(base.kind)}: pct is a share of a cure's green weight, so only a cure can take a part applied to it`,
      ),
    );
  }
  if (target.kind === 'cure') {
    const missing = missingSize(target, component);
    if (missing) issues.push(issue([], 'needs-size', missing));
  }
  if (target.kind === 'assembly') {
    const cycle = pathBack(id, assembly.id, library);
    if (cycle) {
      issues.push(
        issue(
          ['formula'],
          'cycle',
          `${[assembly.id, ...cycle].join(' → ')} goes round in a circle: an assembly cannot contain itself`,
        ),
      );
    }
  }
  return issues;
}

/**
 * Checks an assembly against the other formulas: every formula a component names exists and has
 * a kind its quantity fits (portions a blend, pieces a dough, slices a cure, units another
 * assembly, amount or pct any kind but an assembly), a part applied to another goes on a cure
 * (pct is a share of its green weight), a blend taken by portions has a portion weight, a
 * dough taken by pieces a piece weight, a cure's hold rule gets the size it goes by, and no
 * assembly leads back to this one. Pure: the caller reads the files.
 * @param library every formula that reads cleanly, by id
 */
export function assemblyLibraryIssues(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
): LibraryIssue[] {
  return assembly.components.flatMap((component, i) =>
    componentIssues(assembly, component, i, library),
  );
}

/** {@link assemblyLibraryIssues} as problems of the assembly's file, each an error at its path. */
export function checkAssemblyLibrary(
  assembly: AssemblyFormula,
  library: FormulaLibrary,
): ContentProblem[] {
  return assemblyLibraryIssues(assembly, library).map((issue) =>
    contentError(issue.path, issue.message),
  );
}
