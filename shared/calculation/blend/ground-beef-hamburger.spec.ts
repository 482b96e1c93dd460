import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { FAT_STANDARDS } from '../../reference/fat-standards.ts';
import { failsCriticalLimit, type CalcResult } from '../calc-result.ts';
import { calculateBlend } from './calculate-blend.ts';
import { checkBlendFormula } from './check-blend-formula.ts';
import { we25 } from './blend-spec-helpers.ts';

// source (every test here): 9 CFR 319.15(a) "Chopped beef, ground beef": beef "without the
// addition of beef fat as such", at most 30 % fat; 319.15(b) "Hamburger": beef "with or without
// the addition of beef fat as such", at most 30 % fat (read in training material quoting the
// rule; re-check against eCFR).

/** Lean 90/10 trim and loose beef fat (90 % fat, added as such), 20 % fat wanted. */
function withLooseFat(extra: Partial<BlendFormula> = {}): BlendFormula {
  return we25({
    species: 'beef',
    standard: 'ground-beef',
    components: [
      { key: 'lean', name: 'lean 90/10 trim', fat: 10 },
      { key: 'suet', name: 'beef fat', fat: 90, fat_as_such: true },
    ],
    ...extra,
  });
}

function soldAs(result: CalcResult): string | undefined {
  const figure = result.figures.find((f) => f.label === 'May be sold as');
  return figure?.value as string | undefined;
}

describe('ground beef and hamburger', () => {
  it('should give hamburger its own standard, capped at 30 % fat and allowing fat as such', () => {
    const hamburger = FAT_STANDARDS.hamburger;
    assert.ok(hamburger.maxFatPercent.equals(dec('30')));
    assert.equal(hamburger.forbidsFatAsSuch, false);
    assert.match(hamburger.source, /9 CFR 319\.15\(b\)/);
    assert.equal(FAT_STANDARDS['ground-beef'].forbidsFatAsSuch, true);
  });

  it('should refuse ground beef with beef fat added as such, and say it may be hamburger', () => {
    // own example, derived: 10 % and 90 % to 20 %: parts 70 and 10, so 1000 g is 875 g of lean
    // and 125 g of beef fat: 12.5 % of the blend is fat added as such.
    const result = calculateBlend(withLooseFat(), { total: dec('1000') });
    const added = result.checks.find((c) => c.id === 'fat-as-such-ground-beef');
    assert.ok(added, 'a check of the fat added as such');
    assert.equal(added.status, 'fail');
    assert.equal(added.critical, true);
    assert.ok(added.value.equals(dec('12.5')));
    assert.ok(added.limit.isZero());
    assert.match(added.source, /9 CFR 319\.15\(a\)/);
    assert.equal(failsCriticalLimit(result), true);
    assert.equal(soldAs(result), 'hamburger');
    assert.ok(result.warnings.some((w) => /hamburger/.test(w) && /319\.15\(b\)/.test(w)));
  });

  it('should not offer hamburger when the blend is over 30 % fat as well', () => {
    // own example, derived: 10 % and 90 % to 32 %: fat over the 30 % both standards allow
    const result = calculateBlend(withLooseFat({ target: { fat: 32 } }), { total: dec('1000') });
    assert.equal(failsCriticalLimit(result), true);
    assert.notEqual(soldAs(result), 'hamburger');
    assert.match(soldAs(result) ?? '', /over 30 % fat/);
  });

  it('should pass hamburger with beef fat added as such at 20 % fat', () => {
    const result = calculateBlend(withLooseFat({ standard: 'hamburger' }), {
      total: dec('1000'),
    });
    assert.equal(failsCriticalLimit(result), false);
    assert.deepEqual(
      result.checks.map((c) => [c.id, c.status]),
      [['fat-standard-hamburger', 'pass']],
    );
    assert.match(result.checks[0].source, /9 CFR 319\.15\(b\)/);
    assert.equal(soldAs(result), 'hamburger');
  });

  it('should sell trimmings alone at 20 % fat as ground beef', () => {
    // The demo's 50/50 trim is trimmings (lean and fat together), not fat as such.
    const result = calculateBlend(we25({ standard: 'ground-beef' }), { total: dec('1000') });
    assert.equal(failsCriticalLimit(result), false);
    assert.equal(soldAs(result), 'ground beef');
  });

  it('should not count fat as such that the batch takes none of', () => {
    // own example, derived: a 10 % target is the lean trim alone, so 0 g of beef fat is added
    const result = calculateBlend(withLooseFat({ target: { fat: 10 } }), { total: dec('1000') });
    assert.equal(failsCriticalLimit(result), false);
    assert.equal(soldAs(result), 'ground beef');
  });

  it('should warn when a ground-beef formula marks a component as fat as such', () => {
    const problems = checkBlendFormula(withLooseFat());
    assert.equal(problems.length, 1);
    assert.equal(problems[0].severity, 'warning');
    assert.deepEqual(problems[0].path, ['components', 1, 'fat_as_such']);
    assert.match(problems[0].message, /hamburger/);
    assert.deepEqual(checkBlendFormula(withLooseFat({ standard: 'hamburger' })), []);
  });
});
