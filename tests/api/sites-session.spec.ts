import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import { BELLY, send, suiteServer, type CookieSession } from '../helpers/api-calls.ts';
import { OTHER_SITE, SITE_PASSWORD, addPerson, addSite } from '../helpers/site-fixture.ts';
import type { TestServer } from '../helpers/test-server.ts';

/** Signs in through the console's form as a person the site tests added. */
async function signInAs(server: TestServer, username: string): Promise<CookieSession> {
  const response = await fetch(`${server.url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username, password: SITE_PASSWORD }),
  });
  assert.equal(response.status, 201, `sign-in as ${username}`);
  const { csrfToken } = (await response.json()) as { csrfToken: string };
  const cookie = (response.headers.get('set-cookie') ?? '').split(';')[0];
  return { user: 'tobin', cookie, csrfToken };
}

// A console request reads its person's sites in the session's own statement, not in a read of
// its own: the sites and roles it sees must still be the ones stored at that moment.
describe('sites: a signed-in console person', () => {
  const server = suiteServer();
  let personId: number;

  before(async () => {
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'harbour-cook', null, [{ key: OTHER_SITE.key, role: 'cook' }]);
    const people = await send(server(), 'rosa', { method: 'GET', path: '/api/people' });
    personId = people.json.people.find(
      (person: { username: string }) => person.username === 'harbour-cook',
    ).id;
  });

  const patchSites = async (sites: { key: string; role: string }[]) => {
    const changed = await send(server(), 'rosa', {
      method: 'PATCH',
      path: `/api/people/${personId}`,
      body: { sites },
    });
    assert.equal(changed.status, 200, changed.text);
  };

  it('should work at the only site of theirs, with the role they have there', async () => {
    const session = await signInAs(server(), 'harbour-cook');
    const recorded = await send(server(), session, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(recorded.status, 201, recorded.text);
    const main = await send(server(), session, {
      method: 'GET',
      path: '/api/batches',
      headers: { 'x-larder-site': 'main' },
    });
    assert.equal(main.status, 404, main.text);
    assert.equal(main.json.error.code, 'no-such-site');
  });

  it('should take a role changed at a site on the very next request', async () => {
    const session = await signInAs(server(), 'harbour-cook');
    // A reviewer at the shop now: may read its log, may not record there.
    await patchSites([{ key: OTHER_SITE.key, role: 'reviewer' }]);
    const read = await send(server(), session, { method: 'GET', path: '/api/batches' });
    assert.equal(read.status, 200, read.text);
    const refused = await send(server(), session, {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(refused.status, 403, refused.text);
    // Moved to the main kitchen as its cook: the shop is gone from their sites at once.
    await patchSites([{ key: 'main', role: 'cook' }]);
    const shop = await send(server(), session, {
      method: 'GET',
      path: '/api/batches',
      headers: { 'x-larder-site': OTHER_SITE.key },
    });
    assert.equal(shop.status, 404, shop.text);
    const sites = await send(server(), session, { method: 'GET', path: '/api/sites' });
    assert.deepEqual(
      sites.json.sites.map((site: { key: string; role: string }) => [site.key, site.role]),
      [['main', 'cook']],
    );
    // Every role taken away: no site at all.
    await patchSites([]);
    const none = await send(server(), session, { method: 'GET', path: '/api/batches' });
    assert.equal(none.status, 403, none.text);
    assert.equal(none.json.error.code, 'no-site');
  });

  // Nothing is committed between these requests, so the session is kept and so is each choice
  // of site made for it (resolve-site.ts): each site asked must still get its own.
  it('should give each site asked in turn its own role, with nothing changed between', async () => {
    await addPerson(server(), 'two-site-cook', null, [
      { key: 'main', role: 'cook' },
      { key: OTHER_SITE.key, role: 'reviewer' },
    ]);
    const session = await signInAs(server(), 'two-site-cook');
    // An empty body: a cook may record, so 400 for the body; a reviewer may not, so 403 first.
    // Neither stores anything.
    const roleAt = async (site?: string): Promise<number> => {
      const answer = await send(server(), session, {
        method: 'POST',
        path: '/api/batches',
        body: {},
        headers: site ? { 'x-larder-site': site } : {},
      });
      return answer.status;
    };
    const asked = ['main', OTHER_SITE.key, 'main', undefined, OTHER_SITE.key, OTHER_SITE.key];
    const statuses = [];
    for (const site of asked) statuses.push(await roleAt(site));
    // A role per site; of two sites, the main kitchen is the default.
    assert.deepEqual(statuses, [400, 403, 400, 400, 403, 403]);
  });

  it('should add a person whose role holds at one site only, from the start', async () => {
    const added = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/people',
      body: {
        username: 'harbour-reviewer',
        displayName: 'Harbour reviewer',
        role: 'reviewer',
        password: SITE_PASSWORD,
        site: OTHER_SITE.key,
      },
    });
    assert.equal(added.status, 201, added.text);
    assert.equal(added.json.person.roleEverywhere, false);
    assert.deepEqual(added.json.person.sites, [{ key: OTHER_SITE.key, role: 'reviewer' }]);
    const session = await signInAs(server(), 'harbour-reviewer');
    const sites = await send(server(), session, { method: 'GET', path: '/api/sites' });
    assert.deepEqual(
      sites.json.sites.map((site: { key: string; role: string }) => [site.key, site.role]),
      [[OTHER_SITE.key, 'reviewer']],
    );
    const audit = await send(server(), 'rosa', {
      method: 'GET',
      path: '/api/audit?subject=harbour-reviewer',
    });
    assert.deepEqual(audit.json.events.map((event: { action: string }) => event.action).sort(), [
      'person-add',
      'person-change',
    ]);
  });

  it('should add nobody for a site that does not exist', async () => {
    const refused = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/people',
      body: { username: 'nowhere-cook', displayName: 'Nowhere', role: 'cook', site: 'nowhere' },
    });
    assert.equal(refused.status, 404, refused.text);
    assert.equal(refused.json.error.code, 'no-such-site');
    const people = await send(server(), 'rosa', { method: 'GET', path: '/api/people' });
    assert.ok(
      !people.json.people.some(
        (person: { username: string }) => person.username === 'nowhere-cook',
      ),
      'no half-added person',
    );
  });
});
