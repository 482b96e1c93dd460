import { randomBytes } from 'node:crypto';
import { access, link, open, rename, stat, unlink } from 'node:fs/promises';
import path from 'node:path';

// A temporary file's name: ".NAME.<random hex>.tmp" beside the file NAME it will replace.
const TEMPORARY_NAME = /^\.(.+)\.[0-9a-f]+\.tmp$/;

/**
 * The name of the file a temporary file from writeTemporary was written for ("x.yaml" for
 * ".x.yaml.0a1b2c.tmp"), or undefined for a name writeTemporary never gives.
 */
export function temporaryTarget(name: string): string | undefined {
  return TEMPORARY_NAME.exec(name)?.[1];
}

/**
 * Writes text or bytes to a new temporary file beside `target` and flushes it to disk, so that a
 * rename can then swap it in whole. The temporary name starts with a dot and ends in .tmp, so
 * nothing that lists *.yaml files ever sees it (see temporaryTarget). The file takes the mode of
 * `modeFrom` when that exists.
 * @returns the temporary file's path
 */
export async function writeTemporary(
  target: string,
  text: string | Uint8Array,
  modeFrom?: string,
): Promise<string> {
  const temporary = path.join(
    path.dirname(target),
    `.${path.basename(target)}.${randomBytes(6).toString('hex')}.tmp`,
  );
  let mode = 0o644;
  if (modeFrom !== undefined) {
    try {
      mode = (await stat(modeFrom)).mode & 0o777;
    } catch {
      // The file is gone; the default mode will do.
    }
  }
  const handle = await open(temporary, 'wx', mode);
  try {
    await handle.writeFile(text, 'utf8');
    await handle.chmod(mode);
    await handle.sync();
  } catch (error) {
    await handle.close().catch(() => undefined);
    await removeQuietly(temporary);
    throw error;
  }
  await handle.close();
  return temporary;
}

/** Swaps a temporary file in for `target` in one step (rename is atomic within a folder). */
export async function replaceWith(temporary: string, target: string): Promise<void> {
  await rename(temporary, target);
  await syncFolder(path.dirname(target));
}

/**
 * Puts a temporary file in place as `target` only when `target` does not exist yet (a hard link
 * cannot overwrite), then drops the temporary name.
 * @returns false when `target` already exists
 */
export async function placeNew(temporary: string, target: string): Promise<boolean> {
  try {
    await link(temporary, target);
    await removeQuietly(temporary);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') return false;
    if (code !== 'EPERM' && code !== 'ENOTSUP' && code !== 'ENOSYS') throw error;
    // A file system without hard links: check, then rename (the caller holds the write lock).
    if (await exists(target)) return false;
    await rename(temporary, target);
  }
  await syncFolder(path.dirname(target));
  return true;
}

/** Writes a whole file atomically: a temporary file, then a rename. */
export async function writeFileAtomic(target: string, text: string | Uint8Array): Promise<void> {
  const temporary = await writeTemporary(target, text, target);
  try {
    await replaceWith(temporary, target);
  } catch (error) {
    await removeQuietly(temporary);
    throw error;
  }
}

async function exists(file: string): Promise<boolean> {
  try {
    await access(file);
    return true;
  } catch {
    return false;
  }
}

/** Deletes a file, ignoring one that is already gone. */
export async function removeQuietly(file: string): Promise<void> {
  await unlink(file).catch(() => undefined);
}

// Flushes the folder entry of a rename, so the new name survives a power cut. Best effort: some
// file systems cannot open a folder for syncing.
async function syncFolder(folder: string): Promise<void> {
  try {
    const handle = await open(folder, 'r');
    try {
      await handle.sync();
    } finally {
      await handle.close();
    }
  } catch {
    // Not every platform lets a folder be synced; the rename itself is still atomic.
  }
}
