import { before, describe, it } from 'node:test';
import { send, snapshot, suiteServer } from '../helpers/api-calls.ts';
import {
  ROLES,
  ROUTES,
  USER_OF,
  assertCell,
  makeFixture,
  outcomeOf,
  type Fixture,
} from '../helpers/api-routes.ts';

// Who may do what, as the roles were set out: admin — people, formulas, everything; cook — run
// and record batches, read formulas; reviewer — read everything, sign batches off. Anonymous
// callers get 401 everywhere but the session routes and the health check. Every route × role
// is a test of its own, so a failure names both. Each cell prepares what it needs (a fresh
// batch, person or revision), so the cells do not depend on their order.
describe('role matrix over HTTP Basic: every route × anonymous, cook, reviewer, admin', () => {
  const server = suiteServer();
  let fx: Fixture;
  before(async () => {
    fx = await makeFixture(server());
  });

  for (const route of ROUTES) {
    for (const role of ROLES) {
      it(`should answer ${route.method} ${route.route} as ${role} with ${outcomeOf(route, role)}`, async () => {
        const call = await route.prepare(fx, role);
        const sender = call.as ?? (role === 'anonymous' ? 'anonymous' : USER_OF[role]);
        const stored = await snapshot(server());
        const response = await send(server(), sender, call);
        assertCell(route, role, response, { before: stored, after: await snapshot(server()) });
      });
    }
  }
});
