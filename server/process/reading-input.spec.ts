import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { AppError } from '../http/app-error.ts';
import { readingSource, readingTime, readingValue } from './reading-input.ts';

const CHAMBER = resolveControl({
  id: 'smoker',
  title: 'Smoker chamber',
  step: 'smoke',
  measure: 'chamber-temperature',
  limit: { min: '60 °C', max: '80 °C' },
  source: 'Quillmoor smoker validation, 2026',
  every: '30 min',
});
const NOW = '2026-03-02T12:00:00.000Z';

describe('a reading as entered', () => {
  it('keeps °F as entered beside the exact °C', () => {
    // source: 158 °F = (158 − 32) × 5/9 = 70 °C exactly
    assert.deepEqual(readingValue('158 °F', CHAMBER), { value: '70', enteredAs: '158 °F' });
  });

  it('keeps nothing beside a value typed in °C or bare', () => {
    assert.deepEqual(readingValue('71.5 °C', CHAMBER), { value: '71.5', enteredAs: null });
    assert.deepEqual(readingValue('71.5', CHAMBER), { value: '71.5', enteredAs: null });
  });

  it('refuses a value that is not a temperature, naming the field', () => {
    assert.throws(
      () => readingValue('hot', CHAMBER),
      (error: unknown) =>
        error instanceof AppError &&
        error.status === 422 &&
        (error.details[0] as { field: string }).field === 'value',
    );
  });

  it('takes a time with its zone, as UTC, and refuses one over 5 minutes ahead', () => {
    assert.equal(readingTime('2026-03-02T13:04:00+01:00', NOW), '2026-03-02T12:04:00.000Z');
    assert.equal(readingTime(undefined, NOW), NOW);
    assert.throws(() => readingTime('2026-03-02T12:05:01Z', NOW), /5 minutes/);
    assert.throws(() => readingTime('2026-03-02 12:00', NOW), /zone/);
  });

  it('says where a reading came from', () => {
    assert.equal(readingSource('session', undefined), 'console');
    assert.equal(readingSource('basic', 'larder'), 'command');
    assert.equal(readingSource('basic', 'kitchen-script'), 'api');
  });
});
