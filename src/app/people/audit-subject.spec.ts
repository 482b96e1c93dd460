import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { subjectOf } from './audit-subject.ts';

const TITLES = new Map([['bacon-pack', 'Sliced bacon, 200 g pack']]);

describe('what an audit entry was done to', () => {
  it('should name a planned menu item by its title and link its formula', () => {
    const entry = { action: 'plan-make', subject: 'bacon-pack', subjectDisplayName: null } as const;
    assert.deepEqual(subjectOf({ ...entry, detail: {} }, TITLES), {
      text: 'Sliced bacon, 200 g pack',
      link: '/formulas/bacon-pack',
    });
  });

  it('should keep the id of a formula the list no longer has, still linked', () => {
    const entry = { action: 'formula-save', subject: 'old-rub', subjectDisplayName: null } as const;
    assert.deepEqual(subjectOf({ ...entry, detail: {} }, TITLES), {
      text: 'old-rub',
      link: '/formulas/old-rub',
    });
  });

  it('should link a lot code to its batch, whatever the action', () => {
    const entry = {
      action: 'batch-status',
      subject: '261203-QB-01',
      subjectDisplayName: null,
    } as const;
    assert.deepEqual(subjectOf({ ...entry, detail: {} }, TITLES), {
      text: 'Lot 261203-QB-01',
      link: '/batches/261203-QB-01',
    });
  });
});
