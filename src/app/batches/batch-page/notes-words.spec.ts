import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { notesInWords } from './notes-words.ts';

describe('notesInWords', () => {
  const titles = new Map([['smokehouse-burger', 'Smokehouse burger']]);
  const titleOf = (id: string): string | undefined => titles.get(id);

  it('should say a plan note in words, with no id and no YYYY-MM-DD day', () => {
    assert.equal(
      notesInWords('plan: smokehouse-burger ×120 for 2026-12-18', titleOf),
      'Recorded from the plan for 120 × Smokehouse burger, for the service on 18 Dec 2026',
    );
  });

  it('should not show the id of a menu item whose title is not known', () => {
    const words = notesInWords('plan: gone-burger ×8 for 2026-12-18', titleOf);
    assert.doesNotMatch(words, /gone-burger/);
    assert.match(words, /8 × a menu item/);
  });

  it('should leave a cook’s own note as it was written', () => {
    const note = 'plan: ask Rosa about the 2026-12-18 order';
    assert.equal(notesInWords(note, titleOf), note);
  });
});
