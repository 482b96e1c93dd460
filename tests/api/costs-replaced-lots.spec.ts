import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { send, suiteServer } from '../helpers/api-calls.ts';
import { addReceipt, bellyInEmptyKitchen, dayFromToday } from '../helpers/cost-fixture.ts';

// The demo belly (quillmoor-belly), 4.26 kg green; its lots recorded once on a belly lot at 9.00 a
// kg, then recorded again on another at 12.00 a kg (the cook had picked the wrong lot). Priced by
// hand: only the lot that stands counts, 4 260 × 12.00 ÷ 1000 = 51.12; the replaced use would add
// 4 260 × 9.00 ÷ 1000 = 38.34 more. Nothing else was received, so every other line is unpriced.
describe('GET /api/batches/:lot/cost after the lots were recorded again', () => {
  const server = suiteServer();

  it('should price only the lots that stand, not a use that was replaced', async () => {
    // From a kitchen that has received nothing, so every other line is unpriced.
    const lot = await bellyInEmptyKitchen(server());
    const belly = (unitCost: string) =>
      addReceipt(server(), {
        item: 'pork-belly',
        itemName: 'pork belly',
        quantity: '5',
        unit: 'kg',
        amount: '5000',
        unitCost,
        on: dayFromToday(-2),
      });
    const wrong = await belly('9.00');
    const right = await belly('12.00');
    const pick = (receipt: string, replace: boolean) =>
      send(server(), 'rosa', {
        method: 'POST',
        path: `/api/batches/${lot}/lots`,
        body: {
          picks: [{ item: 'pork-belly', lot: receipt, amount: '4.26 kg' }],
          ...(replace ? { replace: true } : {}),
        },
      });
    const first = await pick(wrong.lot, false);
    assert.equal(first.status, 201, first.text);
    const again = await pick(right.lot, true);
    assert.equal(again.status, 201, again.text);

    const response = await send(server(), 'imke', {
      method: 'GET',
      path: `/api/batches/${lot}/cost`,
    });
    assert.equal(response.status, 200, response.text);
    const bellyLines = response.json.lines
      .filter((l: { name: string }) => l.name === 'pork belly')
      .map((l: { lot: string; costText: string }) => `${l.lot} ${l.costText}`);
    assert.deepEqual(bellyLines, [`${right.lot} 51.12`]);
    assert.equal(response.json.totalText, '51.12');
  });
});
