import {
  parseDocument,
  type Document,
  type DocumentOptions,
  type ParseOptions,
  type SchemaOptions,
} from 'yaml';
import { yamlLimitProblem, type YamlLimitProblem } from './yaml-limits.ts';

/** Formula YAML parsed, or refused unparsed because it is larger or deeper than a formula can be. */
export type GuardedYaml =
  | { readonly ok: true; readonly document: Document.Parsed }
  | { readonly ok: false; readonly problem: YamlLimitProblem };

/**
 * The one way formula YAML is parsed, in the core, the server, the command and the console:
 * the text's size, nesting and node count are checked first (yamlLimitProblem), so a text built
 * to exhaust the parser is refused before the parser builds anything. ESLint forbids importing
 * the yaml package's parsers anywhere else.
 * @param options the yaml package's options for parseDocument
 */
export function parseYamlWithinLimits(
  text: string,
  options: ParseOptions & DocumentOptions & SchemaOptions = {},
): GuardedYaml {
  const problem = yamlLimitProblem(text);
  if (problem) return { ok: false, problem };
  return { ok: true, document: parseDocument(text, options) };
}
