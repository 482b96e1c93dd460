import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { type FifoSuggestion, type StockLot, suggestLots } from './fifo.ts';

const belly = (lot: string, grams: string, receivedAt: string, useBy?: string): StockLot => ({
  item: 'pork-belly',
  lot,
  remaining: dec(grams),
  receivedAt,
  ...(useBy === undefined ? {} : { useBy }),
});

// Quillmoor's cold room on Thursday 3 December 2026, an invented stock drawn by hand.
const LOTS: StockLot[] = [
  belly('B-4471', '4000', '2026-12-01T07:00:00Z', '2026-12-10'),
  belly('B-4480', '6000', '2026-12-02T07:00:00Z', '2026-12-08'),
  belly('B-4460', '5000', '2026-11-30T07:00:00Z'),
  belly('B-4455', '3000', '2026-11-26T07:00:00Z', '2026-12-02'),
  belly('B-4458', '2000', '2026-11-28T07:00:00Z', '2026-12-03'),
  belly('B-4490', '0', '2026-12-03T06:00:00Z', '2026-12-20'),
  { item: 'curing-salt', lot: 'C-1207', remaining: dec('900'), receivedAt: '2026-11-01T09:00:00Z' },
];

/** The suggestion as "lot: grams" lines, to compare with the hand-drawn expectation. */
function taken(suggestion: FifoSuggestion): string[] {
  return suggestion.takes.map(({ lot, take }) => `${lot.lot}: ${take.toString()}`);
}

describe('suggestLots', () => {
  // hand-worked: on 3 Dec, B-4455 (use by 2 Dec) is expired; B-4458 (use by 3 Dec) is still usable
  // on its own day (FDA Food Code 2022, 3-501.17(A): the date marked is the day "by which the
  // food shall be consumed … or discarded"); then 8 Dec, then 10 Dec: 2 000 + 6 000 + 4 000 g
  it('should take 12 kg from the lots that expire first, passing over the expired one', () => {
    const suggestion = suggestLots(LOTS, 'pork-belly', dec('12000'), '2026-12-03');
    assert.deepEqual(taken(suggestion), ['B-4458: 2000', 'B-4480: 6000', 'B-4471: 4000']);
    assert.ok(suggestion.shortfall.isZero());
    assert.deepEqual(
      suggestion.expired.map((lot) => lot.lot),
      ['B-4455'],
    );
  });

  // hand-worked: 2 000 + 6 000 + 4 000 with a use-by, then the 5 000 g lot without one = 17 000 g;
  // 20 000 − 17 000 = 3 000 g short. The empty lot B-4490 is passed over.
  it('should use a lot without a use-by last and say how much is short', () => {
    const suggestion = suggestLots(LOTS, 'pork-belly', dec('20000'), '2026-12-03');
    assert.deepEqual(taken(suggestion), [
      'B-4458: 2000',
      'B-4480: 6000',
      'B-4471: 4000',
      'B-4460: 5000',
    ]);
    assert.ok(suggestion.shortfall.equals(dec('3000')));
  });

  // hand-worked: 2 000 g from the first lot, 500.5 g of the second's 6 000
  it('should take only part of the last lot it needs', () => {
    const suggestion = suggestLots(LOTS, 'pork-belly', dec('2500.5'), '2026-12-03');
    assert.deepEqual(taken(suggestion), ['B-4458: 2000', 'B-4480: 500.5']);
  });

  // hand-worked: the same use-by, so the order received decides; 23:00 at −05:00 on 1 Dec is
  // 04:00 UTC on 2 Dec, after 01:00 UTC on 2 Dec, though its text sorts first
  it('should order lots of the same use-by by the instant they were received', () => {
    const lots = [
      belly('late', '1000', '2026-12-01T23:00:00-05:00', '2026-12-09'),
      belly('early', '1000', '2026-12-02T01:00:00Z', '2026-12-09'),
      belly('undated-late', '1000', '2026-12-02T09:00:00Z'),
      belly('undated-early', '1000', '2026-12-01T09:00:00Z'),
    ];
    const suggestion = suggestLots(lots, 'pork-belly', dec('4000'), '2026-12-03');
    assert.deepEqual(taken(suggestion), [
      'early: 1000',
      'late: 1000',
      'undated-early: 1000',
      'undated-late: 1000',
    ]);
  });

  it('should find nothing for an item with no lots, all of it short', () => {
    const suggestion = suggestLots(LOTS, 'beef-chuck', dec('500'), '2026-12-03');
    assert.deepEqual(suggestion.takes, []);
    assert.ok(suggestion.shortfall.equals(dec('500')));
  });

  it('should refuse a negative need, a day that is no date and a lot with no time of receipt', () => {
    assert.throws(() => suggestLots(LOTS, 'pork-belly', dec('-1'), '2026-12-03'), RangeError);
    assert.throws(() => suggestLots(LOTS, 'pork-belly', dec('1'), '3 Dec'), /not a calendar date/);
    assert.throws(
      () => suggestLots([belly('x', '1', 'Tuesday')], 'pork-belly', dec('1'), '2026-12-03'),
      /no time/,
    );
  });
});
