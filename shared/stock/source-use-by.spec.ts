import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { GRIND, SAUCE } from '../calculation/plan/plan-fixtures.ts';
import type { Formula } from '../formula/formula-types.ts';
import { sourceUseBy } from './source-use-by.ts';

const sauce = (label?: object) => ({ ...SAUCE, label }) as Formula;

describe('sourceUseBy', () => {
  // source: FDA Food Code 2022, 3-501.17(A): ready-to-eat food held at 5 °C (41 °F) or below,
  // "for a maximum of 7 days. The day of preparation shall be counted as Day 1". Made (marked
  // done) on Tuesday 1 December 2026, day 1; day 7 is Monday 7 December 2026.
  it('should date a ready-to-eat batch held cold by the Food Code, the day it was made day 1', () => {
    const useBy = sourceUseBy(sauce({ storage: 'refrigerated', ready_to_eat: true }), '2026-12-01');
    assert.deepEqual(useBy, { useBy: '2026-12-07' });
  });

  // the kitchen's own 3 days, counted the same way: 1, 2, 3 December
  it('should take the kitchen’s validated shelf life before the Food Code’s', () => {
    const validated = sauce({
      storage: 'refrigerated',
      ready_to_eat: false,
      shelf_life: { days: 3, basis: 'Quillmoor challenge study 2, 2026' },
    });
    assert.deepEqual(sourceUseBy(validated, '2026-12-01'), { useBy: '2026-12-03' });
  });

  it('should give none, and say why, when nothing dates it', () => {
    const why = (formula: Formula | undefined, finishedOn: string | null) =>
      sourceUseBy(formula, finishedOn).none ?? '';
    assert.match(
      why(sauce({ storage: 'frozen', ready_to_eat: true }), '2026-12-01'),
      /kept frozen/,
    );
    assert.match(
      why(sauce({ storage: 'shelf-stable', ready_to_eat: true }), '2026-12-01'),
      /shelf-stable/,
    );
    // A raw grind: the Food Code's date marking is for ready-to-eat food.
    assert.match(
      why({ ...GRIND, label: { storage: 'refrigerated', ready_to_eat: false } }, '2026-12-01'),
      /not ready to eat/,
    );
    assert.match(why(sauce(), '2026-12-01'), /how it is stored is not set in its formula/);
    assert.match(why(sauce({ storage: 'refrigerated', ready_to_eat: true }), null), /not finished/);
    assert.match(why(undefined, '2026-12-01'), /no longer kept/);
  });
});
