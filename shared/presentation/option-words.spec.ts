import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BatchError } from '../calculation/batch-error.ts';
import { OPTION_WORDS, optionsInWords } from './option-words.ts';

describe('batch options in a cook’s words', () => {
  it('should put a field’s words in place of each option', () => {
    assert.equal(
      optionsInWords('give --thickness to get a ready date'),
      'give the thickness of the thickest piece to get a ready date',
    );
    assert.equal(
      optionsInWords(
        'The water temperature was not worked out: give --room and --flour-temp (°C or °F).',
      ),
      'The water temperature was not worked out: give the room temperature and the flour temperature (°C or °F).',
    );
    assert.equal(
      optionsInWords('--base must be more than 0 g, not 0 g'),
      'The base ingredient weight must be more than 0 g, not 0 g',
    );
    assert.equal(
      optionsInWords(
        'Give the batch size with one of --total (raw meat weight), --on-hand KEY=WEIGHT (trimmings).',
      ),
      'Give the batch size with one of the total weight (raw meat weight), the trimmings on hand (trimmings).',
    );
  });

  it('should send a cook to the Plans page instead of a command to type', () => {
    assert.equal(
      optionsInWords(
        'ham is an assembly, not one batch: plan it with `larder plan ham --count N --for YYYY-MM-DD`, which works out every batch it needs',
      ),
      'ham is an assembly, not one batch: plan it on the Plans page, which works out every batch it needs',
    );
  });

  it('should name every option the CLI takes for a batch', () => {
    const names = ['start', 'want', 'meat', 'thickness', 'largest-piece', 'room', 'flour-temp'];
    for (const name of names) assert.ok(OPTION_WORDS[name], name);
  });

  it('should leave no flag in the core’s own refusals', () => {
    for (const message of [
      new BatchError('give either --meat or --want, not both', 'want').message,
      new BatchError('--pump must be more than 0 %', 'pump').message,
    ])
      assert.doesNotMatch(optionsInWords(message), /--/);
  });
});
