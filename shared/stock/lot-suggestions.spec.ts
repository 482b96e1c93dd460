import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import type { BatchNeeds } from './batch-needs.ts';
import type { StockLot } from './fifo.ts';
import {
  sourceBatchesExpired,
  sourceBatchOrder,
  suggestForNeeds,
  type SourceCandidate,
} from './lot-suggestions.ts';

const lot = (item: string, code: string, grams: string, useBy?: string): StockLot => ({
  item,
  lot: code,
  remaining: dec(grams),
  receivedAt: '2026-12-01T07:00:00Z',
  ...(useBy ? { useBy } : {}),
});

const NEEDS: BatchNeeds = {
  items: [
    {
      item: 'pork-belly',
      name: 'pork belly',
      unit: 'kg',
      measure: 'g',
      amount: dec('10000'),
      grams: dec('10000'),
      lines: [],
      weighed: false,
    },
    {
      item: 'eggs',
      name: 'eggs',
      unit: 'each',
      measure: 'each',
      amount: null,
      grams: dec('500'),
      lines: [],
      weighed: false,
    },
  ],
  unlinked: [],
};

describe('suggestForNeeds', () => {
  // hand-worked on 3 Dec: R-02 (use by 2 Dec) is expired and set aside; R-03 (use by 5 Dec)
  // goes before R-01 (use by 9 Dec): 6 000 g, then 4 000 of R-01's 8 000
  it('should take each item first to expire first and leave an unknown need to the cook', () => {
    const lots = [
      lot('pork-belly', 'R-01', '8000', '2026-12-09'),
      lot('pork-belly', 'R-02', '5000', '2026-12-02'),
      lot('pork-belly', 'R-03', '6000', '2026-12-05'),
      lot('eggs', 'R-04', '30', '2026-12-20'),
    ];
    const [belly, eggs] = suggestForNeeds(NEEDS, lots, '2026-12-03');
    assert.deepEqual(
      belly.takes.map((t) => `${t.lot.lot}: ${t.take.toString()}`),
      ['R-03: 6000', 'R-01: 4000'],
    );
    assert.ok(belly.shortfall?.isZero());
    assert.deepEqual(
      belly.expired.map((l) => l.lot),
      ['R-02'],
    );
    assert.deepEqual(eggs.takes, []);
    assert.equal(eggs.shortfall, null);
  });
});

describe('sourceBatchOrder', () => {
  const batch = (lotCode: string, status: SourceCandidate['status'], startedOn: string) => ({
    lotCode,
    formulaId: 'chuck-grind',
    status,
    released: false,
    startedOn,
  });

  it('should offer finished batches first, earliest first, never a discarded one or itself', () => {
    const order = sourceBatchOrder(
      [
        batch('261202-SB-01', 'in-progress', '2026-12-02'),
        batch('261201-SB-01', 'discarded', '2026-12-01'),
        batch('261203-SB-01', 'done', '2026-12-03'),
        { ...batch('261130-SB-01', 'in-progress', '2026-11-30'), released: true },
        batch('261204-SB-01', 'done', '2026-12-04'),
        { ...batch('261129-PB-01', 'done', '2026-11-29'), formulaId: 'pit-bun' },
      ],
      'chuck-grind',
      '261203-SB-01',
      '2026-12-03',
    );
    assert.deepEqual(
      order.map((b) => b.lotCode),
      ['261130-SB-01', '261202-SB-01'],
    );
  });

  // hand-worked on Tue 8 Dec 2026: sauce batches dated by the Food Code's 7 days, day 1 the day
  // each was made, marked done (FDA Food Code 2022, 3-501.17(A); see source-use-by.spec.ts): one
  // made 1 Dec, use by 7 Dec, is past it and set apart; one started 2 Dec but made 4 Dec (use by
  // 10 Dec) goes after one started and made 3 Dec (use by 9 Dec): first to expire first, not
  // first started. A finished batch with no use-by (its formula dates nothing) comes after the
  // dated ones; the batch under way last, as before.
  it('should offer finished batches first to expire first, and set those past their use-by apart', () => {
    const dated = (lotCode: string, startedOn: string, useBy?: string): SourceCandidate => ({
      ...batch(lotCode, 'done', startedOn),
      ...(useBy ? { useBy } : {}),
    });
    const candidates = [
      dated('261202-HS-01', '2026-12-02', '2026-12-10'),
      dated('261203-HS-01', '2026-12-03', '2026-12-09'),
      dated('261201-HS-01', '2026-12-01', '2026-12-07'),
      dated('261130-HS-01', '2026-11-30'),
      batch('261208-HS-01', 'in-progress', '2026-12-08'),
      // past its use-by more than a week before: never offered, no longer named
      dated('261120-HS-01', '2026-11-20', '2026-11-26'),
    ];
    assert.deepEqual(
      sourceBatchOrder(candidates, 'chuck-grind', 'X', '2026-12-08').map((b) => b.lotCode),
      ['261203-HS-01', '261202-HS-01', '261130-HS-01', '261208-HS-01'],
    );
    assert.deepEqual(
      sourceBatchesExpired(candidates, 'chuck-grind', 'X', '2026-12-08').map((b) => b.lotCode),
      ['261201-HS-01'],
    );
    // On its use-by day a batch may still be used.
    assert.deepEqual(
      sourceBatchesExpired(candidates, 'chuck-grind', 'X', '2026-12-07').map((b) => b.lotCode),
      [],
    );
  });
});
