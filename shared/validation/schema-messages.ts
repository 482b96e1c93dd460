import type { ErrorObject } from 'ajv/dist/2020.js';
import type { ContentProblem, FormulaPath } from '../formula/formula-problem.ts';
import { allergenItemPath, allergenMessage } from './allergen-messages.ts';
import { closestWord } from './closest-word.ts';

/** Messages for pattern keywords, by the key that carries the pattern. */
const PATTERN_MESSAGES: Readonly<Record<string, string>> = {
  id: 'may hold only lower-case letters, digits and dashes, 2 to 63 characters, e.g. "hickory-belly"',
  formula: 'must be a formula id: lower-case letters, digits and dashes, e.g. "chuck-grind"',
  key: 'may hold only lower-case letters, digits and dashes, starting with a letter, e.g. "lean"',
  item: 'must be the key of an item in the catalogue: lower-case letters, digits and dashes, starting with a letter, e.g. "kosher-salt"',
};

function pathOf(instancePath: string): (string | number)[] {
  if (instancePath === '') return [];
  return instancePath
    .slice(1)
    .split('/')
    .map((part) => part.replace(/~1/g, '/').replace(/~0/g, '~'))
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

function quote(value: unknown): string {
  if (typeof value === 'string') return `"${value}"`;
  if (value === null) return 'nothing';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'a set of keys';
  return String(value);
}

function typeWords(type: string): string {
  const words: Record<string, string> = {
    number: 'a number',
    integer: 'a whole number',
    string: 'text',
    boolean: 'true or false',
    array: 'a list (lines starting with "- ")',
    object: 'a set of keys',
  };
  return type
    .split(',')
    .map((t) => words[t] ?? t)
    .join(' or ');
}

function valueAt(root: unknown, path: FormulaPath): unknown {
  let node = root;
  for (const part of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string | number, unknown>)[part];
  }
  return node;
}

function allowedKeys(error: ErrorObject): string[] {
  const properties = (error.parentSchema as { properties?: Record<string, unknown> } | undefined)
    ?.properties;
  return properties ? Object.keys(properties) : [];
}

function subject(path: FormulaPath): string {
  const last = path[path.length - 1];
  return typeof last === 'string' ? `"${last}"` : 'this item';
}

/** One ajv error in words a cook understands, with the path of the key at fault. */
function describe(error: ErrorObject, root: unknown): ContentProblem | undefined {
  const path = pathOf(error.instancePath);
  const value = valueAt(root, path);
  const p = error.params as Record<string, unknown>;
  const what = subject(path);
  switch (error.keyword) {
    case 'additionalProperties': {
      const key = String(p.additionalProperty);
      const allowed = allowedKeys(error);
      const guess = closestWord(key, allowed);
      const hint = guess
        ? `; did you mean "${guess}"?`
        : allowed.length
          ? ` (allowed here: ${allowed.join(', ')})`
          : '';
      return { path: [...path, key], message: `unknown key "${key}"${hint}`, severity: 'error' };
    }
    case 'required':
      return { path, message: `"${String(p.missingProperty)}" is missing`, severity: 'error' };
    case 'type':
      return {
        path,
        message: `${what} should be ${typeWords(String(p.type))}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'enum': {
      const options = (p.allowedValues as unknown[]).map(String);
      const guess = typeof value === 'string' ? closestWord(value, options) : undefined;
      const hint = guess ? `; did you mean "${guess}"?` : '';
      return {
        path,
        message: `${what} must be one of ${options.join(', ')}, not ${quote(value)}${hint}`,
        severity: 'error',
      };
    }
    case 'const':
      return {
        path,
        message: `${what} must be ${quote(p.allowedValue)}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'minimum':
      return {
        path,
        message: `${what} must be at least ${String(p.limit)}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'exclusiveMinimum':
      return {
        path,
        message: `${what} must be more than ${String(p.limit)}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'maximum':
      return {
        path,
        message: `${what} must be at most ${String(p.limit)}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'exclusiveMaximum':
      return {
        path,
        message: `${what} must be less than ${String(p.limit)}, not ${quote(value)}`,
        severity: 'error',
      };
    case 'minItems':
      return {
        path,
        message: `${what} needs at least ${String(p.limit)} item(s)`,
        severity: 'error',
      };
    case 'maxItems':
      return {
        path,
        message: `${what} may have at most ${String(p.limit)} item(s)`,
        severity: 'error',
      };
    case 'minLength':
      return { path, message: `${what} must not be empty`, severity: 'error' };
    case 'maxLength':
      return {
        path,
        message: `${what} is too long (at most ${String(p.limit)} characters)`,
        severity: 'error',
      };
    case 'minProperties':
      return { path, message: `${what} must have at least one key`, severity: 'error' };
    case 'uniqueItems':
      return { path, message: `${what} lists the same thing twice`, severity: 'error' };
    case 'pattern': {
      const key = String(path[path.length - 1]);
      return {
        path,
        message: `${what} ${PATTERN_MESSAGES[key] ?? `does not have the expected form`}, not ${quote(value)}`,
        severity: 'error',
      };
    }
    case 'oneOf': {
      // Our oneOf is always "fat or lean": say which way it went wrong.
      const both = value !== null && typeof value === 'object' && 'fat' in value && 'lean' in value;
      return {
        path,
        message: both ? 'give "fat" or "lean", not both' : 'give "fat" or "lean"',
        severity: 'error',
      };
    }
    case 'anyOf':
      // Reached only when no branch had an error of the value's own shape (see schemaProblems).
      return {
        path,
        message: `${what} should be one word or a list (lines starting with "- "), not ${quote(value)}`,
        severity: 'error',
      };
    default:
      return { path, message: error.message ?? 'is not valid', severity: 'error' };
  }
}

/**
 * Whether an error comes from a branch of anyOf that does not fit the value's shape: our anyOf
 * is always "one word, or a list of words", so a type error, or a word list offered for a list,
 * only says the value took the other branch.
 */
function otherShapeOfAnyOf(error: ErrorObject, root: unknown): boolean {
  if (!error.schemaPath.includes('/anyOf/')) return false;
  if (error.keyword === 'type') return true;
  const value = valueAt(root, pathOf(error.instancePath));
  return error.keyword === 'enum' && value !== null && typeof value === 'object';
}

/**
 * Turns ajv's errors into plain-words problems, dropping the echoes that compound keywords
 * (if/then, the branches of oneOf, the branch of anyOf the value did not take) add on top of
 * the real error.
 */
export function schemaProblems(errors: readonly ErrorObject[], root: unknown): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const seen = new Set<string>();
  for (const error of errors) {
    if (error.keyword === 'if' || error.schemaPath.includes('/oneOf/')) continue;
    if (otherShapeOfAnyOf(error, root)) continue;
    // anyOf's own error comes after its branches': say it only when no branch said more.
    if (error.keyword === 'anyOf' && problems.some((p) => within(p.path, error.instancePath)))
      continue;
    // An allergen item fails several branches of its schema at once; one message says why.
    const item = allergenItemPath(pathOf(error.instancePath));
    const problem: ContentProblem | undefined = item
      ? { path: item, message: allergenMessage(valueAt(root, item)), severity: 'error' }
      : describe(error, root);
    if (!problem) continue;
    const key = `${problem.path.join('/')}|${problem.message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    problems.push(problem);
  }
  return problems;
}

function within(path: FormulaPath, instancePath: string): boolean {
  const parent = pathOf(instancePath);
  return parent.every((part, i) => path[i] === part);
}
