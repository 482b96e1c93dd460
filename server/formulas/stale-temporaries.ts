import { readdir, stat, unlink } from 'node:fs/promises';
import path from 'node:path';
import { temporaryTarget } from '../../files/atomic-file.ts';

/**
 * How old a save's temporary file must be before it counts as left over. A save writes, flushes
 * and renames its temporary file within milliseconds; one a minute old belongs to a save that
 * never finished (the process killed mid-save), not to one another process is making now.
 * (common practice, no source)
 */
export const STALE_TEMPORARY_MS = 60_000;

/** Whether a file name is a formula save's temporary file: ".NAME.yaml.<hex>.tmp" (or .yml). */
export function isFormulaTemporary(name: string): boolean {
  const target = temporaryTarget(name);
  return target !== undefined && /\.ya?ml$/i.test(target);
}

/**
 * Removes the temporary files that unfinished formula saves left in a folder (a save killed
 * between writing its temporary file and renaming it): only files of that exact pattern, only
 * those older than STALE_TEMPORARY_MS by the file system's clock. Nothing else is touched; a
 * folder that cannot be read is left to the formula store to report; a file that cannot be
 * removed stays.
 * @returns the names removed, for the log
 */
export async function removeStaleTemporaries(
  folder: string,
  nowMs: number = Date.now(),
): Promise<string[]> {
  let entries;
  try {
    entries = await readdir(folder, { withFileTypes: true });
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const entry of entries) {
    // A symbolic link or a folder of that name is not a file a save wrote.
    if (!entry.isFile() || !isFormulaTemporary(entry.name)) continue;
    const file = path.join(folder, entry.name);
    try {
      if (nowMs - (await stat(file)).mtimeMs < STALE_TEMPORARY_MS) continue;
      await unlink(file);
      removed.push(entry.name);
    } catch {
      // Gone already (another process cleaned it), or not ours to remove: it stays, and it is
      // never listed as a formula either way, so the server starts regardless.
    }
  }
  return removed;
}
