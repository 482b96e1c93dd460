import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { VALIDATOR_FILE, validatorSource } from '../../scripts/build-validator.mjs';

describe('the generated formula validator', () => {
  it('should match the schema as it is now (run `npm run build:validator` after editing the schema)', () => {
    assert.equal(readFileSync(VALIDATOR_FILE, 'utf8'), validatorSource());
  });
});
