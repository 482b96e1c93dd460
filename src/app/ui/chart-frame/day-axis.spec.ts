import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { axisDayWords, dayMs, lotDayTitle } from './day-axis.ts';

describe('axisDayWords', () => {
  const at = (day: string): number => Date.parse(`${day}T00:00:00Z`);

  it('should label the time axis with short days, as the product writes them', () => {
    assert.equal(axisDayWords(at('2026-11-08'), at('2026-11-01'), at('2026-12-03')), '8 Nov');
    // A tick between midnights is the day it falls in.
    assert.equal(
      axisDayWords(at('2026-09-30') + 3_600_000, at('2026-09-01'), at('2026-10-01')),
      '30 Sep',
    );
  });

  it('should give the year when the axis runs over New Year', () => {
    const [min, max] = [at('2026-12-20'), at('2027-01-10')];
    assert.equal(axisDayWords(at('2026-12-28'), min, max), '28 Dec 2026');
    assert.equal(axisDayWords(at('2027-01-04'), min, max), '4 Jan 2027');
  });
});

describe('dayMs', () => {
  it('should put each day at its UTC midnight, a whole day after the one before', () => {
    assert.equal(dayMs('2026-10-26') - dayMs('2026-10-25'), 86_400_000);
    assert.equal(dayMs('2026-12-03'), Date.parse('2026-12-03T00:00:00Z'));
  });
});

describe('lotDayTitle', () => {
  it('should name a batch by its lot code and day, and nothing for no point', () => {
    assert.equal(
      lotDayTitle({ lot: '261203-QB-01', day: '2026-12-03' }),
      '261203-QB-01 · 3 Dec 2026',
    );
    assert.equal(lotDayTitle(undefined), '');
  });
});
