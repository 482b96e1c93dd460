import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { revisionWords } from './revision-words.ts';

const day = (iso: string): string => (iso.startsWith('2026-12-03') ? '3 Dec 2026' : iso);
const ROSA = { id: 1, username: 'rosa', displayName: 'Rosa' };

describe('revisionWords', () => {
  it('should say who edited the formula in the console and when, never the hash', () => {
    const words = revisionWords(
      { source: 'save', author: ROSA, at: '2026-12-03T09:12:00Z', current: true },
      day,
    );
    assert.equal(
      words,
      'the formula as edited in the console by Rosa on 3 Dec 2026 (still its current version)',
    );
  });

  it('should say a revision found on disk was changed in the files, and that it changed since', () => {
    const words = revisionWords(
      { source: 'disk', author: null, at: '2026-12-03T06:00:00Z', current: false },
      day,
    );
    assert.equal(
      words,
      'the formula as changed in the files, found on 3 Dec 2026 (it has changed since)',
    );
  });

  it('should speak of a revision with no record at all', () => {
    assert.equal(revisionWords({ current: true }, day), 'the formula as it is in the files now');
    assert.equal(revisionWords(null, day), 'an earlier version of the formula, no longer kept');
  });
});
