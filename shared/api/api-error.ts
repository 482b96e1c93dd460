/** The API's error envelope: every failure answers `{ error: { code, message, details } }`. */
export interface ApiErrorBody {
  readonly error: {
    /** Stable, for programs: 'critical-limit', 'bad-batch', 'not-found'… */
    readonly code: string;
    /** In plain words, for people. */
    readonly message: string;
    readonly details?: readonly unknown[];
  };
}
