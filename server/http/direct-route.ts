import type { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * One busy route's handlers run in turn without a router: for exactly this method and URL (no
 * query, no trailing slash, as sent), each handler's next runs the following one, as the router
 * would run them, and an error, passed, thrown or rejected, leaves for the app's error handler.
 * Any other request leaves at once, with no error, and so does this route asked in any other
 * spelling, which the router answers: both ways must be given the same handlers in the same order
 * (app.ts builds them from one list). ahead-of-router.ts runs it before Express's own entry.
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
