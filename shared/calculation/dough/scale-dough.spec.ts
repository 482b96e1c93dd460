import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import { bunDough, leanDough } from './dough-fixtures.ts';
import { doughForPieces, portionsOf, scaleDough } from './scale-dough.ts';

describe('scaling a dough batch', () => {
  it('should divide by (1 − loss) for 500 lb of bread at 13 % loss', () => {
    // source: "Bread Formula Construction", baking-science education series part 3 (2011)
    assert.equal(doughForPieces(1, dec(500), dec(13)).toFixed(2), '574.71');
  });

  it('should not use the multiply convention', () => {
    // source: BBGA formula guide's "waste factor", as described in secondary discussion of the
    // guide (multiply by 1 + waste; the guide fixes no number)
    assert.notEqual(doughForPieces(1, dec(500), dec(13)).toFixed(2), '565.00');
    // own example, derived (the bun): 48 × 80 g × 1.02 = 3916.800 would be the multiply
    // convention
    assert.notEqual(doughForPieces(48, dec(80), dec(2)).toFixed(3), '3916.800');
  });

  it('should make 3918.367 g of dough and 2143.527 g of flour for 48 buns of 80 g with 2 % loss', () => {
    // own example, derived: the bun formula (182.8 %), 2 % loss divided out
    const scale = scaleDough(bunDough(), { pieces: 48, piece: dec(80), loss: dec(2) });
    assert.equal(scale.mode, 'pieces');
    assert.equal(scale.doughGrams.toFixed(3), '3918.367');
    assert.equal(scale.flourGrams.toFixed(3), '2143.527');
  });

  it('should make 3840 g of dough and 2100.656 g of flour for 48 buns of 80 g without loss', () => {
    // own example, derived: the bun formula (182.8 %), flour = dough ÷ 1.828
    const scale = scaleDough(bunDough(), { pieces: 48, piece: dec(80) });
    assert.equal(scale.doughGrams.toString(), '3840');
    assert.equal(scale.flourGrams.toFixed(3), '2100.656');
  });

  it('should take the piece weight and loss from the formula when the batch does not give them', () => {
    const scale = scaleDough(bunDough({ piece: '80 g', loss_pct: 2 }), { pieces: 48 });
    assert.equal(scale.doughGrams.toFixed(3), '3918.367');
    const piece = scale.inputs.find((figure) => figure.label === 'Piece weight');
    assert.equal(piece?.note, 'from the formula');
  });

  it('should say in its own words that the loss is taken out of the mixed dough', () => {
    // The convention is the one in "Bread Formula Construction", baking-science education series
    // part 3 (2011), ingredients = bread ÷ (1 − loss): the sheet explains it without the
    // handbook's title.
    const scale = scaleDough(bunDough(), { pieces: 48, piece: dec(80), loss: dec(2) });
    const note = scale.inputs[2].note ?? '';
    assert.match(note, /loss taken out of the mixed dough/);
    assert.doesNotMatch(note, /Bread Formula Construction/);
  });

  it('should echo pieces, piece weight and loss with the divide convention named', () => {
    const scale = scaleDough(bunDough(), { pieces: 48, piece: dec(80), loss: dec(2) });
    assert.deepEqual(
      scale.inputs.map((figure) => [figure.label, figure.kind, figure.value.toString()]),
      [
        ['Pieces', 'count', '48'],
        ['Piece weight', 'mass', '80'],
        ['Loss allowance', 'percent', '2'],
      ],
    );
    assert.match(scale.inputs[2].note ?? '', /÷ \(1 − loss\/100\)/);
  });

  it('should scale by mixed dough weight and by flour weight', () => {
    const byTotal = scaleDough(leanDough(), { total: dec(28470) });
    assert.equal(byTotal.flourGrams.toFixed(2), '16747.06');
    const byFlour = scaleDough(leanDough(), { flour: dec(1000) });
    assert.equal(byFlour.doughGrams.toString(), '1700');
  });

  it('should give the loss allowance as the remainder after dividing', () => {
    // own example, derived: the bun formula, 2 % loss divided out
    const scale = scaleDough(bunDough(), { pieces: 48, piece: dec(80), loss: dec(2) });
    const portions = portionsOf(scale, scale.doughGrams);
    assert.equal(portions?.count, 48);
    assert.equal(portions?.pieceGrams.toString(), '80');
    assert.equal(portions?.remainderGrams.toFixed(3), '78.367');
  });

  it('should refuse a batch without a size', () => {
    assert.throws(
      () => scaleDough(leanDough(), {}),
      (error: unknown) => {
        assert.ok(error instanceof BatchError);
        assert.match(error.message, /--pieces.*--total.*--flour/);
        return true;
      },
    );
  });

  it('should refuse a batch with two sizes and name the second option', () => {
    assert.throws(
      () => scaleDough(leanDough(), { pieces: 10, piece: dec(100), total: dec(1000) }),
      (error: unknown) => error instanceof BatchError && error.option === 'total',
    );
    assert.throws(
      () => scaleDough(leanDough(), { total: dec(1000), flour: dec(500) }),
      (error: unknown) => error instanceof BatchError && error.option === 'flour',
    );
  });

  it('should refuse pieces without a piece weight', () => {
    assert.throws(
      () => scaleDough(leanDough(), { pieces: 10 }),
      (error: unknown) => error instanceof BatchError && error.option === 'piece',
    );
  });

  it('should refuse a piece weight without a number of pieces', () => {
    assert.throws(
      () => scaleDough(leanDough(), { total: dec(1000), piece: dec(100) }),
      (error: unknown) => error instanceof BatchError && error.option === 'piece',
    );
  });

  it('should refuse impossible sizes', () => {
    const refuses = (option: string) => (error: unknown) =>
      error instanceof BatchError && error.option === option;
    assert.throws(() => scaleDough(leanDough(), { pieces: 0, piece: dec(80) }), refuses('pieces'));
    assert.throws(
      () => scaleDough(leanDough(), { pieces: 2.5, piece: dec(80) }),
      refuses('pieces'),
    );
    assert.throws(() => scaleDough(leanDough(), { pieces: 4, piece: dec(0) }), refuses('piece'));
    assert.throws(
      () => scaleDough(leanDough(), { pieces: 4, piece: dec(80), loss: dec(100) }),
      refuses('loss'),
    );
    assert.throws(
      () => scaleDough(leanDough(), { pieces: 4, piece: dec(80), loss: dec(-1) }),
      refuses('loss'),
    );
    assert.throws(() => scaleDough(leanDough(), { total: dec(0) }), refuses('total'));
    assert.throws(() => scaleDough(leanDough(), { flour: dec(-5) }), refuses('flour'));
  });

  it('should warn that a loss allowance is ignored unless scaling by pieces', () => {
    const scale = scaleDough(leanDough(), { total: dec(1000), loss: dec(3) });
    assert.equal(scale.warnings.length, 1);
    assert.match(scale.warnings[0], /--loss/);
  });
});
