import { CliError, EXIT } from '../cli-error.ts';

/** A Larderbook server to talk to, with HTTP Basic credentials from the environment. */
export interface ServerTarget {
  readonly url: string;
}

function credentials(): string {
  const username = process.env.LARDER_USER;
  const password = process.env.LARDER_PASSWORD;
  if (!username || !password)
    throw new CliError('set LARDER_USER and LARDER_PASSWORD to sign in to the server', EXIT.usage);
  return `Basic ${Buffer.from(`${username}:${password}`, 'utf8').toString('base64')}`;
}

interface ErrorBody {
  error?: { code?: string; message?: string; details?: unknown[] };
}

/**
 * Calls the server's API and returns the JSON body; every failure becomes a CliError with the
 * server's own message (a refused batch exits 4, like a local one).
 */
export async function callServer<T>(
  target: ServerTarget,
  method: string,
  route: string,
  body?: unknown,
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(new URL(route, target.url), {
      method,
      headers: {
        authorization: credentials(),
        // The server takes a password-signed change only from a client that names itself.
        'x-larder-client': 'larder',
        ...(body === undefined ? {} : { 'content-type': 'application/json' }),
      },
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    });
  } catch (error) {
    throw new CliError(
      `cannot reach the server at ${target.url}: ${(error as Error).message}`,
      EXIT.internal,
    );
  }
  const text = await response.text();
  let json: unknown;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    throw new CliError(
      `the server at ${target.url} did not answer with JSON (HTTP ${response.status})`,
      EXIT.internal,
    );
  }
  if (response.ok) return json as T;
  const error = (json as ErrorBody | undefined)?.error;
  const message = error?.message ?? `HTTP ${response.status}`;
  if (error?.code === 'critical-limit') throw new CliError(message, EXIT.critical);
  if (response.status === 404 || error?.code === 'invalid-formula')
    throw new CliError(message, EXIT.formula);
  if (response.status >= 500) throw new CliError(`the server failed: ${message}`, EXIT.internal);
  throw new CliError(message, EXIT.usage);
}
