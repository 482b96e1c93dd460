import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ApiError } from './api-error.ts';
import { SOMETHING_WENT_WRONG, messageOf } from './message-of.ts';

// The server's words: server/people/people-router.ts (username taken).
const taken = new ApiError(409, 'username-taken', 'the username "mara" is taken');

describe('messageOf', () => {
  it('should give the API message as the server wrote it', () => {
    assert.equal(messageOf(taken), 'the username "mara" is taken');
  });

  it('should give the API message as a sentence when asked', () => {
    assert.equal(messageOf(taken, 'Not added.', 'sentence'), 'The username "mara" is taken.');
  });

  it('should not add a full stop to a sentence that already ends in one', () => {
    const ended = new ApiError(403, 'forbidden', 'Only an admin can do that!');
    assert.equal(messageOf(ended, 'Not done.', 'sentence'), 'Only an admin can do that!');
  });

  it('should say the fallback for a failure that is not the API’s', () => {
    assert.equal(messageOf(new TypeError('x is undefined')), SOMETHING_WENT_WRONG);
    assert.equal(
      messageOf(new Error('boom'), 'The list could not be loaded.'),
      'The list could not be loaded.',
    );
  });

  it('should say the fallback when the API message is blank', () => {
    const blank = new ApiError(500, 'http', '  ');
    assert.equal(messageOf(blank, 'Not saved.'), 'Not saved.');
    assert.equal(messageOf(blank, 'Not saved.', 'sentence'), 'Not saved.');
  });

  it('should name a batch input by its field, never by the command-line option', () => {
    // The core's words: shared/calculation/cure/calculate-cure.ts (meat and want together).
    const both = new ApiError(400, 'bad-batch', 'give either --meat or --want, not both');
    assert.equal(
      messageOf(both),
      'give either the green meat weight or the finished weight wanted, not both',
    );
    assert.equal(
      messageOf(both, 'Not worked out.', 'sentence'),
      'Give either the green meat weight or the finished weight wanted, not both.',
    );
  });
});
