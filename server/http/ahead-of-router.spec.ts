import assert from 'node:assert/strict';
import type { AddressInfo } from 'node:net';
import { after, before, describe, it } from 'node:test';
import express, { type ErrorRequestHandler } from 'express';
import { answerAheadOfRouter } from './ahead-of-router.ts';

describe('a route answered ahead of the router', () => {
  const routed: string[] = [];
  let url = '';
  let close: () => void = () => undefined;

  before(async () => {
    const app = express();
    app.set('query parser', 'simple');
    // Every request the router sees leaves a mark.
    app.use((req, _res, next) => {
      routed.push(`${req.method} ${req.url}`);
      next();
    });
    const handlers = [
      express.json(),
      (req: express.Request, res: express.Response, next: express.NextFunction) => {
        const { fail } = req.body as { fail?: string };
        if (fail === 'thrown') throw new Error('refused');
        if (fail === 'after-answer') {
          res.writeHead(200, { 'content-type': 'application/json' });
          res.write('{"partial":');
          return next(new Error('broke mid-answer'));
        }
        next();
      },
      // Express's own request and response methods: the prototypes were set.
      (req: express.Request, res: express.Response) =>
        void res.status(200).json({ ok: true, path: req.path, from: req.get('x-from') ?? null }),
    ];
    const onError: ErrorRequestHandler = (error: Error, _req, res, next) => {
      if (res.headersSent) return next(error);
      res.status(418).json({ error: error.message });
    };
    answerAheadOfRouter(app, 'POST', '/calc', handlers, onError);
    app.post('/calc', (_req, res) => void res.json({ routed: true }));
    app.use(onError);
    const server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    close = () => server.close();
  });
  after(() => close());

  const post = (path: string, body: unknown) =>
    fetch(url + path, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-from': 'test' },
      body: JSON.stringify(body),
    });

  it('should answer its own method and URL without entering the router', async () => {
    routed.length = 0;
    const answer = await post('/calc', {});
    assert.equal(answer.status, 200);
    assert.deepEqual(await answer.json(), { ok: true, path: '/calc', from: 'test' });
    assert.deepEqual(routed, []);
  });

  it('should leave any other spelling to the router', async () => {
    routed.length = 0;
    for (const path of ['/calc/', '/calc?x=1']) {
      const answer = await post(path, {});
      assert.deepEqual(await answer.json(), { routed: true }, path);
    }
    assert.deepEqual(routed, ['POST /calc/', 'POST /calc?x=1']);
  });

  it("should hand an error to the app's error handler", async () => {
    const answer = await post('/calc', { fail: 'thrown' });
    assert.equal(answer.status, 418);
    assert.deepEqual(await answer.json(), { error: 'refused' });
  });

  it('should end the connection when an error comes after the answer began', async (t) => {
    // The error is logged, as Express logs it; not in the test's output.
    t.mock.method(console, 'error', () => undefined);
    await assert.rejects(async () => {
      const answer = await post('/calc', { fail: 'after-answer' });
      await answer.text();
    });
  });
});
