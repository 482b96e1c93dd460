import http from 'node:http';
import type { Express } from 'express';

/**
 * An HTTP server for an Express app whose requests and responses are made with the app's own
 * prototypes from the start.
 *
 * Express gives each request and response the app's prototypes as it enters the app
 * (`Object.setPrototypeOf`). V8 then gives the object a hidden class of its own, and another for
 * each property added afterwards: Express and our middleware add a dozen to every request, so
 * every request made a dozen hidden classes, which live until a full collection. Made by classes
 * whose prototypes are the app's, the objects already have them, Express's change is no change,
 * and all requests share their hidden classes.
 */
export function appServer(app: Express): http.Server {
  class AppRequest extends http.IncomingMessage {}
  class AppResponse extends http.ServerResponse {}
  // Each class's prototype takes the place of the app's, with the app's above it: everything
  // Express and the app put there is found as before.
  Object.setPrototypeOf(AppRequest.prototype, app.request);
  Object.setPrototypeOf(AppResponse.prototype, app.response);
  app.request = AppRequest.prototype as Express['request'];
  app.response = AppResponse.prototype as unknown as Express['response'];
  return http.createServer({ IncomingMessage: AppRequest, ServerResponse: AppResponse }, app);
}
