import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { readFormula } from '../formula/read-formula.ts';

// A dry-cured belly at 0.192 % of a 6.25 % curing salt: 120 ppm ingoing nitrite (FSIS Directive
// 7620.3, Processing Inspectors' Calculations Handbook, ch. 3: nitrite × 10⁶ ÷ green weight).
const belly = (species: string, controls: string, curingSalt = '0.192') => `formula: 1
id: test-belly
title: Test belly
kind: cure
method: dry
product: bacon
species: ${species}
ingredients:
  - { name: salt, pct: 2.3, salt: 100 }
  - { name: curing salt, pct: ${curingSalt}, nitrite: 6.25, salt: 93.75 }
controls:
${controls}`;

const mix = (controls: string) => `formula: 1
id: test-sauce
title: Test sauce
kind: mix
ingredients:
  - { name: tomato, pct: 100, base: true }
controls:
${controls}`;

/** The problems as "line:column severity message". */
function problems(text: string): string[] {
  return readFormula(text, 'test.yaml').problems.map(
    (problem) => `${problem.line}:${problem.column} ${problem.severity} ${problem.message}`,
  );
}

describe('checking a formula’s process controls', () => {
  it('accepts template rules and an own limit with its source', () => {
    const text = belly(
      'pork',
      `  - { id: smoker, title: Smoker, step: smoke, measure: chamber-temperature, limit: { min: 60 °C, max: 80 °C }, source: Quillmoor smoker validation, every: 30 min }
  - { id: chill, title: Chill, step: chill, measure: internal-temperature, rule: fsis-cooling-cured, every: 1 h }
`,
    );
    assert.deepEqual(problems(text), []);
    assert.equal(readFormula(text, 'test.yaml').formula?.controls?.length, 2);
  });

  it('refuses an unknown rule at its line and lists the rules', () => {
    const [problem] = problems(
      mix(
        '  - { id: cook, title: Cook, step: cook, measure: internal-temperature, rule: cook-it }\n',
      ),
    );
    assert.match(
      problem,
      /^8:73 error "cook-it" is not a process control rule; use one of fsis-lethality-instant, .*curing-room/,
    );
  });

  it('refuses an own limit without a source', () => {
    const [problem] = problems(
      mix(
        '  - { id: cool, title: Cool, step: cool, measure: internal-temperature, limit: { max: 5 °C } }\n',
      ),
    );
    assert.match(problem, /^8:5 error a limit of your own needs source/);
  });

  it('refuses a control id used twice', () => {
    const found = problems(
      mix(`  - { id: hold, title: Hold, step: hold, measure: internal-temperature, rule: cold-holding }
  - { id: hold, title: Hold again, step: hold, measure: internal-temperature, rule: hot-holding }
`),
    );
    assert.deepEqual(found, ['9:7 error the control id "hold" is used twice']);
  });

  it('refuses a unit that does not fit the measure', () => {
    const found = problems(
      mix(`  - id: ph
    title: Acidity
    step: mix
    measure: ph
    rule: cold-holding
  - id: smoker
    title: Smoker
    step: smoke
    measure: chamber-temperature
    limit: { max: 80 kg }
    source: own
`),
    );
    assert.equal(found.length, 2);
    assert.match(found[0], /^11:5 error "cold-holding" is a limit on temperature/);
    assert.match(found[1], /^17:14 error .*"kg" is not °C or °F/);
  });

  it('warns when a poultry formula uses a rule for other meat, saying why', () => {
    const [problem] = problems(
      belly(
        'poultry',
        '  - { id: cook, title: Cook, step: cook, measure: internal-temperature, rule: fsis-lethality-table }\n',
      ),
    );
    assert.match(
      problem,
      /^12:\d+ warning this formula may hold poultry, but "fsis-lethality-table" is for meat other than poultry/,
    );
  });

  it('warns when a pork formula uses a poultry rule', () => {
    const [problem] = problems(
      belly(
        'pork',
        '  - { id: cook, title: Cook, step: cook, measure: internal-temperature, rule: food-code-cook-poultry }\n',
      ),
    );
    assert.match(problem, /warning "food-code-cook-poultry" is for poultry/);
  });

  it('refuses the cured cooling option on a formula that is not a cure', () => {
    const [problem] = problems(
      mix(
        '  - { id: chill, title: Chill, step: chill, measure: internal-temperature, rule: fsis-cooling-cured }\n',
      ),
    );
    assert.match(
      problem,
      /error "fsis-cooling-cured" is for cured product .* this formula is not a cure/,
    );
  });

  it('refuses the cured cooling option on a cure under 100 ppm', () => {
    // 0.128 % of a 6.25 % curing salt: 0.128 × 0.0625 × 10⁴ = 80 ppm ingoing nitrite (FSIS 7620.3
    // ch. 3); the option needs 100 ppm (FSIS Appendix B, 1999, cured-product option)
    const found = problems(
      belly(
        'pork',
        '  - { id: chill, title: Chill, step: chill, measure: internal-temperature, rule: fsis-cooling-cured }\n',
        '0.128',
      ),
    );
    assert.ok(
      found.some((problem) => /error .*needs at least 100 ppm .*puts in 80 ppm/.test(problem)),
      found.join('\n'),
    );
  });

  it('refuses controls on an assembly', () => {
    const found = problems(`formula: 1
id: test-plate
title: Test plate
kind: assembly
components:
  - { formula: test-sauce, amount: 20 g }
controls:
  - { id: hold, title: Hold, step: serve, measure: internal-temperature, rule: hot-holding }
`);
    assert.ok(
      found.some((problem) =>
        /^7:1 error an assembly is put together from batches that carry their own controls/.test(
          problem,
        ),
      ),
      found.join('\n'),
    );
  });

  it('refuses a cooling limit of its own that goes up', () => {
    const found = problems(
      mix(`  - id: cool
    title: Cool
    step: cool
    measure: internal-temperature
    source: own
    limit:
      stages:
        - { from: 21 °C, to: 60 °C, within: 2 h }
`),
    );
    assert.match(found[0], /^15:11 error a cooling stage must go down/);
  });
});
