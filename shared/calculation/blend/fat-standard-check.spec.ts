import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { FAT_STANDARDS } from '../../reference/fat-standards.ts';
import { fatStandardCheck } from './fat-standard-check.ts';

describe('FAT_STANDARDS', () => {
  it('should cap ground beef at 30 % fat', () => {
    // source: 9 CFR 319.15(a) (USDA FSIS), read in training material quoting it
    assert.ok(FAT_STANDARDS['ground-beef'].maxFatPercent.equals(dec('30')));
  });

  it('should cap fresh pork sausage at 50 % fat', () => {
    // source: 9 CFR 319.141 (USDA FSIS), as stated in The National Provisioner trade magazine
    assert.ok(FAT_STANDARDS['fresh-pork-sausage'].maxFatPercent.equals(dec('50')));
  });
});

describe('fatStandardCheck', () => {
  it('should fail 32 % fat as ground beef, as a labelling check that is not critical', () => {
    // source: 9 CFR 319.15(a), at most 30 % fat
    const check = fatStandardCheck('ground-beef', dec('32'));
    assert.equal(check.id, 'fat-standard-ground-beef');
    assert.equal(check.status, 'fail');
    assert.equal(check.critical, false);
    assert.equal(check.unit, 'percent');
    assert.equal(check.comparison, 'at-most');
  });

  it('should pass fat at the limit and under it', () => {
    // source: 9 CFR 319.15(a) and 319.141 ("at most")
    assert.equal(fatStandardCheck('ground-beef', dec('30')).status, 'pass');
    assert.equal(fatStandardCheck('ground-beef', dec('29.999')).status, 'pass');
    assert.equal(fatStandardCheck('fresh-pork-sausage', dec('50')).status, 'pass');
    assert.equal(fatStandardCheck('fresh-pork-sausage', dec('50.001')).status, 'fail');
  });
});
