import path from 'node:path';
import type { Transaction } from 'sequelize';
import type { WriteOutcome } from '../../shared/api/formula-api.ts';
import { isFormulaId, type Formula } from '../../shared/index.ts';
import type { AuditAction } from '../../shared/api/audit-event.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { badRequest, conflict, notFound, type AppError } from '../http/app-error.ts';
import type { Person } from '../../shared/api/person.ts';
import {
  placeNew,
  removeQuietly,
  replaceWith,
  writeFileAtomic,
  writeTemporary,
} from '../../files/atomic-file.ts';
import { staleRevision, usableFormula } from './formula-checks.ts';
import { formulaIdOf, readFormulaFileAt, type FormulaFile } from './formula-files.ts';
import { revisionOf } from '../../files/revision.ts';
import { commitFormulaFile } from './formula-git.ts';
import type { FormulaHistory } from './formula-history.ts';
import type { FormulaStore } from './formula-store.ts';

/** How a change arrived: edited in the console or by a script, created, or uploaded as a file. */
export type WriteSource = 'save' | 'create' | 'upload';

/** A new text for a formula, and who sends it why. */
export interface FormulaChange {
  /** The formula id; checked with isFormulaId before any path is built from it. */
  readonly id: string;
  readonly text: string;
  readonly message: string;
  readonly author: Person;
  readonly source: WriteSource;
  readonly ip?: string;
  /** Extra facts for the audit log, e.g. the name of an uploaded file. */
  readonly detail?: Record<string, unknown>;
}

const AUDIT_ACTION: Record<WriteSource, AuditAction> = {
  save: 'formula-save',
  create: 'formula-create',
  upload: 'formula-upload',
};

/**
 * Writes formula files so that nothing is lost or half-written: the new text goes to a temporary
 * file, and inside one write transaction the file on disk is checked against the revision the
 * writer started from, swapped in by rename, and its revision row and audit entry recorded. Git
 * commits come after, and a git failure is a warning, not an error.
 */
export class FormulaWriter {
  constructor(
    private readonly store: FormulaStore,
    private readonly history: FormulaHistory,
    private readonly db: Database,
    private readonly audit: AuditRepository,
  ) {}

  /**
   * Replaces a formula's text, only if the file is still at `expected` (the client's If-Match).
   * The text may be a function of the current text (a JSON formula merged into the file).
   * @throws AppError 404 (no such formula), 409 stale-revision, 422 invalid-formula or id-mismatch
   */
  async replace(
    request: Omit<FormulaChange, 'text'> & { text: string | ((base: string) => string) },
    expected: string,
  ): Promise<WriteOutcome> {
    const base = await this.fileOf(request.id);
    if (!base) throw notFound(`no formula "${request.id}"`);
    if (base.revision !== expected) {
      await this.history.note([base]);
      throw staleRevision(base.revision);
    }
    const text = typeof request.text === 'string' ? request.text : request.text(base.text);
    const change: FormulaChange = { ...request, text };
    const { formula, problems } = usableFormula(change.text, base.name, change.id);
    const revision = revisionOf(change.text);
    const unchanged = {
      id: change.id,
      file: base.name,
      revision,
      previousRevision: base.revision,
      created: false,
      commit: null,
      warnings: [],
      problems,
    };
    if (revision === base.revision) {
      await this.history.note([base]);
      return { ...unchanged, changed: false };
    }

    const temporary = await writeTemporary(base.path, change.text, base.path);
    let swapped = false;
    let outcome: { rowId: number } | { stale: string | null };
    try {
      outcome = await this.db.write(async (transaction) => {
        // Read again under the write lock: another save, or git, may have changed it since.
        const fresh = await readFormulaFileAt(this.store.folder, base.name);
        if (fresh && formulaIdOf(fresh) === change.id)
          await this.history.noteInTransaction(change.id, fresh, transaction);
        if (!fresh || fresh.revision !== expected) return { stale: fresh?.revision ?? null };
        await replaceWith(temporary, base.path);
        swapped = true;
        this.store.changed();
        return { rowId: await this.record(change, formula, revision, base.revision, transaction) };
      });
    } catch (error) {
      // The database said no after the file was swapped: put the old text back.
      if (swapped) {
        await writeFileAtomic(base.path, base.text);
        this.store.changed();
      } else await removeQuietly(temporary);
      throw error;
    }
    if ('stale' in outcome) {
      await removeQuietly(temporary);
      throw staleRevision(outcome.stale);
    }
    return this.finish(change, outcome.rowId, { ...unchanged, changed: true });
  }

  /**
   * Adds a new formula as ID.yaml.
   * @throws AppError 409 formula-exists, 422 invalid-formula
   */
  async create(change: FormulaChange): Promise<WriteOutcome> {
    const name = `${safeId(change.id)}.yaml`;
    const { formula, problems } = usableFormula(change.text, name, change.id);
    const exists = (): AppError =>
      conflict('formula-exists', `there is already a formula "${change.id}"`, [{ id: change.id }]);
    if (await this.fileOf(change.id)) throw exists();
    const target = path.join(this.store.folder, name);
    const revision = revisionOf(change.text);
    const temporary = await writeTemporary(target, change.text);
    let placed = false;
    let rowId: number | undefined;
    try {
      rowId = await this.db.write(async (transaction) => {
        if (await this.fileOf(change.id)) return undefined;
        if (!(await placeNew(temporary, target))) return undefined;
        placed = true;
        this.store.changed();
        return this.record(change, formula, revision, null, transaction);
      });
    } catch (error) {
      if (placed) {
        await removeQuietly(target);
        this.store.changed();
      }
      throw error;
    } finally {
      await removeQuietly(temporary);
    }
    if (rowId === undefined) throw exists();
    return this.finish(change, rowId, {
      id: change.id,
      file: name,
      revision,
      previousRevision: null,
      created: true,
      changed: true,
      commit: null,
      warnings: [],
      problems,
    });
  }

  /** The file for an id, read from disk now. */
  fileOf(id: string): Promise<FormulaFile | undefined> {
    return this.store.fileOf(safeId(id));
  }

  private async record(
    change: FormulaChange,
    formula: Formula,
    revision: string,
    previousRevision: string | null,
    transaction: Transaction,
  ): Promise<number> {
    const rowId = await this.history.insert(
      {
        formulaId: change.id,
        revision,
        yaml: change.text,
        title: formula.title,
        kind: formula.kind,
        message: change.message,
        source: change.source,
        authorId: change.author.id,
      },
      transaction,
    );
    await this.audit.append(
      {
        actor: change.author,
        action: AUDIT_ACTION[change.source],
        subject: change.id,
        detail: { revision, previousRevision, message: change.message, ...change.detail },
        ip: change.ip,
      },
      transaction,
    );
    return rowId;
  }

  private async finish(
    change: FormulaChange,
    rowId: number,
    outcome: WriteOutcome,
  ): Promise<WriteOutcome> {
    this.history.remember(change.id, outcome.revision);
    const git = await commitFormulaFile(
      this.store.folder,
      outcome.file,
      change.message,
      change.author,
    );
    if (git.commit) await this.history.setCommit(rowId, git.commit);
    return {
      ...outcome,
      commit: git.commit,
      warnings: git.warning ? [...outcome.warnings, git.warning] : outcome.warnings,
    };
  }
}

// Defence in depth: the routes check ids already, and a path is never built from anything else.
function safeId(id: string): string {
  if (!isFormulaId(id)) throw badRequest('a formula id is lower-case letters, digits and dashes');
  return id;
}
