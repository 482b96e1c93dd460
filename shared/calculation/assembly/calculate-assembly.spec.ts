import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import { calculate } from '../calculate.ts';
import { parseBatchOptions } from '../parse-batch-options.ts';
import {
  BURGER,
  KITCHEN,
  RUB,
  BRISKET,
  SANDWICH,
  assembly,
  libraryOf,
} from '../plan/plan-fixtures.ts';
import type { Formula } from '../../formula/formula-types.ts';
import type { FormulaLibrary } from '../plan/check-assembly-library.ts';

const TODAY = '2026-12-03';

/** One assembly batch worked out, its parts' lines by part id as exact grams and note. */
function batchOf(formula: Formula, count: string, library: FormulaLibrary) {
  const result = calculate(
    formula,
    parseBatchOptions({ count }, formula, { today: TODAY }),
    library,
  );
  const parts = Object.fromEntries(
    result.groups
      .flatMap((group) => group.lines)
      .map((line) => [line.part, { grams: line.grams.toString(), note: line.note }]),
  );
  const figure = (label: string) => result.figures.find((f) => f.label === label)?.value;
  return { result, parts, figure };
}

describe('calculateAssembly: one batch of an assembly, its parts as the plan works them out', () => {
  it('should give 24 burgers their grind, buns, bacon and sauce by finished weight', () => {
    const { result, parts, figure } = batchOf(BURGER, '24', KITCHEN);
    assert.equal(result.formula.kind, 'assembly');
    // 24 burgers × 2 portions = 48 portions of 4 oz; 4 oz = 113.3980925 g (1 oz = 28.349523125 g,
    // source: NIST Handbook 44 (2024), Appendix C, avoirdupois ounce): 48 × 113.3980925 g
    // = 5 443.10844 g of grind.
    assert.deepEqual(parts['chuck-grind'], {
      grams: '5443.10844',
      note: '2 portions each = 48 portions of 4 oz',
    });
    // 24 buns × 1 piece of 90 g = 2 160 g (the bun's own piece weight).
    assert.equal(parts['pit-bun'].grams, '2160');
    // 24 × 3 slices × 25 g = 1 800 g of sliced bacon.
    assert.deepEqual(parts['quillmoor-belly'], {
      grams: '1800',
      note: '3 slices of 25 g each = 1800 g sliced',
    });
    // 24 × 20 g = 480 g of sauce.
    assert.equal(parts['house-sauce'].grams, '480');
    // 5 443.10844 + 2 160 + 1 800 + 480 = 9 883.10844 g; ÷ 24 = 411.796185 g a burger.
    assert.equal(figure('Total weight')?.toString(), '9883.10844');
    assert.equal(figure('Weight of one unit')?.toString(), '411.796185');
    // The bun's wheat, milk and egg, the sauce's egg and anchovy, in label order.
    assert.deepEqual(result.allergens, ['milk', 'egg', { fish: 'anchovy' }, 'wheat']);
    assert.deepEqual(result.checks, []);
  });

  it('should weigh a part applied to another by its share of that part’s green weight', () => {
    const { parts } = batchOf(SANDWICH, '10', libraryOf(BRISKET, RUB, SANDWICH));
    // 10 × 140 g = 1 400 g of sliced brisket, back through its yields (smoke 82 %, slice 92 %):
    // 1 400 ÷ 0.82 ÷ 0.92 = 1 855.7794 g green; the rub is 1.5 % of that, 27.8367 g.
    assert.equal(parts['brisket-brine'].grams, '1400');
    assert.equal(new Decimal(parts['brisket-rub'].grams).toDecimalPlaces(4).toString(), '27.8367');
  });

  it('should count an assembly inside another by its units and its parts’ weight', () => {
    const platter = assembly('pit-platter', [
      { formula: 'smokehouse-burger', units: 2 },
      { formula: 'house-sauce', amount: '10 g' },
    ]);
    const { parts } = batchOf(platter, '3', libraryOf(...KITCHEN.values(), platter));
    // 3 platters × 2 = 6 burgers of 411.796185 g (above) = 2 470.77711 g.
    assert.deepEqual(parts['smokehouse-burger'], { grams: '2470.77711', note: '6 units' });
    assert.equal(parts['house-sauce'].grams, '30');
  });

  it('should refuse a batch with no count, and one whose part is not in the library', () => {
    assert.throws(
      () => calculate(BURGER, parseBatchOptions({}, BURGER, { today: TODAY }), KITCHEN),
      (error: unknown) =>
        error instanceof BatchError &&
        error.option === 'count' &&
        /how many of Smokehouse burger were made/.test(error.message),
    );
    const noGrind = new Map([...KITCHEN].filter(([id]) => id !== 'chuck-grind'));
    assert.throws(
      () => batchOf(BURGER, '24', noGrind),
      (error: unknown) => error instanceof BatchError && /chuck-grind/.test(error.message),
    );
    assert.throws(
      () => parseBatchOptions({ count: '0' }, BURGER, { today: TODAY }),
      /--count must be between 1 and 100000/,
    );
    assert.throws(
      () => parseBatchOptions({ total: '5 kg', count: '2' }, BURGER, { today: TODAY }),
      /--total does not apply to an assembly formula/,
    );
  });
});
