import type { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * One busy route answered without walking the router: for exactly this method and URL (no
 * query, no trailing slash, as sent), the handlers run in turn as the router would run them —
 * each one's next runs the following one, and an error, passed, thrown or rejected, leaves for
 * the app's error handler. Any other request goes on to the router unchanged, and so does this
 * route asked in any other spelling, so both ways must be given the same handlers in the same
 * order (app.ts builds them from one list). The router's walk (some forty layers, each matched
 * against the path, and the mount points' bookkeeping) was about a sixth of what a kept
 * calculation allocated.
 *
 * The last handler must answer: one that passes the request on leaves with an error.
 */
export function directRoute(
  method: string,
  url: string,
  handlers: readonly RequestHandler[],
): RequestHandler {
  return (req: Request, res: Response, leave: NextFunction) => {
    if (req.method !== method || req.url !== url) return leave();
    let at = 0;
    const step = (error?: unknown): void => {
      if (error) return leave(error);
      const handler = handlers[at++];
      if (!handler) return leave(new Error(`${method} ${url}: no handler answered`));
      try {
        const done: unknown = handler(req, res, step);
        // As the router does with a handler's promise: a rejection is the request's error.
        if (done instanceof Promise)
          done.catch((reason: unknown) => step(reason ?? new Error('Rejected promise')));
      } catch (thrown) {
        step(thrown);
      }
    };
    step();
  };
}
