import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { chooseSite, rememberedSiteKey } from './site-choice.ts';

const main = { key: 'main', name: 'Quillmoor Smokehouse', role: 'admin' } as const;
const shop = { key: 'saltmarrow', name: 'Saltmarrow Quay shop', role: 'cook' } as const;

describe('chooseSite', () => {
  it('should keep the site chosen before while it is still one of the person’s', () => {
    assert.equal(chooseSite([main, shop], 'saltmarrow'), shop);
  });

  it('should fall back to main when the chosen site is gone', () => {
    assert.equal(chooseSite([main, shop], 'harbour'), main);
    assert.equal(chooseSite([shop, main], null), main);
  });

  it('should fall back to the first site when main is not the person’s', () => {
    assert.equal(chooseSite([shop], 'main'), shop);
    assert.equal(chooseSite([], 'main'), undefined);
  });
});

describe('rememberedSiteKey', () => {
  it('should keep one choice per person', () => {
    assert.notEqual(rememberedSiteKey(1), rememberedSiteKey(2));
  });
});
