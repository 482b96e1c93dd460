import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { unitsTogether } from './units-together.ts';

const NBSP = '\u00a0';

describe('unitsTogether', () => {
  it('should hold each number to its unit', () => {
    assert.equal(
      unitsTogether('Stage 1: 25 °C (77 °F) at 15:00; must be 26.7 °C (80 °F) or below'),
      `Stage 1: 25${NBSP}°C (77${NBSP}°F) at 15:00; must be 26.7${NBSP}°C (80${NBSP}°F) or below`,
    );
    assert.equal(unitsTogether('within 1 h 30 min'), `within 1${NBSP}h 30${NBSP}min`);
    assert.equal(unitsTogether('157.0 ppm, 3.9 kg'), `157.0${NBSP}ppm, 3.9${NBSP}kg`);
  });

  it('should leave a number before an ordinary word alone', () => {
    assert.equal(unitsTogether('3 readings in 2 hours'), '3 readings in 2 hours');
    assert.equal(unitsTogether('at 15:00 sharp'), 'at 15:00 sharp');
  });
});
