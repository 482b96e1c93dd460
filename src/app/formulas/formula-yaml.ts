import { parse } from 'yaml';
import { mergeFormulaIntoYaml } from '../../../shared/formula/merge-formula-yaml.ts';
import type { Formula } from './formula-api-types';

/**
 * Reads formula YAML into a plain object for the form, or null when it is not a YAML map. The
 * server decides whether it is a usable formula; this only gives the form something to show.
 */
export function parseFormulaYaml(text: string): Formula | null {
  try {
    const value: unknown = parse(text);
    return value !== null && typeof value === 'object' && !Array.isArray(value)
      ? (value as Formula)
      : null;
  } catch {
    // The text is being typed: a YAML syntax error is expected, and validation reports it.
    return null;
  }
}

/**
 * Writes `formula` into the YAML text it was edited from, so the YAML view follows the form
 * without losing the author's comments, key order or one-line `{ name, pct }` rows — the same
 * merge the server does when a form is saved (shared/formula/merge-formula-yaml.ts).
 */
export function writeFormulaYaml(text: string, formula: Formula): string {
  return mergeFormulaIntoYaml(text, formula as unknown as Record<string, unknown>);
}
