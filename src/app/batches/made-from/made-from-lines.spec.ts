import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { LotOnHand, SuggestedItem } from '../../../../shared/api/batch-lots.ts';
import {
  amountText,
  lotChoiceWords,
  lotDetailWords,
  noUseByReasons,
  picksOf,
  startingLines,
} from './made-from-lines.ts';

const BELLY: SuggestedItem = {
  item: 'pork-belly',
  name: 'pork belly',
  source: 'receipt',
  unit: 'kg',
  measure: 'g',
  need: '10000',
  grams: '10000',
  weighs: null,
  weighed: false,
  takes: [
    {
      source: 'receipt',
      item: 'pork-belly',
      itemName: 'pork belly',
      lotCode: 'R261201-01',
      supplier: 'Hollin Vale Farm',
      supplierLot: 'HV-01',
      amount: '5952.380952380952',
      measure: 'g',
      lotAmount: '5.952380952380952',
      lotUnit: 'kg',
      useBy: '2026-12-05',
      usedOn: '2026-12-03',
    },
  ],
  shortfall: '0',
  expired: [],
  onHand: [],
};

describe('the lines of what a batch was made from', () => {
  // hand-worked: 5.952380… kg to the gram is 5.952 kg; 12 eggs stay 12
  it('should start from the suggestion, each amount to the gram in the unit the lot came in', () => {
    assert.deepEqual(startingLines(BELLY), [{ lot: 'R261201-01', amount: '5.952 kg' }]);
    assert.equal(amountText({ lotAmount: '12', lotUnit: 'each' }), '12');
  });

  it('should leave out a line with no lot chosen and give a part its batch', () => {
    const part: SuggestedItem = { ...BELLY, item: 'chuck-grind', source: 'batch', takes: [] };
    assert.deepEqual(
      picksOf([
        {
          item: BELLY,
          lines: [
            { lot: 'R261201-01', amount: ' 6 kg ' },
            { lot: '', amount: '1 kg' },
          ],
        },
        { item: part, lines: [{ lot: '261202-CG-01', amount: '2 kg' }] },
      ]),
      [
        { item: 'pork-belly', lot: 'R261201-01', amount: '6 kg' },
        { part: 'chuck-grind', batch: '261202-CG-01', amount: '2 kg' },
      ],
    );
  });

  // hand-worked: 6 000 g of a lot bought by the kilogram is 6 kg
  it('should put a lot’s code in the list and the rest under the field once it is chosen', () => {
    const lot = {
      lotCode: 'R261201-01',
      supplier: 'Hollin Vale Farm',
      supplierLot: 'HV-01',
      remaining: '6000',
      useBy: '2026-12-05',
    };
    assert.equal(
      lotDetailWords(lot, BELLY),
      'Hollin Vale Farm HV-01 · use by 5 Dec 2026 · 6 kg left',
    );
    assert.equal(
      lotChoiceWords(lot, BELLY),
      'R261201-01 · Hollin Vale Farm HV-01 · use by 5 Dec 2026 · 6 kg left',
    );
    assert.equal(
      lotDetailWords(
        { ...lot, supplier: null, supplierLot: null, remaining: null, useBy: null },
        BELLY,
      ),
      '',
    );
  });
});

describe('a batch offered as a part, in a cook’s words', () => {
  const part: SuggestedItem = { ...BELLY, item: 'house-sauce', source: 'batch', takes: [] };
  const lot = (more: Partial<LotOnHand>): LotOnHand => ({
    lotCode: '261203-HS-01',
    supplier: null,
    supplierLot: null,
    remaining: null,
    useBy: null,
    ...more,
  });

  it('should name its use-by, or why it has none, and the day it was made', () => {
    assert.equal(
      lotChoiceWords(lot({ madeOn: '2026-12-03', useBy: '2026-12-09' }), part),
      '261203-HS-01 · use by 9 Dec 2026 · made 3 Dec 2026',
    );
    assert.equal(
      lotChoiceWords(lot({ madeOn: '2026-12-03', noUseBy: 'kept frozen' }), part),
      '261203-HS-01 · no use-by · made 3 Dec 2026',
    );
    assert.equal(lotChoiceWords(lot({ madeOn: null }), part), '261203-HS-01 · under way');
    const onHand = [
      lot({ madeOn: '2026-12-03', noUseBy: 'kept frozen' }),
      lot({ lotCode: '261204-HS-01', madeOn: '2026-12-04', noUseBy: 'kept frozen' }),
      lot({ lotCode: '261205-HS-01', madeOn: null, noUseBy: 'not finished yet' }),
    ];
    assert.deepEqual(noUseByReasons({ ...part, onHand }), ['kept frozen']);
    assert.deepEqual(noUseByReasons({ ...BELLY, onHand }), []);
  });
});
