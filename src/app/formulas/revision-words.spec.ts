import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { nameOf, revisionInWords } from './revision-words.ts';

// The demo crew's names. source: server/demo/demo-people.ts
const ROSA = { displayName: 'Rosa Quennick (head cook)' };

describe('revisionInWords', () => {
  it('should say who edited a formula in the console, by name, without the role', () => {
    assert.equal(
      revisionInWords({ source: 'save', author: ROSA }),
      'edited in the console by Rosa Quennick',
    );
    assert.equal(
      revisionInWords({ source: 'create', author: ROSA }),
      'created in the console by Rosa Quennick',
    );
    assert.equal(
      revisionInWords({ source: 'upload', author: 'Rosa Quennick (head cook)' }),
      'uploaded by Rosa Quennick',
    );
  });

  it('should say a revision found on disk was changed in the files, never "on disk"', () => {
    const words = revisionInWords({ source: 'disk', author: null });
    assert.equal(words, 'changed in the files');
    assert.doesNotMatch(words, /disk|[0-9a-f]{8}/);
  });

  it('should still say something for a revision with no history', () => {
    assert.equal(revisionInWords({ source: null, author: null }), 'an earlier version');
    assert.equal(revisionInWords({ source: 'save', author: null }), 'edited in the console');
  });
});

describe('nameOf', () => {
  it('should keep a name without brackets as it is', () => {
    assert.equal(nameOf('Tobin Marrowfeld'), 'Tobin Marrowfeld');
    assert.equal(nameOf(null), null);
  });
});
