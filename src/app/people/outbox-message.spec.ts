import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  deliveryStatus,
  invitationNote,
  kindText,
  recipientText,
  transportText,
} from './outbox-message.ts';

describe('outbox message words', () => {
  describe('kindText', () => {
    it('should name invitations and each reminder in words', () => {
      assert.equal(kindText('invitation'), 'Invitation');
      assert.equal(kindText('reminder-flip'), 'Reminder: flip');
      assert.equal(kindText('reminder-ready'), 'Reminder: ready');
      assert.equal(kindText('reminder-overdue'), 'Reminder: overdue');
    });

    it('should give back a kind it does not know as the server wrote it', () => {
      assert.equal(kindText('digest'), 'digest');
    });
  });

  describe('deliveryStatus', () => {
    it('should call a message never tried queued, with nothing to add', () => {
      assert.deepEqual(deliveryStatus({ state: 'pending', attempts: 0, result: null }), {
        tone: 'queued',
        label: 'Queued',
        detail: '',
      });
    });

    it('should show the last failure of a message that will be tried again', () => {
      assert.deepEqual(
        deliveryStatus({
          state: 'pending',
          attempts: 2,
          result: 'ECONNREFUSED: connect refused (try 2)',
        }),
        {
          tone: 'queued',
          label: 'Queued, will retry',
          detail: 'ECONNREFUSED: connect refused (try 2)',
        },
      );
    });

    it('should show what the mail server answered for a sent message', () => {
      const status = deliveryStatus({
        state: 'sent',
        attempts: 1,
        result: '250 2.0.0 Ok: queued as 4F2A1',
      });
      assert.equal(status.tone, 'sent');
      assert.equal(status.label, 'Sent');
      assert.equal(status.detail, '250 2.0.0 Ok: queued as 4F2A1');
    });

    it('should never call a message kept here for want of a mail server sent', () => {
      const status = deliveryStatus({
        state: 'kept',
        attempts: 1,
        result: 'kept in the local outbox; nothing left this machine',
      });
      assert.equal(status.tone, 'kept');
      assert.equal(status.label, 'Kept here');
      assert.match(status.detail, /no mail server is set up/);
      assert.doesNotMatch(`${status.label} ${status.detail}`, /\bSent\b/);
    });

    it('should show why a message failed, and say so when the server gave no reason', () => {
      assert.deepEqual(
        deliveryStatus({ state: 'failed', attempts: 1, result: '550 5.1.1 mailbox unknown' }),
        { tone: 'failed', label: 'Failed', detail: '550 5.1.1 mailbox unknown' },
      );
      assert.equal(
        deliveryStatus({ state: 'failed', attempts: 5, result: '  ' }).detail,
        'no reason was given',
      );
    });

    it('should call a message being handed over sending', () => {
      assert.equal(
        deliveryStatus({ state: 'sending', attempts: 1, result: null }).label,
        'Sending',
      );
    });
  });

  describe('recipientText', () => {
    it('should write the name before the address, as mail programs do', () => {
      assert.equal(
        recipientText({ to: 'wren@quillmoor.invalid', toName: 'Wren Ollivane' }),
        'Wren Ollivane <wren@quillmoor.invalid>',
      );
    });

    it('should write the bare address when there is no name', () => {
      assert.equal(
        recipientText({ to: 'wren@quillmoor.invalid', toName: null }),
        'wren@quillmoor.invalid',
      );
      assert.equal(
        recipientText({ to: 'wren@quillmoor.invalid', toName: ' ' }),
        'wren@quillmoor.invalid',
      );
    });
  });

  describe('transportText', () => {
    it('should say in an admin’s words that with no mail server messages are kept here', () => {
      assert.match(
        transportText('local'),
        /^Kept here — no mail server is set up, so nothing is sent and nobody receives these messages\./,
      );
    });

    it('should name no setting of the server, only what it means', () => {
      for (const transport of ['local', 'smtp'] as const)
        assert.doesNotMatch(transportText(transport), /LARDER_|SMTP_URL|[A-Z]{3,}_[A-Z]{3,}/);
    });

    it('should say that an invitation link is shown once to the admin and not kept here', () => {
      assert.match(
        transportText('local'),
        /Invitation links are shown once, to the admin who sends the invitation, and are not kept here/,
      );
    });

    it('should say that messages go to the mail server when one is set', () => {
      assert.match(transportText('smtp'), /^Messages go out through the kitchen’s mail server;/);
      for (const transport of ['smtp', 'local'] as const)
        assert.doesNotMatch(transportText(transport), /LARDER_|SMTP/);
    });

    it('should say nothing before the server has told', () => {
      assert.equal(transportText(null), '');
    });
  });

  describe('invitationNote', () => {
    it('should say where an invitation’s link went, for each transport', () => {
      assert.match(
        invitationNote({ kind: 'invitation', transport: 'local' }),
        /shown once to the admin who sent the invitation.*send a new invitation/,
      );
      assert.match(
        invitationNote({ kind: 'invitation', transport: 'smtp' }),
        /only to the person invited/,
      );
    });

    it('should say nothing about a reminder', () => {
      assert.equal(invitationNote({ kind: 'reminder-ready', transport: 'local' }), '');
    });
  });
});
