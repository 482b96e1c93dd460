import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import { netWeight } from './net-weight.ts';

// 1 oz = 28.349523125 g and 1 lb = 16 oz = 453.59237 g. source: NIST SP 811 (2008), Appendix B.8
describe('netWeight', () => {
  // 340 g ÷ 28.349523125 = 11.993 oz, rounded down to 11.9 oz: never more than is in the package.
  it('should give ounces under a pound, the grams after them', () => {
    assert.equal(netWeight(dec('340')).text, 'Net wt 11.9 oz (340 g)');
  });

  // 680 g = 23.986 oz = 1 lb 7.98 oz, down to 1 lb 7.9 oz. source (from memory): 9 CFR 317.2(h),
  // a package of 1 pound or more in pounds with the remainder in ounces.
  it('should give pounds and ounces from a pound up', () => {
    assert.equal(netWeight(dec('680')).text, 'Net wt 1 lb 7.9 oz (680 g)');
    // 5 lb = 2 267.96185 g; 2 268 g is 80.001 oz, so 5 lb, and 2.26 kg rounded down.
    assert.equal(netWeight(dec('2268')).text, 'Net wt 5 lb (2.26 kg)');
  });

  it('should refuse a package of nothing', () => {
    assert.throws(() => netWeight(dec('0')), /more than 0 g/);
  });
});
