import type { RequestHandler, Response, Router } from 'express';
import multer from 'multer';
import { MAX_FORMULA_BYTES } from '../../shared/index.ts';
import { requireGroupRole } from '../auth/authenticate.ts';
import { personOf } from '../auth/request-person.ts';
import { AppError, badRequest } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import { YAML_TEXT, idOf, ifMatchOf, requireIfMatch, setRevision } from './formula-http.ts';
import { mergeFormulaIntoYaml } from '../../shared/formula/merge-formula-yaml.ts';
import { newFormula } from './formula-checks.ts';
import type { WriteOutcome } from '../../shared/api/formula-api.ts';
import type { FormulaWriter } from './formula-writer.ts';

// The commit message of the change: required, so the history says why.
const MESSAGE = { type: 'string', minLength: 1, maxLength: 1000, pattern: '\\S' } as const;

const SAVE_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['message'],
  properties: { yaml: YAML_TEXT, formula: { type: 'object' }, message: MESSAGE },
} as const;

const CREATE_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['yaml', 'message'],
  properties: { yaml: YAML_TEXT, message: MESSAGE },
} as const;

/** Reads one uploaded file into memory: .yaml or .yml, no larger than a formula may be. */
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_FORMULA_BYTES, files: 1, fields: 4, parts: 6, fieldSize: 4096 },
  fileFilter: (_req, file, callback) => {
    if (/\.ya?ml$/i.test(file.originalname)) callback(null, true);
    else
      callback(
        new AppError(415, 'not-yaml', 'upload a formula file ending in .yaml or .yml', [
          { field: 'file' },
        ]),
      );
  },
});

/** multer's single-file reader, with its errors turned into API errors. */
const readUpload: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (error?: unknown) => {
    if (error instanceof multer.MulterError) {
      next(
        error.code === 'LIMIT_FILE_SIZE'
          ? new AppError(
              413,
              'too-large',
              `a formula file is at most ${MAX_FORMULA_BYTES / 1024} KB`,
            )
          : badRequest(
              `send multipart/form-data with one file field "file" (and an optional "message"): ${error.message}`,
              [{ field: error.field ?? null }],
            ),
      );
      return;
    }
    // The form parser's own errors (a cut-off body, no boundary) are the request's fault too.
    next(
      error === undefined || error instanceof AppError
        ? error
        : badRequest(`the upload is not valid multipart/form-data: ${(error as Error).message}`),
    );
  });
};

function respond(res: Response, outcome: WriteOutcome, status: number): void {
  setRevision(res, outcome.revision);
  if (outcome.created) res.setHeader('Location', `/api/formulas/${outcome.id}`);
  res.status(status).json(outcome);
}

function decodeUtf8(buffer: Buffer): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new AppError(422, 'invalid-formula', 'the file is not UTF-8 text', [
      {
        file: 'upload',
        line: 0,
        column: 0,
        path: [],
        message: 'save the file as UTF-8',
        severity: 'error',
      },
    ]);
  }
}

/**
 * The admin-only changes of /api/formulas: PUT /:id (save), POST / (create), POST /upload.
 * Every change names the revision it was made on (If-Match), is checked like `larder check`, is
 * written atomically, recorded in the history and the audit log, and committed to git.
 */
export function formulaWriteRoutes(router: Router, writer: FormulaWriter): void {
  // The formulas are the group's: a role at one site does not change them.
  const admin = requireGroupRole('admin');

  router.post('/upload', admin, readUpload, async (req, res) => {
    const file = req.file;
    if (!file)
      throw badRequest('send multipart/form-data with one file field "file"', [{ field: 'file' }]);
    const body = (req.body ?? {}) as Record<string, unknown>;
    const given = typeof body.message === 'string' ? body.message.trim() : '';
    if (given.length > 1000) throw badRequest('message is at most 1000 characters');
    const text = decodeUtf8(file.buffer);
    // The file is named by the id inside it, never by the name it was uploaded under.
    const formula = newFormula(text, 'upload');
    const expected = ifMatchOf(req);
    const change = {
      id: formula.id,
      text,
      message: given || `Upload ${formula.id}`,
      author: personOf(req),
      source: 'upload' as const,
      ip: req.ip,
      detail: { uploadedAs: file.originalname.slice(0, 200) },
    };
    if (expected === undefined) {
      respond(res, await writer.create(change), 201);
    } else {
      respond(res, await writer.replace(change, expected), 200);
    }
  });

  router.post('/', admin, validateBody(CREATE_BODY), async (req, res) => {
    const { yaml, message } = req.body as { yaml: string; message: string };
    const formula = newFormula(yaml, 'formula.yaml');
    const outcome = await writer.create({
      id: formula.id,
      text: yaml,
      message,
      author: personOf(req),
      source: 'create',
      ip: req.ip,
    });
    respond(res, outcome, 201);
  });

  router.put('/:id', admin, validateBody(SAVE_BODY), async (req, res) => {
    const id = idOf(req);
    const body = req.body as { yaml?: string; formula?: Record<string, unknown>; message: string };
    if ((body.yaml === undefined) === (body.formula === undefined))
      throw badRequest(
        'send either yaml (the file text) or formula (the formula as JSON), not both',
      );
    const expected = requireIfMatch(req);
    const formula = body.formula;
    if (formula !== undefined && formula.id !== id)
      throw new AppError(
        422,
        'id-mismatch',
        `the formula's id is ${JSON.stringify(formula.id)}, but this is the formula "${id}"; a formula keeps its id`,
        [{ path: ['id'], message: `the id must be "${id}"`, severity: 'error' }],
      );
    const outcome = await writer.replace(
      {
        id,
        // A JSON formula is written into the file as it is, keeping its comments and layout.
        text: body.yaml ?? ((base: string) => mergeOrRefuse(base, formula ?? {})),
        message: body.message,
        author: personOf(req),
        source: 'save',
        ip: req.ip,
      },
      expected,
    );
    respond(res, outcome, 200);
  });
}

/** Writes a JSON formula into the file's YAML; a formula nested beyond reason is the request's fault. */
function mergeOrRefuse(base: string, formula: Record<string, unknown>): string {
  try {
    return mergeFormulaIntoYaml(base, formula);
  } catch (error) {
    if (error instanceof RangeError) throw badRequest(error.message);
    throw error;
  }
}
