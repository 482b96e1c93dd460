import type { Request } from 'express';

// The methods that only read. source: RFC 9110 §9.2.1 (safe methods; TRACE is not served here)
const READING_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Whether a request asks to change something: every method but the ones that only read. */
export function changesState(req: Request): boolean {
  return !READING_METHODS.has(req.method);
}
