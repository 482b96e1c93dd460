import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { ReceivingInputError, judgeReceiving, receivingLimit } from './receiving-limit.ts';

describe('receiving limits by kind of material', () => {
  it('holds refrigerated meat, poultry, seafood and dairy to 5 °C (41 °F)', () => {
    for (const kind of ['meat', 'poultry', 'seafood', 'dairy'] as const) {
      const limit = receivingLimit(kind, false);
      assert.equal(limit.rule, 'refrigerated', kind);
      // source: FDA Food Code 2022, §3-202.11(A): received at 5 °C (41 °F) or below
      assert.ok(new Decimal(limit.maxC!).equals('5'), kind);
      assert.equal(limit.words, '5 °C (41 °F) or colder');
      assert.match(limit.source!, /3-202\.11\(A\)/);
    }
  });

  it('holds shell eggs to 45 °F air temperature', () => {
    const limit = receivingLimit('egg', false);
    assert.equal(limit.rule, 'shell-eggs');
    // source: FDA Food Code 2022, §3-202.11(C): 7 °C (45 °F) air temperature; 45 °F exactly
    // is (45 − 32) × 5/9 = 65/9 °C
    assert.ok(new Decimal(limit.maxC!).equals(new Decimal(65).div(9)));
    assert.equal(limit.words, '7.2 °C (45 °F) or colder, air temperature');
    assert.match(limit.source!, /3-202\.11\(C\)/);
  });

  it('asks for anything shipped frozen to arrive frozen, whatever its kind', () => {
    // source: FDA Food Code 2022, §3-202.11(E): labelled frozen and shipped frozen → received frozen
    for (const kind of ['meat', 'poultry', 'seafood', 'dairy', 'egg'] as const) {
      const limit = receivingLimit(kind, true);
      assert.equal(limit.rule, 'frozen', kind);
      assert.equal(limit.maxC, undefined);
      assert.match(limit.source!, /3-202\.11\(E\)/);
    }
  });

  it('gives dry goods and shelf-stable items no temperature limit', () => {
    for (const kind of [
      'salt',
      'curing-salt',
      'sugar',
      'spice',
      'flour',
      'yeast',
      'sauce',
    ] as const)
      assert.deepEqual(receivingLimit(kind, false), {
        rule: 'none',
        words: 'no temperature limit',
        source: null,
      });
    assert.equal(receivingLimit('dairy', false, true).rule, 'none');
  });
});

describe('judging a delivery at the door', () => {
  const cold = receivingLimit('meat', false);

  it('takes 41 °F itself as within and 41.1 °F as over', () => {
    // source: FDA Food Code 2022, §3-202.11(A): "41 °F or below"
    assert.equal(judgeReceiving(cold, { temperature: '41 °F' }).within, true);
    assert.equal(judgeReceiving(cold, { temperature: '5 °C' }).within, true);
    assert.equal(judgeReceiving(cold, { temperature: '41.1 °F' }).within, false);
    assert.equal(judgeReceiving(cold, { temperature: '5.01 C' }).within, false);
  });

  it('says what was found against the limit in words', () => {
    assert.equal(
      judgeReceiving(cold, { temperature: '8 °C' }).words,
      '8 °C (46 °F): over its limit of 5 °C (41 °F) or colder',
    );
    assert.equal(
      judgeReceiving(cold, { temperature: '3 °C' }).words,
      '3 °C (37 °F): within its limit of 5 °C (41 °F) or colder',
    );
  });

  it('judges shell eggs at 45 °F, so 44 °F is within where meat would be over', () => {
    // source: FDA Food Code 2022, §3-202.11(A) 41 °F and (C) 45 °F
    const eggs = receivingLimit('egg', false);
    assert.equal(judgeReceiving(eggs, { temperature: '44 °F' }).within, true);
    assert.equal(judgeReceiving(cold, { temperature: '44 °F' }).within, false);
    assert.equal(judgeReceiving(eggs, { temperature: '46 °F' }).within, false);
  });

  it('judges a frozen product by whether it arrived frozen solid, keeping any reading', () => {
    const frozen = receivingLimit('meat', true);
    const solid = judgeReceiving(frozen, { frozenSolid: true, temperature: '-18 °C' });
    assert.equal(solid.within, true);
    assert.ok(solid.temperatureC!.equals(-18));
    const thawed = judgeReceiving(frozen, { frozenSolid: false });
    assert.equal(thawed.within, false);
    assert.match(thawed.words, /not frozen solid/);
  });

  it('needs a reading for a chilled product and the frozen observation for a frozen one', () => {
    assert.throws(
      () => judgeReceiving(cold, {}),
      (e) => e instanceof ReceivingInputError && e.field === 'temperature',
    );
    assert.throws(
      () => judgeReceiving(receivingLimit('poultry', true), { temperature: '-20 °C' }),
      (e) => e instanceof ReceivingInputError && e.field === 'frozenSolid',
    );
    assert.throws(() => judgeReceiving(cold, { temperature: 'cold' }), QuantityError);
  });

  it('passes dry goods with or without a reading', () => {
    const dry = receivingLimit('salt', false);
    assert.equal(judgeReceiving(dry, {}).within, true);
    assert.equal(judgeReceiving(dry, { temperature: '30 °C' }).within, true);
  });
});
