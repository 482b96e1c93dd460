import assert from 'node:assert/strict';
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, it } from 'node:test';
import { readCatalogue } from '../../shared/index.ts';
import { SHIPPED_FORMULAS, ensureDemoFormulas } from './demo-formulas.ts';

describe('the demo copy of the formulas', () => {
  it('should hold every shipped file, the catalogue of materials among them', (t) => {
    const dir = mkdtempSync(path.join(tmpdir(), 'larder-demo-formulas-'));
    t.after(() => rmSync(dir, { recursive: true, force: true }));
    const copy = path.join(dir, 'formulas');
    ensureDemoFormulas(copy);
    const shipped = readdirSync(SHIPPED_FORMULAS).filter((name) => !name.startsWith('.'));
    assert.deepEqual(readdirSync(copy).sort(), shipped.sort());
    const text = readFileSync(path.join(copy, 'catalogue.yaml'), 'utf8');
    assert.equal(text, readFileSync(path.join(SHIPPED_FORMULAS, 'catalogue.yaml'), 'utf8'));
    assert.deepEqual(readCatalogue(text, 'catalogue.yaml').problems, []);
  });
});
