import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  addDays,
  isIsoDay,
  paramsOfPlan,
  pdfFileName,
  planQueryFrom,
  requestOf,
} from './plan-query.ts';

describe('planQueryFrom', () => {
  it('should read a linked plan from the address', () => {
    assert.deepEqual(
      planQueryFrom({ assembly: 'smokehouse-burger', count: '120', for: '2026-12-18' }),
      { assembly: 'smokehouse-burger', count: 120, for: '2026-12-18', units: 'metric' },
    );
    assert.equal(planQueryFrom({ units: 'us' }).units, 'us');
  });

  it('should leave out what cannot be used, and keep the rest', () => {
    assert.deepEqual(
      planQueryFrom({ assembly: '../etc', count: '1.5', for: '2026-02-30', units: 'imperial' }),
      { assembly: null, count: null, for: null, units: 'metric' },
    );
    assert.equal(planQueryFrom({ count: '0' }).count, null);
    assert.equal(planQueryFrom({ count: '100001' }).count, null, 'over the API limit of 100000');
    assert.equal(planQueryFrom({ count: '100000' }).count, 100000);
    assert.equal(planQueryFrom({ count: '' }).count, null);
  });
});

describe('paramsOfPlan and requestOf', () => {
  const query = { assembly: 'smokehouse-burger', count: 120, for: '2026-12-18' } as const;

  it('should put a plan in the address without the default units, and read it back', () => {
    const params = paramsOfPlan({ ...query, units: 'metric' });
    assert.deepEqual(params, { ...query, count: '120', units: null });
    const back = planQueryFrom(
      Object.fromEntries(Object.entries(params).map(([k, v]) => [k, v ?? undefined])),
    );
    assert.deepEqual(back, { ...query, units: 'metric' });
    assert.equal(paramsOfPlan({ ...query, units: 'us' })['units'], 'us');
  });

  it('should ask for a plan only when the assembly, the count and the day are all given', () => {
    assert.deepEqual(requestOf({ ...query, units: 'us' }), { ...query, units: 'us' });
    assert.equal(requestOf({ ...query, count: null, units: 'metric' }), null);
    assert.equal(requestOf({ ...query, for: null, units: 'metric' }), null);
    assert.equal(requestOf({ ...query, assembly: null, units: 'metric' }), null);
  });
});

describe('calendar days', () => {
  it('should add days across a month end, a year end and a leap day', () => {
    assert.equal(addDays('2026-11-27', 21), '2026-12-18');
    assert.equal(addDays('2026-12-25', 7), '2027-01-01');
    assert.equal(addDays('2028-02-28', 1), '2028-02-29');
    assert.equal(addDays('2026-03-28', 2), '2026-03-30', 'not thrown by a daylight-saving change');
  });

  it('should know a real day from a well-formed impossible one', () => {
    assert.equal(isIsoDay('2028-02-29'), true);
    assert.equal(isIsoDay('2026-02-29'), false);
    assert.equal(isIsoDay('2026-13-01'), false);
    assert.equal(isIsoDay('18/12/2026'), false);
  });
});

describe('pdfFileName', () => {
  it('should name the PDF after the assembly and the day, as the server does', () => {
    assert.equal(
      pdfFileName({ assembly: 'smokehouse-burger', count: 120, for: '2026-12-18' }),
      'plan-smokehouse-burger-2026-12-18.pdf',
    );
  });
});
