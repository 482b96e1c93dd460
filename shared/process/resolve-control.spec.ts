import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import type { FormulaControl } from './control-types.ts';
import { resolveControl } from './resolve-control.ts';

const base: FormulaControl = {
  id: 'smoker',
  title: 'Smoker chamber',
  step: 'smoke',
  measure: 'chamber-temperature',
};

describe('resolving a control', () => {
  it('takes a template limit, source and corrective action, with the monitoring in seconds', () => {
    const control = resolveControl({
      ...base,
      measure: 'internal-temperature',
      rule: 'cold-holding',
      every: '4 h',
    });
    assert.equal(control.rule, 'cold-holding');
    // source: FDA Food Code 2022, §3-501.16(A)(2): 41 °F = 5 °C
    assert.deepEqual(control.limit, { type: 'at-most', max: '5' });
    assert.match(control.source, /Food Code 2022, §3-501\.16/);
    assert.equal(control.everyS, '14400');
    assert.equal(control.unit, '°C');
  });

  it('keeps the formula’s own corrective action over the template’s', () => {
    const control = resolveControl({ ...base, rule: 'curing-room', if_missed: 'Call the owner.' });
    assert.equal(control.ifMissed, 'Call the owner.');
  });

  it('reads an own range in °F exactly', () => {
    const control = resolveControl({
      ...base,
      limit: { min: '140 °F', max: '176 °F' },
      source: 'Quillmoor smoker validation, 2026',
    });
    assert.deepEqual(control.limit, {
      type: 'between',
      min: fahrenheitToCelsius(new Decimal(140)).toString(),
      max: '80',
    });
    assert.equal(control.rule, null);
    assert.equal(control.everyS, null);
  });

  it('reads an own hold and an own cooling', () => {
    const hold = resolveControl({ ...base, limit: { min: '68 °C', hold: '17 s' }, source: 'own' });
    assert.deepEqual(hold.limit, { type: 'hold', rows: [{ tempC: '68', holdS: '17' }] });
    const cooling = resolveControl({
      ...base,
      limit: {
        stages: [
          { from: '60 °C', to: '21 °C', within: '2 h' },
          { from: '21 °C', to: '5 °C', within: '6 h', counted_from: 'start' },
        ],
      },
      source: 'own',
    });
    assert.deepEqual(cooling.limit, {
      type: 'cooling',
      stages: [
        { fromC: '60', toC: '21', withinS: '7200', countedFrom: 'stage-start' },
        { fromC: '21', toC: '5', withinS: '21600', countedFrom: 'cooling-start' },
      ],
    });
  });

  it('refuses a bare temperature in a limit, which could be °C or °F', () => {
    assert.throws(() => resolveControl({ ...base, limit: { max: '80' }, source: 'own' }), /unit/);
  });

  it('refuses a rule that is not a template', () => {
    assert.throws(
      () => resolveControl({ ...base, rule: 'smoke-it' }),
      /not a process control rule/,
    );
  });
});
