import type { IncomingMessage, Server, ServerResponse } from 'node:http';

/** How long requests in flight may take to finish after a stop signal before they are cut off. */
export const GRACE_MS = 10_000;
/** How often idle keep-alive connections are closed while the server drains. */
const IDLE_SWEEP_MS = 50;
/**
 * How long a request whose client went away still counts as at work if its handler never ends
 * the answer: a file or PDF being streamed stops with its connection and never calls `end()`.
 */
export const ABANDONED_MS = 2_000;

/** Requests a server's handlers are still working on, and who waits for there to be none. */
interface AtWork {
  count: number;
  idle: (() => void)[];
}
const atWork = new WeakMap<Server, AtWork>();

/**
 * Counts the requests the server's handlers are still working on, until each calls `end()` on its
 * answer. A closed connection is not enough: when a client goes away mid-request (a benchmark
 * stopping, a browser tab closed), its handler still runs to the end and may read the database
 * after the server has closed its last connection. closeGracefully waits for these too.
 */
export function trackRequests(server: Server): void {
  const work: AtWork = { count: 0, idle: [] };
  atWork.set(server, work);
  // Added after the app's own listener: an answer the app ended at once is never counted.
  server.on('request', (_req: IncomingMessage, res: ServerResponse) => {
    if (res.writableEnded) return;
    work.count++;
    const end = res.end.bind(res);
    let ended = false;
    const done = (): void => {
      if (ended) return;
      ended = true;
      if (--work.count === 0) for (const resolve of work.idle.splice(0)) resolve();
    };
    res.end = ((...args: Parameters<ServerResponse['end']>) => {
      done();
      return end(...args);
    }) as ServerResponse['end'];
    res.once('close', () => {
      if (!ended) setTimeout(done, ABANDONED_MS).unref();
    });
  });
}

/** Resolves once no tracked request is at work, or after `ms` (a handler may never end). */
function noneAtWork(server: Server, ms: number): Promise<void> {
  const work = atWork.get(server);
  if (!work || work.count === 0) return Promise.resolve();
  return new Promise<void>((resolve) => {
    const timer = setTimeout(resolve, ms);
    work.idle.push(() => {
      clearTimeout(timer);
      resolve();
    });
  });
}

/**
 * Stops accepting connections and resolves once every request in flight has been answered:
 * keep-alive connections are closed as soon as they are idle (a client's next request on one
 * then goes to a new connection, refused or served by another process); past `graceMs` the
 * rest are cut off. With trackRequests, it also waits (within the same grace) for the handlers
 * of requests whose clients went away, so none of them reads a database closed after this.
 */
export function closeGracefully(server: Server, graceMs = GRACE_MS): Promise<void> {
  const deadline = Date.now() + graceMs;
  return new Promise<void>((resolve) => {
    const sweep = setInterval(() => server.closeIdleConnections(), IDLE_SWEEP_MS);
    const cutOff = setTimeout(() => server.closeAllConnections(), graceMs);
    server.close(() => {
      clearInterval(sweep);
      clearTimeout(cutOff);
      resolve(noneAtWork(server, Math.max(0, deadline - Date.now())));
    });
    server.closeIdleConnections();
  });
}
