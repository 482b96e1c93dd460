import { LineCounter, type YAMLError } from 'yaml';
import { schemaErrors } from '../validation/formula-validator.ts';
import { schemaProblems } from '../validation/schema-messages.ts';
import { checkFormulaContent } from './check-formula.ts';
import { explicitTag } from './explicit-tag.ts';
import type { ContentProblem, FormulaPath, FormulaProblem } from './formula-problem.ts';
import type { Formula } from './formula-types.ts';
import { locate, type Position } from './locate.ts';
import { parseYamlWithinLimits } from './parse-yaml.ts';
import { MAX_ALIAS_COUNT, limitFormulaProblem, type YamlLimit } from './yaml-limits.ts';
import { yamlErrorMessage } from './yaml-messages.ts';

/** A formula read from text: the formula when it can be used, and every problem found. */
export interface FormulaReading {
  /** Present when there are no errors (warnings allowed). */
  readonly formula?: Formula;
  readonly problems: readonly FormulaProblem[];
  /** The limit the text passes when it was refused unread (its one problem says where). */
  readonly limit?: YamlLimit;
}

/**
 * Reads formula YAML: syntax, then the JSON Schema, then the checks the schema cannot express.
 * Every problem carries the file, line and column. Pure: the caller reads the file.
 * @param text the file's content
 * @param file the name to print in problems
 */
export function readFormula(text: string, file: string): FormulaReading {
  const read = readYamlValue(
    text,
    file,
    'a formula file is a set of keys (formula:, id:, title:, kind:, …)',
  );
  if (!read.ok) return { problems: read.problems, limit: read.limit };
  const { value, place } = read;
  const errors = schemaErrors(value);
  if (errors.length > 0)
    return { problems: sortByPosition(schemaProblems(errors, value).map(place)) };

  const formula = value as unknown as Formula;
  const problems = sortByPosition(checkFormulaContent(formula).map(place));
  return problems.some((p) => p.severity === 'error') ? { problems } : { formula, problems };
}

/** A YAML file read into a plain value, or the problems that stopped it. */
export type YamlValue =
  | {
      readonly ok: true;
      readonly value: Record<string, unknown>;
      /** Gives a problem found at a path of the value its line and column. */
      readonly place: (problem: ContentProblem) => FormulaProblem;
      /** Where a path of the value is in the text. */
      readonly locate: (path: FormulaPath) => Position;
    }
  | { readonly ok: false; readonly problems: FormulaProblem[]; readonly limit?: YamlLimit };

/**
 * Reads a YAML file of keys, as every file beside the formulas is read: within the size and
 * shape limits, then syntax, tags, control characters, and a set of keys at the top.
 * @param notKeys what the file is told when its top is not a set of keys
 */
