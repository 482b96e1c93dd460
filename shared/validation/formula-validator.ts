import { Ajv2020, type ErrorObject } from 'ajv/dist/2020.js';
import formulaSchema from '../schema/formula.schema.json' with { type: 'json' };

// One ajv instance for the process; the schema is compiled once, when this module loads.
const ajv = new Ajv2020({
  allErrors: true,
  verbose: true,
  strict: true,
  strictRequired: false,
  allowUnionTypes: true,
});
const validate = ajv.compile(formulaSchema);

/** The formula JSON Schema (draft 2020-12), as formula files point at it. */
export const FORMULA_SCHEMA = formulaSchema;

/** Validates a parsed formula against the schema; returns ajv's errors, empty when valid. */
export function schemaErrors(value: unknown): ErrorObject[] {
  return validate(value) ? [] : [...(validate.errors ?? [])];
}
