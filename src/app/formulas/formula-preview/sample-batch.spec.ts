import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { DEFAULT_SAMPLE, batchMessage, batchOptions } from './sample-batch.ts';

describe('batchOptions', () => {
  it('should send a cure its meat and thickness, and leave empty fields out', () => {
    assert.deepEqual(batchOptions('cure', DEFAULT_SAMPLE, 'dry'), {
      meat: '5 kg',
      thickness: '4 cm',
    });
  });

  it('should send the weight after injecting only for a pump cure', () => {
    const sample = { ...DEFAULT_SAMPLE, pumpedWeight: '5.6 kg' };
    assert.equal(batchOptions('cure', sample, 'dry').pumpedWeight, undefined);
    assert.equal(batchOptions('cure', sample, 'pump').pumpedWeight, '5.6 kg');
  });

  it('should scale a mix by its total or by its base, not both', () => {
    assert.deepEqual(batchOptions('mix', DEFAULT_SAMPLE, null), { total: '2 kg' });
    assert.deepEqual(batchOptions('mix', { ...DEFAULT_SAMPLE, mixBy: 'base' }, null), {
      base: '1 kg',
    });
  });
});

describe('batchMessage', () => {
  it('should name a batch field as the screen does, not as the command line does', () => {
    assert.equal(
      batchMessage('--largest-piece must be more than 0'),
      '“Heaviest piece” must be more than 0',
    );
  });
});
