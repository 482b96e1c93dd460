import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import {
  celsiusToFahrenheit,
  parseTemperature,
  parseTemperatureDifference,
} from '../../units/temperature.ts';
import {
  frictionFromTrial,
  ICE_MELT_DEGREES_C,
  iceFraction,
  waterTemperature,
} from './water-temperature.ts';

describe('water temperature for a desired dough temperature', () => {
  it('should need 87 °F water for DDT 75 °F, room and flour 65 °F, friction 8', () => {
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009)
    const water = waterTemperature({
      ddt: dec(75),
      room: dec(65),
      flour: dec(65),
      friction: dec(8),
    });
    assert.equal(water.toString(), '87');
  });

  it('should need 65 °F water for DDT 80 °F, flour 65 °F, room 75 °F, friction 35', () => {
    // source: Pizza Today trade magazine, June 2018
    const water = waterTemperature({
      ddt: dec(80),
      room: dec(75),
      flour: dec(65),
      friction: dec(35),
    });
    assert.equal(water.toString(), '65');
  });

  it('should count four temperatures with a preferment and need 70 °F water', () => {
    // own example, derived (the San Francisco Baking Institute rule with a preferment):
    // 4 × 76 − (72 + 70 + 68 + 24)
    const water = waterTemperature({
      ddt: dec(76),
      room: dec(72),
      flour: dec(70),
      preferment: dec(68),
      friction: dec(24),
    });
    assert.equal(water.toString(), '70');
  });

  it('should need 30.556 °C water in Celsius when the friction factor is scaled by 5/9', () => {
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009),
    // converted to °C (NIST SP 811), the friction factor, a difference, by 5/9 only (derived)
    const water = waterTemperature({
      ddt: parseTemperature('75 °F'),
      room: parseTemperature('65 °F'),
      flour: parseTemperature('65 °F'),
      friction: parseTemperatureDifference('8 °F'),
    });
    assert.equal(water.toFixed(3), '30.556');
    assert.equal(celsiusToFahrenheit(water).toFixed(6), '87.000000');
  });

  it('should not give the wrong 27.0 °C that an unscaled friction factor gives', () => {
    // derived from the same SFBI example: the wrong answer when FF = 8 is used unscaled in °C
    const right = waterTemperature({
      ddt: parseTemperature('75 °F'),
      room: parseTemperature('65 °F'),
      flour: parseTemperature('65 °F'),
      friction: parseTemperatureDifference('8 °F'),
    });
    assert.notEqual(right.toFixed(1), '27.0');
    const wrong = waterTemperature({
      ddt: parseTemperature('75 °F'),
      room: parseTemperature('65 °F'),
      flour: parseTemperature('65 °F'),
      friction: dec(8),
    });
    assert.equal(wrong.toFixed(1), '27.0');
  });

  it('should find a friction factor of 38 from a trial mix', () => {
    // own example, derived: friction from a trial mix as in PMQ trade magazine, Spring 2003
    // dough Q&A column: 3 × 80 − (72 + 70 + 60)
    assert.equal(
      frictionFromTrial({
        mixed: dec(80),
        room: dec(72),
        flour: dec(70),
        water: dec(60),
      }).toString(),
      '38',
    );
  });

  it('should find the same friction factor from the trial mix in °C, as a difference', () => {
    // own example, derived (the PMQ trial mix in °C): 38 °F of rise = 21.111 °C of rise
    const friction = frictionFromTrial({
      mixed: parseTemperature('80 °F'),
      room: parseTemperature('72 °F'),
      flour: parseTemperature('70 °F'),
      water: parseTemperature('60 °F'),
    });
    assert.equal(friction.toFixed(3), parseTemperatureDifference('38 °F').toFixed(3));
    assert.equal(friction.toFixed(3), '21.111');
  });
});

describe('ice for cold dough water', () => {
  it('should use 79.7 for latent heat over specific heat', () => {
    // from memory, unverified: latent heat of fusion of ice 333.55 J/g ÷ specific heat of water
    // 4.186 J/(g·K)
    assert.equal(ICE_MELT_DEGREES_C.toString(), '79.7');
  });

  it('should replace 15.045 % of the water with ice for 5 °C water from a 20 °C tap', () => {
    // own example, derived from the heat balance of melting ice: (20 − 5) / (20 + 79.7)
    const fraction = iceFraction(dec(20), dec(5));
    assert.equal(fraction.toFixed(5), '0.15045');
    assert.equal(fraction.toString(), dec(15).div('99.7').toString());
  });

  it('should need no ice when the tap water is cold enough', () => {
    assert.equal(iceFraction(dec(12), dec(20)).toString(), '0');
    assert.equal(iceFraction(dec(12), dec(12)).toString(), '0');
  });

  it('should reach 1 or more when ice alone cannot cool the water enough', () => {
    // own example, derived: (20 − (−80)) / 99.7 > 1
    assert.ok(iceFraction(dec(20), dec(-80)).greaterThanOrEqualTo(1));
  });
});
