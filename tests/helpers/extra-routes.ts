import assert from 'node:assert/strict';
import { BELLY, send, type Call } from './api-calls.ts';
import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';
import { readOutbox, tokenOf } from './mail.ts';

/** A parsed response body (tests read any shape). */
type Json = Awaited<ReturnType<typeof send>>['json'];

let serial = 0;
/** A name no earlier preparation used. */
const unique = (stem: string): string => `${stem}-x${++serial}`;

async function setupCall(fx: Fixture, call: Call): Promise<Json> {
  const response = await send(fx.server, fx.setup, call);
  assert.ok(response.status < 300, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json;
}

/** A day a month from now: far enough ahead for every hold of the demo burger's parts. */
function serviceDay(): string {
  return new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
}

/** A plan of the demo assembly that can be made. */
const plan = (): PreparedCall['body'] => ({
  assembly: 'smokehouse-burger',
  count: 120,
  for: serviceDay(),
});

/**
 * A new cook with an e-mail address; their invitation goes to the outbox without its link, which
 * the answer shows the admin once.
 */
async function invitedPerson(fx: Fixture): Promise<{ id: number; token: string }> {
  const username = unique('invitee');
  const added = await setupCall(fx, {
    method: 'POST',
    path: '/api/people',
    body: {
      username,
      displayName: 'Invitee',
      role: 'cook',
      email: `${username}@quillmoor.invalid`,
    },
  });
  return { id: added.person.id as number, token: tokenOf(added.invitation.link) };
}

const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];
const ADMIN: readonly Role[] = ['admin'];

function extra(
  method: string,
  route: string,
  allowed: readonly Role[],
  prepare: (fx: Fixture) => Promise<Omit<PreparedCall, 'method'>>,
  anonymous?: number,
): RouteCase {
  return {
    method,
    route,
    allowed,
    ...(anonymous === undefined ? {} : { anonymous }),
    prepare: async (fx) => ({ method, ...(await prepare(fx)) }),
  };
}

/**
 * The routes of plans, sheets, the outbox, invitations and reminders, which the role matrix's
 * ROUTES (api-routes.ts) does not list yet, each with a minimal valid request.
 */
export const EXTRA_ROUTES: readonly RouteCase[] = [
  extra('GET', '/api/plans', ALL, async () => ({ path: '/api/plans' })),
  extra('POST', '/api/plans', ALL, async () => ({ path: '/api/plans', body: plan() })),
  extra('POST', '/api/plans/sheet.pdf', ALL, async () => ({
    path: '/api/plans/sheet.pdf',
    body: plan(),
  })),
  extra('POST', '/api/plans/record', ['cook', 'admin'], async () => ({
    path: '/api/plans/record',
    body: plan(),
  })),
  extra('GET', '/api/batches/:lot/sheet.pdf', ALL, async (fx) => {
    const recorded = await setupCall(fx, { method: 'POST', path: '/api/batches', body: BELLY });
    return { path: `/api/batches/${recorded.batch.lotCode}/sheet.pdf` };
  }),
  extra('GET', '/api/batches/:lot/label.pdf', ALL, async (fx) => {
    const recorded = await setupCall(fx, { method: 'POST', path: '/api/batches', body: BELLY });
    return { path: `/api/batches/${recorded.batch.lotCode}/label.pdf?size=4x6&net=340%20g` };
  }),
  extra('GET', '/api/batches/:lot/label', ALL, async (fx) => {
    const recorded = await setupCall(fx, { method: 'POST', path: '/api/batches', body: BELLY });
    return { path: `/api/batches/${recorded.batch.lotCode}/label` };
  }),
  extra('GET', '/api/people/me/reminders', ALL, async () => ({ path: '/api/people/me/reminders' })),
  extra('PUT', '/api/people/me/reminders', ALL, async () => ({
    path: '/api/people/me/reminders',
    body: { flip: true, ready: true, overdue: false },
  })),
  extra('POST', '/api/people/:id/invitation', ADMIN, async (fx) => ({
    path: `/api/people/${(await invitedPerson(fx)).id}/invitation`,
    body: {},
  })),
  extra('GET', '/api/outbox', ADMIN, async () => ({ path: '/api/outbox?limit=5' })),
  extra('GET', '/api/outbox/:id', ADMIN, async (fx) => {
    await invitedPerson(fx);
    const [newest] = await readOutbox(fx.server);
    return { path: `/api/outbox/${newest.id}` };
  }),
  // Anyone holding the link: the token is the proof, so anonymous callers get through.
  extra(
    'GET',
    '/api/invitations/:token',
    ALL,
    async (fx) => ({ path: `/api/invitations/${(await invitedPerson(fx)).token}` }),
    200,
  ),
  extra(
    'POST',
    '/api/invitations/:token',
    ALL,
    async (fx) => ({
      path: `/api/invitations/${(await invitedPerson(fx)).token}`,
      body: { password: 'long-enough-3' },
    }),
    200,
  ),
];
