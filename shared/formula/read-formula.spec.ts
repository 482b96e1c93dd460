import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { formatProblem, placeProblems, readFormula } from './read-formula.ts';

const GOOD = `formula: 1
id: test-belly
title: Test belly
kind: cure
method: dry
product: bacon
ingredients:
  - { name: salt, pct: 2.25, salt: 100 }
  - { name: curing salt, pct: 0.25, nitrite: 6.25, salt: 93.75 }
`;

function only(text: string) {
  const reading = readFormula(text, 'test.yaml');
  assert.equal(reading.formula, undefined, 'expected the formula to be refused');
  return reading.problems;
}

describe('readFormula', () => {
  it('should accept a valid formula with no problems', () => {
    const reading = readFormula(`${GOOD}species: pork\n`, 'test.yaml');
    assert.equal(reading.problems.length, 0);
    assert.equal(reading.formula?.id, 'test-belly');
  });

  it('should keep the id "catalogue" for the catalogue of materials', () => {
    const problems = only(`${GOOD.replace('id: test-belly', 'id: catalogue')}species: pork\n`);
    // "id:" is line 2, column 1 of GOOD. own example
    assert.deepEqual(
      problems.map((p) => [p.line, p.column, p.message]),
      [
        [
          2,
          1,
          'the id "catalogue" is kept for the catalogue of materials (catalogue.yaml); give the formula another',
        ],
      ],
    );
  });

  it('should say what an item key looks like', () => {
    const problems = only(GOOD.replace('{ name: salt,', '{ name: salt, item: Kosher Salt,'));
    // The salt line is line 8; "item" is its second key, at column 19. own example
    assert.deepEqual(
      problems.map((p) => [p.line, p.column, p.message]),
      [
        [
          8,
          19,
          '"item" must be the key of an item in the catalogue: lower-case letters, digits and dashes, starting with a letter, e.g. "kosher-salt", not "Kosher Salt"',
        ],
      ],
    );
  });

  it('should name the line and column of a YAML syntax error', () => {
    const problems = only(
      GOOD.replace(
        '  - { name: salt, pct: 2.25, salt: 100 }',
        '  - { name: salt, pct: 2.25, salt: 100',
      ),
    );
    assert.equal(problems[0].line, 9);
    assert.match(problems[0].message, /^YAML:/);
  });

  it('should refuse tabs for indentation and say so in plain words', () => {
    const problems = only(GOOD.replace('  - { name: curing', '\t- { name: curing'));
    assert.ok(problems.some((p) => /indent with spaces, not tabs/.test(p.message) && p.line === 9));
  });

  it('should refuse a key given twice', () => {
    const problems = only(`${GOOD}title: Again\n`);
    assert.equal(problems[0].line, 10);
    assert.match(problems[0].message, /given twice/);
  });

  it('should refuse an unknown key, point at it and suggest the right one', () => {
    const problems = only(GOOD.replace('pct: 2.25, salt', 'pcts: 2.25, salt'));
    const unknown = problems.find((p) => p.message.includes('unknown key "pcts"'));
    assert.ok(unknown);
    assert.match(unknown.message, /did you mean "pct"/);
    assert.deepEqual([unknown.line, unknown.column], [8, 19]);
    assert.match(
      formatProblem(unknown),
      /^test\.yaml:8:19: error: unknown key "pcts".*\(at ingredients\[1\]\.pcts\)$/,
    );
  });

  it('should refuse an unknown top-level key', () => {
    const problems = only(`${GOOD}colour: red\n`);
    assert.deepEqual([problems[0].line, problems[0].column], [10, 1]);
    assert.match(problems[0].message, /unknown key "colour"/);
  });

  it('should say a percentage must be a number and show what it got', () => {
    const problems = only(GOOD.replace('pct: 2.25', 'pct: two'));
    assert.ok(
      problems.some((p) => p.message === '"pct" should be a number, not "two"' && p.line === 8),
    );
  });

  it('should name a missing required key', () => {
    const problems = only(GOOD.replace('product: bacon\n', ''));
    assert.ok(problems.some((p) => p.message === '"product" is missing'));
  });

  it('should list the allowed values and guess the intended one', () => {
    const problems = only(GOOD.replace('method: dry', 'method: dyr'));
    assert.ok(
      problems.some(
        (p) =>
          /must be one of dry, brine, pump, not "dyr"; did you mean "dry"\?/.test(p.message) &&
          p.line === 5,
      ),
    );
  });

  it('should refuse an unknown kind', () => {
    const problems = only(GOOD.replace('kind: cure', 'kind: sauce'));
    assert.ok(
      problems.some((p) => /"kind" must be one of cure, dough, blend, mix/.test(p.message)),
    );
  });

  it('should refuse percentages that cannot be right', () => {
    const problems = only(GOOD.replace('pct: 2.25', 'pct: 0').replace('pct: 0.25', 'pct: 45'));
    assert.ok(problems.some((p) => p.message === '"pct" must be more than 0, not 0'));
    assert.ok(problems.some((p) => p.message === '"pct" must be at most 30, not 45'));
  });

  it('should refuse a formula over its critical limit, naming the rule', () => {
    // source: 9 CFR 424.22(b), dry-cured bacon 200 ppm; 0.4 % of a 6.25 % mix = 250 ppm
    const problems = only(GOOD.replace('pct: 0.25', 'pct: 0.4'));
    assert.ok(
      problems.some((p) =>
        /critical limit exceeded: ingoing sodium nitrite 250\.0 ppm is over 200 ppm for dry-cured bacon/.test(
          p.message,
        ),
      ),
    );
  });

  it('should locate content problems the schema cannot see', () => {
    const problems = only(
      `${GOOD.replace('method: dry\nproduct: bacon', 'method: brine\nproduct: comminuted')}species: pork\n`,
    );
    assert.deepEqual([problems[0].line, problems[0].column], [5, 1]);
    assert.match(problems[0].message, /use method "dry"/);
  });

  it('should refuse more than one document, an empty file and a file that is not a set of keys', () => {
    assert.match(only(`${GOOD}---\n${GOOD}`)[0].message, /one formula per file/);
    assert.match(only('   \n')[0].message, /empty/);
    assert.match(only('- just\n- a list\n')[0].message, /set of keys/);
  });

  it('should stop an alias bomb instead of expanding it', () => {
    const bomb = ['a: &a [x, x, x, x, x, x, x, x, x]'];
    for (let i = 0; i < 8; i++) {
      const name = String.fromCharCode(98 + i);
      const previous = String.fromCharCode(97 + i);
      bomb.push(
        `${name}: &${name} [*${previous}, *${previous}, *${previous}, *${previous}, *${previous}, *${previous}, *${previous}, *${previous}, *${previous}]`,
      );
    }
    const problems = only(`${bomb.join('\n')}\n`);
    assert.match(problems[0].message, /^YAML:/);
  });

  it('should refuse a file larger than a formula can reasonably be', () => {
    assert.match(only(`${GOOD}notes: "${'x'.repeat(300_000)}"\n`)[0].message, /larger than/);
  });

  it('should refuse a file nested beyond any formula, at the line and column of the level too many', () => {
    const problems = only(`${GOOD}notes: ${'['.repeat(127_000)}${']'.repeat(127_000)}`);
    // Line 10 is "notes: [[[…": the keys are level 1, so the 32nd "[" (column 8 + 31) opens level 33.
    assert.deepEqual(
      problems.map((p) => [p.line, p.column]),
      [[10, 39]],
    );
    assert.match(problems[0].message, /more than 32 levels deep/);
  });

  it('should place problems in a file nested beyond any formula on the whole file, unparsed', () => {
    const deep = `${GOOD}notes: ${'['.repeat(127_000)}`;
    const placed = placeProblems(deep, 'deep.yaml', [
      { path: ['ingredients', 0], message: 'a problem', severity: 'error' },
    ]);
    assert.deepEqual(
      placed.map((p) => [p.file, p.line, p.column, p.message]),
      [['deep.yaml', 0, 0, 'a problem']],
    );
  });
});
