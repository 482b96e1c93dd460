import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import type { ReadingPoint } from './control-types.ts';
import { evaluateControl } from './evaluate-control.ts';
import { clockAt, readingF, templateControl } from './judge-spec-helpers.ts';

describe('a cooling log judged against FSIS Appendix B, option 1', () => {
  // source: USDA FSIS, Compliance Guidelines for Cooling Heat-Treated Meat and Poultry Products
  // (Stabilization), Appendix B (1999), option 1: 130 °F to 80 °F within 1.5 h, then 80 °F to
  // 40 °F within 5 h; the logs are worked by hand against those figures.
  const option1 = templateControl('fsis-cooling-option-1');

  it('is met when 80 °F comes at 1.4 h and 40 °F at 6.3 h (1.4 ≤ 1.5 h, then 4.9 ≤ 5 h)', () => {
    const log = [readingF('0', '130'), readingF('1.4', '80'), readingF('6.3', '40')];
    const state = evaluateControl(option1, log, clockAt('7'));
    assert.equal(state.status, 'met');
    assert.deepEqual(state.misses, []);
    assert.equal(state.nextDue, null);
  });

  it('is missed at stage 1 when 80 °F comes at 1.6 h, though the whole cool took 6.0 h', () => {
    const log = [readingF('0', '130'), readingF('1.6', '80'), readingF('6.0', '40')];
    const state = evaluateControl(option1, log, clockAt('7'));
    assert.equal(state.status, 'missed');
    assert.deepEqual(
      state.misses.map((miss) => [miss.kind, miss.key, miss.at]),
      [['reading', 'stage-1', readingF('1.6', '80').at]],
    );
  });

  it('names the stage, its target and its deadline while the cool is on', () => {
    const log = [readingF('0', '130'), readingF('0.5', '110')];
    const state = evaluateControl(option1, log, {
      now: readingF('1', '0').at,
      timeZone: 'America/Chicago',
    });
    assert.equal(state.status, 'in-progress');
    // source: 80 °F = (80 − 32) × 5/9 °C, the deadline 1.5 h after 12:00 UTC = 07:30 in Chicago (CST)
    assert.deepEqual(state.stage, {
      index: 1,
      toC: fahrenheitToCelsius(new Decimal(80)).toString(),
      deadline: readingF('1.5', '0').at,
    });
    assert.match(state.summary, /Stage 1: must reach 26\.7 °C \(80 °F\) by 07:30/);
    assert.equal(state.nextDue, readingF('1', '0').at);
  });

  it('is missed at the deadline when no reading reaches 80 °F by 1.5 h', () => {
    const log = [readingF('0', '130'), readingF('1', '95')];
    assert.equal(evaluateControl(option1, log, clockAt('1.5')).status, 'in-progress');
    const state = evaluateControl(option1, log, clockAt('1.51'));
    assert.equal(state.status, 'missed');
    assert.deepEqual(
      state.misses.map((miss) => [miss.kind, miss.key, miss.at]),
      [['deadline', 'stage-1', readingF('1.5', '0').at]],
    );
  });

  it('starts the clock at the last reading at or above 130 °F before the first below it', () => {
    // Still at 131 °F at 0.5 h: the 1.5 h run from there, so 80 °F at 1.9 h is in time.
    const log = [
      readingF('0', '135'),
      readingF('0.5', '131'),
      readingF('1', '110'),
      readingF('1.9', '80'),
    ];
    const state = evaluateControl(option1, log, clockAt('2'));
    assert.equal(state.status, 'in-progress');
    assert.equal(state.stage?.index, 2);
  });

  it('says the start was not seen when the first reading is already below 130 °F', () => {
    const state = evaluateControl(option1, [readingF('0', '120')], clockAt('0.1'));
    assert.match(state.summary, /not seen/);
    assert.equal(state.stage?.deadline, readingF('1.5', '0').at);
  });
});

describe('a cooling log judged against the Food Code', () => {
  // source: FDA Food Code 2022, §3-501.14: 135 °F to 70 °F within 2 h, and to 41 °F within 6 h
  // in all; time saved in the first stage may be used in the second.
  const foodCode = templateControl('food-code-cooling');

  it('is met at 70 °F after 1.0 h and 41 °F at 5.5 h, though the second stage took 4.5 h', () => {
    const log = [readingF('0', '135'), readingF('1.0', '70'), readingF('5.5', '41')];
    assert.equal(evaluateControl(foodCode, log, clockAt('6')).status, 'met');
  });

  it('is missed when 41 °F comes at 6.1 h, even though the first stage was quick', () => {
    const log = [readingF('0', '135'), readingF('1.0', '70'), readingF('6.1', '41')];
    const state = evaluateControl(foodCode, log, clockAt('7'));
    assert.deepEqual(
      state.misses.map((miss) => miss.key),
      ['stage-2'],
    );
  });
});

describe('the cured-product cooling option', () => {
  // source: FSIS Appendix B (1999), cured products: 130 °F to 80 °F in 5 h, then 80 °F to 45 °F
  // in 10 h (the 45 °F end point from memory of the FSIS text)
  it('is met at 80 °F after 4.5 h and 45 °F 9.5 h later', () => {
    const cured = templateControl('fsis-cooling-cured');
    const log = [readingF('0', '130'), readingF('4.5', '80'), readingF('14', '45')];
    assert.equal(evaluateControl(cured, log, clockAt('15')).status, 'met');
  });
});

describe('adding readings above the targets', () => {
  // A missed option-1 cool stays missed when readings between 80 °F and 130 °F are added at any
  // time, or readings at 130 °F and above after the product first fell below 130 °F. (A reading
  // at or above 130 °F before the fall says the cool had not begun, and may rightly move its
  // start.)
  const option1 = templateControl('fsis-cooling-option-1');
  const missedLog = fc
    .tuple(fc.integer({ min: 91, max: 400 }), fc.integer({ min: 1, max: 600 }))
    .map(([stage1Minutes, stage2Minutes]) => [
      readingF('0', '130'),
      readingF(new Decimal(stage1Minutes).div(60).toString(), '80'),
      readingF(new Decimal(stage1Minutes + stage2Minutes).div(60).toString(), '40'),
    ]);
  const extra = fc.record({
    minute: fc.integer({ min: 0, max: 1000 }),
    tenthsF: fc.integer({ min: 801, max: 1600 }),
  });

  it('never turns a missed stage into a met one', () => {
    fc.assert(
      fc.property(missedLog, fc.array(extra, { maxLength: 8 }), (log, extras) => {
        const added: ReadingPoint[] = extras
          .map(({ minute, tenthsF }) =>
            readingF(
              new Decimal(minute).div(60).toString(),
              new Decimal(tenthsF).div(10).toString(),
            ),
          )
          .filter(
            (reading) =>
              new Decimal(reading.value).lessThan(log[0].value) ||
              Date.parse(reading.at) > Date.parse(log[1].at),
          );
        const all = [...log, ...added].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
        const state = evaluateControl(option1, all, clockAt('30'));
        assert.equal(evaluateControl(option1, log, clockAt('30')).status, 'missed');
        assert.notEqual(state.status, 'met');
      }),
    );
  });
});
