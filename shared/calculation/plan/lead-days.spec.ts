import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { DEFAULT_LEAD_DAYS, leadDaysOf } from './lead-days.ts';
import { BELLY, BUN, GRIND, SAUCE } from './plan-fixtures.ts';

describe('leadDaysOf: days between ready and service', () => {
  it('should default to the kitchen’s own rule: cure 1, dough with a preferment 1, others 0', () => {
    // The kitchen's own rule (common practice, no source), stated in lead-days.ts and
    // formulas/README.md.
    assert.deepEqual(DEFAULT_LEAD_DAYS, { cure: 1, doughWithPreferment: 1, other: 0 });
    assert.equal(leadDaysOf(BELLY).days, 1);
    assert.equal(leadDaysOf(BUN).days, 1);
    const { preferment: _preferment, ...straight } = BUN;
    assert.equal(leadDaysOf(straight).days, 0);
    assert.equal(leadDaysOf(GRIND).days, 0);
    assert.equal(leadDaysOf(SAUCE).days, 0);
    assert.match(leadDaysOf(BELLY).source, /common practice, no source/);
  });

  it('should take the formula’s own lead_days, zero included', () => {
    assert.deepEqual(leadDaysOf({ ...BELLY, lead_days: 0 }), {
      days: 0,
      source: "the formula's own",
    });
    assert.equal(leadDaysOf({ ...SAUCE, lead_days: 2 }).days, 2);
  });
});
