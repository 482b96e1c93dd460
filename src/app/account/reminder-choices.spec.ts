import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { REMINDER_OPTIONS, choicesText, sameChoices } from './reminder-choices.ts';

const ALL = { flip: true, ready: true, overdue: true } as const;
const NONE = { flip: false, ready: false, overdue: false } as const;

describe('reminder choices', () => {
  it('should offer the three reminders in the order a cure meets them', () => {
    assert.deepEqual(
      REMINDER_OPTIONS.map((option) => option.kind),
      ['flip', 'ready', 'overdue'],
    );
  });

  describe('sameChoices', () => {
    it('should tell equal choices from choices that differ in one reminder', () => {
      assert.equal(sameChoices(ALL, { flip: true, ready: true, overdue: true }), true);
      assert.equal(sameChoices(ALL, { ...ALL, ready: false }), false);
      assert.equal(sameChoices(NONE, { ...NONE, overdue: true }), false);
    });
  });

  describe('choicesText', () => {
    it('should list every reminder that is on, joined as a sentence', () => {
      assert.equal(choicesText(ALL), 'You get turn-day, ready-day and overdue reminders.');
      assert.equal(
        choicesText({ flip: false, ready: true, overdue: true }),
        'You get ready-day and overdue reminders.',
      );
    });

    it('should name a single reminder on its own', () => {
      assert.equal(
        choicesText({ flip: false, ready: false, overdue: true }),
        'You get overdue reminders.',
      );
    });

    it('should say so when every reminder is off', () => {
      assert.equal(choicesText(NONE), 'You get no reminders.');
    });
  });
});
