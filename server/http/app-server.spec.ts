import assert from 'node:assert/strict';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { setFlagsFromString } from 'node:v8';
import { after, before, describe, it } from 'node:test';
import express from 'express';
import { appServer } from './app-server.ts';

// V8's own test of hidden classes, %HaveSameMap, is syntax only with this flag; the function is
// compiled after it is set.
setFlagsFromString('--allow-natives-syntax');
const sameHiddenClass = new Function('a', 'b', 'return %HaveSameMap(a, b)') as (
  a: object,
  b: object,
) => boolean;

describe('the app server', () => {
  let url = '';
  let close: () => void = () => undefined;
  /** Each request as the server made it, before Express saw it: whether it had the app's prototypes. */
  const madeWithAppPrototypes: boolean[] = [];
  /** Each request as its handler leaves it, after everything Express and the route added. */
  const handled: express.Request[] = [];

  before(async () => {
    const app = express();
    app.post('/echo', express.json(), (req, res) => {
      (req as express.Request & { mark?: string }).mark = 'added by the route';
      handled.push(req);
      // Express's own request and response methods and getters, through the app's prototypes.
      res.status(201).json({
        query: req.query,
        header: req.get('x-from') ?? null,
        path: req.path,
        sameApp: req.app === app,
        body: req.body as unknown,
      });
    });
    const server = appServer(app);
    // Ahead of the app's own listener: the request as the server made it.
    server.prependListener('request', (req: IncomingMessage, res: ServerResponse) => {
      madeWithAppPrototypes.push(
        Object.getPrototypeOf(req) === app.request && Object.getPrototypeOf(res) === app.response,
      );
    });
    server.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    close = () => server.close();
  });
  after(() => close());

  const echo = (n: number) =>
    fetch(`${url}/echo?n=${n}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-from': 'test' },
      body: JSON.stringify({ n }),
    });

  it('should answer through Express as an ordinary app does', async () => {
    const response = await echo(1);
    assert.equal(response.status, 201);
    assert.deepEqual(await response.json(), {
      query: { n: '1' },
      header: 'test',
      path: '/echo',
      sameApp: true,
      body: { n: 1 },
    });
  });

  it('should make requests and responses with the app’s prototypes, so Express changes none', async () => {
    await echo(2);
    assert.ok(madeWithAppPrototypes.length > 0);
    assert.ok(madeWithAppPrototypes.every(Boolean));
  });

  it('should give every request the same hidden class, whatever Express and the route added', async () => {
    for (let n = 0; n < 5; n++) await (await echo(n)).text();
    const [first, ...rest] = handled.slice(-5);
    // With the prototypes set by Express as it enters the app, each of these is false.
    for (const request of rest) assert.ok(sameHiddenClass(first, request));
  });
});
