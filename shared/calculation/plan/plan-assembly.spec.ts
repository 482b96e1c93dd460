import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CalcResult } from '../calc-result.ts';
import { planAssembly } from './plan-assembly.ts';
import { BURGER, KITCHEN } from './plan-fixtures.ts';
import type { PlanBatch, PlanResult } from './plan-types.ts';

const d = (value: string | number): Decimal => new Decimal(value);
/** An exact value to four decimal places, as the figures below are written. */
const places4 = (value: Decimal): string => value.toDecimalPlaces(4).toFixed(4);

const OPTIONS = { count: 120, serviceDate: '2026-12-18', today: '2026-11-20' };

function batchOf(plan: PlanResult, id: string): PlanBatch {
  const found = plan.batches.find((batch) => batch.formula.id === id);
  assert.ok(found, `no batch of ${id}`);
  return found;
}

function line(result: CalcResult, name: string): Decimal {
  const found = result.groups.flatMap((g) => g.lines).find((l) => l.name === name);
  assert.ok(found, `no line ${name}`);
  return found.grams;
}

function figure(result: CalcResult, label: string): Decimal {
  const found = result.figures.find((f) => f.label === label);
  assert.ok(found, `no figure ${label}`);
  return found.value as Decimal;
}

describe('planAssembly: 120 smokehouse burgers for 2026-12-18', () => {
  const plan = planAssembly(BURGER, KITCHEN, OPTIONS);

  it('should make one batch of each formula, earliest start first', () => {
    assert.deepEqual(
      plan.batches.map((b) => `${b.start} ${b.formula.id}`),
      [
        '2026-12-09 quillmoor-belly',
        '2026-12-17 pit-bun',
        // Same day: by title, "Pit-house sandwich sauce" before "Smokehouse burger grind".
        '2026-12-18 house-sauce',
        '2026-12-18 chuck-grind',
      ],
    );
  });

  it('should blend 240 quarter-pound portions: 27 215.5422 g of grind, 23 327.6076 g lean and 3 887.9346 g fat trim', () => {
    const grind = batchOf(plan, 'chuck-grind');
    // 120 burgers × 2 = 240 portions × 113.3980925 g (¼ lb; 1 lb = 453.59237 g, NIST SP 811)
    // = 27 215.5422 g; no seasoning, so all of it is meat.
    assert.deepEqual(grind.batch, { total: '27215.5422 g', start: '2026-12-18' });
    // Pearson square, 15 % and 50 % to 20 %: lean 30 parts, fat 5 parts of 35.
    // lean = 27 215.5422 × 30 ÷ 35 = 23 327.6076 g; fat = 27 215.5422 × 5 ÷ 35 = 3 887.9346 g.
    // source: Pearson square, "Meat Calculations" training presentation for meat-evaluation
    // contests (issuer not identified)
    assert.equal(line(grind.result, 'chuck trim 85/15 (15 % fat)').toString(), '23327.6076');
    assert.equal(line(grind.result, 'brisket fat trim 50/50 (50 % fat)').toString(), '3887.9346');
    assert.equal(grind.result.portions?.count, 240);
    assert.equal(grind.result.portions?.remainderGrams.isZero(), true);
    assert.deepEqual(grind.purposes, [
      'Smokehouse burger (120 units): 2 portions each = 240 portions of 4 oz',
    ]);
  });

  it('should mix 11 134.0206 g of bun dough for 120 pieces of 90 g at 3 % loss, starting the evening before', () => {
    const bun = batchOf(plan, 'pit-bun');
    assert.deepEqual(bun.batch, { pieces: '120', start: '2026-12-17' });
    // 120 × 90 g ÷ (1 − 0.03) = 10 800 ÷ 0.97 = 11 134.0206 g.
    // source: "Bread Formula Construction" (2011), divide convention
    assert.equal(places4(figure(bun.result, 'Mixed dough')), '11134.0206');
    // flour = 11 134.0206… ÷ 1.87 (the formula's 187 %) = 5 954.0217 g
    assert.equal(places4(figure(bun.result, 'Total flour')), '5954.0217');
    // A preferment: lead 1 day (mixed the evening before), no hold.
    assert.equal(bun.holdDays, 0);
    assert.equal(bun.leadDays, 1);
    assert.equal(bun.ready, '2026-12-17');
    assert.match(bun.rule, /sponge is mixed the evening before/);
  });

  it('should cure 10 638.2979 g of green belly for 9 000 g of sliced bacon, starting 2026-12-09', () => {
    const belly = batchOf(plan, 'quillmoor-belly');
    // 120 × 3 slices × 25 g = 9 000 g sliced, ÷ (0.90 smoke × 0.94 slice) = 10 638.2979 g green.
    assert.deepEqual(belly.batch, { want: '9000 g', thickness: '40 mm', start: '2026-12-09' });
    const green = belly.result.inputs.find((f) => f.label === 'Green weight');
    assert.equal(places4(green?.value as Decimal), '10638.2979');
    // curing salt 0.25 % × 10 638.2979 = 26.5957 g; 0.25 % × 6.25 % × 10⁶ = 156.25 ppm ≤ 200.
    // source: USDA FSIS Directive 7620.3 ch. 3 (dry cure); 9 CFR 424.22(b) (dry-cured bacon)
    assert.equal(places4(line(belly.result, 'curing salt no. 1 (6.25 % nitrite)')), '26.5957');
    assert.equal(belly.result.checks[0].value.toString(), '156.25');
    // hold 2 days/cm × 4 cm = 8 days (over the 7-day minimum), + 1 lead day = 9 days before
    // 2026-12-18 → start 2026-12-09, ready 2026-12-17.
    assert.equal(belly.holdDays, 8);
    assert.equal(belly.leadDays, 1);
    assert.equal(belly.ready, '2026-12-17');
    assert.deepEqual(
      belly.result.schedule && [belly.result.schedule.start, belly.result.schedule.ready],
      ['2026-12-09', '2026-12-17'],
    );
    assert.match(belly.rule, /^hold 8 days \(2 days per cm × 4 cm = 8/);
  });

  it('should make 2 400 g of sauce on the day: 120 × 20 g, base 1 729.1066 g', () => {
    const sauce = batchOf(plan, 'house-sauce');
    assert.deepEqual(sauce.batch, { total: '2400 g', start: '2026-12-18' });
    // mayonnaise = 2 400 × 100 ÷ 138.8 (the formula's percentages) = 1 729.1066 g
    assert.equal(
      places4(line(sauce.result, 'mayonnaise (made with pasteurized egg)')),
      '1729.1066',
    );
  });

  it('should group the batches into one production day each start date', () => {
    assert.deepEqual(
      plan.days.map((day) => [day.date, day.batches.map((b) => b.formula.id)]),
      [
        ['2026-12-09', ['quillmoor-belly']],
        ['2026-12-17', ['pit-bun']],
        ['2026-12-18', ['house-sauce', 'chuck-grind']],
      ],
    );
  });

  it('should add the pull list up across batches: fine sea salt from the bacon and the bun', () => {
    const item = (name: string) => plan.pullList.find((i) => i.name === name);
    // bacon 2.25 % × 10 638.2979 = 239.3617 g; bun 1.8 % × 5 954.0217 = 107.1724 g; 346.5341 g.
    assert.equal(places4(item('fine sea salt')?.grams ?? d(0)), '346.5341');
    assert.deepEqual(item('fine sea salt')?.usedBy, ['quillmoor-belly', 'pit-bun']);
    // The bun's flour from the overall formula, once: 5 954.0217 g (not sponge + final dough twice).
    assert.equal(places4(item('bread flour')?.grams ?? d(0)), '5954.0217');
    // the overall formula's water, 28 % × 5 954.0217 = 1 667.1261 g (sponge water included once)
    assert.equal(places4(item('water')?.grams ?? d(0)), '1667.1261');
    assert.equal(item('sponge'), undefined);
    assert.equal(
      places4(item('green meat for Quillmoor belly, dry equilibrium cure')?.grams ?? d(0)),
      '10638.2979',
    );
    assert.equal(places4(item('chuck trim 85/15 (15 % fat)')?.grams ?? d(0)), '23327.6076');
    const names = plan.pullList.map((i) => i.name);
    assert.deepEqual(
      names,
      [...names].sort((a, b) => a.localeCompare(b)),
    );
  });

  it('should roll the allergens up: milk and egg (bun), egg and anchovy (sauce), wheat (bun)', () => {
    assert.deepEqual(plan.allergens, ['milk', 'egg', { fish: 'anchovy' }, 'wheat']);
  });

  it('should carry every batch’s cautions once, the sauce’s own by its formula, local codes last', () => {
    const ids = plan.cautions.map((c) => c.id);
    for (const id of [
      'curing-salt-handling',
      'raw-dough',
      'ground-meat-cooking',
      'house-sauce/formula-1',
    ])
      assert.ok(ids.includes(id), id);
    assert.equal(new Set(ids).size, ids.length);
    assert.equal(ids.at(-1), 'local-codes');
    // One allergen caution for the whole plan, naming what the bun and the sauce bring.
    assert.match(
      plan.cautions.find((c) => c.id === 'allergens')?.text ?? '',
      // source: 21 U.S.C. 343(w)(2): the species of fish is named
      /^Contains: milk, egg, fish \(anchovy\), wheat\./,
    );
  });
});
