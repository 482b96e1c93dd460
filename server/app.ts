import express, { type Express } from 'express';
import helmet from 'helmet';
import type { AppContext } from './app-context.ts';
import { auditRouter } from './audit/audit-router.ts';
import { authenticate, useBasicStrategy } from './auth/authenticate.ts';
import { requireScriptWrite } from './auth/basic-writes.ts';
import { requireCsrfToken } from './auth/csrf.ts';
import { sessionMiddleware } from './auth/session.ts';
import { sessionRouter } from './auth/session-router.ts';
import { demoInfo } from './demo/demo-people.ts';
import { SignIns } from './auth/sign-ins.ts';
import { batchesCsv, batchesRouter } from './batches/batches-router.ts';
import { calcHandlers, calcRouter } from './calc/calc-router.ts';
import { equipmentRouter } from './equipment/equipment-router.ts';
import { plansRouter } from './plans/plans-router.ts';
import { blendsRouter } from './costing/blends-router.ts';
import { costsRouter } from './costing/costs-router.ts';
import { loggerText } from './process/logger-body.ts';
import {
  batchProcessRouter,
  deviationsRouter,
  processNowRouter,
  readingsRouter,
} from './process/process-router.ts';
import { formulasRouter } from './formulas/formulas-router.ts';
import { consoleRouter, cspNonce } from './http/console-files.ts';
import { apiNotFound, errorHandler } from './http/error-handler.ts';
import { answerAheadOfRouter } from './http/ahead-of-router.ts';
import { fixedHeaders } from './http/fixed-headers.ts';
import { requireJsonBody } from './http/require-json.ts';
import { refuseCrossSiteWrites } from './http/same-origin.ts';
import { invitationsRouter } from './invitations/invitations-router.ts';
import { outboxRouter } from './mail/outbox-router.ts';
import { peopleRouter } from './people/people-router.ts';
import { remindersRouter } from './reminders/reminders-router.ts';
import { reportsRouter } from './reports/reports-router.ts';
import { startRouter } from './batches/start-router.ts';
import { refusalsRouter } from './process/refusals-router.ts';
import { batchWeighingsRouter, weighingsRouter } from './process/weighings-router.ts';
import { lotUsesRouter } from './lot-uses/lot-uses-router.ts';
import { traceRouter } from './trace/trace-router.ts';
import { receiptsRouter, stockRouter } from './stock/receipts-router.ts';
import { resolveSite } from './sites/resolve-site.ts';
import { recordAtSite } from './sites/site-guards.ts';
import { SiteRepository } from './sites/site-repository.ts';
import { sitesRouter } from './sites/sites-router.ts';

/** Largest JSON body the API reads; a formula is a few kilobytes. */
const JSON_LIMIT = '512kb';

/**
 * Builds the Express application: security headers, sessions, the API routers, the console,
 * a JSON 404 and the one error handler. Never listens; main.ts and the tests do that.
 */
