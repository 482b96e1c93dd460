import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { FormulaSummary } from '../formula-api-types.ts';
import { matchesSearch, sortedByTitle } from './formula-search.ts';

function summary(title: string | null, id: string | null, file = `${id}.yaml`): FormulaSummary {
  return {
    id,
    title,
    kind: 'mix',
    file,
    revision: 'r',
    valid: true,
    problemCount: 0,
    errorCount: 0,
    duplicate: false,
    lastChangedBy: null,
    lastChangedAt: null,
    lastChangeSource: null,
  } as FormulaSummary;
}

describe('sortedByTitle', () => {
  it('should sort by title in any case, numbers in order, a file without a title by its name', () => {
    const sorted = sortedByTitle([
      summary('smokehouse burger', 'smokehouse-burger'),
      summary('Brine 10 %', 'brine-10'),
      summary('Brine 2 %', 'brine-2'),
      summary(null, null, 'broken.yaml'),
      summary('Ham pump', 'ham-pump'),
    ]);
    assert.deepEqual(
      sorted.map((s) => s.title ?? s.file),
      ['Brine 2 %', 'Brine 10 %', 'broken.yaml', 'Ham pump', 'smokehouse burger'],
    );
  });
});

describe('matchesSearch', () => {
  const sauce = summary('Pit-house sandwich sauce', 'house-sauce');

  it('should find every word typed in the title or id, in any case and order', () => {
    assert.equal(matchesSearch(sauce, 'SAUCE pit'), true);
    assert.equal(matchesSearch(sauce, 'house-sauce'), true);
    assert.equal(matchesSearch(sauce, 'sauce bun'), false);
  });

  it('should match with or without accents, and match everything when nothing is typed', () => {
    assert.equal(matchesSearch(summary('Crème fraîche dip', 'creme-dip'), 'creme fraiche'), true);
    assert.equal(matchesSearch(sauce, '   '), true);
  });
});
