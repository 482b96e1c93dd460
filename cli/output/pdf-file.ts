import { stat } from 'node:fs/promises';
import path from 'node:path';
import {
  placeNew,
  removeQuietly,
  writeFileAtomic,
  writeTemporary,
} from '../../files/atomic-file.ts';
import type { PresentedPlan, PresentedResult } from '../../shared/index.ts';
import {
  batchSheetPdf,
  planSheetPdf,
  type SheetRecord,
  type SheetSource,
} from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';

/** What `--pdf FILE` was given with. */
export interface PdfTarget {
  readonly file: string;
  /** Whether an existing file may be replaced (--force). */
  readonly force: boolean;
}

/** A file-system failure as words a cook can act on. */
function reason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'ENOENT') return 'the folder does not exist';
  if (code === 'ENOTDIR') return 'a part of the path is a file, not a folder';
  if (code === 'EROFS') return 'the disk is read-only';
  if (code === 'ENOSPC') return 'the disk is full';
  return (error as Error).message;
}

function exists(file: string): CliError {
  return new CliError(`${file} already exists: add --force to replace it`, EXIT.usage);
}

/**
 * Checks, before any work is done (or any batch recorded), that the sheet can be written: the
 * folder is there, the name is not a folder, and the file is new unless --force is given.
 * @throws CliError (exit 2) saying what is wrong with the path
 */
export async function checkPdfTarget({ file, force }: PdfTarget): Promise<void> {
  const folder = path.dirname(path.resolve(file));
  try {
    if (!(await stat(folder)).isDirectory())
      throw new CliError(`cannot write ${file}: ${folder} is not a folder`, EXIT.usage);
  } catch (error) {
    if (error instanceof CliError) throw error;
    throw new CliError(`cannot write ${file}: ${reason(error)} (${folder})`, EXIT.usage);
  }
  let found;
  try {
    found = await stat(file);
  } catch {
    return;
  }
  if (found.isDirectory())
    throw new CliError(`${file} is a folder: give a file name, e.g. sheet.pdf`, EXIT.usage);
  if (!force) throw exists(file);
}

/**
 * Writes the PDF whole or not at all: to a temporary file beside the target, then renamed into
 * place (with --force) or linked in only while the name is still free (without), so a reader
 * never sees half a file and a file that appeared meanwhile is never overwritten.
 * @throws CliError (exit 2) when the file cannot be written or now exists
 */
export async function writePdf({ file, force }: PdfTarget, bytes: Uint8Array): Promise<void> {
  try {
    if (force) {
      await writeFileAtomic(file, bytes);
      return;
    }
    const temporary = await writeTemporary(file, bytes);
    try {
      if (!(await placeNew(temporary, file))) throw exists(file);
    } finally {
      await removeQuietly(temporary);
    }
  } catch (error) {
    if (error instanceof CliError) throw error;
    throw new CliError(`cannot write ${file}: ${reason(error)}`, EXIT.usage);
  }
}

/**
 * Renders a batch sheet as a PDF and writes it: a recorded batch's with its lot code, or a plain
 * calculation's with the formula revision it was made from.
 */
export async function writeBatchSheet(
  target: PdfTarget,
  result: PresentedResult,
  record?: SheetRecord,
  source?: SheetSource,
): Promise<void> {
  await writePdf(target, await batchSheetPdf(result, record, source));
}

/** Renders a plan's sheets (an overview, then one production sheet per start day) and writes them. */
export async function writePlanSheet(target: PdfTarget, plan: PresentedPlan): Promise<void> {
  await writePdf(target, await planSheetPdf(plan));
}
