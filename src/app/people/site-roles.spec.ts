import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Person, SiteInfo } from '../core/api/api-types.ts';
import { adminEverywhere, roleChanges, roleChoices, rolesInWords } from './site-roles.ts';

const SITES: readonly SiteInfo[] = [
  { key: 'smokehouse', name: 'Quillmoor Smokehouse', role: 'admin' },
  { key: 'saltmarrow', name: 'Saltmarrow Quay shop', role: 'admin' },
];

function person(fields: Partial<Person>): Person {
  return {
    id: 7,
    username: 'maren',
    displayName: 'Maren',
    email: null,
    role: 'cook',
    roleEverywhere: true,
    sites: [],
    active: true,
    demo: false,
    createdAt: '2026-12-01T08:00:00Z',
    updatedAt: '2026-12-01T08:00:00Z',
    ...fields,
  };
}

describe('a person’s roles per site', () => {
  it('should start the form from the role at every site and each site’s own role', () => {
    const cook = person({ sites: [{ key: 'saltmarrow', role: 'reviewer' }] });
    assert.deepEqual(roleChoices(cook, SITES), {
      everywhere: 'cook',
      sites: { smokehouse: 'same', saltmarrow: 'reviewer' },
    });
    const shopOnly = person({
      roleEverywhere: false,
      sites: [{ key: 'saltmarrow', role: 'cook' }],
    });
    assert.equal(roleChoices(shopOnly, SITES).everywhere, 'none');
  });

  it('should send nothing when nothing changed', () => {
    const cook = person({ sites: [{ key: 'saltmarrow', role: 'reviewer' }] });
    assert.deepEqual(roleChanges(cook, roleChoices(cook, SITES)), {});
  });

  it('should take away the role at every site and keep one site’s', () => {
    const cook = person({});
    const changes = roleChanges(cook, {
      everywhere: 'none',
      sites: { smokehouse: 'same', saltmarrow: 'cook' },
    });
    assert.deepEqual(changes, {
      roleEverywhere: false,
      sites: [{ key: 'saltmarrow', role: 'cook' }],
    });
  });

  it('should give a role at every site back, and drop a site’s role that says the same', () => {
    const shopOnly = person({
      roleEverywhere: false,
      sites: [{ key: 'saltmarrow', role: 'cook' }],
    });
    const changes = roleChanges(shopOnly, {
      everywhere: 'cook',
      sites: { smokehouse: 'same', saltmarrow: 'cook' },
    });
    assert.deepEqual(changes, { role: 'cook', sites: [] });
  });

  it('should send the new role at every site alone when the sites stay', () => {
    const cook = person({ sites: [{ key: 'saltmarrow', role: 'admin' }] });
    const changes = roleChanges(cook, {
      everywhere: 'reviewer',
      sites: { smokehouse: 'same', saltmarrow: 'admin' },
    });
    assert.deepEqual(changes, { role: 'reviewer' });
  });

  it('should say each role in words, naming the sites', () => {
    assert.equal(rolesInWords(person({}), SITES), 'Cook');
    assert.equal(
      rolesInWords(
        person({ role: 'reviewer', sites: [{ key: 'saltmarrow', role: 'cook' }] }),
        SITES,
      ),
      'Reviewer; Cook at Saltmarrow Quay shop',
    );
    assert.equal(
      rolesInWords(
        person({ roleEverywhere: false, sites: [{ key: 'saltmarrow', role: 'cook' }] }),
        SITES,
      ),
      'Cook at Saltmarrow Quay shop only',
    );
    assert.equal(
      rolesInWords(
        person({
          roleEverywhere: false,
          sites: [
            { key: 'smokehouse', role: 'reviewer' },
            { key: 'saltmarrow', role: 'cook' },
          ],
        }),
        SITES,
      ),
      'Reviewer at Quillmoor Smokehouse; Cook at Saltmarrow Quay shop',
    );
    assert.equal(rolesInWords(person({ roleEverywhere: false }), SITES), 'No role at any site');
  });

  it('should count as admin everywhere only an admin whose role holds at every site', () => {
    assert.equal(adminEverywhere(person({ role: 'admin' })), true);
    assert.equal(adminEverywhere(person({ role: 'admin', roleEverywhere: false })), false);
    assert.equal(adminEverywhere(person({ role: 'cook' })), false);
  });
});
