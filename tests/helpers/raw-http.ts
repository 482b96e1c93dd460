import http from 'node:http';

/** What came back from a raw request, and how long it took. */
export interface RawResponse {
  readonly status: number;
  readonly headers: http.IncomingHttpHeaders;
  readonly text: string;
  /** The parsed JSON body (undefined when the body is not JSON). */
  readonly json: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
  /** Milliseconds from sending the request to the end of the answer. */
  readonly ms: number;
}

/** One request made with node:http. */
export interface RawCall {
  readonly method?: string;
  readonly path: string;
  /** Header values go out as bytes, one per character (latin1), as node:http sends them. */
  readonly headers?: Readonly<Record<string, string>>;
  readonly body?: unknown;
  /**
   * The address the request comes from (any of 127.0.0.0/8 on Linux), so that one test can be
   * several callers to the server's limits per address.
   */
  readonly from?: string;
  /** Reuses connections across calls, so timings hold no connection set-up. */
  readonly agent?: http.Agent;
}

/**
 * Sends a request with node:http rather than fetch: it may come from another local address, and
 * a header may hold bytes fetch does not send as they are.
 */
export function rawRequest(baseUrl: string, call: RawCall): Promise<RawResponse> {
  const url = new URL(call.path, baseUrl);
  const body = call.body === undefined ? undefined : JSON.stringify(call.body);
  const headers: Record<string, string> = { ...call.headers };
  if (body !== undefined) headers['content-type'] ??= 'application/json';
  const started = performance.now();
  return new Promise((resolve, reject) => {
    const request = http.request(
      {
        host: url.hostname,
        port: url.port,
        path: url.pathname + url.search,
        method: call.method ?? 'GET',
        headers,
        ...(call.from === undefined ? {} : { localAddress: call.from }),
        ...(call.agent === undefined ? {} : { agent: call.agent }),
      },
      (response) => {
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('error', reject);
        response.on('end', () => {
          const text = Buffer.concat(chunks).toString('utf8');
          let json: unknown;
          try {
            json = text ? JSON.parse(text) : undefined;
          } catch {
            json = undefined;
          }
          resolve({
            status: response.statusCode ?? 0,
            headers: response.headers,
            text,
            json,
            ms: performance.now() - started,
          });
        });
      },
    );
    request.on('error', reject);
    request.end(body);
  });
}
