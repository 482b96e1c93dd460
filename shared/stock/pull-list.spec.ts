import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dec } from '../decimal.ts';
import type { StockLot } from './fifo.ts';
import { type ItemNeed, type LastDelivery, type PullLine, pullAgainstStock } from './pull-list.ts';

const lot = (item: string, code: string, grams: string, receivedAt: string, useBy?: string) =>
  ({
    item,
    lot: code,
    remaining: dec(grams),
    receivedAt,
    ...(useBy === undefined ? {} : { useBy }),
  }) satisfies StockLot;

// Quillmoor's dry store on Thursday 3 December 2026, invented and drawn by hand. Two batches use
// fine sea salt: the belly cure starting Mon 7 Dec (1 000 g) and the ham cure starting Thu 10 Dec
// (1 500 g). Cracked pepper is used by the belly alone (36 g), and there is none on hand.
const NEEDS: ItemNeed[] = [
  {
    item: 'sea-salt',
    name: 'fine sea salt',
    uses: [
      { start: '2026-12-07', amount: dec('1000'), formula: 'quillmoor-belly' },
      { start: '2026-12-10', amount: dec('1500'), formula: 'ham-pump' },
    ],
  },
  {
    item: 'pepper-cracked',
    name: 'cracked black pepper',
    uses: [{ start: '2026-12-07', amount: dec('36'), formula: 'quillmoor-belly' }],
  },
];

const LOTS: StockLot[] = [
  // use by Tue 8 Dec: fine for the belly on the 7th, past it for the ham on the 10th
  lot('sea-salt', 'R261201-01', '4000', '2026-12-01T07:10:00Z', '2026-12-08'),
  lot('sea-salt', 'R261202-03', '500', '2026-12-02T07:30:00Z', '2027-06-30'),
  // another item's lot: never counted for salt
  lot('sugar', 'R261202-01', '9000', '2026-12-02T07:20:00Z'),
];

const LAST = new Map<string, LastDelivery>([
  ['sea-salt', { supplier: 'Harrowgate Dry Goods', receivedOn: '2026-12-02' }],
  ['pepper-cracked', { supplier: 'Fenwick Spice Co.', receivedOn: '2026-11-12' }],
]);

function lineOf(lines: PullLine[], item: string): PullLine {
  const found = lines.find((line) => line.item === item);
  assert.ok(found, `no line for ${item}`);
  return found;
}

/** The figures of a line as text, to compare with the hand-worked expectation. */
function figures(line: PullLine): Record<string, string> {
  return {
    needed: line.needed.toString(),
    onHand: line.onHand.toString(),
    usable: line.usable.toString(),
    short: line.short.toString(),
    arriveBy: line.arriveBy ? `${line.arriveBy.date} ${line.arriveBy.formula}` : 'none',
  };
}

describe('pullAgainstStock', () => {
  const lines = pullAgainstStock(NEEDS, LOTS, LAST);

  // hand-worked, sea salt: on hand 4 000 + 500 = 4 500 g, more than the 2 500 g needed.
  // Mon 7 Dec, belly, 1 000 g: first to expire first, R261201-01 (use by 8 Dec) gives 1 000 g,
  //   leaving 3 000 g in it.
  // Thu 10 Dec, ham, 1 500 g: R261201-01 is past its use-by (8 Dec) and does not count;
  //   R261202-03 gives its 500 g; 1 000 g short.
  // needed 2 500, usable 1 000 + 500 = 1 500, short 1 000; it must arrive by the morning of
  // Thu 10 Dec, the day the ham starts.
  it('should not count a lot past its use-by on the day the second batch starts', () => {
    const salt = lineOf(lines, 'sea-salt');
    assert.deepEqual(figures(salt), {
      needed: '2500',
      onHand: '4500',
      usable: '1500',
      short: '1000',
      arriveBy: '2026-12-10 ham-pump',
    });
    assert.deepEqual(salt.outOfDate, [
      { lot: 'R261201-01', useBy: '2026-12-08', neededOn: '2026-12-10' },
    ]);
    assert.deepEqual(salt.lastFrom, { supplier: 'Harrowgate Dry Goods', receivedOn: '2026-12-02' });
  });

  // hand-worked, cracked pepper: nothing on hand, 36 g needed on Mon 7 Dec: all 36 g short, by
  // the morning of the 7th; ask Fenwick Spice Co., who delivered it last.
  it('should say an item with nothing on hand is short all of it, from its first batch', () => {
    const pepper = lineOf(lines, 'pepper-cracked');
    assert.deepEqual(figures(pepper), {
      needed: '36',
      onHand: '0',
      usable: '0',
      short: '36',
      arriveBy: '2026-12-07 quillmoor-belly',
    });
    assert.equal(pepper.lastFrom?.supplier, 'Fenwick Spice Co.');
    assert.deepEqual(pepper.outOfDate, []);
  });

  // hand-worked: 1 000 g on 7 Dec and 1 000 g on 10 Dec from one 2 500 g lot (use by 31 Dec):
  // 2 000 g covered, nothing short, no day to arrive by.
  it('should say nothing is short when the lots cover every batch', () => {
    const [line] = pullAgainstStock(
      [
        {
          item: 'sugar',
          name: 'dark brown sugar',
          uses: [
            { start: '2026-12-07', amount: dec('1000'), formula: 'quillmoor-belly' },
            { start: '2026-12-10', amount: dec('1000'), formula: 'ham-pump' },
          ],
        },
      ],
      [lot('sugar', 'R261130-02', '2500', '2026-11-30T08:00:00Z', '2026-12-31')],
      new Map(),
    );
    assert.deepEqual(figures(line), {
      needed: '2000',
      onHand: '2500',
      usable: '2000',
      short: '0',
      arriveBy: 'none',
    });
    assert.equal(line.lastFrom, undefined);
  });

  // hand-worked: the batches given latest first. Taken in start-day order, the 7 Dec batch takes
  // 500 of the 600 g, the 10 Dec batch the last 100 g and is 400 g short: arrive by 10 Dec.
  // (Taken as given, the 10 Dec batch would have had 500 g and the 7 Dec one been short.)
  it('should take the batches in start-day order whatever order they come in', () => {
    const [line] = pullAgainstStock(
      [
        {
          item: 'sea-salt',
          name: 'fine sea salt',
          uses: [
            { start: '2026-12-10', amount: dec('500'), formula: 'ham-pump' },
            { start: '2026-12-07', amount: dec('500'), formula: 'quillmoor-belly' },
          ],
        },
      ],
      [lot('sea-salt', 'R261201-01', '600', '2026-12-01T07:10:00Z')],
      new Map(),
    );
    assert.equal(line.short.toString(), '400');
    assert.deepEqual(line.arriveBy, { date: '2026-12-10', formula: 'ham-pump' });
  });
});
