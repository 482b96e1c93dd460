import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { handClock, readMessage, readOutbox, tokenOf } from '../helpers/mail.ts';
import { tableNames } from '../helpers/table-names.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

const WREN = {
  username: 'wren',
  displayName: 'Wren Ollivane',
  email: 'wren@quillmoor.invalid',
  role: 'cook',
};

/**
 * Adds Wren with an e-mail address and returns the token of the invitation's link, which (with
 * no mail server) the answer shows the admin this once.
 */
async function inviteWren(server: TestServer): Promise<{ id: number; token: string }> {
  const added = await server.as('rosa').post('/api/people', WREN);
  assert.equal(added.status, 201, added.text);
  return { id: added.json.person.id, token: tokenOf(added.json.invitation.link) };
}

/** Every row of every table of the database, as text. */
async function everyRow(server: TestServer): Promise<string> {
  const { sequelize } = server.context.db;
  const tables = await tableNames(server.context.db);
  assert.ok(tables.includes('outbox'));
  const rows = await Promise.all(
    tables.map((table) => sequelize.query(`SELECT * FROM "${table}"`, { type: QueryTypes.SELECT })),
  );
  return JSON.stringify(rows);
}

/** The database file and its write-ahead log as bytes: what a copy of the data folder holds. */
function databaseBytes(server: TestServer): Buffer {
  const file = server.context.config.databaseFile;
  return Buffer.concat(
    [file, `${file}-wal`].filter((f) => existsSync(f)).map((f) => readFileSync(f)),
  );
}

/** Asserts a token appears in no API answer an admin can read, no row and no byte of the database. */
async function assertNowhere(server: TestServer, token: string): Promise<void> {
  const rosa = server.as('rosa');
  const outbox = await readOutbox(server);
  assert.ok(!JSON.stringify(outbox).includes(token), 'the outbox list');
  for (const row of outbox) {
    const message = await readMessage(server, row.id);
    assert.ok(!JSON.stringify(message).includes(token), `outbox message ${row.id}`);
  }
  for (const route of ['/api/people', '/api/audit?limit=200'])
    assert.ok(!(await rosa.get(route)).text.includes(token), route);
  assert.ok(!(await everyRow(server)).includes(token), 'a row of the database');
  assert.ok(!(await everyRow(server)).includes(encodeURIComponent(token)), 'an encoded link');
  // The SQLite file is a copy of the data folder away; PostgreSQL's own files are not the
  // server's to read, and every row of its tables is checked above.
  if (server.context.db.dialect === 'sqlite') {
    await server.context.db.sequelize.query('PRAGMA wal_checkpoint(FULL)');
    assert.ok(!databaseBytes(server).includes(token), 'a byte of the database file');
  }
}

const anonymous = (server: TestServer) => server.as('anonymous');

