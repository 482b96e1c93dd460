import type { Decimal } from '../../decimal.ts';
import {
  contentError,
  contentWarning,
  type ContentProblem,
  type FormulaPath,
} from '../../formula/formula-problem.ts';
import type { AssemblyComponent, AssemblyFormula } from '../../formula/formula-types.ts';
import { parseLength } from '../../units/length.ts';
import { parseMass } from '../../units/mass.ts';
import { QuantityError } from '../../units/quantity-error.ts';
import { SIZE_KEYS, quantityKeysOf } from './component-quantity.ts';

const HOW_MUCH =
  'one of portions (a blend), pieces (a dough), slices with slice (a cure), amount (any kind), ' +
  'units (another assembly) or pct with on (a part applied to another, such as a rub)';

/** A quantity text read by `parse`, or a problem when it is not one or not more than zero. */
function checkQuantity(
  text: string | undefined,
  path: FormulaPath,
  parse: (text: string) => Decimal,
  problems: ContentProblem[],
): void {
  if (text === undefined) return;
  try {
    if (!parse(text).greaterThan(0)) {
      problems.push(
        contentError(path, `${String(path.at(-1))} must be more than 0, not "${text}"`),
      );
    }
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    problems.push(contentError(path, error.message));
  }
}

function checkComponent(
  assembly: AssemblyFormula,
  component: AssemblyComponent,
  i: number,
): ContentProblem[] {
  const at = (key?: string): FormulaPath =>
    key === undefined ? ['components', i] : ['components', i, key];
  const problems: ContentProblem[] = [];
  const keys = quantityKeysOf(component);
  if (keys.length === 0) {
    problems.push(
      contentError(at(), `say how much of ${component.formula} goes into one unit: ${HOW_MUCH}`),
    );
  } else if (keys.length > 1) {
    problems.push(
      contentError(
        at(keys[1]),
        `give one quantity for ${component.formula}, not ${keys.join(' and ')}`,
      ),
    );
  }
  if (component.slice !== undefined && component.slices === undefined) {
    problems.push(
      contentError(at('slice'), 'slice is the weight of one slice: it goes with slices (how many)'),
    );
  }
  if (component.slices !== undefined && component.slice === undefined) {
    problems.push(
      contentError(
        at('slices'),
        'slices needs slice, the finished weight of one slice (slice: 25 g)',
      ),
    );
  }
  if (component.on !== undefined && component.pct === undefined) {
    problems.push(
      contentError(
        at('on'),
        `on names the part ${component.formula} goes on: it goes with pct, its weight as a percent of that part's green weight (pct: 1.5)`,
      ),
    );
  }
  if (component.pct !== undefined && component.on === undefined) {
    problems.push(
      contentError(
        at('pct'),
        `pct is a share of the part ${component.formula} goes on: name that part with on (on: brisket-brine)`,
      ),
    );
  }
  const cureQuantity = keys.includes('slices') || keys.includes('amount') || keys.includes('pct');
  for (const key of SIZE_KEYS) {
    if (component[key] !== undefined && keys.length > 0 && !cureQuantity) {
      problems.push(
        contentError(
          at(key),
          `${key} is the size of a cure's pieces, for its hold rule: it goes with slices or amount`,
        ),
      );
    }
  }
  checkQuantity(component.slice, at('slice'), parseMass, problems);
  checkQuantity(component.amount, at('amount'), parseMass, problems);
  checkQuantity(component.largest_piece, at('largest_piece'), parseMass, problems);
  checkQuantity(component.thickness, at('thickness'), parseLength, problems);
  if (component.formula === assembly.id) {
    problems.push(contentError(at('formula'), 'an assembly cannot be a part of itself'));
  }
  return problems;
}

/** The formulas from `start` along the parts' on: links that lead back to `target`, or undefined. */
function onPathBack(
  start: string,
  target: string,
  goesOn: ReadonlyMap<string, readonly string[]>,
  seen = new Set<string>(),
): string[] | undefined {
  if (start === target) return [start];
  if (seen.has(start)) return undefined;
  seen.add(start);
  for (const next of goesOn.get(start) ?? []) {
    const rest = onPathBack(next, target, goesOn, seen);
    if (rest) return [start, ...rest];
  }
  return undefined;
}

/**
 * The problems of the parts applied to other parts: each goes on another part of this assembly
 * (not on itself, not on one missing here) and no chain of them leads back to where it began.
 */
function appliedPartProblems(assembly: AssemblyFormula): ContentProblem[] {
  const goesOn = new Map<string, string[]>();
  for (const { formula, on } of assembly.components) {
    if (on !== undefined) goesOn.set(formula, [...(goesOn.get(formula) ?? []), on]);
  }
  const problems: ContentProblem[] = [];
  assembly.components.forEach(({ formula, on }, i) => {
    if (on === undefined) return;
    const path: FormulaPath = ['components', i, 'on'];
    const others = assembly.components.filter((c) => c.formula !== formula).map((c) => c.formula);
    if (on === formula) {
      problems.push(
        contentError(path, `${formula} cannot go on itself: name another part of this assembly`),
      );
    } else if (!others.includes(on)) {
      const parts = others.length
        ? `, or name one of its parts (${[...new Set(others)].join(', ')})`
        : '';
      problems.push(
        contentError(
          path,
          `${formula} goes on ${on}, which is not a part of this assembly: add ${on} as a part${parts}`,
        ),
      );
    } else {
      const circle = onPathBack(on, formula, goesOn);
      if (circle) {
        problems.push(
          contentError(
            path,
            `${[formula, ...circle].join(' → ')} goes round in a circle: a part cannot go on a part that goes on it`,
          ),
        );
      }
    }
  });
  return problems;
}

/**
 * Checks what the schema cannot about an assembly, in this one file: each component gives
 * exactly one quantity (portions, pieces, slices, amount, units or pct), slice goes with slices
 * and on with pct, a part applied to another goes on another part of this assembly without
 * going round in a circle, the sizes for a cure's hold rule go with a cure's quantity, every
 * weight and length reads and is more than zero, and no component names the assembly itself.
 * Warns when one formula is named twice (the plan adds the two up). Whether the formulas named
 * exist and fit is checked across files, by checkAssemblyLibrary.
 * @returns the problems found; none when the assembly can be planned as far as this file goes
 */
export function checkAssemblyFormula(assembly: AssemblyFormula): ContentProblem[] {
  const problems = [
    ...assembly.components.flatMap((component, i) => checkComponent(assembly, component, i)),
    ...appliedPartProblems(assembly),
  ];
  const seen = new Set<string>();
  assembly.components.forEach((component, i) => {
    if (seen.has(component.formula)) {
      problems.push(
        contentWarning(
          ['components', i, 'formula'],
          `${component.formula} is named twice; the plan adds the two together`,
        ),
      );
    }
    seen.add(component.formula);
  });
  return problems;
}
