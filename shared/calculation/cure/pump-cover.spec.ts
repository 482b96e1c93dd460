import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CureFormula, CureIngredient } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult } from '../calc-result.ts';
import { calculateCure } from './calculate-cure.ts';
import { checkCureFormula } from './check-cure-formula.ts';

// The FSIS formulas these tests work by hand. source: USDA FSIS Directive 7620.3, Processing
// Inspectors' Calculations Handbook (1995), ch. 3 — pumped: nitrite in pickle × pump fraction
// × 10⁶ ÷ pickle weight; immersion method one: the same with the pick-up fraction; immersion
// method two: nitrite × 10⁶ ÷ (green weight + pickle weight).

const d = (value: string | number): Decimal => new Decimal(value);
const CURING_SALT = { name: 'curing salt', nitrite: 6.25, salt: 93.75 };
const SALT = { name: 'kosher salt', salt: 100 };

/** A pumped ham: 12 % pump, curing salt at `cure` % of green weight. */
function ham(cure: number, overrides: Partial<CureFormula> = {}): CureFormula {
  return {
    formula: 1,
    id: 'test-ham',
    title: 'Test ham',
    kind: 'cure',
    method: 'pump',
    product: 'whole-muscle',
    brine: { pump_pct: 12, cover_pct: 25, extra_pct: 10 },
    ingredients: [
      { ...SALT, pct: 1.8 },
      { ...CURING_SALT, pct: cure },
      { name: 'light brown sugar', pct: 1 },
      { name: 'sodium erythorbate', pct: 0.05, accelerator: 100 },
    ],
    ...overrides,
  };
}

const PLAIN_COVER: CureIngredient[] = [
  { ...SALT, pct: 4 },
  { name: 'white sugar', pct: 2 },
];

function check(result: CalcResult, id: string) {
  const found = result.checks.find((c) => c.id === id);
  assert.ok(found, `check ${id}`);
  return found;
}

function group(result: CalcResult, title: string) {
  const found = result.groups.find((g) => g.title === title);
  assert.ok(found, `group ${title}: ${result.groups.map((g) => g.title).join(', ')}`);
  return found;
}

function grams(result: CalcResult, title: string, name: string): string {
  const found = group(result, title).lines.find((l) => l.name === name);
  assert.ok(found, `${title}: ${name}`);
  return found.grams.toString();
}

function figure(result: CalcResult, label: string): Decimal {
  const found = result.figures.find((f) => f.label === label);
  assert.ok(found, `figure ${label}`);
  return found.value as Decimal;
}

