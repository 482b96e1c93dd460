import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { evaluateControl } from './evaluate-control.ts';
import { clockAt, readingAtMinuteF, templateControl } from './judge-spec-helpers.ts';

/** One reading a minute from `fromMinute` to `toMinute` at the °F each minute gives. */
function everyMinute(fromMinute: number, toMinute: number, degreesF: (minute: number) => string) {
  const readings = [];
  for (let minute = fromMinute; minute <= toMinute; minute++) {
    readings.push(readingAtMinuteF(String(minute), degreesF(minute)));
  }
  return readings;
}

describe('cooking judged against the FSIS Appendix A table (6.5-log)', () => {
  // source: USDA FSIS, Compliance Guidelines for Meeting Lethality Performance Standards for
  // Certain Meat and Poultry Products, Appendix A (1999), table for cooked beef, roast beef and
  // cooked corned beef: 140 °F for 12 min, 141 °F for 9 min, 158 °F instant.
  const table = templateControl('fsis-lethality-table', '1 min');

  it('is met after 12 minutes at 140 °F', () => {
    const state = evaluateControl(
      table,
      everyMinute(0, 12, () => '140'),
      clockAt('1'),
    );
    assert.equal(state.status, 'met');
  });

  it('is not met by 11 minutes between 140 °F and 141 °F, and is missed once the step is over', () => {
    // 141 °F only every other minute, so no run at 141 °F lasts 9 minutes either
    const readings = everyMinute(0, 11, (minute) => (minute % 2 === 0 ? '140' : '141'));
    const during = evaluateControl(table, readings, clockAt('1'));
    assert.equal(during.status, 'in-progress');
    assert.match(during.summary, /for 11 min of the 12 min it needs/);
    const over = evaluateControl(table, readings, clockAt('1'), { stepOver: true });
    assert.equal(over.status, 'missed');
    assert.deepEqual(
      over.misses.map((miss) => miss.key),
      ['not-reached'],
    );
  });

  it('is met at once by one reading at 158 °F', () => {
    const state = evaluateControl(table, [readingAtMinuteF('0', '158')], clockAt('1'));
    assert.equal(state.status, 'met');
  });

  it('starts the time again when a reading drops below the row', () => {
    const readings = everyMinute(0, 14, (minute) => (minute === 6 ? '139.9' : '140'));
    // two runs of 5 and 8 minutes at 140 °F: neither is 12 minutes
    assert.equal(evaluateControl(table, readings, clockAt('1')).status, 'in-progress');
  });
});

describe('cooking ground meat judged against the Food Code', () => {
  // source: FDA Food Code 2022, §3-401.11(A)(2): comminuted meat 155 °F for 17 seconds, or
  // 145 °F 3 min, 150 °F 1 min, 158 °F < 1 s
  const comminuted = templateControl('food-code-cook-comminuted', '1 min');

  it('is in progress while it peaks below 155 °F, and missed once the step is over', () => {
    // 145 °F and above for 2 min (needs 3), 150 °F and above at one reading only (needs 1 min)
    const readings = everyMinute(0, 4, (minute) => ['120', '140', '148', '154', '149'][minute]);
    assert.equal(evaluateControl(comminuted, readings, clockAt('1')).status, 'in-progress');
    const over = evaluateControl(comminuted, readings, clockAt('1'), { stepOver: true });
    assert.equal(over.status, 'missed');
    assert.match(over.summary, /highest was 67\.8 °C \(154 °F\)/);
  });

  it('is met by 150 °F held for a minute', () => {
    const readings = [readingAtMinuteF('0', '150'), readingAtMinuteF('1', '150.5')];
    assert.equal(evaluateControl(comminuted, readings, clockAt('1')).status, 'met');
  });

  it('is missed with no reading at all when the step is over', () => {
    const over = evaluateControl(comminuted, [], clockAt('1'), { stepOver: true });
    assert.equal(over.status, 'missed');
  });
});

describe('holding judged reading by reading', () => {
  // source: FDA Food Code 2022, §3-501.16(A)(2): cold holding at 41 °F or less
  const cold = templateControl('cold-holding', '4 h');

  it('is in progress while readings keep at or under 41 °F, with the next one due', () => {
    const readings = [readingAtMinuteF('0', '38'), readingAtMinuteF('240', '41')];
    const state = evaluateControl(cold, readings, clockAt('5'));
    assert.equal(state.status, 'in-progress');
    assert.equal(state.nextDue, readingAtMinuteF('480', '0').at);
  });

  it('misses the reading over 41 °F, keyed by its time', () => {
    const readings = [readingAtMinuteF('0', '38'), readingAtMinuteF('240', '41.5')];
    const state = evaluateControl(cold, readings, clockAt('5'));
    assert.equal(state.status, 'missed');
    assert.deepEqual(
      state.misses.map((miss) => miss.key),
      [readingAtMinuteF('240', '0').at],
    );
  });

  it('misses hot holding under 135 °F', () => {
    // source: FDA Food Code 2022, §3-501.16(A)(1): hot holding at 135 °F or above
    const hot = templateControl('hot-holding', '2 h');
    const state = evaluateControl(hot, [readingAtMinuteF('0', '134')], clockAt('1'));
    assert.equal(state.status, 'missed');
  });

  it('meets a single check on receiving', () => {
    // source: FDA Food Code 2022, §3-202.11(A): refrigerated food received at 41 °F or below
    const receiving = templateControl('receiving-cold', '0 s');
    const single = { ...receiving, everyS: null };
    assert.equal(
      evaluateControl(single, [readingAtMinuteF('0', '39')], clockAt('1')).status,
      'met',
    );
  });

  it('waits when there is no reading', () => {
    assert.equal(evaluateControl(cold, [], clockAt('1')).status, 'waiting');
  });
});
