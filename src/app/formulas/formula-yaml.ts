import { mergeFormulaIntoYaml } from '../../../shared/formula/merge-formula-yaml.ts';
import { parseYamlWithinLimits } from '../../../shared/formula/parse-yaml.ts';
import {
  MAX_ALIAS_COUNT,
  limitFormulaProblem,
  yamlLimitProblem,
} from '../../../shared/formula/yaml-limits.ts';
import type { Formula, FormulaProblem } from './formula-api-types';

/**
 * Reads formula YAML into a plain object for the form, or null when it is not a YAML map. The
 * server decides whether it is a usable formula; this only gives the form something to show.
 * A text larger or deeper than a formula can be is not parsed at all: it would freeze the tab.
 */
export function parseFormulaYaml(text: string): Formula | null {
  try {
    const parsed = parseYamlWithinLimits(text);
    if (!parsed.ok || parsed.document.errors.length > 0) return null;
    const value: unknown = parsed.document.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
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

/**
 * The problem of a text larger or deeper than a formula can be, the same the server gives, found
 * in the browser before anything parses the text; null when the text is within the limits.
 */
export function formulaLimitProblem(text: string): FormulaProblem | null {
  const problem = yamlLimitProblem(text);
  return problem ? limitFormulaProblem(problem, 'formula.yaml') : null;
}