export function createApp(context: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  // Behind a reverse proxy, the client's own address (sign-in limits, audit) and protocol
  // (Secure cookies) come from the proxy's X-Forwarded-* headers, believed only from it.
  app.set('trust proxy', context.config.trustProxy);
  const { httpsOnly } = context.config;
  // API answers (JSON, CSV, PDF) need the policy but no nonce: no random bytes for them, and the
  // same headers on every answer, worked out once.
  const apiHeaders = fixedHeaders(securityHeaders(httpsOnly));
  // First of all: a change another site's page sent is refused before anything reads it.
  const crossSite = refuseCrossSiteWrites(context.config.publicUrl);
  const jsonBody = [express.json({ limit: JSON_LIMIT }), requireJsonBody];
  const session = sessionMiddleware(
    context.db,
    context.config.sessionSecret,
    httpsOnly,
    context.people,
  );
  // No passport.initialize(): passport.authenticate() sets up the request itself, and Basic is
  // the one strategy, so the rest of the API need not pay for it.
  // One limit of sign-in attempts per address, whether by the form or by HTTP Basic.
  const signIns = new SignIns(
    context.people,
    context.config.signInLimit,
    context.audit,
    context.db,
  );
  useBasicStrategy(signIns, context.audit);
  // Everything behind the sign-in routes needs a signed-in person, and a CSRF token for
  // cookie-signed changes or a script's own marks for password-signed ones.
  const signedIn = [authenticate(context.people), requireCsrfToken, requireScriptWrite];
  const sites = new SiteRepository(context.db);
  const atSite = resolveSite(sites);
  const calc = calcHandlers(context);

  // The busiest route is answered ahead of Express's router: the same handlers the router below
  // gives it, in the same order (ahead-of-router.ts). No route of the router's could answer it first.
  answerAheadOfRouter(
    app,
    'POST',
    '/api/calc',
    [apiHeaders, crossSite, ...jsonBody, session, ...signedIn, atSite, ...calc],
    errorHandler,
  );
  app.use('/api', apiHeaders);

  const api = express.Router();
  api.use(crossSite);
  // A data logger's CSV is read as text on its one route, before the JSON parser.
  api.post('/batches/:lot/readings/upload', loggerText);
  api.use(...jsonBody);
  api.use(session);
  api.get('/health', (_req, res) => void res.json({ ok: true }));
  api.use(
    '/session',
    sessionRouter(context.people, context.audit, signIns, demoInfo(context.config), sites),
  );
  // Anyone holding an invitation link; the token is the proof, so no sign-in and no CSRF token.
  api.use('/invitations', invitationsRouter(context));
  api.use(...signedIn);
  // The sites one may choose from, before a site is chosen; then every route works at one site,
  // with the person's role there.
  api.use('/sites', sitesRouter(context, sites));
  api.use(atSite);
  // A record of another site, named in a path, is not found by any route under that path.
  const { db } = context;
  api.use('/batches/:lot', recordAtSite(db, 'batch', 'lot', true));
  api.use('/receipts/:lot', recordAtSite(db, 'receipt', 'lot', true));
  api.use('/equipment/:id', recordAtSite(db, 'equipment', 'id'));
  api.use('/readings/:id', recordAtSite(db, 'reading', 'id'));
  api.use('/weighings/:id', recordAtSite(db, 'weighing', 'id'));
  api.use('/deviations/:id', recordAtSite(db, 'deviation', 'id'));
  api.use('/trace/back/:lot', recordAtSite(db, 'lot', 'lot', true));
  api.use('/trace/forward/:lot', recordAtSite(db, 'lot', 'lot', true));
  api.use('/calc', calcRouter(calc));
  api.use('/plans', plansRouter(context));
  api.use('/formulas', formulasRouter(context));
  api.use('/batches', batchProcessRouter(context), batchesRouter(context));
  api.use('/batches', batchWeighingsRouter(context), startRouter(context));
  api.use('/batches', lotUsesRouter(context));
  api.use('/weighings', weighingsRouter(context));
  api.use('/refusals', refusalsRouter(context));
  api.use('/readings', readingsRouter(context));
  api.use('/deviations', deviationsRouter(context));
  api.use('/process', processNowRouter(context));
  // A mount at /batches does not match /batches.csv, so the export is a route of its own.
  api.get('/batches.csv', batchesCsv(context));
  api.use('/equipment', equipmentRouter(context));
  api.use('/people/me/reminders', remindersRouter(context));
  api.use('/people', peopleRouter(context));
  api.use('/audit', auditRouter(context));
  api.use('/reports', reportsRouter(context));
  api.use('/receipts', receiptsRouter(context));
  api.use('/stock', stockRouter(context));
  api.use('/outbox', outboxRouter(context));
  api.use('/trace', traceRouter(context));
  api.use(costsRouter(context));
  api.use('/blends', blendsRouter(context));
  api.use(apiNotFound);

  app.use('/api', api);
  // Every /api path has been answered above (apiNotFound), so only console pages get a nonce.
  app.use(
    cspNonce,
    securityHeaders(httpsOnly, consoleStyleNonce),
    consoleRouter(context.config.consoleDir),
  );
  app.use(errorHandler);
  return app;
}

/** A console page's own styles carry this response's nonce (see consoleRouter). */
const consoleStyleNonce = (_req: unknown, res: unknown): string =>
  `'nonce-${String((res as express.Response).locals.cspNonce)}'`;

/** How long a browser keeps to https once told (HSTS max-age): a year. common practice, no source */
const HSTS_SECONDS = 365 * 24 * 60 * 60;

/**
 * helmet's headers with one content security policy: nothing from other sites, no framing, no
 * plugins; styles also from a nonce when one is given. HSTS only when the console is served
 * over https in production.
 */
function securityHeaders(
  httpsOnly: boolean,
  styleNonce?: typeof consoleStyleNonce,
): express.RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: styleNonce ? ["'self'", styleNonce] : ["'self'"],
        fontSrc: ["'self'"],
        imgSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        upgradeInsecureRequests: null,
      },
    },
    // Not on plain http (the demo on 127.0.0.1); not for sub-domains, which may be other hosts'.
    strictTransportSecurity: httpsOnly ? { maxAge: HSTS_SECONDS, includeSubDomains: false } : false,
  });
}
