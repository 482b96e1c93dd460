import type { FormulaLibrary } from '../calculation/plan/check-assembly-library.ts';
import { checkAssemblyLibrary } from '../calculation/plan/check-assembly-library.ts';
import type { Formula } from './formula-types.ts';
import { placeProblems, type FormulaReading } from './read-formula.ts';

/** One formula file of a folder, as read on its own. */
export interface LibraryFile {
  /** The name problems are printed with. */
  readonly file: string;
  readonly reading: FormulaReading;
}

/**
 * The formulas of a folder that read cleanly, by id; the first file wins when two claim one id
 * (the duplicate is an error of its own).
 */
export function formulaLibrary(files: readonly LibraryFile[]): Map<string, Formula> {
  const library = new Map<string, Formula>();
  for (const { reading } of files) {
    if (reading.formula && !library.has(reading.formula.id)) {
      library.set(reading.formula.id, reading.formula);
    }
  }
  return library;
}

/**
 * Checks the formulas of a folder against each other: each assembly's components must name
 * formulas that exist and fit (checkAssemblyLibrary). Returns the readings in the same order,
 * each assembly's with its cross-file problems placed at their line and column; an assembly
 * with such an error loses its formula, exactly as a file with errors of its own does.
 * @param textOf the text of a file, for the line and column of its problems
 */
export function checkLibrary(
  files: readonly LibraryFile[],
  textOf: (file: string) => string,
  library: FormulaLibrary = formulaLibrary(files),
): FormulaReading[] {
  return files.map(({ file, reading }) => {
    const formula = reading.formula;
    if (formula?.kind !== 'assembly') return reading;
    const found = checkAssemblyLibrary(formula, library);
    if (found.length === 0) return reading;
    const placed = placeProblems(textOf(file), file, found);
    const problems = [...reading.problems, ...placed].sort(
      (a, b) => a.line - b.line || a.column - b.column,
    );
    // Every cross-file problem is an error: the assembly cannot be planned until it is fixed.
    return { problems };
  });
}
