import type { ErrorObject } from 'ajv/dist/2020.js';
import formulaSchema from '../schema/formula.schema.json' with { type: 'json' };
import validate from './formula-validate.generated.js';

// The schema is compiled ahead of time by scripts/build-validator.mjs (ajv standalone code), so
// nothing compiles it at run time; a spec keeps the generated code in step with the schema.

/** The formula JSON Schema (draft 2020-12), as formula files point at it. */
export const FORMULA_SCHEMA = formulaSchema;

/** Validates a parsed formula against the schema; returns ajv's errors, empty when valid. */
export function schemaErrors(value: unknown): ErrorObject[] {
  return validate(value) ? [] : [...(validate.errors ?? [])];
}
