import { createHash } from 'node:crypto';
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import { readFormula, type FormulaReading } from '../../shared/index.ts';

/** One formula file as it is on disk now. */
export interface FormulaFile {
  /** File name within the formulas folder, e.g. "quillmoor-belly.yaml". */
  readonly name: string;
  readonly path: string;
  readonly text: string;
  /** sha-256 of the text: the revision, and the ETag clients send back in If-Match. */
  readonly revision: string;
  readonly reading: FormulaReading;
}

/** The revision of a formula text: its sha-256 in hex. */
export function revisionOf(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}

/** Reads one formula file; undefined when it does not exist. */
export async function readFormulaFileAt(
  folder: string,
  name: string,
): Promise<FormulaFile | undefined> {
  const file = path.join(folder, name);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    // A file deleted between listing and reading is simply gone.
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
  return { name, path: file, text, revision: revisionOf(text), reading: readFormula(text, name) };
}

/** Every *.yaml / *.yml file directly in the folder, read and checked, sorted by name. */
export async function readFormulaFolder(folder: string): Promise<FormulaFile[]> {
  const names = (await readdir(folder)).filter((name) => /\.ya?ml$/i.test(name)).sort();
  const files = await Promise.all(names.map((name) => readFormulaFileAt(folder, name)));
  return files.filter((file): file is FormulaFile => file !== undefined);
}
