import type { Response } from 'express';

/**
 * Answers a request that changes nothing cacheable (a calculation POST) with JSON: the same
 * bytes and Content-Type as res.json, without what res.send adds for answers that may be cached —
 * an ETag (a SHA-1 of the whole answer) and the freshness check against it — which a POST's
 * answer never uses.
 */
export function sendJsonAnswer(res: Response, value: unknown): void {
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(JSON.stringify(value));
}

/** As sendJsonAnswer, for an answer already written as JSON bytes (a kept calculation). */
export function sendJsonBytes(res: Response, json: Buffer): void {
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(json);
}
