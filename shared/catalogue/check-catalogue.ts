import type { LibraryFile } from '../formula/check-library.ts';
import { placeProblems, type FormulaReading } from '../formula/read-formula.ts';
import { catalogueProblems, type LinkCatalogue } from './link-catalogue.ts';

/**
 * Checks the formulas of a folder against its catalogue (catalogueProblems). Returns the
 * readings in the same order, each with the catalogue's problems placed at their line and
 * column; a formula with such an error loses its formula, as a file with errors of its own does.
 * @param textOf the text of a file, for the line and column of its problems
 */
export function checkCatalogue(
  files: readonly LibraryFile[],
  textOf: (file: string) => string,
  linked: LinkCatalogue,
): FormulaReading[] {
  return files.map(({ file, reading }) => {
    if (!reading.formula) return reading;
    const found = catalogueProblems(reading.formula, linked);
    if (found.length === 0) return reading;
    const problems = [...reading.problems, ...placeProblems(textOf(file), file, found)].sort(
      (a, b) => a.line - b.line || a.column - b.column,
    );
    return problems.some((p) => p.severity === 'error')
      ? { problems }
      : { formula: reading.formula, problems };
  });
}
