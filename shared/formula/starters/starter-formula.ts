import type { CureMethod, FormulaKind } from '../formula-types.ts';
import { assemblyStarter, type LibraryEntry } from './assembly-starter.ts';
import { CURE_STARTERS } from './cure-starters.ts';
import { KIND_STARTERS } from './kind-starters.ts';

/**
 * The schema as a formula in the library folder (formulas/, beside shared/) finds it: what
 * `larder new --out formulas/ID.yaml` writes in the repository, and what the console writes.
 */
export const LIBRARY_SCHEMA_PATH = '../shared/schema/formula.schema.json';

/** What a starter is filled in with. */
export interface StarterOptions {
  /** The formula id, already checked against the id pattern. */
  readonly id: string;
  readonly title: string;
  /** Cure only: which cure starter (dry when not given). */
  readonly method?: CureMethod;
  /** The schema file for the editor hint on the first line, as seen from the formula's file. */
  readonly schemaPath: string;
  /** Assembly only: the formulas its parts may name (see starterParts). */
  readonly library?: readonly LibraryEntry[];
}

/**
 * A commented starter formula of a kind, ready to edit and pass `larder check`: the one source
 * of `larder new` and the console's new-formula dialog.
 */
export function starterFormula(kind: FormulaKind, options: StarterOptions): string {
  const body =
    kind === 'cure'
      ? CURE_STARTERS[options.method ?? 'dry']
      : kind === 'assembly'
        ? assemblyStarter(options.library ?? [])
        : KIND_STARTERS[kind];
  // JSON quoting is valid YAML and keeps a title with a colon or a hash in one piece.
  return `# yaml-language-server: $schema=${options.schemaPath}
formula: 1                 # file format version
id: ${options.id}
title: ${JSON.stringify(options.title)}
${body}`;
}
