import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { readFormula } from './read-formula.ts';

const CURE = `formula: 1
id: turkey-breast
title: Cured turkey breast
kind: cure
method: dry
product: whole-muscle
ingredients:
  - { name: salt, pct: 2.5, salt: 100 }
  - { name: curing salt, pct: 0.25, nitrite: 6.25, salt: 93.75 }
`;

const BLEND = `formula: 1
id: house-grind
title: House grind
kind: blend
components:
  - { key: lean, name: lean trim, fat: 10 }
  - { key: fat, name: fat trim, fat: 50 }
target: { fat: 20 }
`;

const problemsOf = (text: string) => readFormula(text, 'test.yaml').problems;

describe('the species of a formula', () => {
  it('should be asked for, at the kind line, in a cure and a blend that lack it', () => {
    // source: USDA FSIS Safe Minimum Internal Temperature Chart — the cooking temperature
    // depends on the meat (145 °F whole cuts, 160 °F ground, 165 °F poultry)
    for (const text of [CURE, BLEND]) {
      const reading = readFormula(text, 'test.yaml');
      assert.ok(reading.formula, 'an old file still calculates, with poultry’s temperature');
      const asked = reading.problems.filter((p) => /which meat/.test(p.message));
      assert.equal(asked.length, 1, reading.problems.map((p) => p.message).join('\n'));
      assert.equal(asked[0].severity, 'warning');
      assert.equal(asked[0].line, 4);
      assert.match(asked[0].message, /species: beef, pork, lamb, veal or poultry/);
      assert.match(asked[0].message, /74 °C \(165 °F\)/);
    }
  });

  it('should be accepted as one meat or a list of the meats in a mixture', () => {
    assert.deepEqual(problemsOf(`${CURE}species: poultry\n`), []);
    assert.deepEqual(problemsOf(`${CURE}species: [pork, beef]\n`), []);
    assert.deepEqual(problemsOf(`${BLEND}species:\n  - pork\n  - poultry\n`), []);
    assert.deepEqual(problemsOf(`${BLEND}species: mixed\n`), []);
  });

  it('should refuse a meat it does not know, in one word or in a list, in a cook’s words', () => {
    const one = problemsOf(`${CURE}species: turky\n`);
    assert.deepEqual(
      one.map((p) => [p.line, p.severity, p.message]),
      [
        [
          10,
          'error',
          '"species" must be one of beef, pork, lamb, veal, poultry, mixed, not "turky"',
        ],
      ],
    );
    const listed = problemsOf(`${CURE}species: [pork, porc]\n`);
    assert.deepEqual(
      listed.map((p) => [p.line, p.severity, p.message]),
      [
        [
          10,
          'error',
          'this item must be one of beef, pork, lamb, veal, poultry, not "porc"; did you mean "pork"?',
        ],
      ],
    );
    const twice = problemsOf(`${CURE}species: [pork, pork]\n`);
    assert.deepEqual(
      twice.map((p) => p.message),
      ['"species" lists the same thing twice'],
    );
  });
});
