import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { parse } from 'yaml';
import { isFormulaFileName, readFormula } from '../../shared/index.ts';
import { mergeFormulaIntoYaml } from './merge-formula-yaml.ts';

const FORMULAS = path.join(import.meta.dirname, '..', '..', 'formulas');

const SOURCE = `# top comment
formula: 1 # file format version
id: test-mix
title: Test mix
kind: mix

# the ingredients
ingredients:
  - { name: salt, pct: 100, base: true } # the base
  - name: pepper # block item
    pct: 10
    allergens: [mustard]
steps:
  - one
  - two
notes: keep
`;

function json(text: string): Record<string, unknown> {
  return parse(text) as Record<string, unknown>;
}

describe('mergeFormulaIntoYaml', () => {
  it('should give back every demo formula unchanged when its own values are merged in', () => {
    for (const name of readdirSync(FORMULAS).filter(isFormulaFileName)) {
      const text = readFileSync(path.join(FORMULAS, name), 'utf8');
      const formula = readFormula(text, name).formula;
      assert.ok(formula, name);
      assert.equal(mergeFormulaIntoYaml(text, structuredClone(formula) as never), text, name);
    }
  });

  it('should change only the value that changed, keeping its comment', () => {
    const value = json(SOURCE);
    (value.ingredients as { pct: number }[])[0].pct = 90;
    (value.ingredients as { pct: number }[])[1].pct = 12.5;
    value.formula = 1;
    const merged = mergeFormulaIntoYaml(SOURCE, value);
    assert.equal(
      merged,
      SOURCE.replace('pct: 100, base', 'pct: 90, base').replace('pct: 10\n', 'pct: 12.5\n'),
    );
  });

  it('should drop keys, add new ones at the end and trim or grow lists', () => {
    const value = json(SOURCE);
    delete value.notes;
    value.cautions = ['hot'];
    value.steps = ['one'];
    (value.ingredients as unknown[]).push({ name: 'garlic', pct: 3 });
    const merged = mergeFormulaIntoYaml(SOURCE, value);
    assert.deepEqual(parse(merged), value);
    assert.ok(merged.includes('# the ingredients\n'));
    // A new item takes the style of the item before it: here a block map.
    assert.ok(merged.includes('    allergens: [mustard]\n  - name: garlic\n    pct: 3\n'), merged);
    assert.ok(merged.endsWith('steps:\n  - one\ncautions:\n  - hot\n'), merged);
  });

  it('should quote a new text where YAML needs it', () => {
    const value = json(SOURCE);
    value.title = 'Salt: the mix #1';
    value.notes = '100';
    const merged = mergeFormulaIntoYaml(SOURCE, value);
    assert.deepEqual(parse(merged), value);
  });

  it('should write a file that is not valid YAML afresh', () => {
    const value = json(SOURCE);
    assert.deepEqual(parse(mergeFormulaIntoYaml('formula: [\n', value)), value);
  });

  it('should write afresh a file nested deeper than a formula may be, without parsing it', () => {
    const value = json(SOURCE);
    const deep = `notes: ${'['.repeat(100_000)}${']'.repeat(100_000)}\n`;
    assert.deepEqual(parse(mergeFormulaIntoYaml(deep, value)), value);
  });

  it('should refuse a formula with more values than any formula file may hold', () => {
    // 5,001 steps and the formula itself: past the 5,000 values a file may hold.
    assert.throws(
      () => mergeFormulaIntoYaml(SOURCE, { ...json(SOURCE), steps: Array(5001).fill('stir') }),
      (error: unknown) =>
        error instanceof RangeError && /more than 5000 values/.test(error.message),
    );
  });

  it('should refuse a formula nested deeper than any formula is', () => {
    let deep: unknown = 1;
    for (let i = 0; i < 40; i++) deep = [deep];
    assert.throws(
      () => mergeFormulaIntoYaml(SOURCE, { ...json(SOURCE), notes: deep }),
      (error: unknown) => error instanceof RangeError,
    );
  });
});
