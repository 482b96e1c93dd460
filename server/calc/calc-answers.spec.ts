import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { CalcAnswers, calcAnswerKeyText } from './calc-answers.ts';

const key = (batch: Record<string, string>, revision = 'r1') =>
  calcAnswerKeyText({
    file: 'house-sauce.yaml',
    revision,
    libraryRevision: '',
    units: 'metric',
    today: '2026-03-02',
    batch,
  });

describe('calculation answers kept', () => {
  it('should give one key to one batch in any order of its options, and another to any change', () => {
    assert.equal(key({ meat: '4kg', thickness: '4cm' }), key({ thickness: '4cm', meat: '4kg' }));
    assert.notEqual(key({ meat: '4kg' }), key({ meat: '4 kg' }));
    assert.notEqual(key({ meat: '4kg' }), key({ meat: '4kg' }, 'r2'));
    // A value holding the text of another option cannot pass for it.
    assert.notEqual(key({ meat: '4kg","thickness' }), key({ meat: '4kg', thickness: '' }));
  });

  it('should drop the least recently used answer first when full, by count and by bytes', () => {
    const answers = new CalcAnswers(2, 10);
    answers.set('a', Buffer.from('1111'));
    answers.set('b', Buffer.from('2222'));
    assert.ok(answers.get('a'), 'a is now the newer');
    answers.set('c', Buffer.from('3333'));
    assert.equal(answers.get('b'), undefined);
    assert.equal(answers.get('a')?.toString(), '1111');
    // Four and four and six bytes are more than ten: the least recently used, c, goes.
    answers.set('d', Buffer.from('444444'));
    assert.deepEqual(
      [answers.get('c'), answers.get('a')?.toString(), answers.get('d')?.toString()],
      [undefined, '1111', '444444'],
    );
    // Seven bytes more: a and d both go, the older first, until the new one fits.
    answers.set('e', Buffer.from('5555555'));
    assert.deepEqual([answers.get('a'), answers.get('d')], [undefined, undefined]);
    assert.ok(answers.stats().bytes <= 10);
  });

  it('should keep nothing when asked to keep no answers', () => {
    const answers = new CalcAnswers(0);
    answers.set('a', Buffer.from('1'));
    assert.equal(answers.get('a'), undefined);
    assert.equal(answers.stats().entries, 0);
  });
});
