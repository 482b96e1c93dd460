import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { speciesChoices, speciesFromChoices } from './species-choices.ts';

describe('the meat select of a cure or blend', () => {
  it('should write nothing, one meat, or the list of meats in a mixture', () => {
    assert.equal(speciesFromChoices([]), undefined);
    assert.equal(speciesFromChoices(['poultry']), 'poultry');
    assert.deepEqual(speciesFromChoices(['pork', 'beef']), ['pork', 'beef']);
    assert.equal(speciesFromChoices(['mixed']), 'mixed');
  });

  it('should keep the meats named when "mixed" is chosen with them, for the right temperature', () => {
    // source: USDA FSIS Safe Minimum Internal Temperature Chart — named meats give their own line
    // (pork and beef ground 160 °F); an unnamed mixture can only be given poultry's 165 °F
    assert.deepEqual(speciesFromChoices(['mixed', 'pork', 'beef']), ['pork', 'beef']);
  });

  it('should show a formula’s species as the meats chosen', () => {
    assert.deepEqual(speciesChoices(undefined), []);
    assert.deepEqual(speciesChoices('lamb'), ['lamb']);
    assert.deepEqual(speciesChoices(['pork', 'poultry']), ['pork', 'poultry']);
  });
});
