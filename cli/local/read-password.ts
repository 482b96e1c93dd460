import { createInterface } from 'node:readline';
import { CliError, EXIT } from '../cli-error.ts';

/** Reads one line from standard input without echoing it when it is a terminal. */
function readLine(prompt: string): Promise<string> {
  return new Promise((resolve) => {
    const input = process.stdin;
    const rl = createInterface({ input, output: process.stderr, terminal: input.isTTY });
    if (input.isTTY) {
      // Echo nothing while the password is typed.
      const write = (rl as unknown as { _writeToOutput: (s: string) => void })._writeToOutput;
      (rl as unknown as { _writeToOutput: (s: string) => void })._writeToOutput = (s: string) => {
        if (s.includes(prompt)) write.call(rl, prompt);
      };
      process.stderr.write(prompt);
    }
    rl.once('line', (line) => {
      rl.close();
      if (input.isTTY) process.stderr.write('\n');
      resolve(line);
    });
    rl.once('close', () => resolve(''));
  });
}

/**
 * A new password: from $LARDER_NEW_PASSWORD, else typed twice at a terminal, else the first line
 * of standard input (for scripts).
 */
export async function readNewPassword(minLength: number): Promise<string> {
  const fromEnv = process.env.LARDER_NEW_PASSWORD;
  let password = fromEnv ?? (await readLine('New password: '));
  if (fromEnv === undefined && process.stdin.isTTY && password !== (await readLine('Again: '))) {
    throw new CliError('the two passwords differ', EXIT.usage);
  }
  password = password.trim();
  if (password.length < minLength)
    throw new CliError(`the password needs at least ${minLength} characters`, EXIT.usage);
  return password;
}
