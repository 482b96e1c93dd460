import { QueryTypes, type Transaction } from 'sequelize';
import { insertNew } from '../db/insert-row.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { FormulaRevision, RevisionSource } from '../../shared/api/formula-api.ts';
import {
  filesById,
  formulaFacts,
  formulaIdOf,
  readFormulaFileAt,
  type FormulaFile,
} from './formula-files.ts';
import type { CurrentFormula, FormulaStore } from './formula-store.ts';
import type { FormulaSite } from './formula-site.ts';

/** One row of a formula's history: the API's entry without `current`, with its row and formula. */
export interface RevisionRecord extends Omit<FormulaRevision, 'current'> {
  /** Row id: orders revisions, newest highest. */
  readonly rowId: number;
  readonly formulaId: string;
}

/** What it takes to record a revision. */
export interface NewRevision {
  readonly formulaId: string;
  readonly revision: string;
  readonly yaml: string;
  readonly title: string | null;
  readonly kind: string | null;
  readonly message: string;
  readonly source: RevisionSource;
  readonly authorId: number | null;
}

interface RevisionRow {
  id: number;
  formula_id: string;
  revision: string;
  yaml?: string;
  title: string | null;
  kind: string | null;
  message: string;
  source: RevisionSource;
  author_id: number | null;
  commit_sha: string | null;
  created_at: string;
  username: string | null;
  display_name: string | null;
}

const SELECT_ROWS = `SELECT r.id, r.formula_id, r.revision, r.title, r.kind, r.message, r.source,
  r.author_id, r.commit_sha, r.created_at, p.username, p.display_name
  FROM formula_revisions r LEFT JOIN people p ON p.id = r.author_id`;

function toRevision(row: RevisionRow): RevisionRecord {
  return {
    rowId: row.id,
    formulaId: row.formula_id,
    revision: row.revision,
    source: row.source,
    message: row.message,
    title: row.title,
    kind: row.kind,
    author:
      row.author_id === null
        ? null
        : {
            id: row.author_id,
            username: row.username ?? '',
            displayName: row.display_name ?? row.username ?? '',
          },
    commit: row.commit_sha,
    at: row.created_at,
  };
}

/**
 * The formula_revisions table: every text a formula has had, who made it and how. The YAML files
 * stay the source of truth; this is their history. A revision found on disk that is not the
 * formula's latest recorded one (first sight, a git pull, an editor) is recorded as source "disk".
 */
export class FormulaHistory {
  // The latest revision recorded per formula id, so reads need not ask the database each time.
  private readonly latestSeen = new Map<string, string>();

  constructor(
    private readonly store: FormulaStore,
    private readonly db: Database,
    private readonly audit: AuditRepository,
  ) {}

  /** The folder the formulas (and the catalogue of materials beside them) are read from. */
  get folder(): string {
    return this.store.folder;
  }

  /** Every formula as it is now, by id: what an assembly's parts are worked out from. */
  library(at?: FormulaSite): ReturnType<FormulaStore['library']> {
    return this.store.library(at);
  }

  /** Records a revision; returns its row id. */
  async insert(revision: NewRevision, transaction: Transaction): Promise<number> {
    // Bound, not replaced into the SQL: a file's text may hold any character, and a NUL would end
    // the statement early.
    return insertNew(
      this.db,
      `INSERT INTO formula_revisions
         (formula_id, revision, yaml, title, kind, message, source, author_id, created_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)`,
      [
        revision.formulaId,
        revision.revision,
        revision.yaml,
        revision.title,
        revision.kind,
        revision.message,
        revision.source,
        revision.authorId,
        new Date().toISOString(),
      ],
      transaction,
      { bound: true },
    );
  }

  /** Stores the git commit of a revision once git has made it. */
  async setCommit(rowId: number, commit: string): Promise<void> {
    await this.db.sequelize.query('UPDATE formula_revisions SET commit_sha = ? WHERE id = ?', {
      replacements: [commit, rowId],
    });
  }

  /** The newest revision row of a formula. */
  async latest(formulaId: string, transaction?: Transaction): Promise<RevisionRecord | undefined> {
    const [row] = await this.db.sequelize.query<RevisionRow>(
      `${SELECT_ROWS} WHERE r.formula_id = ? ORDER BY r.id DESC LIMIT 1`,
      { replacements: [formulaId], type: QueryTypes.SELECT, transaction },
    );
    return row ? toRevision(row) : undefined;
  }