describe('invitations', () => {
  it('should put an invitation in the outbox when an admin adds a person with an e-mail address', async (t) => {
    const server = await startTestServer(t);
    const before = Date.now();
    const added = await server.as('rosa').post('/api/people', WREN);
    assert.equal(added.status, 201, added.text);
    assert.equal(added.json.invitation.sentTo, 'wren@quillmoor.invalid');
    // 72 hours from now. source: the product brief (invitation links expire after 72 h)
    const expires = Date.parse(added.json.invitation.expiresAt);
    assert.ok(expires >= before + 72 * 3_600_000 && expires <= Date.now() + 72 * 3_600_000);

    const outbox = await readOutbox(server);
    assert.equal(outbox.length, 1);
    const [row] = outbox;
    assert.equal(row.kind, 'invitation');
    assert.equal(row.to, 'wren@quillmoor.invalid');
    assert.equal(row.toName, 'Wren Ollivane');
    assert.equal(row.related, 'wren');
    assert.equal(row.subject, 'Your Larderbook sign-in at Quillmoor Smokehouse');
    assert.equal(row.transport, 'local');
    // With no mail server nothing left: the message is kept, never called sent.
    assert.equal(row.state, 'kept');
    assert.equal(row.sentAt, null);
    assert.match(row.result ?? '', /local outbox; nothing left this machine/);

    // With no mail server the answer shows the admin the link, this once, to pass on by hand.
    const link = added.json.invitation.link as string;
    assert.ok(link.startsWith(`${server.url}/set-password?token=`), link);
    const message = await readMessage(server, row.id);
    assert.match(message.text, /Hello Wren Ollivane,/);
    assert.match(message.text, /Your username is wren\./);
    assert.match(message.text, /Larderbook at Quillmoor Smokehouse/);
    assert.match(message.text, /My reminders/);
    // The outbox keeps the message, with the link's token replaced by words.
    const kept = `${server.url}/set-password?token=(shown once to the admin who sent the invitation)`;
    assert.ok(message.text.includes(`Set my password: ${kept}`), message.text);
    assert.ok(message.html.includes(kept), 'the HTML carries the same words');
    assert.match(message.messageId, /^<[0-9a-f]+\.larderbook@localhost>$/);

    // Only the token's hash is stored with the invitation.
    const token = tokenOf(link);
    const rows = await server.context.db.sequelize.query<Record<string, unknown>>(
      'SELECT * FROM invitations',
      { type: QueryTypes.SELECT },
    );
    assert.equal(rows.length, 1);
    assert.equal(rows[0].token_hash, createHash('sha256').update(token).digest('hex'));
    assert.ok(!JSON.stringify(rows).includes(token));

    const audit = await server.as('rosa').get('/api/audit?action=invitation-send');
    assert.equal(audit.json.events[0].subject, 'wren');
    assert.equal(audit.json.events[0].actorName, 'rosa');
    // No mail server: the message stays in the outbox, and the entry says so.
    assert.equal(audit.json.events[0].detail.kept, true);
  });

  it('should show the link in the answer once, and never again through the API or in the database', async (t) => {
    const server = await startTestServer(t);
    const { id, token } = await inviteWren(server);
    await assertNowhere(server, token);
    const resend = await server.as('rosa').post(`/api/people/${id}/invitation`);
    assert.equal(resend.status, 201, resend.text);
    const again = tokenOf(resend.json.invitation.link);
    assert.notEqual(again, token);
    await assertNowhere(server, again);
    // The link shown is the one that works.
    const set = await anonymous(server).post(`/api/invitations/${again}`, {
      password: 'hickory-bench-42',
    });
    assert.equal(set.status, 200, set.text);
  });

  it('should set the password with the link once, then answer 410', async (t) => {
    const server = await startTestServer(t);
    const { token } = await inviteWren(server);

    const look = await anonymous(server).get(`/api/invitations/${token}`);
    assert.equal(look.status, 200, look.text);
    assert.deepEqual(Object.keys(look.json).sort(), ['displayName', 'expiresAt']);
    assert.equal(look.json.displayName, 'Wren Ollivane');

    const short = await anonymous(server).post(`/api/invitations/${token}`, { password: 'short' });
    assert.equal(short.status, 400);

    const set = await anonymous(server).post(`/api/invitations/${token}`, {
      password: 'hickory-bench-42',
    });
    assert.equal(set.status, 200, set.text);
    assert.equal(set.json.username, 'wren');

    const signIn = await anonymous(server).post('/api/session', {
      username: 'wren',
      password: 'hickory-bench-42',
    });
    assert.equal(signIn.status, 201, signIn.text);

    const again = await anonymous(server).post(`/api/invitations/${token}`, {
      password: 'another-password-1',
    });
    assert.equal(again.status, 410);
    assert.equal(again.json.error.code, 'invitation-used');
    assert.match(again.json.error.message, /used already/);
    assert.equal((await anonymous(server).get(`/api/invitations/${token}`)).status, 410);
    // The password stayed the one set first.
    const stale = await anonymous(server).post('/api/session', {
      username: 'wren',
      password: 'another-password-1',
    });
    assert.equal(stale.status, 401);

    const audit = await server.as('rosa').get('/api/audit?action=password-reset');
    const reset = audit.json.events[0];
    assert.equal(reset.subject, 'wren');
    assert.equal(reset.actorName, 'wren');
    assert.deepEqual(reset.detail, { via: 'invitation' });
  });

  it('should end the sessions the person already had when the link sets a password', async (t) => {
    const server = await startTestServer(t);
    const added = await server
      .as('rosa')
      .post('/api/people', { ...WREN, password: 'first-password-1' });
    assert.equal(added.status, 201);
    const first = await anonymous(server).post('/api/session', {
      username: 'wren',
      password: 'first-password-1',
    });
    const cookie = (first.headers.get('set-cookie') ?? '').split(';')[0];
    assert.equal((await anonymous(server).get('/api/session', { cookie })).status, 200);
    const token = tokenOf(added.json.invitation.link);
    await new Promise((resolve) => setTimeout(resolve, 5));
    const set = await anonymous(server).post(`/api/invitations/${token}`, {
      password: 'second-password-2',
    });
    assert.equal(set.status, 200, set.text);
    const old = await anonymous(server).post(
      '/api/calc',
      { formula: 'brisket-rub', batch: { base: '1kg' } },
      { cookie },
    );
    assert.equal(old.status, 401);
  });

  it('should let a link expire after 72 hours (injected clock)', async (t) => {
    const clock = handClock(new Date('2026-03-02T09:00:00Z'));
    const server = await startTestServer(t, {}, { now: clock.now });
    const { token } = await inviteWren(server);
    // A minute short of 72 hours: still valid.
    clock.advance(72 * 3_600_000 - 60_000);
    assert.equal((await anonymous(server).get(`/api/invitations/${token}`)).status, 200);
    clock.advance(60_000);
    const expired = await anonymous(server).get(`/api/invitations/${token}`);
    assert.equal(expired.status, 410);
    assert.equal(expired.json.error.code, 'invitation-expired');
    assert.match(expired.json.error.message, /expired/);
    const set = await anonymous(server).post(`/api/invitations/${token}`, {
      password: 'too-late-password',
    });
    assert.equal(set.status, 410);
    const signIn = await anonymous(server).post('/api/session', {
      username: 'wren',
      password: 'too-late-password',
    });
    assert.equal(signIn.status, 401);
  });

  it('should resend: a new link works and the older one is replaced', async (t) => {
    const server = await startTestServer(t);
    const { id, token: first } = await inviteWren(server);
    const resend = await server.as('rosa').post(`/api/people/${id}/invitation`);
    assert.equal(resend.status, 201, resend.text);
    assert.equal(resend.json.invitation.sentTo, 'wren@quillmoor.invalid');
    const invitations = (await readOutbox(server)).filter((m) => m.kind === 'invitation');
    assert.equal(invitations.length, 2);
    const second = tokenOf(resend.json.invitation.link);
    assert.notEqual(second, first);
    const old = await anonymous(server).get(`/api/invitations/${first}`);
    assert.equal(old.status, 410);
    assert.equal(old.json.error.code, 'invitation-replaced');
    assert.equal((await anonymous(server).get(`/api/invitations/${second}`)).status, 200);
  });

  it('should refuse a resend for someone without an address, someone deactivated, or nobody', async (t) => {
    const server = await startTestServer(t);
    const plain = await server.as('rosa').post('/api/people', {
      username: 'moss',
      displayName: 'Moss',
      role: 'cook',
    });
    assert.equal(plain.json.invitation, null, 'no address, no invitation');
    assert.equal((await readOutbox(server)).length, 0);
    const noEmail = await server.as('rosa').post(`/api/people/${plain.json.person.id}/invitation`);
    assert.equal(noEmail.status, 409);
    assert.equal(noEmail.json.error.code, 'no-email');

    const { id, token } = await inviteWren(server);
    await server.as('rosa').request('PATCH', `/api/people/${id}`, { active: false });
    const inactive = await server.as('rosa').post(`/api/people/${id}/invitation`);
    assert.equal(inactive.status, 409);
    assert.equal(inactive.json.error.code, 'inactive');
    const dead = await anonymous(server).get(`/api/invitations/${token}`);
    assert.equal(dead.status, 410);
    assert.equal(dead.json.error.code, 'invitation-inactive');

    assert.equal((await server.as('rosa').post('/api/people/9999/invitation')).status, 404);
    assert.equal(
      (await server.as('rosa').post(`/api/people/${id}/invitation`, { to: 'x@y.z' })).status,
      400,
    );
  });

  it('should answer 404 for a token that is unknown or not a token at all', async (t) => {
    const server = await startTestServer(t);
    for (const token of ['A'.repeat(43), 'not-a-token', 'A'.repeat(44)]) {
      const response = await anonymous(server).get(`/api/invitations/${token}`);
      assert.equal(response.status, 404, token);
      assert.equal(response.json.error.code, 'invitation-unknown');
      const set = await anonymous(server).post(`/api/invitations/${token}`, {
        password: 'long-enough-1',
      });
      assert.equal(set.status, 404, token);
    }
  });

  it('should escape names in the HTML and keep them as written in the text', async (t) => {
    const server = await startTestServer(t);
    const added = await server.as('rosa').post('/api/people', {
      ...WREN,
      displayName: '<b>Wren</b> & "Co"',
    });
    assert.equal(added.status, 201, added.text);
    const [row] = await readOutbox(server);
    const message = await readMessage(server, row.id);
    assert.match(message.text, /Hello <b>Wren<\/b> & "Co",/);
    assert.ok(message.html.includes('Hello &lt;b&gt;Wren&lt;/b&gt; &amp; &quot;Co&quot;,'));
    assert.ok(!message.html.includes('<b>Wren'));
  });

  it('should limit tries with invitation links per address, like sign-in', async (t) => {
    const server = await startTestServer(t, { LARDER_SIGN_IN_LIMIT: '3' });
    const token = 'B'.repeat(43);
    for (let i = 0; i < 3; i++)
      assert.equal((await anonymous(server).get(`/api/invitations/${token}`)).status, 404);
    const throttled = await anonymous(server).post(`/api/invitations/${token}`, {
      password: 'long-enough-1',
    });
    assert.equal(throttled.status, 429);
    assert.equal(throttled.json.error.code, 'too-many-attempts');
  });
});

