import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import type { PresentedPlan } from '../../shared/index.ts';
import { failureOfStatus } from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { credentialsFor } from './credentials.ts';
import type { BatchToRecord, PlanToRecord, RecordKeeper } from './record-keeper.ts';
import { cliErrorOf, type PersonVerb } from './records-failure.ts';

interface ErrorBody {
  error?: { code?: string; message?: string; details?: unknown[] };
}

/**
 * The records of a Larderbook server, through its API, signed in with HTTP Basic as
 * $LARDER_USER. The server plans, calculates and dates batches by its own today.
 */
export class ServerRecords implements RecordKeeper {
  constructor(readonly server: string) {}

  async recordBatch({ formula, batch, units, status, notes }: BatchToRecord): Promise<Batch> {
    const request = {
      formula,
      batch,
      units,
      ...(status ? { status } : {}),
      ...(notes ? { notes } : {}),
    };
    return (await this.call<{ batch: Batch }>('record', 'POST', '/api/batches', request)).batch;
  }

  recordPlan(request: PlanToRecord): Promise<{ plan: PresentedPlan; batches: Batch[] }> {
    const { assembly, count, serviceDate, units } = request;
    return this.call('record', 'POST', '/api/plans/record', {
      assembly,
      count,
      for: serviceDate,
      units,
    });
  }

  listBatches(query: Record<string, string>): Promise<BatchPage> {
    return this.call('list', 'GET', `/api/batches?${new URLSearchParams(query)}`);
  }

  async showBatch(lot: string): Promise<Batch> {
    const route = `/api/batches/${encodeURIComponent(lot)}`;
    return (await this.call<{ batch: Batch }>('show', 'GET', route)).batch;
  }

  /**
   * Calls the API and returns the JSON body; a refusal becomes the verb's error with the
   * server's own words, as the same failure on this machine would.
   */
  private async call<T>(
    verb: PersonVerb,
    method: string,
    route: string,
    body?: unknown,
  ): Promise<T> {
    const { username, password } = credentialsFor(verb, this.server);
    let response: Response;
    try {
      response = await fetch(new URL(route, this.server), {
        method,
        headers: {
          authorization: `Basic ${Buffer.from(`${username}:${password}`, 'utf8').toString('base64')}`,
          // The server takes a password-signed change only from a client that names itself.
          'x-larder-client': 'larder',
          ...(body === undefined ? {} : { 'content-type': 'application/json' }),
        },
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      });
    } catch (error) {
      throw new CliError(
        `cannot reach the server at ${this.server}: ${(error as Error).message}`,
        EXIT.internal,
      );
    }
    const text = await response.text();
    let json: unknown;
    try {
      json = text ? JSON.parse(text) : undefined;
    } catch {
      throw new CliError(
        `the server at ${this.server} did not answer with JSON (HTTP ${response.status})`,
        EXIT.internal,
      );
    }
    if (response.ok) return json as T;
    const error = (json as ErrorBody | undefined)?.error;
    const message = error?.message ?? `HTTP ${response.status}`;
    if (response.status >= 500) throw new CliError(`the server failed: ${message}`, EXIT.internal);
    throw cliErrorOf(
      {
        // A refusal outside record keeping's own (a wrong password, too many tries) is bad input.
        kind: failureOfStatus(response.status) ?? 'bad-input',
        code: error?.code ?? '',
        message,
        details: error?.details ?? [],
      },
      verb,
    );
  }
}
