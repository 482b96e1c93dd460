import type { Server } from 'node:http';

/** How long requests in flight may take to finish after a stop signal before they are cut off. */
export const GRACE_MS = 10_000;
/** How often idle keep-alive connections are closed while the server drains. */
const IDLE_SWEEP_MS = 50;

/**
 * Stops accepting connections and resolves once every request in flight has been answered:
 * keep-alive connections are closed as soon as they are idle (a client's next request on one
 * then goes to a new connection, refused or served by another process); past `graceMs` the
 * rest are cut off.
 */
export function closeGracefully(server: Server, graceMs = GRACE_MS): Promise<void> {
  return new Promise<void>((resolve) => {
    const sweep = setInterval(() => server.closeIdleConnections(), IDLE_SWEEP_MS);
    const cutOff = setTimeout(() => server.closeAllConnections(), graceMs);
    server.close(() => {
      clearInterval(sweep);
      clearTimeout(cutOff);
      resolve();
    });
    server.closeIdleConnections();
  });
}
