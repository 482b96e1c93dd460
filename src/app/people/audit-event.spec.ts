import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { actionText, detailText } from './audit-event.ts';

describe('audit event words', () => {
  describe('plans', () => {
    it('should say a plan in words, never its field names or a YYYY-MM-DD day', () => {
      const made = { count: 120, serviceDate: '2026-12-18' };
      assert.equal(
        detailText({ action: 'plan-make', detail: made }),
        '120 for the service on 18 Dec 2026',
      );
      assert.equal(
        detailText({
          action: 'plan-record',
          detail: { ...made, lots: ['261203-CG-01', '261203-PB-01'], again: true },
        }),
        '120 for the service on 18 Dec 2026 · 2 batches: 261203-CG-01, 261203-PB-01 · recorded again',
      );
      assert.equal(
        detailText({
          action: 'batch-lots',
          detail: {
            usedOn: '2026-12-03',
            accepted: true,
            replaced: [4],
            uses: [
              { item: 'pork-belly', lot: 'R261201-01', amount: '6000' },
              { item: 'pork-belly', lot: 'R261202-01', amount: '4000' },
            ],
          },
        }),
        'used on 3 Dec 2026 · 2 lots: R261201-01, R261202-01 · as suggested · recorded again',
      );
    });
  });

  describe('actionText', () => {
    it('should name a known action in words', () => {
      assert.equal(actionText({ action: 'batch-sign-off', detail: null }), 'Signed a batch off');
      assert.equal(actionText({ action: 'batch-turn', detail: null }), 'Turned a cure');
    });

    it('should tell a person changing their own password from an admin reset', () => {
      assert.equal(
        actionText({ action: 'password-reset', detail: { own: true } }),
        'Changed their own password',
      );
      assert.equal(actionText({ action: 'password-reset', detail: null }), 'Reset a password');
    });

    it('should tell a password set from an invitation link', () => {
      assert.equal(
        actionText({ action: 'password-reset', detail: { via: 'invitation' } }),
        'Set their password from an invitation',
      );
    });

    it('should never say a message was sent when it was only kept in the outbox', () => {
      const kept = { kept: true };
      assert.equal(
        actionText({
          action: 'invitation-send',
          detail: { to: 'wren@quillmoor.invalid', ...kept },
        }),
        'Kept an invitation (no mail server)',
      );
      assert.equal(
        actionText({ action: 'reminder-send', detail: { kind: 'flip', ...kept } }),
        'Kept a reminder (no mail server)',
      );
      assert.equal(
        actionText({ action: 'process-alert-send', detail: { what: 'x', ...kept } }),
        'Kept an alert (no mail server)',
      );
      assert.equal(actionText({ action: 'invitation-send', detail: {} }), 'Sent an invitation');
      assert.equal(actionText({ action: 'reminder-send', detail: null }), 'Sent a reminder');
    });
  });

  describe('detailText', () => {
    const cases: { name: string; event: Parameters<typeof detailText>[0]; expected: string }[] = [
      {
        name: 'a form sign-in',
        event: { action: 'sign-in', detail: { via: 'form' } },
        expected: 'with the sign-in form',
      },
      {
        name: 'a failed sign-in over HTTP Basic',
        event: { action: 'sign-in-failed', detail: { via: 'basic' } },
        expected: 'from the command line or a script',
      },
      {
        name: 'a formula save with its message and shortened revisions',
        event: {
          action: 'formula-save',
          detail: {
            revision: 'a'.repeat(64),
            previousRevision: 'b'.repeat(64),
            message: 'Less salt',
          },
        },
        expected: '“Less salt” · revision aaaaaaaa · was bbbbbbbb',
      },
      {
        name: 'a cure turned, with its day in words and the note',
        event: { action: 'batch-turn', detail: { on: '2026-12-04', note: 'Restacked' } },
        expected: 'on 4 Dec 2026 · note: Restacked',
      },
      {
        name: 'a batch moved on with a reason',
        event: {
          action: 'batch-status',
          detail: { from: 'in-progress', to: 'discarded', reason: 'Dropped on the floor' },
        },
        expected: 'in progress → discarded · reason: Dropped on the floor',
      },
      {
        name: 'a signed-off batch moved on by an admin',
        event: {
          action: 'batch-status',
          detail: { from: 'curing', to: 'done', reason: 'Probe read late', afterSignOff: true },
        },
        expected: 'curing → done · after sign-off · reason: Probe read late',
      },
      {
        name: 'a person deactivated and made a cook',
        event: { action: 'person-change', detail: { active: false, role: 'cook' } },
        expected: 'deactivated, role → cook',
      },
      {
        name: 'an e-mail removed',
        event: { action: 'person-change', detail: { email: null } },
        expected: 'e-mail removed',
      },
      { name: 'a sign-out', event: { action: 'sign-out', detail: null }, expected: '' },
      {
        name: 'an invitation with its address',
        event: {
          action: 'invitation-send',
          detail: { to: 'wren@quillmoor.invalid', expiresAt: '2026-03-05T09:00:00.000Z' },
        },
        expected: 'to wren@quillmoor.invalid',
      },
      {
        name: 'reminder choices as the kinds chosen',
        event: {
          action: 'reminder-choices',
          detail: { flip: false, ready: true, overdue: true },
        },
        expected: 'ready, overdue',
      },
      {
        name: 'reminder choices with every kind turned off',
        event: {
          action: 'reminder-choices',
          detail: { flip: false, ready: false, overdue: false },
        },
        expected: 'no reminders',
      },
      {
        name: 'a reminder sent to two people',
        event: {
          action: 'reminder-send',
          detail: { kind: 'flip', dueOn: '2024-03-02', to: ['rosa', 'tobin'] },
        },
        expected: 'flip reminder, due 2 Mar 2024, to rosa, tobin',
      },
      {
        name: 'a reminder nobody could be sent',
        event: { action: 'reminder-send', detail: { kind: 'ready', dueOn: '2024-03-08', to: [] } },
        expected: 'ready reminder, due 8 Mar 2024, to nobody',
      },
    ];
    for (const { name, event, expected } of cases) {
      it(`should summarise ${name}`, () => {
        assert.equal(detailText(event), expected);
      });
    }

    it('should list the fields of an action it does not know', () => {
      const event = {
        action: 'oven-fire',
        detail: { oven: 2, out: true },
      } as unknown as Parameters<typeof detailText>[0];
      assert.equal(detailText(event), 'oven: 2, out: true');
    });
  });
});
