import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import {
  COMMON_YEAST_FACTORS,
  DEFAULT_YEAST_FACTORS,
  PUBLISHED_YEAST_FACTORS,
} from '../../reference/yeast-factors.ts';
import type { DoughLine } from './dough-line.ts';
import { convertYeast, convertYeastLine } from './yeast.ts';

describe('converting yeast', () => {
  it('should turn 30 g fresh yeast into 12.0 g active dry and 9.9 g instant by the published set', () => {
    // source: professional bread-baking text, "Yeast conversions: fresh to dry" (title and
    // edition not confirmed)
    assert.equal(convertYeast(dec(30), 'fresh', 'active-dry').toFixed(1), '12.0');
    assert.equal(convertYeast(dec(30), 'fresh', 'instant').toFixed(1), '9.9');
    assert.equal(convertYeast(dec(30), 'fresh', 'instant').toString(), '9.9');
  });

  it('should turn 30 g fresh yeast into 15.0 g active dry and 10.0 g instant by the common set', () => {
    // common practice, no source (quoted among pizza and bread bakers)
    assert.equal(
      convertYeast(dec(30), 'fresh', 'active-dry', COMMON_YEAST_FACTORS).toFixed(1),
      '15.0',
    );
    assert.equal(
      convertYeast(dec(30), 'fresh', 'instant', COMMON_YEAST_FACTORS).toFixed(1),
      '10.0',
    );
  });

  it('should use the published set by default', () => {
    assert.equal(DEFAULT_YEAST_FACTORS, PUBLISHED_YEAST_FACTORS);
  });

  it('should convert back to the amount it started from', () => {
    const instant = convertYeast(dec(30), 'fresh', 'instant');
    assert.equal(convertYeast(instant, 'instant', 'fresh').toString(), '30');
    const dry = convertYeast(dec(12), 'active-dry', 'instant');
    // own example, derived: 12 g active dry = 30 g fresh = 9.9 g instant (published set)
    assert.equal(dry.toString(), '9.9');
  });

  it('should leave an amount alone when the kind does not change', () => {
    assert.equal(convertYeast(dec('7.25'), 'instant', 'instant').toString(), '7.25');
  });

  it('should rename a converted line and say what it was converted from', () => {
    const line: DoughLine = {
      ingredient: { name: 'Compressed yeast', pct: 2, yeast: 'fresh' },
      name: 'Compressed yeast',
      grams: dec(30),
      percent: dec(2),
      role: 'ingredient',
      yeast: 'fresh',
    };
    const converted = convertYeastLine(line, 'instant');
    assert.equal(converted.name, 'Instant yeast');
    assert.equal(converted.grams.toString(), '9.9');
    assert.equal(converted.percent.toString(), '0.66');
    assert.equal(converted.yeast, 'instant');
    assert.match(converted.note ?? '', /^converted from 30\.0 g fresh yeast/);
  });

  it('should leave lines that are not yeast alone', () => {
    const line: DoughLine = { name: 'Salt', grams: dec(20), percent: dec(2), role: 'ingredient' };
    assert.equal(convertYeastLine(line, 'instant'), line);
  });
});
