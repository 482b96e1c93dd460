import { CommanderError } from 'commander';
import { CliError, EXIT } from './cli-error.ts';
import { PROCESS_IO, type Io } from './io.ts';
import { createProgram } from './program.ts';

/**
 * Runs larder with the given arguments and returns the exit code. Every failure ends here as a
 * message (JSON with --json) and an exit code; a stack trace is printed only for a real bug.
 */
export async function run(argv: readonly string[], io: Io = PROCESS_IO): Promise<number> {
  const json = argv.includes('--json');
  try {
    await createProgram(io).parseAsync([...argv], { from: 'user' });
    return typeof process.exitCode === 'number' ? process.exitCode : EXIT.ok;
  } catch (error) {
    if (error instanceof CommanderError) {
      // --help and --version end this way too, with code 0; commander has already printed.
      if (error.exitCode === 0) return EXIT.ok;
      if (json)
        io.out(
          `${JSON.stringify({ error: { message: error.message.replace(/^error: /, ''), exitCode: EXIT.usage, details: [] } }, null, 2)}\n`,
        );
      return EXIT.usage;
    }
    if (error instanceof CliError) {
      if (json)
        io.out(
          `${JSON.stringify({ error: { message: error.message, exitCode: error.exitCode, details: error.details } }, null, 2)}\n`,
        );
      else io.err(`larder: ${error.message}\n${error.details.map((line) => `${line}\n`).join('')}`);
      return error.exitCode;
    }
    io.err(
      `larder: unexpected error, please report it:\n${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
    );
    return EXIT.internal;
  }
}

// A reader that stops early (`larder calc … | head`) closes the pipe: that is not an error.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

process.exitCode = await run(process.argv.slice(2));
