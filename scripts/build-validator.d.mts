/** Path of the generated validator module. */
export declare const VALIDATOR_FILE: string;
/** The generated validator source for the schema as it is now. */
export declare function validatorSource(): string;
