/** The exit codes of the larder command, shown in --help. */
export const EXIT = {
  ok: 0,
  /** Something unexpected went wrong inside larder. */
  internal: 1,
  /** The command line or batch input is wrong (unknown option, bad unit, impossible size). */
  usage: 2,
  /** A formula file is missing, unreadable or invalid. */
  formula: 3,
  /** A critical limit is failed (a ceiling exceeded or a required level not met): refused. */
  critical: 4,
  /** A reading was recorded and missed a critical limit: a deviation is open, the batch on hold. */
  deviation: 5,
} as const;

/** The exit-code table as printed at the end of --help. */
export const EXIT_CODES_HELP = `
Exit codes:
  0  done
  1  unexpected internal error
  2  bad command line or batch input (unknown option, bad unit, impossible size)
  3  formula file missing, unreadable or invalid
  4  critical limit failed (over a ceiling, or short of a required level): the batch is refused
  5  a reading was recorded and missed a critical limit: a deviation is open, the batch on hold`;

/** A failure that ends the command with a message and a given exit code. */
export class CliError extends Error {
  override readonly name = 'CliError';

  constructor(
    message: string,
    readonly exitCode: number,
    /** Extra lines printed after the message (problems in a file). */
    readonly details: readonly string[] = [],
  ) {
    super(message);
  }
}
