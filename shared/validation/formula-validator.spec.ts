import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { VALIDATORS, validatorSource } from '../../scripts/build-validator.mjs';

describe('the generated validators', () => {
  for (const validator of VALIDATORS) {
    it(`should match ${validator.schema} as it is now (run \`npm run build:validator\` after editing it)`, () => {
      assert.equal(readFileSync(validator.file, 'utf8'), validatorSource(validator));
    });
  }
});
