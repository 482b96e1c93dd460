import assert from 'node:assert/strict';
import { createRequire } from 'node:module';
import { describe, it } from 'node:test';
import type { Request } from 'express';
import type { SessionData, Store } from 'express-session';
import { cookieValue, sessionReader, unsignSessionCookie } from './session-reader.ts';

// The signer express-session itself uses, as the oracle for the cookies it writes.
const requireFromSession = createRequire(createRequire(import.meta.url).resolve('express-session'));
const signature = requireFromSession('cookie-signature') as {
  sign(value: string, secret: string): string;
};

const SECRET = 'a secret for the tests, long enough';

describe('proving a session cookie', () => {
  it('should give the id of a cookie express-session signed, and nothing for a changed one', () => {
    const cookie = `s:${signature.sign('abc-123_XYZ', SECRET)}`;
    assert.equal(unsignSessionCookie(cookie, SECRET), 'abc-123_XYZ');
    assert.equal(unsignSessionCookie(cookie, `${SECRET}!`), undefined, 'another secret');
    assert.equal(unsignSessionCookie(cookie.replace('abc', 'abd'), SECRET), undefined, 'other id');
    assert.equal(unsignSessionCookie(`${cookie}x`, SECRET), undefined, 'longer signature');
    assert.equal(unsignSessionCookie(cookie.slice(2), SECRET), undefined, 'not marked signed');
  });

  it('should read the first value of the cookie, unquoted and decoded, as the cookie package does', () => {
    assert.equal(
      cookieValue('a=1; larder.sid=s%3Aone.two; larder.sid=x', 'larder.sid'),
      's:one.two',
    );
    assert.equal(cookieValue('larder.sid="s:q.r"', 'larder.sid'), 's:q.r');
    assert.equal(cookieValue('xlarder.sid=1; b=2', 'larder.sid'), undefined);
    assert.equal(cookieValue('larder.sid=%E0%A4%A', 'larder.sid'), undefined, 'bad escape');
    assert.equal(cookieValue(undefined, 'larder.sid'), undefined);
  });
});

describe('the session of a request that only reads it', () => {
  const data = { cookie: {}, personId: 7, csrfToken: 't', signedInAt: '2026-12-04' };
  const destroyed: string[] = [];
  const store = { destroy: (sid: string, done: () => void) => (destroyed.push(sid), done()) };
  const reader = sessionReader(store as unknown as Store, SECRET, 'larder.sid', (sid) =>
    Promise.resolve(sid === 'known' ? { data: data as SessionData, person: null } : undefined),
  );
  const request = (id: string): Request =>
    ({ headers: { cookie: `larder.sid=s:${signature.sign(id, SECRET)}` } }) as Request;
  const read = (req: Request): Promise<boolean> =>
    new Promise((resolve, reject) => {
      const handled = reader(req, (error) => (error ? reject(error) : resolve(handled)));
      if (!handled) resolve(false);
    });

  it('should be frozen, so a route that changes it fails instead of losing the change', async () => {
    const req = request('known');
    assert.equal(await read(req), true);
    assert.equal(req.session.personId, 7);
    assert.equal(req.sessionPerson, null);
    assert.throws(() => {
      req.session.signedInAt = 'later';
    }, TypeError);
    await new Promise((resolve) => req.session.destroy(resolve));
    assert.deepEqual(destroyed, ['known']);
  });

  it('should leave a request without a proved cookie to express-session', async () => {
    const forged = { headers: { cookie: 'larder.sid=s:known.forged' } } as Request;
    assert.equal(await read(forged), false);
    assert.equal(forged.session, undefined);
    const gone = request('gone');
    assert.equal(await read(gone), true);
    assert.equal(gone.session, undefined, 'no such session: none');
  });
});