  /** The newest revision row of every formula, by formula id. */
  async latestOfEach(): Promise<Map<string, RevisionRecord>> {
    const rows = await this.db.sequelize.query<RevisionRow>(
      `${SELECT_ROWS} WHERE r.id IN (SELECT MAX(id) FROM formula_revisions GROUP BY formula_id)`,
      { type: QueryTypes.SELECT },
    );
    return new Map(rows.map((row) => [row.formula_id, toRevision(row)]));
  }

  /** A formula's revisions, newest first. */
  async list(formulaId: string): Promise<RevisionRecord[]> {
    const rows = await this.db.sequelize.query<RevisionRow>(
      `${SELECT_ROWS} WHERE r.formula_id = ? ORDER BY r.id DESC`,
      { replacements: [formulaId], type: QueryTypes.SELECT },
    );
    return rows.map(toRevision);
  }

  /** The newest row holding one revision of a formula, with its YAML. */
  async find(
    formulaId: string,
    revision: string,
  ): Promise<(RevisionRecord & { yaml: string }) | undefined> {
    const [row] = await this.db.sequelize.query<RevisionRow & { yaml: string }>(
      `SELECT r.id, r.formula_id, r.revision, r.yaml, r.title, r.kind, r.message, r.source,
         r.author_id, r.commit_sha, r.created_at, p.username, p.display_name
       FROM formula_revisions r LEFT JOIN people p ON p.id = r.author_id
       WHERE r.formula_id = ? AND r.revision = ? ORDER BY r.id DESC LIMIT 1`,
      { replacements: [formulaId, revision], type: QueryTypes.SELECT },
    );
    return row ? { ...toRevision(row), yaml: row.yaml } : undefined;
  }

  /** Notes that a formula's latest recorded revision is this one (after a committed write). */
  remember(formulaId: string, revision: string): void {
    this.latestSeen.set(formulaId, revision);
  }

  /**
   * Records, as source "disk", every file whose text is not its formula's latest recorded
   * revision. Each file is read again inside the write transaction, so a save that renamed its
   * file and recorded its row in one transaction is never mistaken for a change on disk, and two
   * readers never record one change twice.
   */
  async note(files: readonly FormulaFile[]): Promise<void> {
    const unseen = [...filesById(files)].filter(
      ([id, file]) => this.latestSeen.get(id) !== file.revision,
    );
    if (unseen.length === 0) return;
    // A read first: after a restart nearly every file is its formula's latest recorded revision,
    // and a read needs no write lock, which another program may be holding.
    const latest = await this.latestOfEach();
    const pending = unseen.filter(([id, file]) => {
      if (latest.get(id)?.revision !== file.revision) return true;
      this.remember(id, file.revision);
      return false;
    });
    if (pending.length === 0) return;
    const seen: [string, string][] = [];
    await this.db.write(async (transaction) => {
      for (const [id, file] of pending) {
        const fresh = await readFormulaFileAt(this.store.folder, file.name);
        if (!fresh || formulaIdOf(fresh) !== id) continue;
        await this.noteInTransaction(id, fresh, transaction);
        seen.push([id, fresh.revision]);
      }
    });
    for (const [id, revision] of seen) this.remember(id, revision);
  }

  /**
   * Inside a write transaction: records the file as found on disk unless it is the formula's
   * latest recorded revision; a change to a known formula is audited.
   */
  async noteInTransaction(id: string, file: FormulaFile, transaction: Transaction): Promise<void> {
    const latest = await this.latest(id, transaction);
    if (latest?.revision === file.revision) return;
    const { title, kind } = formulaFacts(file);
    await this.insert(
      {
        formulaId: id,
        revision: file.revision,
        yaml: file.text,
        title,
        kind,
        message: latest ? 'changed on disk' : 'found on disk',
        source: 'disk',
        authorId: null,
      },
      transaction,
    );
    if (latest) {
      await this.audit.append(
        {
          action: 'formula-disk-change',
          subject: id,
          detail: { file: file.name, from: latest.revision, to: file.revision },
        },
        transaction,
      );
    }
  }

  /**
   * FormulaStore.current, with the revision recorded in the history first. For callers that keep
   * the revision (a batch record): call it before, not inside, a write transaction of your own.
   */
  async current(id: string, at?: FormulaSite): Promise<CurrentFormula> {
    const current = await this.store.current(id, at);
    await this.note([current.file]);
    return current;
  }
}
