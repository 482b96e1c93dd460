import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { coolingWindows, curvePoints, limitBands } from './curve-points.ts';
import type { ControlLimit, Reading } from './process-types.ts';

const MIN = 60_000;
const T0 = Date.parse('2026-03-02T12:00:00Z');

/** 130 → 80 °F in 1.5 h, then → 40 °F in 5 h, each stage timed from its own start.
 * source: FSIS, Appendix B to the Compliance Guidelines for Cooling Heat-Treated Meat and
 * Poultry Products (Stabilization), 1999, cooling option 1 (°F converted exactly) */
const OPTION_1: Extract<ControlLimit, { type: 'cooling' }> = {
  type: 'cooling',
  stages: [
    { fromC: '54.4444444444', toC: '26.6666666667', withinS: '5400', countedFrom: 'stage-start' },
    { fromC: '26.6666666667', toC: '4.4444444444', withinS: '18000', countedFrom: 'stage-start' },
  ],
};

const at = (minutes: number, y: number): { x: number; y: number } => ({ x: T0 + minutes * MIN, y });

describe('curvePoints', () => {
  it('should leave corrected readings out and sort by time', () => {
    const reading = (id: number, minutes: number, value: string, correctedBy: number | null) =>
      ({ id, at: new Date(T0 + minutes * MIN).toISOString(), value, correctedBy }) as Reading;
    assert.deepEqual(
      curvePoints([reading(2, 30, '50', null), reading(1, 0, '60', 3), reading(3, 0, '58', null)]),
      [at(0, 58), at(30, 50)],
    );
  });
});

describe('coolingWindows', () => {
  it('should start the clock at the last reading at or above the start before the first below it', () => {
    const points = [at(0, 70), at(30, 56), at(60, 50), at(120, 25), at(300, 10)];
    const [stage1, stage2] = coolingWindows(OPTION_1, points);
    assert.equal(stage1.start, T0 + 30 * MIN);
    assert.equal(stage1.deadline, T0 + 30 * MIN + 90 * MIN);
    assert.equal(stage1.reached, T0 + 120 * MIN);
    // Stage 2 starts where stage 1 reached its target, and has 5 h from there.
    assert.equal(stage2.start, T0 + 120 * MIN);
    assert.equal(stage2.deadline, T0 + 120 * MIN + 300 * MIN);
    assert.equal(stage2.reached, null);
  });

  it('should give no window before the product falls below the first stage', () => {
    assert.deepEqual(coolingWindows(OPTION_1, [at(0, 70), at(30, 60)]), []);
  });
});

describe('limitBands', () => {
  const words = { temp: (c: string) => `${Number(c).toFixed(1)} °C`, clock: () => '14:00' };
  it('should draw a range with both edges and a stage as target then drop', () => {
    const span = { from: T0, to: T0 + 60 * MIN };
    const [range] = limitBands({ type: 'between', min: '60', max: '80' }, [], span, words);
    assert.equal(range.kind, 'range');
    assert.deepEqual(
      range.points.map((p) => p.y),
      [80, 80],
    );
    assert.deepEqual(
      range.other?.map((p) => p.y),
      [60, 60],
    );
    const [stage] = limitBands(OPTION_1, [at(0, 56), at(30, 50)], span, words);
    assert.equal(stage.kind, 'stage');
    assert.equal(stage.label, 'Stage 1: 26.7 °C by 14:00');
    assert.equal(stage.points.length, 3);
  });
});
