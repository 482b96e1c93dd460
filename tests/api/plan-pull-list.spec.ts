import assert from 'node:assert/strict';
import { rmSync } from 'node:fs';
import path from 'node:path';
import { before, describe, it } from 'node:test';
import { addDays, dec } from '../../shared/index.ts';
import { snapshot, suiteServer } from '../helpers/api-calls.ts';
import { addReceipts, burgerReceipts, clearStock } from '../helpers/pull-list-fixture.ts';

/** The server plans from its own today; a day far enough ahead for the belly's 10 days. */
const TODAY = new Date().toISOString().slice(0, 10);
const SERVICE = addDays(TODAY, 21);
const BURGERS = { assembly: 'smokehouse-burger', count: 120, for: SERVICE };
const QUERY = `assembly=smokehouse-burger&count=120&for=${SERVICE}`;
// Belly: 8-day hold + 2 lead days; bun: sponge the evening before (plans.spec.ts works them out).
const BELLY_START = addDays(SERVICE, -10);
const BUN_START = addDays(SERVICE, -1);

interface Line {
  item: string;
  status: string;
  measure: string;
  conversion: string | null;
  needed: { amount: string; exact: string };
  onHand: { amount: string; exact: string };
  usable: { amount: string; exact: string };
  short: { amount: string; exact: string };
  arriveBy: string | null;
  arriveByWords: string | null;
  lastFrom: { supplier: string; receivedOn: string } | null;
  outOfDate: string[];
}

const places4 = (grams: string): string => dec(grams).toDecimalPlaces(4).toFixed(4);