export function readYamlValue(text: string, file: string, notKeys: string): YamlValue {
  const whole = (message: string): YamlValue => ({
    ok: false,
    problems: [{ file, line: 0, column: 0, path: [], message, severity: 'error' }],
  });
  const lineCounter = new LineCounter();
  // Size first, then nesting and node count as the text is read: a text built to exhaust the
  // parser is stopped where it passes a limit.
  const parsed = parseYamlWithinLimits(text, { lineCounter, uniqueKeys: true });
  if (!parsed.ok) {
    return {
      ok: false,
      problems: [limitFormulaProblem(parsed.problem, file)],
      limit: parsed.problem.limit,
    };
  }
  if (text.trim() === '') return whole('the file is empty');

  const control = controlCharacter(text);
  if (control) {
    return {
      ok: false,
      problems: [
        {
          file,
          ...control,
          path: [],
          severity: 'error',
          message: `the file holds an invisible control character (U+${control.code}); delete it`,
        },
      ],
    };
  }

  const doc = parsed.document;
  if (doc.errors.length > 0) {
    const problems = doc.errors.map((error): FormulaProblem => {
      const { line, col } = lineCounter.linePos(unclosedQuoteStart(text, error) ?? error.pos[0]);
      return {
        file,
        line,
        column: col,
        path: [],
        message: yamlErrorMessage(error),
        severity: 'error',
      };
    });
    return { ok: false, problems };
  }

  const tagged = explicitTag(doc);
  if (tagged) {
    const { line, col } = lineCounter.linePos(tagged.offset);
    return {
      ok: false,
      problems: [
        {
          file,
          line,
          column: col,
          path: [],
          severity: 'error',
          message: `YAML tags such as ${tagged.tag} are not part of a formula; write the value plainly, without the tag`,
        },
      ],
    };
  }

  let value: unknown;
  try {
    value = doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (error) {
    // yaml throws here for an unresolved alias or an alias bomb; both are the file's fault.
    return whole(`YAML: ${error instanceof Error ? error.message : String(error)}`);
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return whole(notKeys);

  const where = (path: FormulaPath): Position => locate(doc, lineCounter, path);
  const place = (problem: ContentProblem): FormulaProblem => ({
    ...problem,
    file,
    ...where(problem.path),
  });
  // An escape in a quoted value ("\0", "\x07") writes a control character the text check above
  // cannot see; it would reach sheets, files and the database all the same.
  const escaped = escapedControl(value, []);
  if (escaped) return { ok: false, problems: [place(escaped)] };
  return { ok: true, value: value as Record<string, unknown>, place, locate: where };
}

// Control characters other than tab, line feed and carriage return: never typed on purpose, and
// they can hide text on a screen or garble a printed sheet.
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;

function controlCharacter(
  text: string,
): { line: number; column: number; code: string } | undefined {
  const match = CONTROL.exec(text);
  if (!match) return undefined;
  const before = text.slice(0, match.index).split('\n');
  const code = match[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0');
  return { line: before.length, column: before[before.length - 1].length + 1, code };
}

/** The first key or string value (depth first) holding a control character, as a problem. */
function escapedControl(value: unknown, path: (string | number)[]): ContentProblem | undefined {
  const problem = (text: string, at: (string | number)[]): ContentProblem | undefined => {
    const match = CONTROL.exec(text);
    if (!match) return undefined;
    const code = match[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0');
    return {
      path: at,
      severity: 'error',
      message: `an escape in this value writes an invisible control character (U+${code}); delete it`,
    };
  };
  if (typeof value === 'string') return problem(value, path);
  if (value === null || typeof value !== 'object') return undefined;
  for (const [key, item] of Object.entries(value)) {
    const at = [...path, Array.isArray(value) ? Number(key) : key];
    const found = problem(key, at) ?? escapedControl(item, at);
    if (found) return found;
  }
  return undefined;
}

/**
 * Where a quoted value that is never closed begins. The parser only notices at the end of the
 * file; the line the cook must fix is the one with the lone quote.
 */
function unclosedQuoteStart(text: string, error: YAMLError): number | undefined {
  if (error.code !== 'MISSING_CHAR' || !/quote/i.test(error.message)) return undefined;
  const quote = error.message.includes('"') ? '"' : "'";
  let offset = 0;
  let start: number | undefined;
  for (const line of text.slice(0, error.pos[0]).split('\n')) {
    const count = line.split(quote).length - 1;
    if (count % 2 === 1 && start === undefined) start = offset + line.indexOf(quote);
    offset += line.length + 1;
  }
  return start;
}

/**
 * Places problems found in a formula's content (such as the cross-file checks of an assembly)
 * in its file: each gets the line and column its path points at. Pure: the caller has the text.
 * @param text the file's content, as it was read
 * @param file the name to print in problems
 */
export function placeProblems(
  text: string,
  file: string,
  problems: readonly ContentProblem[],
): FormulaProblem[] {
  if (problems.length === 0) return [];
  const lineCounter = new LineCounter();
  const parsed = parseYamlWithinLimits(text, { lineCounter });
  // A text the reader refused has no places to point at: its problems stand for the whole file.
  if (!parsed.ok) return problems.map((problem) => ({ ...problem, file, line: 0, column: 0 }));
  const doc = parsed.document;
  return sortByPosition(
    problems.map((problem) => ({ ...problem, file, ...locate(doc, lineCounter, problem.path) })),
  );
}

/** Problems in the order of the file, by line and column. */
export function sortByPosition(problems: FormulaProblem[]): FormulaProblem[] {
  return problems.sort((a, b) => a.line - b.line || a.column - b.column);
}

/** A problem as one line of text: "file:line:column: error: message". */
export function formatProblem(problem: FormulaProblem): string {
  const where =
    problem.line > 0 ? `${problem.file}:${problem.line}:${problem.column}` : problem.file;
  const key = problem.path.length ? ` (at ${pathText(problem.path)})` : '';
  return `${where}: ${problem.severity}: ${problem.message}${key}`;
}

/** A formula path as people read it: ingredients[3].pct, counting list items from 1. */
export function pathText(path: FormulaProblem['path']): string {
  return path
    .map((part, i) => (typeof part === 'number' ? `[${part + 1}]` : i === 0 ? part : `.${part}`))
    .join('')
    .replace(
      new RegExp(CONTROL.source, 'g'),
      (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`,
    );
}
