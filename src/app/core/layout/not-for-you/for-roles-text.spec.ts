import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { askText, rolesText } from './for-roles-text.ts';

describe('the words of a page for other roles', () => {
  it('should name the roles a page is for', () => {
    assert.equal(rolesText(['admin']), 'admins');
    assert.equal(rolesText(['admin', 'reviewer']), 'admins and reviewers');
    assert.equal(rolesText(['admin', 'cook', 'reviewer']), 'admins, cooks and reviewers');
  });

  it('should name the admins to ask, or an admin while their names are not known', () => {
    assert.equal(
      askText(['Rosa Quennick']),
      'Ask Rosa Quennick, an admin here, if you need something done on this page, or if your role should change.',
    );
    assert.match(
      askText(['Rosa Quennick', 'Odile Farrant']),
      /^Ask Rosa Quennick or Odile Farrant, admins here, /,
    );
    assert.match(askText(['A', 'B', 'C']), /^Ask A, B or C, admins here, /);
    assert.match(askText(null), /^Ask an admin if you need/);
    assert.match(askText([]), /^Ask an admin if you need/);
  });
});
