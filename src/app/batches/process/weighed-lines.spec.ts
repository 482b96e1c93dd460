import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { PresentedResult } from '../batch-types.ts';
import type { Weighing } from './process-types.ts';
import { weighedLines, weighingNews, weightText } from './weighed-lines.ts';

const result = {
  groups: [
    {
      title: 'Cure',
      lines: [
        { name: 'Salt', amount: '106.5 g', grams: '106.5', role: 'ingredient' },
        { name: 'Curing salt', amount: '10.7 g', grams: '10.65', role: 'cure' },
      ],
    },
  ],
} as unknown as PresentedResult;

const weighing = (id: number, name: string, grams: string, extra: Partial<Weighing> = {}) =>
  ({ id, kind: 'line', name, grams, corrects: null, correctedBy: null, ...extra }) as Weighing;

describe('weighedLines', () => {
  it('should pair each sheet line with its standing weighing and the one it corrected', () => {
    const lines = weighedLines(result, [
      weighing(1, 'Curing salt', '11.2', { correctedBy: 2 }),
      weighing(2, 'Curing salt', '10.6', { corrects: 1 }),
    ]);
    assert.deepEqual(
      lines.map((l) => [l.name, l.weighed?.grams ?? null, l.replaced?.grams ?? null]),
      [
        ['Salt', null, null],
        ['Curing salt', '10.6', '11.2'],
      ],
    );
  });
});

describe('weightText', () => {
  it('should give a bare number the unit of the calculated amount', () => {
    assert.equal(weightText('10,6', '10.7 g'), '10.6 g');
    assert.equal(weightText('4.3', '4.26 kg'), '4.3 kg');
    assert.equal(weightText('2 lb 4 oz', '2 lb 3.4 oz'), '2 lb 4 oz');
  });
});

describe('weighingNews', () => {
  it('should leave out only the all-clear the actual-nitrite line repeats', () => {
    const allClear = 'Ingoing sodium nitrite on the weights as weighed: 157.0 ppm, within 200 ppm.';
    const over =
      'On the weights as weighed, ingoing nitrite 212.0 ppm is over 200 ppm. A deviation is open: the batch is held until a corrective action is recorded.';
    assert.deepEqual(weighingNews([allClear]), []);
    assert.deepEqual(weighingNews([over]), [over]);
  });
});
