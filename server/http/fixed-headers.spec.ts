import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Request, RequestHandler, Response } from 'express';
import helmet from 'helmet';
import { fixedHeaders } from './fixed-headers.ts';

/** Runs a middleware on a response that keeps its headers; returns them and whether it went on. */
function headersOf(middleware: RequestHandler): { headers: Map<string, unknown>; next: boolean } {
  const headers = new Map<string, unknown>([['x-powered-by', 'Express']]);
  const res = {
    setHeader: (name: string, value: unknown) => headers.set(name.toLowerCase(), value),
    removeHeader: (name: string) => headers.delete(name.toLowerCase()),
  };
  let next = false;
  void middleware({} as Request, res as unknown as Response, () => {
    next = true;
  });
  return { headers, next };
}

describe('headers worked out once', () => {
  it("should set and remove exactly helmet's own headers, on every response", () => {
    const policy = helmet({ contentSecurityPolicy: { directives: { defaultSrc: ["'self'"] } } });
    const fixed = fixedHeaders(policy);
    const expected = headersOf(policy);
    assert.ok(expected.headers.has('content-security-policy'));
    assert.equal(expected.headers.has('x-powered-by'), false);
    for (let i = 0; i < 2; i++) assert.deepEqual(headersOf(fixed), expected);
  });

  it('should refuse at start a middleware that does not pass the request on', () => {
    assert.throws(() => fixedHeaders((_req, res) => void res.setHeader('a', 'b')), /pass/);
    assert.throws(() => fixedHeaders((_req, _res, next) => next(new Error('no'))), /no/);
  });
});
