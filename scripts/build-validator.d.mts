/** A schema (path from the repository root) and the path of the validator module made from it. */
export interface Validator {
  readonly schema: string;
  readonly file: string;
}
/** Each schema and its generated validator; the formula schema first. */
export declare const VALIDATORS: readonly Validator[];
/** Path of the generated formula validator module. */
export declare const VALIDATOR_FILE: string;
/** The generated validator source for a schema as it is now (the formula schema by default). */
export declare function validatorSource(validator?: Validator): string;
