import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { TracedReceipt } from '../api/trace-record.ts';
import { establishmentWords, lotFacts } from './trace-words.ts';

const belly: TracedReceipt = {
  kind: 'receipt',
  lotCode: 'R261201-01',
  item: 'pork-belly',
  itemName: 'pork belly',
  supplier: 'Fenwick Hollow Pork',
  supplierLot: 'FH-4471',
  establishment: 'EST. 38214',
  packedOn: null,
  useBy: null,
  receivedOn: '2026-12-01',
  amount: '10000',
  remaining: '0',
  measure: 'g',
  emptiedOn: '2026-12-03',
  decision: 'accepted',
};

describe('establishment numbers in the facts of a lot', () => {
  // The mark of inspection prints the number after "EST." (9 CFR 312.2, from memory), and the
  // receiving form asks for it as on the mark: "EST. 38214".
  it('should say a number typed as on the mark as it is, once', () => {
    assert.equal(establishmentWords('EST. 38214'), 'EST. 38214');
    assert.equal(establishmentWords('est 38214'), 'est 38214');
    assert.equal(
      lotFacts(belly),
      'Fenwick Hollow Pork lot FH-4471 · EST. 38214 · received 1 Dec 2026 · used up 3 Dec 2026',
    );
  });

  it('should name a bare number or a poultry number as an establishment', () => {
    assert.equal(establishmentWords('38214'), 'est. 38214');
    assert.equal(establishmentWords('P-4821'), 'est. P-4821');
    // A word that merely begins with the letters is not the mark's "EST.".
    assert.equal(establishmentWords('Estate 12'), 'est. Estate 12');
  });
});
