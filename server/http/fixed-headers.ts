import type { NextFunction, Request, RequestHandler, Response } from 'express';

/** A header a middleware set or removed. */
type HeaderStep = readonly [name: string, value: string | number | readonly string[] | null];

/**
 * A middleware that sets the same headers as `headersOnly`, worked out once: for a middleware
 * whose headers never depend on the request (helmet's, with no per-response nonce), each
 * request then pays for its headers alone, not for running a dozen small middlewares that
 * compute them again. Throws at start when the middleware does anything but set or remove
 * headers synchronously, or passes an error on.
 */
export function fixedHeaders(headersOnly: RequestHandler): RequestHandler {
  const steps: HeaderStep[] = [];
  let passedOn = false;
  const recorder = {
    setHeader(name: string, value: string | number | readonly string[]) {
      steps.push([name, value]);
      return recorder;
    },
    removeHeader(name: string) {
      steps.push([name, null]);
    },
  };
  void headersOnly(
    {} as Request,
    recorder as unknown as Response,
    ((error?: unknown) => {
      if (error) throw error instanceof Error ? error : new Error(String(error));
      passedOn = true;
    }) as NextFunction,
  );
  if (!passedOn) throw new Error('fixedHeaders: the middleware did not pass the request on');
  return (_req, res, next) => {
    for (const [name, value] of steps) {
      if (value === null) res.removeHeader(name);
      else res.setHeader(name, value);
    }
    next();
  };
}