describe('the outbox over the API', () => {
  it('should be for admins only', async (t) => {
    const server = await startTestServer(t);
    await inviteWren(server);
    const [row] = await readOutbox(server);
    for (const [user, status] of [
      ['anonymous', 401],
      ['tobin', 403],
      ['imke', 403],
      ['rosa', 200],
    ] as const) {
      assert.equal((await server.as(user).get('/api/outbox')).status, status, user);
      assert.equal((await server.as(user).get(`/api/outbox/${row.id}`)).status, status, user);
    }
  });

  it('should page newest first and refuse bad queries', async (t) => {
    const server = await startTestServer(t);
    const { id } = await inviteWren(server);
    await server.as('rosa').post(`/api/people/${id}/invitation`);
    await server.as('rosa').post(`/api/people/${id}/invitation`);
    await server.context.mail.delivery.idle();
    const first = await server.as('rosa').get('/api/outbox?limit=2');
    assert.equal(first.json.messages.length, 2);
    assert.ok(first.json.messages[0].id > first.json.messages[1].id);
    assert.equal(first.json.transport, 'local');
    const rest = await server.as('rosa').get(`/api/outbox?limit=2&before=${first.json.next}`);
    assert.equal(rest.json.messages.length, 1);
    assert.equal(rest.json.next, null);
    assert.equal('text' in first.json.messages[0], false, 'the list leaves the bodies out');
    for (const query of ['limit=0', 'limit=500', 'before=x', 'kind=invitation'])
      assert.equal((await server.as('rosa').get(`/api/outbox?${query}`)).status, 400, query);
    assert.equal((await server.as('rosa').get('/api/outbox/12345')).status, 404);
    assert.equal((await server.as('rosa').get('/api/outbox/abc')).status, 404);
  });
});
