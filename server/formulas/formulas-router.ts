import { Router, type Request } from 'express';
import type {
  FormulaDetail,
  FormulaPreview,
  FormulaRevision,
  FormulaRevisions,
  FormulaValidation,
  LastChange,
} from '../../shared/api/formula-api.ts';
import type { FormulaDiff } from '../../shared/api/revision-diff.ts';
import { readFormula, type RawBatchOptions, type UnitSystem } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import { serverToday } from '../server-today.ts';
import { requireRole } from '../auth/authenticate.ts';
import {
  BATCH_OPTIONS_SCHEMA,
  UNITS_SCHEMA,
  calculateBatch,
  formulaFromText,
} from '../calc/calc-request.ts';
import { badRequest, notFound } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import { filesById, formulaFacts, formulaIdOf, type FormulaFile } from './formula-files.ts';
import { revisionOf } from '../../files/revision.ts';
import { refuseOverLimit } from './formula-checks.ts';
import { FormulaHistory, type RevisionRecord } from './formula-history.ts';
import {
  REVISION,
  YAML_TEXT,
  checkIdParam,
  checkRevisionParam,
  idOf,
  setRevision,
} from './formula-http.ts';
import { FormulaWriter } from './formula-writer.ts';
import { formulaSiteOf } from './formula-site.ts';
import { formulaWriteRoutes } from './formula-write-routes.ts';
import { diffHunks, diffLines } from './line-diff.ts';

const KINDS = ['cure', 'dough', 'blend', 'mix', 'assembly'];

// Validation reads any text, empty included, so that it answers with the same problem the
// command line gives for that file ("the file is empty"); a text larger or deeper than a formula
// can be is refused unread (413, 422), with that same problem in the details.
const VALIDATE_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['yaml'],
  properties: { yaml: { type: 'string' } },
} as const;

const PREVIEW_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['batch'],
  properties: { yaml: YAML_TEXT, batch: BATCH_OPTIONS_SCHEMA, units: UNITS_SCHEMA },
} as const;

function lastChange(row: RevisionRecord | undefined): LastChange {
  return {
    lastChangedBy: row?.author?.displayName ?? null,
    lastChangedAt: row?.at ?? null,
    lastChangeSource: row?.source ?? null,
  };
}

function revisionView(row: RevisionRecord, current: string | undefined): FormulaRevision {
  return {
    revision: row.revision,
    source: row.source,
    message: row.message,
    title: row.title,
    kind: row.kind,
    author: row.author,
    at: row.at,
    commit: row.commit,
    current: row.revision === current,
  };
}

/**
 * /api/formulas: the formula files, their history and diffs, validation and previews for every
 * signed-in role; changes for admins (formula-write-routes.ts).
 */
