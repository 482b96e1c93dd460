import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ApiError } from '../core/api/api-error.ts';
import { invitationRefusal, linkRefused } from './invitation.ts';

// The server's codes and words: server/invitations/invitation-repository.ts (usable).
const expired = new ApiError(
  410,
  'invitation-expired',
  'this invitation link expired (links work for 72 hours); ask an admin to send a new invitation',
);
const unknown = new ApiError(404, 'invitation-unknown', 'this invitation link is not known');
const used = new ApiError(410, 'invitation-used', 'this invitation link has been used already');

describe('invitation refusals', () => {
  it('should tell an expired link and send the person to an admin for a new one', () => {
    const refusal = invitationRefusal(expired);
    assert.equal(refusal.code, 'invitation-expired');
    assert.equal(refusal.title, 'This invitation link has expired');
    assert.match(refusal.advice, /re-send the invitation/);
  });

  it('should tell a used link and point to signing in', () => {
    const refusal = invitationRefusal(used);
    assert.equal(refusal.title, 'This invitation link has been used');
    assert.match(refusal.advice, /sign in with that password/);
    assert.match(refusal.advice, /re-send the invitation/);
  });

  it('should ask for the whole link when the token is unknown or missing', () => {
    assert.match(invitationRefusal(unknown).advice, /whole link/);
    const missing = invitationRefusal('no-token');
    assert.equal(missing.code, 'no-token');
    assert.match(missing.advice, /\?token=/);
  });

  it('should tell a replaced link, a deactivated person and too many tries apart', () => {
    const titles = ['invitation-replaced', 'invitation-inactive', 'too-many-attempts'].map(
      (code) =>
        invitationRefusal(new ApiError(code === 'too-many-attempts' ? 429 : 410, code, 'x')).title,
    );
    assert.deepEqual(titles, [
      'A newer invitation replaced this link',
      'This sign-in is deactivated',
      'Too many tries with invitation links',
    ]);
  });

  it('should pass on the server’s words for a failure it does not know', () => {
    const refusal = invitationRefusal(new ApiError(0, 'offline', 'The server cannot be reached.'));
    assert.equal(refusal.title, 'The invitation link could not be checked');
    assert.match(refusal.advice, /^The server cannot be reached\. Try again in a moment/);
    assert.match(invitationRefusal(new Error('boom')).advice, /^Something went wrong\./);
  });

  describe('linkRefused', () => {
    it('should count unknown and no-longer-valid links, not passing failures', () => {
      assert.equal(linkRefused(unknown), true);
      assert.equal(linkRefused(expired), true);
      assert.equal(linkRefused(new ApiError(400, 'invalid-body', 'too short')), false);
      assert.equal(linkRefused(new ApiError(0, 'offline', 'offline')), false);
      assert.equal(linkRefused(new Error('boom')), false);
    });
  });
});
