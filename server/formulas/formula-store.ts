import {
  checkLibrary,
  formulaLibrary,
  type Formula,
  type FormulaLibrary,
} from '../../shared/index.ts';
import { revisionOf } from '../../files/revision.ts';
import { AppError, notFound } from '../http/app-error.ts';
import { FolderWatch } from './folder-watch.ts';
import { filesById, readFormulaFolder, type FormulaFile } from './formula-files.ts';
import { filesAtSite, type FormulaSite } from './formula-site.ts';

/** A formula that can be calculated, with the revision it was read at. */
export interface CurrentFormula {
  readonly formula: Formula;
  readonly revision: string;
  readonly file: FormulaFile;
}

/**
 * The formulas folder as it is on disk, so that edits there (a git pull) are seen at once. The
 * YAML files stay the source of truth.
 */
export class FormulaStore {
  // The files of the last read and the same files after the library checks: while no file has
  // changed on disk (each unchanged file is the same object, see readFormulaFileAt), the checks
  // are not run again on every request.
  private checked: { read: readonly FormulaFile[]; files: readonly FormulaFile[] } | undefined;
  // With `watch`, the folder is listed and its files stat'ed again only after the system has told
  // of a change; without, on every call (a CLI run reads it once anyway).
  private readonly changes: FolderWatch | undefined;
  private readsStarted = 0;
  private readsRunning = 0;
  private readKept = 0;

  constructor(
    readonly folder: string,
    { watch = false }: { watch?: boolean } = {},
  ) {
    this.changes = watch ? new FolderWatch(folder) : undefined;
  }

  /** Something in the folder was just written here: read it again on the next call. */
  changed(): void {
    this.changes?.markChanged();
  }

  /** Stops watching the folder. */
  close(): void {
    this.changes?.close();
  }

  /**
   * Every formula file a site sees, valid or not (filesAtSite: another site's formulas left out);
   * without a site, every file. Each assembly is also checked against the other formulas
   * (checkLibrary): one that names a missing or unfitting formula has errors like any other.
   */
  async files(at?: FormulaSite): Promise<FormulaFile[]> {
    return this.seenAt(await this.allFiles(), at);
  }

  /** Of all the files, those the site sees, assemblies checked against them (files). */
  private seenAt(all: readonly FormulaFile[], at?: FormulaSite): FormulaFile[] {
    const seen = filesAtSite(all, at);
    // An assembly of the group naming another site's formula cannot be made at this site: its
    // parts are checked again against what the site sees (only when the site sees less).
    const same = seen.length === all.length && seen.every((file, i) => file === all[i]);
    return same ? seen : withLibraryChecks(seen);
  }

  /** Every formula file of the folder, checked, read again only when something changed. */
  private async allFiles(): Promise<FormulaFile[]> {
    const last = this.checked;
    // While another call is reading, this one reads too: what it would reuse may be outdated.
    if (last && this.readsRunning === 0 && this.changes && !this.changes.needsRead())
      return [...last.files];
    const order = ++this.readsStarted;
    let files: FormulaFile[];
    this.readsRunning++;
    try {
      const read = await readFormulaFolder(this.folder);
      files = read.files;
      if (read.linked) this.changes?.markChanged();
    } catch (error) {
      this.changes?.markChanged();
      // A missing or unreadable folder is a setup problem the person asking can act on.
      const code = (error as NodeJS.ErrnoException).code;
      throw new AppError(
        503,
        'formulas-unavailable',
        `the formulas folder cannot be read (${code ?? String(error)})`,
      );
    } finally {
      this.readsRunning--;
    }
    const latest = this.checked;
    if (latest?.read.length === files.length && files.every((file, i) => file === latest.read[i]))
      return [...latest.files];
    const checked = withLibraryChecks(files);
    // Reads can end out of order; only a later read replaces what an earlier one kept.
    if (order > this.readKept) {
      this.readKept = order;
      this.checked = { read: files, files: checked };
    }
    return [...checked];
  }

  /** The file holding a formula id (among those the site sees), or undefined. */
  async find(id: string, at?: FormulaSite): Promise<FormulaFile | undefined> {
    return fileFor(await this.files(at), id);
  }

  /**
   * The file that answers to exactly this id (see filesById): unlike find, never a valid formula
   * of another id that happens to have this file name. The formulas API reads and writes by this.
   */
  async fileOf(id: string, at?: FormulaSite): Promise<FormulaFile | undefined> {
    return filesById(await this.files(at)).get(id);
  }

  /**
   * Whether the formula of this id is another site's: the site must not see it, nor its history,
   * as if it did not exist.
   */
  async elsewhere(id: string, at: FormulaSite | undefined): Promise<boolean> {
    if (!at) return false;
    const site = filesById(await this.allFiles()).get(id)?.reading.formula?.site;
    return site !== undefined && site !== at.key && at.known.includes(site);
  }

  /** Every formula that reads cleanly (assemblies checked against the others), by id. */
  async library(at?: FormulaSite): Promise<FormulaLibrary> {
    return (await this.libraryWithRevision(at)).library;
  }

  /**
   * The library with one revision for the whole of it, read from the same files: the same names
   * and texts give the same revision, any file added, removed, renamed or changed a new one.
   */
  async libraryWithRevision(
    at?: FormulaSite,
  ): Promise<{ library: FormulaLibrary; revision: string }> {
    const files = await this.files(at);
    return {
      library: formulaLibrary(files.map((file) => ({ file: file.name, reading: file.reading }))),
      revision: revisionOf(files.map((file) => `${file.name}\0${file.revision}`).join('\n')),
    };
  }

  /**
   * The formula with this id as it is now.
   * @throws AppError 404 when there is none, 422 when its file has errors
   */
  async current(id: string, at?: FormulaSite): Promise<CurrentFormula> {
    return currentOf(await this.find(id, at), id);
  }

  /**
   * current(), at once when nothing in the folder has changed since it was last read (nearly
   * every call on a server, which watches the folder); undefined when it must be read first.
   * @throws AppError as current() does
   */
  currentNow(id: string, at?: FormulaSite): CurrentFormula | undefined {
    const last = this.checked;
    // As allFiles reuses the last read, but only looking: a change seen is left for it to read.
    if (!last || this.readsRunning !== 0 || !this.changes?.unchanged()) return undefined;
    return currentOf(fileFor(this.seenAt(last.files, at), id), id);
  }
}

/** The file holding a formula id among these files: its formula's id, else its file name. */
function fileFor(files: readonly FormulaFile[], id: string): FormulaFile | undefined {
  return (
    files.find((file) => file.reading.formula?.id === id) ??
    files.find((file) => file.name.replace(/\.ya?ml$/i, '') === id)
  );
}

/**
 * The formula of this file, with its revision.
 * @throws AppError 404 when there is no file, 422 when it has errors
 */
function currentOf(file: FormulaFile | undefined, id: string): CurrentFormula {
  if (!file) throw notFound(`no formula "${id}"`);
  const formula = file.reading.formula;
  if (!formula)
    throw new AppError(
      422,
      'invalid-formula',
      `the formula file ${file.name} has errors`,
      file.reading.problems,
    );
  return { formula, revision: file.revision, file };
}

/** The files with each assembly's cross-file problems added to its reading. */
function withLibraryChecks(files: FormulaFile[]): FormulaFile[] {
  const byName = new Map(files.map((file) => [file.name, file]));
  const checked = checkLibrary(
    files.map((file) => ({ file: file.name, reading: file.reading })),
    (name) => byName.get(name)?.text ?? '',
  );
  return files.map((file, i) =>
    checked[i] === file.reading ? file : { ...file, reading: checked[i] },
  );
}