export function formulasRouter(context: AppContext): Router {
  const { formulas: store } = context;
  const history = new FormulaHistory(store, context.db, context.audit);
  const writer = new FormulaWriter(store, history, context.db, context.audit);
  const router = Router();
  router.param('id', checkIdParam);
  router.param('revision', checkRevisionParam);
  const anyone = requireRole('admin', 'cook', 'reviewer');

  /**
   * The file of an id as the request's site sees it now, with its revision recorded in the
   * history. @throws AppError 404 for another site's formula, as for one that does not exist
   */
  const fileOf = async (req: Request, id: string): Promise<FormulaFile | undefined> => {
    const at = formulaSiteOf(req);
    if (await store.elsewhere(id, at)) throw notFound(`no formula "${id}"`);
    const file = await store.fileOf(id, at);
    if (file) await history.note([file]);
    return file;
  };

  /** The YAML of one revision: the file when it is the current one, else the history's copy. */
  const textOf = async (id: string, revision: string, file: FormulaFile | undefined) => {
    if (file?.revision === revision) return file.text;
    const row = await history.find(id, revision);
    if (!row) throw notFound(`formula "${id}" has no revision ${revision}`);
    return row.yaml;
  };

  router.get('/', anyone, allowQuery('kind'), async (req, res) => {
    const kind = req.query.kind;
    if (kind !== undefined && (typeof kind !== 'string' || !KINDS.includes(kind)))
      throw badRequest(`kind must be one of ${KINDS.join(', ')}`, [{ field: 'kind' }]);
    const files = await store.files(formulaSiteOf(req));
    await history.note(files);
    const chosen = filesById(files);
    const latest = await history.latestOfEach();
    const list = files
      .map((file) => {
        const id = formulaIdOf(file) ?? null;
        const facts = formulaFacts(file);
        const problems = file.reading.problems;
        return {
          id,
          title: facts.title,
          kind: facts.kind,
          file: file.name,
          revision: file.revision,
          valid: file.reading.formula !== undefined,
          problemCount: problems.length,
          errorCount: problems.filter((p) => p.severity === 'error').length,
          // A second file claiming an id already taken: the API reads and writes the first.
          duplicate: id !== null && chosen.get(id) !== file,
          ...lastChange(id !== null && chosen.get(id) === file ? latest.get(id) : undefined),
        };
      })
      .filter((item) => kind === undefined || item.kind === kind);
    res.json({ formulas: list });
  });

  router.post('/validate', anyone, validateBody(VALIDATE_BODY), (req, res) => {
    const { yaml } = req.body as { yaml: string };
    const reading = readFormula(yaml, 'formula.yaml');
    refuseOverLimit(reading);
    res.json({
      usable: reading.formula !== undefined,
      id: reading.formula?.id ?? null,
      title: reading.formula?.title ?? null,
      kind: reading.formula?.kind ?? null,
      revision: revisionOf(yaml),
      problems: reading.problems,
    } satisfies FormulaValidation);
  });

  formulaWriteRoutes(router, writer);

  router.get('/:id', anyone, async (req, res) => {
    const id = idOf(req);
    const file = await fileOf(req, id);
    if (!file) throw notFound(`no formula "${id}"`);
    const latest = await history.latest(id);
    setRevision(res, file.revision);
    res.json({
      id,
      file: file.name,
      revision: file.revision,
      yaml: file.text,
      formula: file.reading.formula ?? null,
      valid: file.reading.formula !== undefined,
      problems: file.reading.problems,
      ...lastChange(latest),
    } satisfies FormulaDetail);
  });

  router.post('/:id/preview', anyone, validateBody(PREVIEW_BODY), async (req, res) => {
    const id = idOf(req);
    const body = req.body as { yaml?: string; batch: RawBatchOptions; units?: UnitSystem };
    let formula;
    let revision: string;
    if (body.yaml !== undefined) {
      formula = formulaFromText(body.yaml, `${id}.yaml`);
      revision = revisionOf(body.yaml);
    } else {
      const current = await store.current(id, formulaSiteOf(req));
      formula = current.formula;
      revision = current.revision;
    }
    const result = calculateBatch(
      formula,
      body.batch,
      body.units ?? 'metric',
      serverToday(context),
      formula.kind === 'assembly' ? await store.library(formulaSiteOf(req)) : undefined,
    );
    res.json({ id, saved: body.yaml === undefined, revision, result } satisfies FormulaPreview);
  });

  router.get('/:id/revisions', anyone, async (req, res) => {
    const id = idOf(req);
    const file = await fileOf(req, id);
    const rows = await history.list(id);
    if (!file && rows.length === 0) throw notFound(`no formula "${id}"`);
    res.json({
      id,
      currentRevision: file?.revision ?? null,
      revisions: rows.map((row) => revisionView(row, file?.revision)),
    } satisfies FormulaRevisions);
  });

  router.get('/:id/revisions/:revision', anyone, async (req, res) => {
    const id = idOf(req);
    const revision = String(req.params.revision);
    const file = await fileOf(req, id);
    const row = await history.find(id, revision);
    if (!row && file?.revision !== revision) {
      // Worded as the other formula routes word an id that is no formula (or another site's).
      if (!file && (await history.list(id)).length === 0) throw notFound(`no formula "${id}"`);
      throw notFound(`formula "${id}" has no revision ${revision}`);
    }
    setRevision(res, revision);
    res.json({
      id,
      ...(row ? revisionView(row, file?.revision) : { revision, current: true }),
      yaml: row?.yaml ?? file?.text,
    });
  });

  router.get('/:id/diff', anyone, async (req, res) => {
    const id = idOf(req);
    const { from, to } = req.query;
    if (typeof from !== 'string' || !REVISION.test(from))
      throw badRequest('from must be a revision (64 hex digits)', [{ field: 'from' }]);
    if (to !== undefined && (typeof to !== 'string' || !REVISION.test(to)))
      throw badRequest('to must be a revision (64 hex digits), or left out for the current one', [
        { field: 'to' },
      ]);
    const file = await fileOf(req, id);
    const toRevision = to ?? file?.revision;
    if (toRevision === undefined) throw notFound(`no formula "${id}"`);
    const oldText = await textOf(id, from, file);
    const newText = await textOf(id, toRevision, file);
    const lines = diffLines(oldText, newText);
    res.json({
      id,
      from: { revision: from, yaml: oldText },
      to: { revision: toRevision, yaml: newText, current: toRevision === file?.revision },
      changed: oldText !== newText,
      added: lines.filter((line) => line.kind === 'added').length,
      removed: lines.filter((line) => line.kind === 'removed').length,
      lines,
      hunks: diffHunks(lines),
    } satisfies FormulaDiff);
  });

  return router;
}
