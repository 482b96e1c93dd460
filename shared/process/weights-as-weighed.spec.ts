import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { calculate } from '../calculation/calculate.ts';
import { parseBatchOptions } from '../calculation/parse-batch-options.ts';
import { cure, d } from '../calculation/cure/cure-spec-helpers.ts';
import type { CureFormula } from '../formula/formula-types.ts';
import { presentResult } from '../presentation/present-result.ts';
import { judgeWeights } from './weights-as-weighed.ts';

/** A recorded calculation of a formula, as the records keep it. */
function recorded(formula: CureFormula, batch: Record<string, string>) {
  return presentResult(
    calculate(formula, parseBatchOptions(batch, formula, { today: '2026-12-01' })),
    'metric',
  );
}

const PUMPED: CureFormula = cure({
  method: 'pump',
  brine: { pump_pct: 10, cover_pct: 0, extra_pct: 0 },
  ingredients: [
    { name: 'salt', pct: 1.5, salt: 100 },
    { name: 'curing salt', nitrite: 6.25, salt: 93.75, pct: 0.192 },
    { name: 'erythorbate', pct: 0.055, accelerator: 100 },
  ],
});

describe('weights as weighed', () => {
  it('should judge nothing of the cure before a line or a pumped weight is weighed', () => {
    const verdict = judgeWeights(cure({}), recorded(cure({}), { meat: '5 kg' }), {
      lines: new Map(),
      stages: new Map([['green', d(5000)]]),
    });
    assert.equal(verdict.actualNitritePpm, null);
    assert.deepEqual(verdict.failed, []);
  });

  it('should work the nitrite again on the green weight really weighed, failing a dry cure over its limit', () => {
    // The calculation: 5000 g × 0.192 % = 9.6 g of curing salt, 120 ppm. Weighed onto 4000 g of
    // green meat, 9.6 g × 6.25 % × 10^6 / 4000 = 150 ppm. source: FSIS Directive 7620.3,
    // Processing Inspectors' Calculations Handbook, ch. 3 (dry cure); 10.2 g more makes 12.8 g,
    // 200 ppm, and 13.0 g makes 203.125 ppm, over 200 ppm for dry-cured bacon (9 CFR 424.22(b))
    const result = recorded(cure({}), { meat: '5 kg' });
    const on = (grams: string) =>
      judgeWeights(cure({}), result, {
        lines: new Map([['curing salt', d(grams)]]),
        stages: new Map([['green', d(4000)]]),
      });
    assert.equal(on('9.6').actualNitritePpm?.toString(), '150');
    assert.deepEqual(on('12.8').failed, []);
    const over = on('13');
    assert.equal(over.actualNitritePpm?.toString(), '203.125');
    assert.deepEqual(
      over.failed.map((check) => check.id),
      ['nitrite-max'],
    );
  });

  it('should take a pump cure at the pumped weight weighed, and at its own pump when not', () => {
    const result = recorded(PUMPED, { meat: '5 kg', pump: '8' });
    const erythorbate = result.groups[0].lines.find((line) => line.name === 'erythorbate');
    // Not weighed: the batch's own 8 % pump, so 0.192 % × 6.25 % × 10^6 = 120 ppm as designed.
    // source: FSIS Directive 7620.3 ch. 3, pumped formula (the brine made for the batch's pump)
    const own = judgeWeights(PUMPED, result, {
      lines: new Map([['erythorbate', d(erythorbate!.grams)]]),
      stages: new Map(),
    });
    assert.equal(own.actualNitritePpm?.toString(), '120');
    // Pumped to 5500 g is 10 %, not 8: 120 × 10/8 = 150 ppm, over 120 ppm for pumped bacon (9 CFR
    // 424.22(b)), and over the 8 % target of 5400 g.
    const pumped = judgeWeights(PUMPED, result, {
      lines: new Map(),
      stages: new Map([
        ['green', d(5000)],
        ['pumped', d(5500)],
      ]),
    });
    assert.equal(pumped.actualNitritePpm?.toString(), '150');
    assert.equal(pumped.pump?.over, true);
    assert.equal(pumped.pump?.targetGrams.toString(), '5400');
  });
});
