import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { directRoute } from './direct-route.ts';

/** Runs the route on a request of this method and URL; resolves with how it left. */
function run(
  route: RequestHandler,
  method: string,
  url: string,
): Promise<{ left: 'on' | 'error' | 'answered'; error?: unknown; trail: string[] }> {
  const trail: string[] = [];
  return new Promise((resolve) => {
    const req = { method, url, trail } as unknown as Request;
    const res = { answer: () => resolve({ left: 'answered', trail }) } as unknown as Response;
    const leave: NextFunction = (error?: unknown) =>
      resolve(error ? { left: 'error', error, trail } : { left: 'on', trail });
    void route(req, res, leave);
  });
}

const step =
  (name: string): RequestHandler =>
  (req, _res, next) => {
    (req as unknown as { trail: string[] }).trail.push(name);
    next();
  };
const answer: RequestHandler = (_req, res) => (res as unknown as { answer(): void }).answer();

describe('a route answered without the router', () => {
  it('should run its handlers in turn for its own method and URL, and pass others on', async () => {
    const route = directRoute('POST', '/api/calc', [step('a'), step('b'), answer]);
    assert.deepEqual(await run(route, 'POST', '/api/calc'), {
      left: 'answered',
      trail: ['a', 'b'],
    });
    for (const [method, url] of [
      ['GET', '/api/calc'],
      ['POST', '/api/calc/'],
      ['POST', '/api/calc?site=main'],
    ])
      assert.deepEqual(
        await run(route, method, url),
        { left: 'on', trail: [] },
        `${method} ${url}`,
      );
  });

  it('should leave with an error passed, thrown or rejected, running nothing after it', async () => {
    const failure = new Error('refused');
    const ways: Record<string, RequestHandler> = {
      passed: (_req, _res, next) => next(failure),
      thrown: () => {
        throw failure;
      },
      rejected: async () => {
        await Promise.resolve();
        throw failure;
      },
    };
    for (const [way, handler] of Object.entries(ways)) {
      const route = directRoute('POST', '/api/calc', [step('a'), handler, step('after'), answer]);
      const left = await run(route, 'POST', '/api/calc');
      assert.deepEqual(left, { left: 'error', error: failure, trail: ['a'] }, way);
    }
  });

  it('should leave with an error when no handler answers', async () => {
    const left = await run(directRoute('POST', '/api/calc', [step('a')]), 'POST', '/api/calc');
    assert.equal(left.left, 'error');
    assert.match(String(left.error), /no handler answered/);
  });
});