describe('GET /api/plans/pull-list and POST /api/plans: the pull list against the lots on hand', () => {
  const server = suiteServer();

  before(async () => {
    await clearStock(server().context.db);
  });

  it('should say there is no stock to compare with before any delivery is recorded', async () => {
    const answer = await server().as('imke').post('/api/plans', BURGERS);
    assert.equal(answer.status, 200, answer.text);
    assert.equal(answer.json.stock.compared, false);
    assert.match(answer.json.stock.reason, /No deliveries have been recorded yet/);
    // The plan itself is as it was.
    assert.equal(answer.json.assembly.id, 'smokehouse-burger');
  });

  describe('with deliveries', () => {
    let lines: Line[];
    let codes: string[];
    let answer: Awaited<ReturnType<ReturnType<ReturnType<typeof server>['as']>['get']>>;
    before(async () => {
      const at = (time: string) => `${TODAY}T${time}:00Z`;
      // burgerReceipts: sea salt 5 000 g to use by service − 5, honey, 5 g of curing salt.
      codes = await addReceipts(server().context.db, [
        ...burgerReceipts(TODAY, SERVICE),
        {
          item: 'sea-salt',
          itemName: 'sea salt',
          supplier: 'Brannock Salt Works',
          supplierLot: 'BSW-88',
          grams: '50',
          useBy: addDays(SERVICE, 60),
          receivedAt: at('06:10'),
        },
        // Refused at the door, and a lot used up: neither counts, nor names a supplier.
        {
          item: 'sea-salt',
          itemName: 'sea salt',
          supplier: 'Turned Away Ltd',
          supplierLot: 'TA-1',
          grams: '10000',
          receivedAt: at('07:00'),
          decision: 'refused',
        },
        {
          item: 'sea-salt',
          itemName: 'sea salt',
          supplier: 'Harrowgate Dry Goods',
          supplierLot: 'HG-2100',
          grams: '9000',
          remaining: '0',
          receivedAt: at('05:00'),
          emptiedOn: TODAY,
        },
        // Eggs counted and milk by volume: compared through the catalogue's weights per unit.
        {
          item: 'eggs',
          itemName: 'eggs',
          supplier: 'Lowmere Dairy',
          supplierLot: 'LD-40',
          grams: '30',
          unit: 'each',
          useBy: addDays(SERVICE, 30),
          receivedAt: at('06:40'),
        },
        {
          item: 'whole-milk',
          itemName: 'whole milk',
          supplier: 'Lowmere Dairy',
          supplierLot: 'LD-41',
          grams: '6000',
          unit: 'ml',
          useBy: addDays(SERVICE, 30),
          receivedAt: at('06:50'),
        },
      ]);
      const before = await snapshot(server());
      answer = await server().as('tobin').get(`/api/plans/pull-list?${QUERY}`);
      assert.equal(answer.status, 200, answer.text);
      // Read only: nothing was noted, not even the plan as made.
      assert.deepEqual(await snapshot(server()), before);
      assert.equal(answer.json.stock.compared, true);
      lines = answer.json.stock.lines;
    });

    const line = (item: string): Line => {
      const found = lines.find((l) => l.item === item);
      assert.ok(found, `no line for ${item}`);
      return found;
    };

    // by hand: the belly's salt is 2.25 % of its green weight, 9 000 g sliced ÷ 0.90 ÷ 0.94 =
    // 10 638.2979 g, so 239.3617 g (source: formulas/quillmoor-belly.yaml, its pct and yields);
    // the bun's is the rest of the pull list's fine sea salt.
    // On the belly's day, lot 1 (5 000 g, use by service − 5) covers its 239.3617 g. On the bun's
    // day, lot 1 is past its use-by; lot 2 gives its 50 g; the refused and the emptied lots count
    // for nothing. usable = 239.3617 + 50, short = bun − 50, to arrive by the bun's start day.
    it('should not count a lot past its use-by by the second batch, nor refused or emptied lots', () => {
      const salt = line('sea-salt');
      const total = answer.json.pullList.find((i: { name: string }) => i.name === 'fine sea salt');
      const belly = dec(9000).div('0.90').div('0.94').times('0.0225');
      const bun = dec(total.grams).minus(belly);
      assert.equal(places4(belly.toString()), '239.3617');
      assert.equal(places4(salt.needed.exact), places4(total.grams));
      assert.equal(salt.onHand.exact, '5050');
      assert.equal(places4(salt.usable.exact), places4(belly.plus(50).toString()));
      assert.equal(places4(salt.short.exact), places4(bun.minus(50).toString()));
      assert.equal(salt.status, 'short');
      assert.equal(salt.arriveBy, BUN_START);
      assert.match(
        salt.arriveByWords ?? '',
        /^by the morning of \w{3} \d{1,2} \w{3} \d{4}, when Milk and honey bun, with sponge starts$/,
      );
      assert.deepEqual(salt.lastFrom, { supplier: 'Brannock Salt Works', receivedOn: TODAY });
      assert.equal(salt.outOfDate.length, 1);
      assert.match(salt.outOfDate[0], new RegExp(`^lot ${codes[0]} is past its use-by`));
    });

    // by hand: none on hand, never received: the belly's whole need is short, by its start day.
    it('should say an item with nothing on hand is short all of it, by its first batch', () => {
      const pepper = line('pepper-cracked');
      assert.equal(pepper.onHand.exact, '0');
      assert.equal(pepper.short.exact, pepper.needed.exact);
      assert.equal(pepper.arriveBy, BELLY_START);
      assert.equal(pepper.lastFrom, null);
    });

    // by hand: the bun's honey is 6 % of its flour, well under the 10 000 g lot.
    it('should say an item the lots cover is covered, with no day to arrive by', () => {
      const honey = line('honey');
      assert.equal(honey.status, 'covered');
      assert.equal(honey.short.exact, '0');
      assert.equal(honey.usable.exact, honey.needed.exact);
      assert.equal(honey.arriveBy, null);
    });

    it('should list short items first and what cannot be compared apart, with the reason', () => {
      const statuses = lines.map((l) => l.status);
      assert.deepEqual(
        statuses,
        [...statuses].sort((a, b) => (a === b ? 0 : a === 'short' ? -1 : 1)),
      );
      const apart = answer.json.stock.apart as { name: string; reason: string }[];
      // The demo belly names the item its green meat is drawn from (meat_item: pork-belly).
      assert.ok(!apart.some((a) => a.name.startsWith('green meat for')));
      assert.ok(lines.some((l) => l.item === 'pork-belly'));
      assert.ok(apart.some((a) => a.name === 'water' && a.reason === 'tap-water'));
      // The catalogue weighs eggs and milk: neither is set apart; the sauce's brine it does not.
      assert.ok(!apart.some((a) => a.name === 'whole egg' || a.name === 'whole milk'));
      assert.ok(apart.some((a) => a.name === 'dill pickle brine' && a.reason === 'by-volume'));
    });

    // by hand: the bun batch's egg, in grams on the pull list, at 50 g a large egg (source: USDA
    // FoodData Central, SR Legacy, "Egg, whole, raw, fresh", 1 large = 50 g, from memory, as the
    // demo catalogue gives it), rounded up to whole eggs; its milk at 244 g a US cup of
    // 236.5882365 ml (source: the same, "Milk, whole, 3.25% milkfat", 1 cup = 244 g, from
    // memory; the cup from NIST SP 811 (2008), Appendix B.8). Both within what is on hand.
    it('should compare the eggs in pieces and the milk in millilitres with what is on hand', () => {
      const grams = (name: string) =>
        dec(answer.json.pullList.find((i: { name: string }) => i.name === name).grams);
      const eggs = line('eggs');
      assert.equal(eggs.measure, 'each');
      assert.equal(eggs.needed.exact, grams('whole egg').div(50).ceil().toString());
      assert.equal(eggs.onHand.exact, '30');
      assert.equal(eggs.status, 'covered');
      const milk = line('whole-milk');
      assert.equal(milk.measure, 'ml');
      assert.equal(
        places4(milk.needed.exact),
        places4(grams('whole milk').times('236.5882365').div(244).toString()),
      );
      assert.equal(milk.onHand.exact, '6000');
      assert.equal(milk.status, 'covered');
    });

    it('should give POST /api/plans the same comparison', async () => {
      const posted = await server().as('imke').post('/api/plans', BURGERS);
      assert.equal(posted.status, 200, posted.text);
      assert.deepEqual(posted.json.stock, answer.json.stock);
    });
  });

  it('should refuse a query that is not a plan with 400, naming the field', async () => {
    const bad = await server()
      .as('imke')
      .get(`/api/plans/pull-list?assembly=smokehouse-burger&count=lots&for=${SERVICE}`);
    assert.equal(bad.status, 400, bad.text);
    assert.match(bad.json.error.message, /count/);
    const unknown = await server().as('imke').get(`/api/plans/pull-list?${QUERY}&colour=red`);
    assert.equal(unknown.status, 400, unknown.text);
  });

  it('should say so when there is no catalogue beside the formulas', async () => {
    rmSync(path.join(server().context.formulas.folder, 'catalogue.yaml'));
    const answer = await server().as('imke').get(`/api/plans/pull-list?${QUERY}`);
    assert.equal(answer.status, 200, answer.text);
    assert.equal(answer.json.stock.compared, false);
    assert.match(answer.json.stock.reason, /no catalogue of materials/);
  });
});
