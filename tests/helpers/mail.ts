import assert from 'node:assert/strict';
import type { TestServer } from './test-server.ts';

/** A clock a test sets and moves by hand, for startTestServer's `now`. */
export interface HandClock {
  now(): Date;
  set(instant: Date): void;
  advance(ms: number): void;
}

/** A clock standing still at `start` until a test moves it. */
export function handClock(start: Date = new Date()): HandClock {
  let at = start.getTime();
  return {
    now: () => new Date(at),
    set: (instant) => {
      at = instant.getTime();
    },
    advance: (ms) => {
      at += ms;
    },
  };
}

/** Noon of a day in the server's time zone: the same calendar day wherever the tests run. */
export function localNoon(isoDate: string): Date {
  const [year, month, day] = isoDate.split('-').map(Number);
  return new Date(year, month - 1, day, 12, 0, 0);
}

/** One row of GET /api/outbox. */
export interface OutboxRow {
  id: number;
  createdAt: string;
  to: string;
  toName: string | null;
  subject: string;
  kind: string;
  related: string | null;
  transport: 'local' | 'smtp';
  state: 'pending' | 'sending' | 'sent' | 'failed' | 'kept';
  attempts: number;
  sentAt: string | null;
  result: string | null;
}

/** The outbox as an admin reads it, newest first, once the delivery going on has finished. */
export async function readOutbox(server: TestServer): Promise<OutboxRow[]> {
  await server.context.mail.delivery.idle();
  const response = await server.as('rosa').get('/api/outbox?limit=200');
  assert.equal(response.status, 200, response.text);
  return response.json.messages as OutboxRow[];
}

/** One message with its text and HTML, as an admin reads it. */
export async function readMessage(
  server: TestServer,
  id: number,
): Promise<OutboxRow & { text: string; html: string; messageId: string }> {
  const response = await server.as('rosa').get(`/api/outbox/${id}`);
  assert.equal(response.status, 200, response.text);
  return response.json.message;
}

/** The set-password link in a message's text. */
export function invitationLink(text: string): string {
  const match = /https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]+/.exec(text);
  assert.ok(match, `no set-password link in:\n${text}`);
  return match[0];
}

/** The token of a set-password link. */
export function tokenOf(link: string): string {
  const token = new URL(link).searchParams.get('token');
  assert.ok(token, `no token in ${link}`);
  return token;
}

/** Gives the demo people e-mail addresses (the demo has none), as an admin would. */
export async function giveDemoAddresses(server: TestServer): Promise<Record<string, string>> {
  const people = (await server.as('rosa').get('/api/people')).json.people as {
    id: number;
    username: string;
  }[];
  const addresses: Record<string, string> = {};
  for (const person of people) {
    const email = `${person.username}@quillmoor.invalid`;
    const response = await server
      .as('rosa')
      .request('PATCH', `/api/people/${person.id}`, { email });
    assert.equal(response.status, 200, response.text);
    addresses[person.username] = email;
  }
  return addresses;
}
