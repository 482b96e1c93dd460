import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchControl, ControlLimit } from './process-types.ts';
import {
  controlsByDue,
  dueWords,
  durationWords,
  limitWords,
  readingText,
  valueWords,
} from './process-words.ts';

describe('limitWords', () => {
  it('should say a cooling limit stage by stage, rounded to a tenth of a degree', () => {
    // 130 °F → 80 °F in 1.5 h, 80 °F → 40 °F in 5 h, each stage timed from its own start.
    // source: FSIS, Appendix B to the Compliance Guidelines for Cooling Heat-Treated Meat and
    // Poultry Products (Stabilization), 1999, cooling option 1
    const limit: ControlLimit = {
      type: 'cooling',
      stages: [
        {
          fromC: '54.4444444444',
          toC: '26.6666666667',
          withinS: '5400',
          countedFrom: 'stage-start',
        },
        {
          fromC: '26.6666666667',
          toC: '4.4444444444',
          withinS: '18000',
          countedFrom: 'stage-start',
        },
      ],
    };
    assert.equal(
      limitWords(limit, '°C'),
      'from 54.4 °C (130 °F) to 26.7 °C (80 °F) within 1 h 30 min, then to 4.4 °C (40 °F) within 5 h',
    );
  });

  it('should say a stage counted from the start of the cool as such', () => {
    // 135 °F → 70 °F within 2 h, and to 41 °F within 6 h in all.
    // source: FDA Food Code 2022, §3-501.14(A)
    const limit: ControlLimit = {
      type: 'cooling',
      stages: [
        {
          fromC: '57.2222222222',
          toC: '21.1111111111',
          withinS: '7200',
          countedFrom: 'stage-start',
        },
        { fromC: '21.1111111111', toC: '5', withinS: '21600', countedFrom: 'cooling-start' },
      ],
    };
    assert.match(limitWords(limit, '°C'), /then to 5 °C \(41 °F\) within 6 h of the start$/);
  });

  it('should say a time-at-temperature table row by row', () => {
    // 155 °F for 17 s, or 150 °F for 1 min. source: FDA Food Code 2022, §3-401.11(A)(2)
    const limit: ControlLimit = {
      type: 'hold',
      rows: [
        { tempC: '68.3333333333', holdS: '17' },
        { tempC: '65.5555555556', holdS: '60' },
      ],
    };
    assert.equal(
      limitWords(limit, '°C'),
      'at least 68.3 °C (155 °F) for 17 s, or 65.6 °C (150 °F) for 1 min',
    );
  });

  it('should say a range and a maximum', () => {
    // 41 °F = 5 °C. source: FDA Food Code 2022, §3-501.16(A)(2)
    assert.equal(limitWords({ type: 'at-most', max: '5' }, '°C'), 'at most 5 °C (41 °F)');
    assert.equal(
      limitWords({ type: 'between', min: '60', max: '80' }, '°C'),
      'between 60 °C (140 °F) and 80 °C (176 °F)',
    );
  });
});

describe('valueWords and durationWords', () => {
  it('should round half up and drop a trailing zero', () => {
    // 21.25 °C = 70.25 °F. source: the Celsius–Fahrenheit relation, °F = °C × 9/5 + 32
    assert.equal(valueWords('21.25', '°C'), '21.3 °C (70 °F)');
    assert.equal(valueWords('70.0', '°C'), '70 °C (158 °F)');
    assert.equal(valueWords('12450', 'g'), '12.45 kg');
    assert.equal(durationWords('5400'), '1 h 30 min');
    assert.equal(durationWords('17'), '17 s');
  });
});

describe('readingText', () => {
  it('should give a bare number the box unit and send a typed unit as typed', () => {
    assert.equal(readingText('71,5', 'internal-temperature'), '71.5 °C');
    assert.equal(readingText(' 160 F ', 'internal-temperature'), '160 F');
    assert.equal(readingText('5.9', 'ph'), '5.9');
  });
});

function control(id: string, nextDue: string | null): BatchControl {
  return {
    control: { id } as BatchControl['control'],
    state: { status: 'in-progress', summary: '', stage: null, nextDue, misses: [] },
    readings: [],
  };
}

describe('controlsByDue', () => {
  it('should put the control due soonest first and those with nothing due last', () => {
    const sorted = controlsByDue([
      control('smoker', '2026-03-02T15:00:00Z'),
      control('receiving', null),
      control('chill', '2026-03-02T14:30:00Z'),
    ]);
    assert.deepEqual(
      sorted.map((c) => c.control.id),
      ['chill', 'smoker', 'receiving'],
    );
  });
});

describe('dueWords', () => {
  it('should say overdue when the time has passed', () => {
    const now = new Date('2026-03-02T14:40:00Z');
    assert.match(dueWords('2026-03-02T14:30:00Z', now) ?? '', /^overdue since/);
    assert.match(dueWords('2026-03-02T14:52:00Z', now) ?? '', /in 12 min$/);
    assert.equal(dueWords(null, now), null);
  });
});
