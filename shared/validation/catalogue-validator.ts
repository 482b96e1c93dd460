import type { ErrorObject } from 'ajv/dist/2020.js';
import catalogueSchema from '../schema/catalogue.schema.json' with { type: 'json' };
import validate from './catalogue-validate.generated.js';

// Compiled ahead of time by scripts/build-validator.mjs, like the formula schema.

/** The catalogue JSON Schema (draft 2020-12). */
export const CATALOGUE_SCHEMA = catalogueSchema;

/** Validates a parsed catalogue against its schema; returns ajv's errors, empty when valid. */
export function catalogueSchemaErrors(value: unknown): ErrorObject[] {
  return validate(value) ? [] : [...(validate.errors ?? [])];
}
