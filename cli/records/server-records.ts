import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import type { HaccpReport } from '../../shared/api/haccp-report.ts';
import type { ReadingAnswer, ReadingRequest } from '../../shared/api/process-record.ts';
import type { PlanWithStock } from '../../shared/api/plan-record.ts';
import type { RecallReport, TraceAnswer, TraceSearch } from '../../shared/api/trace-record.ts';
import type { Receipt, ReceiptRequest, StockView } from '../../shared/api/receipt.ts';
import type { PresentedPlan } from '../../shared/index.ts';
import { failureOfStatus } from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { credentialsFor } from './credentials.ts';
import type {
  BatchToRecord,
  PlanToRecord,
  RecallOutput,
  RecordKeeper,
  ReportOutput,
  ReportPeriodOptions,
  TracedBothWays,
  UploadedReadings,
} from './record-keeper.ts';
import { cliErrorOf, type PersonVerb } from './records-failure.ts';

/** A body sent as it is, with its content type (a logger's CSV), not as JSON. */
class TextBody {
  constructor(
    readonly type: string,
    readonly text: string,
  ) {}
}

interface ErrorBody {
  error?: { code?: string; message?: string; details?: unknown[] };
}

/**
 * The records of a Larderbook server, through its API, signed in with HTTP Basic as
 * $LARDER_USER. The server plans, calculates and dates batches by its own today.
 */
export class ServerRecords implements RecordKeeper {
  /** @param site the key of the site to work at, sent as X-Larder-Site; none: the server's default */
  constructor(
    readonly server: string,
    private readonly site?: string,
  ) {}

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
    const { assembly, count, serviceDate, units, again } = request;
    return this.call('record', 'POST', '/api/plans/record', {
      assembly,
      count,
      for: serviceDate,
      units,
      ...(again ? { again: true } : {}),
    });
  }

  /** The plan as the server makes it, with its pull list against the server's lots on hand. */
  planStock(request: PlanToRecord): Promise<PlanWithStock> {
    const { assembly, count, serviceDate, units } = request;
    const query = new URLSearchParams({ assembly, count: String(count), for: serviceDate, units });
    return this.call('list', 'GET', `/api/plans/pull-list?${query}`);
  }

  listBatches(query: Record<string, string>): Promise<BatchPage> {
    return this.call('list', 'GET', `/api/batches?${new URLSearchParams(query)}`);
  }

  async showBatch(lot: string): Promise<Batch> {
    const route = `/api/batches/${encodeURIComponent(lot)}`;
    return (await this.call<{ batch: Batch }>('show', 'GET', route)).batch;
  }

  addReading(lot: string, request: ReadingRequest): Promise<ReadingAnswer> {
    const route = `/api/batches/${encodeURIComponent(lot)}/readings`;
    return this.call('reading', 'POST', route, request);
  }

  uploadReadings(lot: string, control: string, text: string): Promise<UploadedReadings> {
    const route = `/api/batches/${encodeURIComponent(lot)}/readings/upload?${new URLSearchParams({ control })}`;
    return this.call('reading', 'POST', route, new TextBody('text/csv', text));
  }

  async receive(request: ReceiptRequest): Promise<Receipt> {
    return (await this.call<{ receipt: Receipt }>('receive', 'POST', '/api/receipts', request))
      .receipt;
  }

  stock(): Promise<StockView> {
    return this.call('stock', 'GET', '/api/stock');
  }

  async report(format: ReportOutput['format'], period: ReportPeriodOptions): Promise<ReportOutput> {
    const query = new URLSearchParams(
      Object.entries(period).filter((entry): entry is [string, string] => entry[1] !== undefined),
    );
    const route = `/api/reports/${format === 'json' ? 'haccp' : `haccp.${format}`}?${query}`;
    const response = await this.send('report', 'GET', route);
    if (!response.ok) return this.refused(response, 'report');
    if (format === 'json') return { format, body: (await response.json()) as HaccpReport };
    if (format === 'csv') return { format, body: await response.text() };
    return { format, body: new Uint8Array(await response.arrayBuffer()) };
  }

  async trace(lot: string): Promise<TracedBothWays> {
    const code = encodeURIComponent(lot);
    return {
      back: await this.call<TraceAnswer>('trace', 'GET', `/api/trace/back/${code}`),
      forward: await this.call<TraceAnswer>('trace', 'GET', `/api/trace/forward/${code}`),
    };
  }

  async recall(format: RecallOutput['format'], search: TraceSearch): Promise<RecallOutput> {
    const query = new URLSearchParams(search as Record<string, string>);
    const route = `/api/trace/${format === 'json' ? 'recall' : `recall.${format}`}?${query}`;
    const response = await this.send('recall', 'GET', route);
    if (!response.ok) return this.refused(response, 'recall');
    if (format === 'json') return { format, body: (await response.json()) as RecallReport };
    if (format === 'csv') return { format, body: await response.text() };
    return { format, body: new Uint8Array(await response.arrayBuffer()) };
  }

  /** Sends a request signed in as $LARDER_USER, with a JSON body or a {@link TextBody}. */
  private async send(
    verb: PersonVerb,
    method: string,
    route: string,
    body?: unknown,
  ): Promise<Response> {
    const { username, password } = credentialsFor(verb, this.server);
    try {
      return await fetch(new URL(route, this.server), {
        method,
        headers: {
          authorization: `Basic ${Buffer.from(`${username}:${password}`, 'utf8').toString('base64')}`,
          // The server takes a password-signed change only from a client that names itself.
          'x-larder-client': 'larder',
          ...(this.site === undefined ? {} : { 'x-larder-site': this.site }),
          ...(body === undefined
            ? {}
            : { 'content-type': body instanceof TextBody ? body.type : 'application/json' }),
        },
        ...(body === undefined
          ? {}
          : { body: body instanceof TextBody ? body.text : JSON.stringify(body) }),
      });
    } catch (error) {
      throw new CliError(
        `cannot reach the server at ${this.server}: ${(error as Error).message}`,
        EXIT.internal,
      );
    }
  }

  /** Calls the API and returns the JSON body; a refusal becomes the verb's error. */
  private async call<T>(
    verb: PersonVerb,
    method: string,
    route: string,
    body?: unknown,
  ): Promise<T> {
    const response = await this.send(verb, method, route, body);
    if (!response.ok) return this.refused(response, verb);
    const text = await response.text();
    try {
      return (text ? JSON.parse(text) : undefined) as T;
    } catch {
      throw this.notJson(response);
    }
  }

  private notJson(response: Response): CliError {
    return new CliError(
      `the server at ${this.server} did not answer with JSON (HTTP ${response.status})`,
      EXIT.internal,
    );
  }

  /**
   * A refusal as the verb's error with the server's own words, as the same failure on this
   * machine would be.
   */
  private async refused(response: Response, verb: PersonVerb): Promise<never> {
    let json: unknown;
    try {
      json = JSON.parse(await response.text());
    } catch {
      if (response.status < 500) throw this.notJson(response);
    }
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
