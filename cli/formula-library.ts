import { readFileSync } from 'node:fs';
import path from 'node:path';
import {
  checkLibrary,
  formatProblem,
  formulaLibrary,
  type FormulaLibrary,
} from '../shared/index.ts';
import { formulaFilesIn, formulasFolder, readFormulaFile } from './formula-files.ts';
import type { Io } from './io.ts';

function isPath(reference: string): boolean {
  return reference.includes('/') || reference.includes(path.sep) || /\.ya?ml$/i.test(reference);
}

/**
 * The folder an assembly's parts are looked up in: --formulas, else the folder of the assembly's
 * own file when it was given by path, else the formulas folder.
 */
export function partsFolder(reference: string, file: string, option?: string): string {
  return option ?? (isPath(reference) ? path.dirname(file) : formulasFolder());
}

/**
 * The formulas of a folder, each assembly checked against the others, by id. The errors of the
 * assembly's own file are printed; another file's are summed up by the refusal of whatever
 * needs that file (`larder check` lists them all).
 */
export function libraryIn(folder: string, assemblyFile: string, io: Io): FormulaLibrary {
  const readings = formulaFilesIn(folder).map((file) => ({ file, reading: readFormulaFile(file) }));
  const checked = checkLibrary(readings, (file) => readFileSync(file, 'utf8'));
  const own = path.resolve(assemblyFile);
  checked.forEach((reading, i) => {
    if (path.resolve(readings[i].file) !== own) return;
    for (const problem of reading.problems.filter((p) => p.severity === 'error')) {
      io.err(`${formatProblem(problem)}\n`);
    }
  });
  return formulaLibrary(readings.map(({ file }, i) => ({ file, reading: checked[i] })));
}
