import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import express, { Router, type RequestHandler } from 'express';

/** Gives every response a fresh nonce for the content security policy. */
export const cspNonce: RequestHandler = (_req, res, next) => {
  res.locals.cspNonce = randomBytes(16).toString('base64');
  next();
};

/**
 * Serves the built console: its files, and index.html for every other non-API path (deep
 * links), with this response's nonce written in so Angular's own styles pass the policy.
 */
export function consoleRouter(folder: string): Router {
  const router = Router();
  const indexFile = path.join(folder, 'index.html');
  if (!existsSync(indexFile)) {
    router.get('/{*splat}', (_req, res) => {
      res
        .status(503)
        .type('text/plain')
        .send('The console is not built. Run `npm start` (it builds it) or `npm run build`.');
    });
    return router;
  }
  const index = readFileSync(indexFile, 'utf8');
  router.use(express.static(folder, { index: false, maxAge: '1h' }));
  router.get('/{*splat}', (_req, res) => {
    const nonce = String(res.locals.cspNonce);
    res.type('html').setHeader('Cache-Control', 'no-store');
    res.send(index.replace(/CSP_NONCE/g, nonce));
  });
  return router;
}
