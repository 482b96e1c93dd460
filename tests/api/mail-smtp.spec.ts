import assert from 'node:assert/strict';
import type { AddressInfo } from 'node:net';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { SMTPServer } from 'smtp-server';
import { invitationLink, readMessage, readOutbox, tokenOf } from '../helpers/mail.ts';
import { startTestServer } from '../helpers/test-server.ts';

/** One message as the mail server received it. */
interface Received {
  readonly from: string;
  readonly to: readonly string[];
  readonly data: string;
}

/** A mail server on loopback that keeps what it is sent; `reject` refuses every recipient. */
async function captureServer(
  t: { after(fn: () => unknown): void },
  { reject = false } = {},
): Promise<{ url: string; received: Received[] }> {
  const received: Received[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onRcptTo(address, _session, callback) {
      if (reject) {
        const error = Object.assign(new Error('no such mailbox here'), { responseCode: 550 });
        callback(error);
      } else callback();
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        received.push({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          data: Buffer.concat(chunks).toString('utf8'),
        });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  t.after(() => new Promise<void>((resolve) => server.close(() => resolve())));
  const { port } = server.server.address() as AddressInfo;
  return { url: `smtp://127.0.0.1:${port}`, received };
}

const WREN = {
  username: 'wren',
  displayName: 'Wren Ollivane',
  email: 'wren@quillmoor.invalid',
  role: 'cook',
};

describe('mail through an SMTP server (LARDER_SMTP_URL)', () => {
  it('should deliver the invitation to the mail server and mark it sent in the outbox', async (t) => {
    const smtp = await captureServer(t);
    const server = await startTestServer(t, {
      LARDER_SMTP_URL: smtp.url,
      LARDER_MAIL_FROM: 'Quillmoor kitchen <kitchen@quillmoor.invalid>',
    });
    const added = await server.as('rosa').post('/api/people', WREN);
    assert.equal(added.status, 201, added.text);
    // The mail server takes the link to the person: the admin is not shown it.
    assert.equal(added.json.invitation.link, null);
    await server.context.mail.delivery.idle();

    assert.equal(smtp.received.length, 1);
    const [message] = smtp.received;
    assert.equal(message.from, 'kitchen@quillmoor.invalid');
    assert.deepEqual(message.to, ['wren@quillmoor.invalid']);
    assert.match(message.data, /^Subject: Your Larderbook sign-in at Quillmoor Smokehouse/m);
    // The link in the delivered text is the one the outbox keeps (quoted-printable may wrap it).
    const [row] = await readOutbox(server);
    assert.equal(row.transport, 'smtp');
    assert.equal(row.state, 'sent');
    // Handed to a mail server: the audit entry does not say it was kept here.
    const audit = await server.as('rosa').get('/api/audit?action=invitation-send');
    assert.equal(audit.json.events[0].detail.kept, undefined);
    const unwrapped = message.data.replace(/=\r\n/g, '').replace(/=3D/g, '=');
    // Once sent, the outbox no longer holds the token; the delivered link is the only one, and works.
    const kept = await readMessage(server, row.id);
    assert.match(kept.text, /token=\(removed once the message was sent\)/);
    const token = tokenOf(invitationLink(unwrapped));
    const set = await server
      .as('anonymous')
      .post(`/api/invitations/${token}`, { password: 'wren-own-password-1' });
    assert.equal(set.status, 200, set.text);
  });

  it('should keep a waiting invitation’s token for the mail server only, never in an answer', async (t) => {
    // A mail server that has gone away: the message waits for the next try.
    const smtp = await captureServer(t);
    const server = await startTestServer(t, {
      LARDER_SMTP_URL: smtp.url.replace(/:\d+$/, ':1'),
      LARDER_MAIL_FROM: 'kitchen@quillmoor.invalid',
    });
    const added = await server.as('rosa').post('/api/people', WREN);
    assert.equal(added.status, 201, added.text);
    const [row] = await readOutbox(server);
    assert.equal(row.state, 'pending');
    const message = await readMessage(server, row.id);
    assert.match(message.text, /token=\(kept only until the mail server has the message\)/);
    assert.doesNotMatch(message.text + message.html, /token=[A-Za-z0-9_-]{43}/);
    const [stored] = await server.context.db.sequelize.query<{ text: string }>(
      'SELECT text FROM outbox WHERE id = ?',
      { replacements: [row.id], type: QueryTypes.SELECT },
    );
    assert.match(stored.text, /token=[A-Za-z0-9_-]{43}/, 'kept for the next try');
  });

  it('should keep a refused message in the outbox as failed, with the server’s answer', async (t) => {
    const smtp = await captureServer(t, { reject: true });
    const server = await startTestServer(t, {
      LARDER_SMTP_URL: smtp.url,
      LARDER_MAIL_FROM: 'kitchen@quillmoor.invalid',
    });
    const added = await server.as('rosa').post('/api/people', WREN);
    // The person is added even though the mail server refuses the address.
    assert.equal(added.status, 201, added.text);
    await server.context.mail.delivery.idle();
    assert.equal(smtp.received.length, 0);
    const [row] = await readOutbox(server);
    assert.equal(row.state, 'failed');
    assert.match(row.result ?? '', /550|no such mailbox/);
    // Given up on, the stored copy keeps no token either.
    const [stored] = await server.context.db.sequelize.query<{ text: string; html: string }>(
      'SELECT text, html FROM outbox WHERE id = ?',
      { replacements: [row.id], type: QueryTypes.SELECT },
    );
    assert.match(stored.text, /token=\(removed: the message could not be sent\)/);
    assert.doesNotMatch(stored.text + stored.html, /token=[A-Za-z0-9_-]{43}/);
  });
});
