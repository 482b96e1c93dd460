import assert from 'node:assert/strict';
import { createServer, request, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { describe, it } from 'node:test';
import { ABANDONED_MS, closeGracefully, trackRequests } from './graceful-close.ts';

/** A server whose one handler answers only when `release()` is called, and says when it ended. */
async function slowServer(tracked: boolean) {
  let release!: () => void;
  const held = new Promise<void>((resolve) => (release = resolve));
  let handlerEnded = false;
  let reached!: () => void;
  const arrived = new Promise<void>((resolve) => (reached = resolve));
  const server: Server = createServer((_req, res) => {
    reached();
    void held.then(() => {
      handlerEnded = true;
      res.end('late');
    });
  });
  if (tracked) trackRequests(server);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  // The client goes away mid-request, as autocannon does when its run ends.
  const client = request({ port, host: '127.0.0.1', method: 'POST' });
  client.on('error', () => {});
  client.end('{}');
  await arrived;
  client.destroy();
  return { server, release, ended: () => handlerEnded };
}

describe('closing a server gracefully', () => {
  it('waits for the handler of a request whose client went away', async () => {
    const { server, release, ended } = await slowServer(true);
    let closed = false;
    const closing = closeGracefully(server, 5_000).then(() => (closed = true));
    await new Promise((resolve) => setTimeout(resolve, 300));
    assert.equal(closed, false, 'closed while a handler was still at work');
    release();
    await closing;
    assert.equal(ended(), true);
  });

  it('without tracking, the close ends with the last connection (why trackRequests exists)', async () => {
    const { server, release, ended } = await slowServer(false);
    await closeGracefully(server, 5_000);
    assert.equal(ended(), false);
    release();
  });

  it('counts a request whose client went away for ABANDONED_MS at most when its handler never ends the answer', async () => {
    const { server, release } = await slowServer(true);
    const started = Date.now();
    await closeGracefully(server, 10_000);
    const waited = Date.now() - started;
    assert.ok(waited < ABANDONED_MS + 1_000, `waited ${waited} ms`);
    release();
  });

  it('gives up waiting at the grace period', async () => {
    const { server, release } = await slowServer(true);
    const started = Date.now();
    await closeGracefully(server, 400);
    assert.ok(Date.now() - started < ABANDONED_MS);
    release();
  });

  it('counts nothing for an answer ended at once', async () => {
    const server = createServer((_req, res) => res.end('ok'));
    trackRequests(server);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    const response = await fetch(`http://127.0.0.1:${port}/`);
    assert.equal(await response.text(), 'ok');
    const started = Date.now();
    await closeGracefully(server, 5_000);
    assert.ok(Date.now() - started < 1_000, 'waited for an answer already sent');
  });
});
