import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { isCatalogueFile, isFormulaFileName } from './catalogue-file.ts';

describe('the catalogue among the formula files', () => {
  it('should know the catalogue by its one name, in any folder', () => {
    assert.equal(isCatalogueFile('catalogue.yaml'), true);
    assert.equal(isCatalogueFile('formulas/catalogue.yaml'), true);
    assert.equal(isCatalogueFile('C:\\kitchen\\formulas\\catalogue.yaml'), true);
    // Any other spelling is read as a formula, whose problems then say what is wrong.
    assert.equal(isCatalogueFile('Catalogue.yaml'), false);
    assert.equal(isCatalogueFile('catalogue.yml'), false);
  });

  it('should take every other YAML file for a formula', () => {
    assert.deepEqual(
      ['ham-pump.yaml', 'bun.YML', 'catalogue.yaml', 'notes.md', 'formulas/catalogue.yaml'].filter(
        isFormulaFileName,
      ),
      ['ham-pump.yaml', 'bun.YML'],
    );
  });
});
