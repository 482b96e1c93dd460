// Types for the validator that scripts/build-validator.mjs generates from the catalogue schema.
import type { ErrorObject } from 'ajv/dist/2020.js';

/** Validates a parsed catalogue against the schema; sets `errors` when it returns false. */
declare const validate: ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };
export default validate;
