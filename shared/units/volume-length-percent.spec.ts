import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { parseLength } from './length.ts';
import { parseCount, parsePercent } from './percent.ts';
import { LITRES_PER_US_GALLON, parseVolume, waterGramsFromLitres } from './volume.ts';

describe('volumes, lengths and percentages', () => {
  it('should define the US gallon as exactly 3.785411784 L', () => {
    // source: NIST SP 811 (2008), Appendix B.8 (the US gallon, 231 in³, exact)
    assert.equal(LITRES_PER_US_GALLON.toString(), '3.785411784');
    assert.equal(parseVolume('100 gal').toString(), '378.5411784');
  });

  it('should weigh measured water at 1 kg per litre, the stated convention', () => {
    // common practice, no source: 1 L of water counted as 1 kg (stated in formulas/README.md;
    // error under 0.3 %)
    assert.equal(waterGramsFromLitres(parseVolume('12 L')).toString(), '12000');
    assert.equal(waterGramsFromLitres(parseVolume('1500 ml')).toString(), '1500');
  });

  it('should read thickness in mm, cm and inches, with the inch exactly 25.4 mm', () => {
    // source: NIST SP 811 (2008), Appendix B.8 (1 in = 2.54 cm exactly)
    assert.equal(parseLength('4cm').toString(), '40');
    assert.equal(parseLength('1.5 in').toString(), '38.1');
    assert.equal(parseLength('38 mm').toString(), '38');
    assert.equal(parseLength('1.5"').toString(), '38.1');
    assert.throws(() => parseLength('4 kg'), /not a length unit/);
  });

  it('should read percentages with or without the sign and refuse other units', () => {
    assert.equal(parsePercent('3').toString(), '3');
    assert.equal(parsePercent('12.5 %').toString(), '12.5');
    assert.throws(() => parsePercent('3 kg'), /not a percent sign/);
  });

  it('should read a count only as a whole number', () => {
    assert.equal(parseCount('48'), 48);
    assert.throws(() => parseCount('4.5'), /not a whole number/);
    assert.throws(() => parseCount('-3'), /not a whole number/);
  });
});
