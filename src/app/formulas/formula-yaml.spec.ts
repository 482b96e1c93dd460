import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Formula } from './formula-api-types.ts';
import { formulaLimitProblem, parseFormulaYaml, writeFormulaYaml } from './formula-yaml.ts';

/** Notes that open 127,000 lists: the text that ran the server's heap out, pasted in the editor. */
const DEEP = `${'formula: 1\nid: x\ntitle: x\nkind: mix\n'}notes: ${'['.repeat(127_000)}${']'.repeat(127_000)}`;

const TEXT = `# a comment the author wrote
formula: 1
id: test-mix
title: Test mix
kind: mix
ingredients:
  - { name: oil, pct: 100, base: true } # the base
  - { name: garlic, pct: 2, allergens: [sesame] }
`;

describe('writeFormulaYaml', () => {
  it('should change only the value that changed, keeping comments and one-line rows', () => {
    const formula = parseFormulaYaml(TEXT) as Formula & { ingredients: { pct: number }[] };
    formula.ingredients[1].pct = 2.5;
    const text = writeFormulaYaml(TEXT, formula);
    assert.equal(text, TEXT.replace('pct: 2,', 'pct: 2.5,'));
  });

  it('should write a new row in the style of the rows before it', () => {
    const formula = parseFormulaYaml(TEXT) as Formula & { ingredients: object[] };
    formula.ingredients.push({ name: 'salt', pct: 1 });
    const text = writeFormulaYaml(TEXT, formula);
    assert.match(text, /\n {2}- \{ name: salt, pct: 1 \}\n$/);
  });

  it('should drop a key the formula no longer has', () => {
    const formula = parseFormulaYaml(TEXT) as Formula & { ingredients: { allergens?: string[] }[] };
    delete formula.ingredients[1].allergens;
    assert.ok(!writeFormulaYaml(TEXT, formula).includes('allergens'));
  });

  it('should write the formula afresh when the text is not valid YAML', () => {
    const formula = parseFormulaYaml(TEXT) as Formula;
    const text = writeFormulaYaml('id: [unclosed', formula);
    assert.deepEqual(parseFormulaYaml(text), formula);
  });
});

describe('parseFormulaYaml', () => {
  it('should give null for text that is not a YAML map', () => {
    assert.equal(parseFormulaYaml('- a list'), null);
    assert.equal(parseFormulaYaml('id: [unclosed'), null);
  });

  it('should give null for text nested beyond any formula, without parsing it', () => {
    assert.equal(parseFormulaYaml(DEEP), null);
  });
});

describe('formulaLimitProblem', () => {
  it('should give the problem the server gives, at its line and column, for text past a limit', () => {
    // Line 5 is "notes: [[[…": the keys are level 1, so the 32nd "[" (column 8 + 31) opens level 33.
    assert.deepEqual(formulaLimitProblem(DEEP), {
      file: 'formula.yaml',
      line: 5,
      column: 39,
      path: [],
      message:
        'the file nests lists and sets of keys more than 32 levels deep here; a formula needs only a few',
      severity: 'error',
    });
  });

  it('should give null for a formula within the limits', () => {
    assert.equal(formulaLimitProblem(TEXT), null);
  });
});
