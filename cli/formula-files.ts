import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import {
  MAX_FORMULA_BYTES,
  TOO_LARGE_MESSAGE,
  formatProblem,
  isFormulaFileName,
  readFormula,
  type Formula,
  type FormulaReading,
} from '../shared/index.ts';
import { CliError, EXIT } from './cli-error.ts';

/** The folder formulas are looked up in by id: --formulas, else $LARDER_FORMULAS, else ./formulas. */
export function formulasFolder(option?: string): string {
  return option ?? process.env.LARDER_FORMULAS ?? 'formulas';
}

/** Whether a file name is a formula file: *.yaml or *.yml, not the catalogue of materials. */
export function isFormulaFile(name: string): boolean {
  return isFormulaFileName(name);
}

/** Every formula file under a folder, sorted, depth first. */
export function formulaFilesIn(folder: string): string[] {
  const found: string[] = [];
  for (const entry of readdirSync(folder, { withFileTypes: true }).sort((a, b) =>
    a.name.localeCompare(b.name),
  )) {
    const full = path.join(folder, entry.name);
    if (entry.isDirectory() && !entry.name.startsWith('.') && entry.name !== 'node_modules')
      found.push(...formulaFilesIn(full));
    else if (entry.isFile() && isFormulaFile(entry.name)) found.push(full);
  }
  return found;
}

/** Reads and checks one formula file; file-system failures become a problem of the file. */
export function readFormulaFile(file: string): FormulaReading {
  let text: string;
  try {
    // Not read at all when larger than a formula may be: the reader would refuse it anyway.
    if (statSync(file).size > MAX_FORMULA_BYTES) {
      return {
        problems: [
          { file, line: 0, column: 0, path: [], severity: 'error', message: TOO_LARGE_MESSAGE },
        ],
      };
    }
    text = readFileSync(file, 'utf8');
  } catch (error) {
    // The file may vanish or be unreadable between listing and reading; report it like any problem.
    const code = (error as NodeJS.ErrnoException).code;
    const message =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EACCES'
          ? 'permission denied'
          : code === 'EISDIR'
            ? 'this is a folder, not a file'
            : String(error);
    return { problems: [{ file, line: 0, column: 0, path: [], severity: 'error', message }] };
  }
  return readFormula(text, file);
}

/**
 * Finds a formula by path ("formulas/belly.yaml") or by id ("hickory-belly", looked up in the
 * formulas folder), reads and checks it.
 * @throws CliError (exit 3) when it cannot be found or has errors; exit 4 when its only errors
 *   are its own levels failing a critical limit
 */
export function loadFormula(
  reference: string,
  folder: string,
): { formula: Formula; file: string; warnings: string[] } {
  const file = resolveFormula(reference, folder);
  const reading = readFormulaFile(file);
  if (!reading.formula) {
    const errors = reading.problems.filter((p) => p.severity === 'error');
    // A formula whose own levels fail a critical limit is sound as a file, but no batch of it may
    // be made: that is a refusal (exit 4), as for a batch over its limit.
    if (errors.every((p) => p.criticalLimit)) {
      throw new CliError(
        `${file}: REFUSED: the formula itself fails a critical limit; no batch of it may be made`,
        EXIT.critical,
        reading.problems.map(formatProblem),
      );
    }
    throw new CliError(
      `${file}: the formula has ${errors.length} error(s)`,
      EXIT.formula,
      reading.problems.map(formatProblem),
    );
  }
  return { formula: reading.formula, file, warnings: reading.problems.map(formatProblem) };
}

function resolveFormula(reference: string, folder: string): string {
  if (isFormulaFile(reference) || reference.includes('/') || reference.includes(path.sep)) {
    if (!exists(reference)) throw new CliError(`${reference}: no such file`, EXIT.formula);
    return reference;
  }
  if (!exists(folder)) {
    throw new CliError(
      `no formula "${reference}": the formulas folder ${folder} does not exist (set --formulas or LARDER_FORMULAS)`,
      EXIT.formula,
    );
  }
  // Look for the id inside the files, the one named for it first: a file's name may differ
  // from the id it holds, and the id is what counts.
  const idLine = new RegExp(
    `^id:\\s*['"]?${reference.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}['"]?\\s*(#.*)?$`,
    'm',
  );
  const named = new Set(['.yaml', '.yml'].map((ext) => path.join(folder, reference + ext)));
  const files = formulaFilesIn(folder).sort((a, b) => Number(named.has(b)) - Number(named.has(a)));
  for (const file of files) {
    if (idLine.test(readFileSync(file, 'utf8'))) return file;
  }
  throw new CliError(
    `no formula "${reference}" in ${folder}: give a file path or one of the ids that \`larder check\` lists`,
    EXIT.formula,
  );
}

function exists(file: string): boolean {
  try {
    statSync(file);
    return true;
  } catch {
    return false;
  }
}
