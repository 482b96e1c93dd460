import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { FOOD_CODE_DAYS, dateMark } from './date-mark.ts';

describe('dateMark by the Food Code', () => {
  // source: FDA Food Code 2022, 3-501.17(A), "for a maximum of 7 days. The day of preparation
  // shall be counted as Day 1" (as adopted word for word in Virginia, 12VAC5-421-830 A)
  it('should hold 7 days with the day of preparation as day 1', () => {
    assert.equal(FOOD_CODE_DAYS, 7);
  });

  // source: as above; Monday 3 August 2026 is day 1, so day 7 is Sunday 9 August 2026
  it('should mark food prepared on Monday the 3rd to be used by Sunday the 9th', () => {
    const mark = dateMark({ preparedOn: '2026-08-03' });
    assert.equal(mark.useBy, '2026-08-09');
    assert.equal(new Date(`${mark.useBy}T00:00:00Z`).getUTCDay(), 0);
    assert.equal(mark.basis, 'food-code');
    assert.match(mark.source, /Food Code 2022, 3-501\.17/);
  });

  // source: Southern Nevada Health District, "How long can I keep TCS food?" (FAQ): "food prepared
  // or opened on April 1 must be used by April 7 or discarded"
  it('should mark food prepared on 1 April to be used by 7 April', () => {
    assert.equal(dateMark({ preparedOn: '2027-04-01' }).useBy, '2027-04-07');
  });

  // derived: the same count across a month end, a year end and February in a leap year and not
  it('should count across the end of a month, a year and February', () => {
    assert.equal(dateMark({ preparedOn: '2026-08-28' }).useBy, '2026-09-03');
    assert.equal(dateMark({ preparedOn: '2026-12-28' }).useBy, '2027-01-03');
    assert.equal(dateMark({ preparedOn: '2027-02-25' }).useBy, '2027-03-03');
    assert.equal(dateMark({ preparedOn: '2028-02-25' }).useBy, '2028-03-02');
  });

  // source: FDA Food Code 2022, 3-501.17(C), a combined food keeps "the date marking of the
  // earliest-prepared or first-prepared ingredient" (Virginia, 12VAC5-421-830 C); the worked case
  // is Southern Nevada Health District's FAQ: burgers cooked 1 June, made into chili 3 June, the
  // chili's use-by "will still be June 7"
  it('should count a food from its earliest-prepared ready-to-eat ingredient', () => {
    const mark = dateMark({
      preparedOn: '2027-06-03',
      ingredientDays: ['2027-06-02', '2027-06-01'],
    });
    assert.equal(mark.dayOne, '2027-06-01');
    assert.equal(mark.useBy, '2027-06-07');
  });
});

describe('dateMark by a validated shelf life', () => {
  // derived: the Food Code's counting (day of preparation = day 1) applied to the kitchen's days
  it('should count the kitchen’s own days the same way and keep its source', () => {
    const mark = dateMark({
      preparedOn: '2026-12-28',
      validated: { days: 21, source: 'challenge study, Quillmoor lab report 14' },
    });
    assert.equal(mark.useBy, '2027-01-17');
    assert.equal(mark.days, 21);
    assert.equal(mark.basis, 'validated');
    assert.equal(mark.source, 'challenge study, Quillmoor lab report 14');
    const oneDay = dateMark({ preparedOn: '2026-12-31', validated: { days: 1, source: 'study' } });
    assert.equal(oneDay.useBy, '2026-12-31');
  });

  it('should refuse a shelf life that is not a whole number of days, and a day that is no date', () => {
    const study = (days: number) => ({ days, source: 'study' });
    assert.throws(() => dateMark({ preparedOn: '2026-08-03', validated: study(0) }), RangeError);
    assert.throws(() => dateMark({ preparedOn: '2026-08-03', validated: study(2.5) }), RangeError);
    assert.throws(() => dateMark({ preparedOn: '2026-02-30' }), /not a calendar date/);
    assert.throws(
      () => dateMark({ preparedOn: '2026-08-03', ingredientDays: ['3 Aug'] }),
      /not a calendar date/,
    );
  });
});
