import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { FormulaFacts } from '../batch-types';
import { batchOptions, fieldOf, fieldsFor, inBox, inFormWords, withUnit } from './batch-fields.ts';

const cure = (method: 'dry' | 'brine' | 'pump'): FormulaFacts => ({
  id: 'x',
  title: 'X',
  kind: 'cure',
  method,
});

describe('fieldsFor', () => {
  it('should offer water only to a brine cure and pump only to a pump cure', () => {
    const keys = (method: 'dry' | 'brine' | 'pump'): string[] =>
      fieldsFor(cure(method)).map((x) => x.key);
    assert.deepEqual(keys('dry'), ['meat', 'thickness', 'largestPiece']);
    assert.deepEqual(keys('brine'), ['meat', 'thickness', 'largestPiece', 'water']);
    assert.deepEqual(keys('pump'), ['meat', 'thickness', 'largestPiece', 'pump', 'pumpedWeight']);
  });

  it('should offer only the size a cure’s own hold goes by, and require it', () => {
    const sized = (hold: FormulaFacts['hold']) =>
      fieldsFor({ ...cure('dry'), hold })
        .filter((x) => x.key === 'thickness' || x.key === 'largestPiece')
        .map((x) => [x.key, x.required ?? false]);
    // formulas/quillmoor-belly.yaml: 2 days per cm, at least 7; formulas/ham-pump.yaml: 1 day per kg
    assert.deepEqual(sized({ days_per_cm: 2, min_days: 7 }), [['thickness', true]]);
    assert.deepEqual(sized({ days_per_kg: 1, plus_days: 1 }), [['largestPiece', true]]);
    // formulas/maple-pump-belly.yaml: 2 days, whatever the size
    assert.deepEqual(sized({ days: 2 }), []);
  });

  it('should require the size the preview says a default hold needs', () => {
    const fields = fieldsFor(cure('brine'), 'largestPiece');
    assert.equal(fields.find((x) => x.key === 'largestPiece')?.required, true);
    assert.equal(fields.find((x) => x.key === 'thickness')?.required, undefined);
  });

  it('should ask a preferment temperature only of a dough with a preferment', () => {
    const plain = fieldsFor({ id: 'b', title: 'B', kind: 'dough' }).map((x) => x.key);
    const sponge = fieldsFor({ id: 'b', title: 'B', kind: 'dough', preferment: {} }).map(
      (x) => x.key,
    );
    assert.equal(plain.includes('prefermentTemp'), false);
    assert.equal(sponge.includes('prefermentTemp'), true);
  });
});

describe('withUnit', () => {
  it('should give a bare number the box’s unit', () => {
    assert.equal(withUnit('4.26', 'mass', 'metric'), '4.26 kg');
    assert.equal(withUnit('9,4', 'mass', 'us'), '9.4 lb');
    assert.equal(withUnit('90', 'small-mass', 'metric'), '90 g');
    assert.equal(withUnit('4', 'length', 'metric'), '4 cm');
    assert.equal(withUnit('26', 'temperature', 'metric'), '26C');
    assert.equal(withUnit('78', 'temperature', 'us'), '78F');
  });

  it('should leave percentages and counts as plain numbers', () => {
    assert.equal(withUnit('12', 'percent', 'metric'), '12');
    assert.equal(withUnit('48', 'count', 'us'), '48');
  });

  it('should send a value with its own unit as typed', () => {
    assert.equal(withUnit(' 9 lb 6 oz ', 'mass', 'metric'), '9 lb 6 oz');
    assert.equal(withUnit('12 L', 'mass', 'metric'), '12 L');
  });
});

describe('inBox', () => {
  it('should take off the unit the box shows beside it', () => {
    assert.equal(inBox('4.26kg', 'mass', 'metric'), '4.26');
    assert.equal(inBox('4 cm', 'length', 'metric'), '4');
    assert.equal(inBox('26C', 'temperature', 'metric'), '26');
    assert.equal(inBox('12', 'percent', 'metric'), '12');
  });

  it('should keep a value in another unit, or in several, as it is', () => {
    assert.equal(inBox('9.4 lb', 'mass', 'metric'), '9.4 lb');
    assert.equal(inBox('9 lb 6 oz', 'mass', 'us'), '9 lb 6 oz');
    assert.equal(inBox('78F', 'temperature', 'metric'), '78F');
  });

  it('should give back what withUnit sent', () => {
    for (const [text, measure] of [
      ['4.26', 'mass'],
      ['90', 'small-mass'],
      ['26', 'temperature'],
    ] as const)
      assert.equal(inBox(withUnit(text, measure, 'metric'), measure, 'metric'), text);
  });
});

describe('batchOptions', () => {
  it('should leave out empty boxes and join each trimming’s on hand and fat test as KEY=VALUE', () => {
    const fields = fieldsFor({ id: 'g', title: 'G', kind: 'blend' });
    assert.deepEqual(
      batchOptions(
        fields,
        { total: '100', targetFat: '20' },
        'metric',
        [
          { key: 'lean', onHand: '', fatTest: '18.5' },
          { key: 'fat', onHand: '', fatTest: '' },
          { key: 'plate', onHand: '20', fatTest: '' },
          { key: 'chuck', onHand: '9 lb 6 oz', fatTest: '' },
        ],
        '2026-12-02',
      ),
      {
        total: '100 kg',
        targetFat: '20',
        onHand: 'plate=20 kg, chuck=9 lb 6 oz',
        fatTest: 'lean=18.5',
        start: '2026-12-02',
      },
    );
  });
});

describe('inFormWords and fieldOf', () => {
  it('should name the box instead of the command-line option', () => {
    const fields = fieldsFor(cure('dry'));
    assert.equal(
      inFormWords('--largest-piece 0.5 g is less than 1 g; check the unit', fields),
      '“Weight of the heaviest piece” 0.5 g is less than 1 g; check the unit',
    );
    assert.equal(fieldOf([{ option: 'largest-piece' }]), 'largestPiece');
    assert.equal(
      inFormWords('--fat-test names "belly", but --on-hand…', []),
      '“Fat test” names "belly", but “On hand”…',
    );
    assert.equal(fieldOf([]), null);
  });
});