describe('a pump cure held under a cover brine', () => {
  it('counts a cover of the same brine with the meat and all pickle as one system (method two)', () => {
    // The ham-pump by hand: 0.24 % curing salt ÷ 12 % pump = 2 % of the brine, 1250 ppm
    // nitrite; 0.12 + 0.25 = 0.37 of green weight in pickle carries 0.4625 mg per g of meat;
    // 462.5 ÷ 1.37 = 337.591… ppm, over the 200 ppm for pumped product other than bacon.
    // source: FSIS 7620.3 ch. 3 immersion method two; 9 CFR 424.21(c) 200 ppm
    const result = calculateCure(ham(0.24), { meat: d(10_000) });
    const max = check(result, 'nitrite-max');
    assert.equal(max.value.toFixed(4), '337.5912');
    assert.equal(max.status, 'fail');
    assert.equal(max.critical, true);
    assert.match(max.label, /method two/);
  });

  it('still checks the injected figure when the cover is weaker and it is the larger', () => {
    // A cover of plain salt and sugar: nitrite only in the injection. 0.25 % curing salt → 156.25
    // ppm by the pumped formula; method two gives 0.25 % × 6.25 % × 10⁶ ÷ 1.37 = 114.05 ppm;
    // the larger, 156.25, is checked. source: FSIS 7620.3 ch. 3 pumped formula and method two
    const result = calculateCure(ham(0.25, { cover_brine: PLAIN_COVER }), { meat: d(10_000) });
    const max = check(result, 'nitrite-max');
    assert.equal(max.value.toString(), '156.25');
    assert.equal(max.status, 'pass');
    assert.match(max.label, /pumped/);
  });

  it('weighs a cover brine of its own make-up on its own lines, and the pump brine without it', () => {
    // Own example, 10 kg of meat: cover 25 % = 2500 g at 4 % salt and 2 % sugar → 100 g salt,
    // 50 g sugar, 2350 g water; the pump brine is 12 % × 1.10 extra = 1320 g.
    const result = calculateCure(ham(0.25, { cover_brine: PLAIN_COVER }), { meat: d(10_000) });
    assert.equal(grams(result, 'Cover brine make-up', 'kosher salt'), '100');
    assert.equal(grams(result, 'Cover brine make-up', 'white sugar'), '50');
    assert.equal(grams(result, 'Cover brine make-up', 'water'), '2350');
    const pump = group(result, 'Brine make-up').lines.reduce((s, l) => s.plus(l.grams), d(0));
    assert.equal(pump.toString(), '1320');
    // source: "The Salometer and How to Use It" (°SAL = % salt ÷ 26.395 × 100):
    // 100 ÷ (100 + 2350) = 4.0816 % → 15.46 °SAL
    assert.equal(figure(result, 'Cover brine strength').toFixed(4), '4.0816');
    assert.equal(figure(result, 'Cover brine salinometer').toFixed(2), '15.46');
  });

  it('counts nitrite the cover brine carries by method two when it is the larger', () => {
    // Cover of 0.5 % curing salt = 312.5 ppm nitrite (0.5 % × 6.25 %). Nitrite per g of meat:
    // injected 0.25 % × 6.25 % = 0.15625 mg, cover 0.25 g × 312.5 ppm = 0.078125 mg; together
    // 0.234375 mg over 1.37 g of meat and pickle = 171.0766 ppm, over the 156.25 injected.
    // source: FSIS 7620.3 ch. 3 method two
    const cover = [...PLAIN_COVER, { ...CURING_SALT, pct: 0.5 }];
    const result = calculateCure(ham(0.25, { cover_brine: cover }), { meat: d(10_000) });
    assert.equal(check(result, 'nitrite-max').value.toFixed(4), '171.0766');
    assert.match(check(result, 'nitrite-max').label, /method two/);
  });

  it('adds a measured pick-up from the cover to the injected figure (method one)', () => {
    // 156.25 injected + 3 % pick-up × 312.5 ppm in the cover = 156.25 + 9.375 = 165.625 ppm.
    // source: FSIS 7620.3 ch. 3 immersion method one (pick-up fraction in place of the pump)
    const cover = [...PLAIN_COVER, { ...CURING_SALT, pct: 0.5 }];
    const formula = ham(0.25, {
      brine: { pump_pct: 12, cover_pct: 25, cover_pickup_pct: 3, extra_pct: 10 },
      cover_brine: cover,
    });
    const max = check(calculateCure(formula, { meat: d(10_000) }), 'nitrite-max');
    assert.equal(max.value.toString(), '165.625');
    assert.match(max.label, /method one/);
  });

  it('adds a measured pick-up of the same brine to the injected figure', () => {
    // 150 ppm injected + 2 % × 1250 ppm = 175 ppm. source: FSIS 7620.3 ch. 3 method one
    const formula = ham(0.24, {
      brine: { pump_pct: 12, cover_pct: 25, cover_pickup_pct: 2, extra_pct: 10 },
    });
    assert.equal(
      check(calculateCure(formula, { meat: d(10_000) }), 'nitrite-max').value.toString(),
      '175',
    );
  });

  it('counts the accelerator and nitrate by the same rule', () => {
    // Erythorbate 0.05 % ÷ 12 % = 0.41667 % of the brine; method two: 0.05 % × 0.37 ÷ 0.12 ÷
    // 1.37 × 10⁶ = 1125.304 ppm (against 500 ppm injected). source: FSIS 7620.3 ch. 3 method two
    const same = calculateCure(ham(0.24), { meat: d(10_000) });
    assert.equal(figure(same, 'Ingoing ascorbate/erythorbate').toFixed(3), '1125.304');
    // Nitrate only in the cover of a pumped bacon: 1 % of a cover at 25 % → 0.25 % of green
    // weight over 1 + 0.10 + 0.25 = 1.35 → 1851.9 ppm; nitrate is not permitted in bacon.
    // source: FSIS 7620.3 ch. 3 method two; 9 CFR 424.21(c)
    const bacon = ham(0.192, {
      product: 'bacon',
      brine: { pump_pct: 10, cover_pct: 25 },
      ingredients: [
        { ...SALT, pct: 1.5 },
        { ...CURING_SALT, pct: 0.192 },
        { name: 'sodium erythorbate', pct: 0.055, accelerator: 100 },
      ],
      cover_brine: [{ name: 'saltpetre', pct: 1, nitrate: 100 }],
    });
    const nitrate = check(calculateCure(bacon, { meat: d(10_000) }), 'nitrate-max');
    assert.equal(nitrate.value.toFixed(1), '1851.9');
    assert.equal(nitrate.status, 'fail');
  });

  it('declares the allergens of the cover brine’s own ingredients', () => {
    // What the meat rests in reaches the food: FALCPA 2004 names soy a major food allergen.
    const cover = [...PLAIN_COVER, { name: 'soy sauce', pct: 5, salt: 15, allergens: ['soy'] }];
    const result = calculateCure(ham(0.25, { cover_brine: cover as CureIngredient[] }), {
      meat: d(1000),
    });
    assert.deepEqual(result.allergens, ['soy']);
  });

  it('refuses a cover brine saltier than saturated', () => {
    // source: saturated brine is 26.395 % salt, 100 °SAL at 60 °F ("The Salometer and How to
    // Use It"); 27 % salt is over it
    const formula = ham(0.25, { cover_brine: [{ ...SALT, pct: 27 }] });
    assert.throws(
      () => calculateCure(formula, { meat: d(1000) }),
      (e: unknown) => e instanceof BatchError && /cover brine/.test(e.message),
    );
  });

  it('finds the cover in the formula check, with its keys in the right places', () => {
    // The ham of the issue (337.6 ppm by method two) is a formula error. source: as above
    const errors = (f: CureFormula) =>
      checkCureFormula(f)
        .filter((p) => p.severity === 'error')
        .map((p) => p.message);
    assert.ok(errors(ham(0.24)).some((m) => /method two/.test(m) && /200 ppm/.test(m)));
    assert.deepEqual(errors(ham(0.25, { cover_brine: PLAIN_COVER })), []);
    // A make-up with no cover to make, and a pick-up larger than the cover, are mistakes.
    const noCover = ham(0.25, {
      brine: { pump_pct: 12, extra_pct: 10 },
      cover_brine: PLAIN_COVER,
    });
    assert.ok(errors(noCover).some((m) => /cover_pct/.test(m)));
    const pickup = ham(0.25, { brine: { pump_pct: 12, cover_pct: 2, cover_pickup_pct: 3 } });
    assert.ok(errors(pickup).some((m) => /pick-up/.test(m)));
    const dry = ham(0.25, { method: 'dry', brine: undefined, cover_brine: PLAIN_COVER });
    assert.ok(errors(dry).some((m) => /cover_brine/.test(m)));
  });
});
