import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { labelContentUrl, labelPdfUrl, labelProblem } from './label-request.ts';

describe('asking for a product label in the console', () => {
  it('should ask the API for the content without the size and for the PDF with it', () => {
    const ask = { size: 'letter', net: ' 12 oz ', packed: '2026-03-02' } as const;
    assert.equal(
      labelContentUrl('261203-QB-01', ask),
      '/api/batches/261203-QB-01/label?net=12+oz&packed=2026-03-02',
    );
    assert.equal(
      labelPdfUrl('261203-QB-01', ask),
      '/api/batches/261203-QB-01/label.pdf?size=letter&net=12+oz&packed=2026-03-02',
    );
  });

  // The net quantity of contents is a required feature of the label (9 CFR 317.2(c)(4), read at
  // foodcompliance.com); the small label goes on a pack that carries it elsewhere.
  it('should ask for the net weight before a 4 × 6 label, not before a small one', () => {
    assert.match(labelProblem({ size: '4x6', net: '', packed: '' }) ?? '', /net weight/);
    assert.equal(labelProblem({ size: '4x6', net: '340 g', packed: '' }), null);
    assert.equal(labelProblem({ size: '2x1', net: '', packed: '' }), null);
  });

  it('should give the API’s reason for a size too small for this product, before the net weight', () => {
    const view = {
      sizes: [
        { size: '4x6' },
        {
          size: '2x1',
          refused: 'A 2 × 1 in label is too small for the safe handling instructions',
        },
      ],
    } as const;
    assert.equal(
      labelProblem({ size: '2x1', net: '', packed: '' }, view),
      'A 2 × 1 in label is too small for the safe handling instructions.',
    );
    assert.match(labelProblem({ size: '4x6', net: '', packed: '' }, view) ?? '', /net weight/);
    assert.equal(labelProblem({ size: 'letter', net: '', packed: '' }, view), null);
  });

  it('should print a 4 × 6 label whose net weight the label works out itself', () => {
    const view = { sizes: [{ size: '4x6' }], net: 'Net wt 10.5 oz (300 g)' } as const;
    assert.equal(labelProblem({ size: '4x6', net: '', packed: '' }, view), null);
  });
});
