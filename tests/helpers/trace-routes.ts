import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';
import { insertSmokehouseLots } from './trace-fixture.ts';

const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];

/** The drawn kitchen's lots (tests/helpers/trace-fixture.ts), put in once per server. */
const stocked = new WeakMap<Fixture['server'], Promise<unknown>>();

function route(method: string, template: string, path: string): RouteCase {
  return {
    method,
    route: template,
    allowed: ALL,
    prepare: async (fx: Fixture): Promise<PreparedCall> => {
      if (!stocked.has(fx.server))
        stocked.set(fx.server, insertSmokehouseLots(fx.server.context.db));
      await stocked.get(fx.server);
      return { method, path };
    },
  };
}

/** The trace and recall routes (server/trace/trace-router.ts): every signed-in role reads them. */
export const TRACE_ROUTES: readonly RouteCase[] = [
  route('GET', '/api/trace/back/:lot', '/api/trace/back/201206-BA-01'),
  route('GET', '/api/trace/forward/:lot', '/api/trace/forward/R201201-91'),
  route('GET', '/api/trace/forward', '/api/trace/forward?supplierLot=HF-4471'),
  route('GET', '/api/trace/recall', '/api/trace/recall?supplierLot=HF-4471&supplier=Hollin%20Farm'),
  route('GET', '/api/trace/recall.pdf', '/api/trace/recall.pdf?lot=201201-SB-01'),
  route('GET', '/api/trace/recall.csv', '/api/trace/recall.csv?supplierLot=TR-301'),
];
