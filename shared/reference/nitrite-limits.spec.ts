import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { nitriteRuleFor } from './nitrite-limits.ts';

// 100 lb = 1 600 oz (NIST SP 811: 1 oz = 1/16 lb), so "n oz per 100 lb" is n / 1 600 by weight.
const ppmOfOuncesPer100Pounds = (ounces: string): string =>
  new Decimal(ounces).div(1600).times(1_000_000).toString();

// FSIS 7620.3 ch. 3 reads "2 lb to 100 gal pickle at 10 percent pump level" as 200 ppm ingoing;
// the same pickle and pump with 7 lb of nitrate carries 7/2 as much.
const ppmOfPoundsPer100GallonsPickle = (pounds: string): string =>
  new Decimal(pounds).div(2).times(200).toString();

function rule(product: 'bacon' | 'whole-muscle' | 'comminuted', method: 'dry' | 'brine' | 'pump') {
  const found = nitriteRuleFor(product, method);
  assert.ok(found, `${product} ${method}`);
  return found;
}

describe('the curing-agent ceilings', () => {
  it('should hold chopped meat to ¼ oz of nitrite per 100 lb exactly: 156.25 ppm', () => {
    // source: 9 CFR 424.21(c), nitrite: "¼ oz to 100 lb chopped meat" (the handbook prints 156)
    assert.equal(ppmOfOuncesPer100Pounds('0.25'), '156.25');
    assert.equal(rule('comminuted', 'dry').maxPpm.toString(), ppmOfOuncesPer100Pounds('0.25'));
    assert.equal(rule('comminuted', 'dry').basis, '¼ oz per 100 lb chopped meat');
  });

  it('should hold a dry cure other than bacon to 1 oz of nitrite per 100 lb: 625 ppm', () => {
    // source: 9 CFR 424.21(c), nitrite: "1 oz to 100 lb meat (dry cure)"
    assert.equal(rule('whole-muscle', 'dry').maxPpm.toString(), ppmOfOuncesPer100Pounds('1'));
    assert.equal(rule('whole-muscle', 'dry').basis, '1 oz per 100 lb, dry cure');
  });

  it('should hold nitrate to 3½ oz per 100 lb dry and 2¾ oz per 100 lb chopped', () => {
    // source: 9 CFR 424.21(c), nitrate: "3½ oz to 100 lb meat (dry cure); 2¾ oz to 100 lb chopped meat"
    assert.equal(
      rule('whole-muscle', 'dry').maxNitratePpm.toString(),
      ppmOfOuncesPer100Pounds('3.5'),
    );
    assert.equal(rule('whole-muscle', 'dry').maxNitratePpm.toString(), '2187.5');
    assert.equal(
      rule('comminuted', 'dry').maxNitratePpm.toString(),
      ppmOfOuncesPer100Pounds('2.75'),
    );
    assert.equal(rule('comminuted', 'dry').maxNitratePpm.toString(), '1718.75');
  });

  it('should hold pickle-cured products to 7 lb of nitrate per 100 gal pickle: 700 ppm', () => {
    // source: 9 CFR 424.21(c), nitrate: "7 lb to 100 gal pickle"; read at 10 % pump as FSIS 7620.3
    // ch. 3 reads the nitrite figure "2 lb to 100 gal pickle at 10 percent pump level" (200 ppm)
    assert.equal(ppmOfPoundsPer100GallonsPickle('2'), '200');
    for (const method of ['brine', 'pump'] as const) {
      assert.equal(rule('whole-muscle', method).maxPpm.toString(), '200');
      assert.equal(
        rule('whole-muscle', method).maxNitratePpm.toString(),
        ppmOfPoundsPer100GallonsPickle('7'),
      );
      assert.equal(rule('whole-muscle', method).maxNitratePpm.toString(), '700');
    }
  });

  it('should permit no nitrate in bacon by any method', () => {
    // source: 9 CFR 424.21(c) lists nitrate for "cured meat products other than bacon" only
    for (const method of ['dry', 'brine', 'pump'] as const)
      assert.equal(rule('bacon', method).maxNitratePpm.toString(), '0');
  });

  it('should warn a whole-muscle dry cure above the 200 ppm finished-product cap', () => {
    // source: 9 CFR 424.21(c): nitrites and nitrates "shall not result in more than 200 ppm of
    // nitrite, calculated as sodium nitrite in finished product"
    assert.equal(rule('whole-muscle', 'dry').warnAbove?.ppm.toString(), '200');
    assert.equal(rule('comminuted', 'dry').warnAbove, undefined);
    assert.equal(rule('bacon', 'dry').warnAbove, undefined);
  });
});
