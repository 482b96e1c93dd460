import { readdirSync, statSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import {
  MAX_ALIAS_COUNT,
  isFormulaFileName,
  isFormulaId,
  parseYamlWithinLimits,
  readFormula,
  type FormulaReading,
} from '../../shared/index.ts';
import { revisionOf } from '../../files/revision.ts';

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

/** What identifies one state of a file on disk: when a save or a git pull changes it, this changes. */
function stamp(info: { mtimeMs: number; ctimeMs: number; size: number; ino: number }): string {
  return `${info.ino}:${info.size}:${info.mtimeMs}:${info.ctimeMs}`;
}

// Parsed files by path and disk stamp: a request re-reads and re-checks only files that changed
// since they were last read, instead of every formula on every call.
const readings = new Map<string, { stamp: string; file: FormulaFile }>();

/** Reads one formula file (from the cache when it has not changed); undefined when it does not exist. */
export async function readFormulaFileAt(
  folder: string,
  name: string,
): Promise<FormulaFile | undefined> {
  const file = path.join(folder, name);
  let text: string;
  let current: string;
  try {
    // Every request that needs a formula stats the folder's files: a synchronous stat takes
    // microseconds, where fs/promises' round trip through the thread pool cost more than the
    // calculation itself under load.
    const info = statSync(file, { throwIfNoEntry: false });
    if (!info) {
      readings.delete(file);
      return undefined;
    }
    current = stamp(info);
    const cached = readings.get(file);
    if (cached?.stamp === current) return cached.file;
    text = await readFile(file, 'utf8');
  } catch (error) {
    // A file deleted between listing and reading is simply gone.
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
      readings.delete(file);
      return undefined;
    }
    throw error;
  }
  const read: FormulaFile = {
    name,
    path: file,
    text,
    revision: revisionOf(text),
    reading: readFormula(text, name),
  };
  readings.set(file, { stamp: current, file: read });
  return read;
}

/**
 * Every *.yaml / *.yml file directly in the folder but the catalogue of materials, read and
 * checked, sorted by name; `linked` when any of them is a symbolic link (its target can change
 * with no notice in this folder).
 */
export async function readFormulaFolder(
  folder: string,
): Promise<{ files: FormulaFile[]; linked: boolean }> {
  const entries = readdirSync(folder, { withFileTypes: true })
    .filter((entry) => isFormulaFileName(entry.name))
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  const files = await Promise.all(entries.map((entry) => readFormulaFileAt(folder, entry.name)));
  return {
    files: files.filter((file): file is FormulaFile => file !== undefined),
    linked: entries.some((entry) => entry.isSymbolicLink()),
  };
}

/** A file name without its .yaml / .yml ending. */
export function fileStem(name: string): string {
  return name.replace(/\.ya?ml$/i, '');
}

/**
 * The id a file answers to: its formula's id when it reads cleanly, else its file name without
 * the ending when that is a well-formed id (an invalid file is still a formula someone edits).
 */
export function formulaIdOf(file: FormulaFile): string | undefined {
  const id = file.reading.formula?.id;
  if (id !== undefined) return id;
  const stem = fileStem(file.name);
  return isFormulaId(stem) ? stem : undefined;
}

/**
 * Picks the file for each id among files read together, the way FormulaStore.find does: a
 * formula's own id first (the first file by name when two claim one id), then the file name of a
 * file that cannot be read as a formula.
 */
export function filesById(files: readonly FormulaFile[]): Map<string, FormulaFile> {
  const chosen = new Map<string, FormulaFile>();
  for (const file of files) {
    const id = file.reading.formula?.id;
    if (id !== undefined && !chosen.has(id)) chosen.set(id, file);
  }
  for (const file of files) {
    const id = formulaIdOf(file);
    if (!file.reading.formula && id !== undefined && !chosen.has(id)) chosen.set(id, file);
  }
  return chosen;
}

/** Title and kind of a file, read loosely when the file has errors; null when not there. */
export function formulaFacts(file: FormulaFile): { title: string | null; kind: string | null } {
  const formula = file.reading.formula;
  if (formula) return { title: formula.title, kind: formula.kind };
  let value: unknown;
  try {
    // A file too large or too deep to read has no title or kind to show.
    const parsed = parseYamlWithinLimits(file.text);
    value = parsed.ok ? parsed.document.toJS({ maxAliasCount: MAX_ALIAS_COUNT }) : undefined;
  } catch {
    value = undefined;
  }
  const record = (value && typeof value === 'object' ? value : {}) as Record<string, unknown>;
  return {
    title: typeof record.title === 'string' ? record.title : null,
    kind: typeof record.kind === 'string' ? record.kind : null,
  };
}
