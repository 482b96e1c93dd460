import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import { addDays } from '../../shared/index.ts';
import { BELLY, send, suiteServer } from '../helpers/api-calls.ts';
import { OTHER_SITE, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';
import type { ApiResponse } from '../helpers/test-server.ts';

const TODAY = new Date().toISOString().slice(0, 10);
/** A service day far enough ahead for the belly's days of cure. */
const SERVICE = addDays(TODAY, 21);
const BURGERS = { assembly: 'smokehouse-burger', count: 120, for: SERVICE };
const PLAN_COST = `/api/plans/${BURGERS.assembly}/${SERVICE}/cost`;
const PULL_LIST = `/api/plans/pull-list?assembly=${BURGERS.assembly}&count=120&for=${SERVICE}`;

/** A delivery of pork belly, as the receiving door takes it. */
const DELIVERY = {
  item: 'pork-belly',
  supplier: 'Harbour Test Farm',
  supplierLot: 'HT-1',
  establishment: 'EST. 9012',
  packedOn: addDays(TODAY, -2),
  useBy: addDays(TODAY, 12),
  quantity: '20',
  unit: 'kg',
  unitCost: '7.10',
  temperature: '3 °C',
};

// source: 9 CFR 424.22(b), 120 ppm for pumped bacon; 5 kg pumped to 5.6 kg is 144 ppm, refused
const OVER_LIMIT = { formula: 'maple-pump-belly', batch: { meat: '5kg', pumpedWeight: '5.6kg' } };

const HARBOUR = OTHER_SITE.key;

function ok(response: ApiResponse, status = 200): ApiResponse {
  assert.equal(response.status, status, response.text);
  return response;
}

// Two sites of one group: the demo's own (main) and a second shop, with rows of every kind at
// both. A cook and a reviewer of the second shop only see its rows; a group-wide admin sees main's
// without a header and the shop's with it; a record of the other site named by id is not found.
describe('sites: the lists and writes of plans, stock, equipment, the board, reports and costs', () => {
  const server = suiteServer();
  const at = {
    harbourCook: (path: string, method = 'GET', body?: unknown) =>
      sendAs(server(), 'harbour-cook', { method, path, body }),
    harbourReviewer: (path: string) =>
      sendAs(server(), 'harbour-reviewer', { method: 'GET', path }),
    main: (path: string, method = 'GET', body?: unknown) =>
      send(server(), 'rosa', { method, path, body }),
    groupAtHarbour: (path: string, method = 'GET', body?: unknown) =>
      send(server(), 'rosa', { method, path, body, headers: { 'x-larder-site': HARBOUR } }),
  };
  let harbourBatch: string;
  let harbourReceipt: string;
  let mainReceipt: string;
  let harbourEquipment: number;
  /** The lot codes of every batch and delivery at main, the demo's included. */
  let mainLots: string[];

  before(async () => {
    await addSite(server(), OTHER_SITE);
    await addPerson(server(), 'harbour-cook', null, [{ key: HARBOUR, role: 'cook' }]);
    await addPerson(server(), 'harbour-reviewer', null, [{ key: HARBOUR, role: 'reviewer' }]);
    harbourBatch = ok(await at.harbourCook('/api/batches', 'POST', BELLY), 201).json.batch.lotCode;
    harbourReceipt = ok(await at.harbourCook('/api/receipts', 'POST', DELIVERY), 201).json.receipt
      .lotCode;
    mainReceipt = ok(await at.main('/api/receipts', 'POST', DELIVERY), 201).json.receipt.lotCode;
    assert.notEqual(mainReceipt, harbourReceipt, 'lot codes stay unique across the group');
    ok(await at.harbourCook('/api/batches', 'POST', OVER_LIMIT), 422);
    ok(await at.main('/api/batches', 'POST', OVER_LIMIT), 422);
    ok(await at.harbourCook('/api/plans', 'POST', BURGERS));
    ok(await at.main('/api/plans', 'POST', BURGERS));
    const batches = ok(await at.main('/api/batches?limit=200')).json.items;
    const receipts = ok(await at.main('/api/receipts?pageSize=100')).json.receipts;
    mainLots = [
      ...batches.map((b: { lotCode: string }) => b.lotCode),
      ...receipts.map((r: { lotCode: string }) => r.lotCode),
    ];
    assert.ok(!mainLots.includes(harbourBatch), 'main lists no batch of the shop');
    assert.ok(!mainLots.includes(harbourReceipt), 'main lists no delivery of the shop');
  });

  /** Asserts an answer names no lot of main (and so can fail: main has many). */
  function noMainLot(response: ApiResponse, what: string): void {
    for (const lot of mainLots) assert.ok(!response.text.includes(lot), `${what} shows ${lot}`);
  }

  describe('plans', () => {
    it('should note the same plan once at each site, and list each site its own', async () => {
      const rows = await server().context.db.sequelize.query<{ site_id: number }>(
        'SELECT site_id FROM plans WHERE assembly_id = ? AND service_date = ?',
        { replacements: [BURGERS.assembly, SERVICE], type: 'SELECT' as never },
      );
      assert.equal(rows.length, 2, 'one plan at each site');
      const madeBy = (response: ApiResponse) =>
        response.json.plans.map((p: { madeBy: { displayName: string } }) => p.madeBy.displayName);
      assert.deepEqual(madeBy(ok(await at.harbourCook('/api/plans'))), ['harbour-cook']);
      assert.deepEqual(madeBy(ok(await at.groupAtHarbour('/api/plans'))), ['harbour-cook']);
      assert.ok(!madeBy(ok(await at.main('/api/plans'))).includes('harbour-cook'));
    });

    it("should compare a pull list with the site's own stock", async () => {
      const harbour = ok(await at.harbourCook(PULL_LIST));
      noMainLot(harbour, "the shop's pull list");
      assert.equal(harbour.json.stock.compared, true, 'the shop has had a delivery');
      const main = ok(await at.main(PULL_LIST));
      assert.ok(
        mainLots.some((lot) => main.text.includes(lot)),
        "main's pull list takes its lots",
      );
    });

    it("should record a plan at each site, and price each site's batches only", async () => {
      const harbour = ok(await at.harbourCook('/api/plans/record', 'POST', BURGERS), 201);
      const harbourLots = harbour.json.batches.map((b: { lotCode: string }) => b.lotCode);
      // Main's plan of the same day is not the shop's: no 409 for batches recorded elsewhere.
      const main = ok(await at.main('/api/plans/record', 'POST', BURGERS), 201);
      const mainPlanLots = main.json.batches.map((b: { lotCode: string }) => b.lotCode);
      const again = await at.harbourCook('/api/plans/record', 'POST', BURGERS);
      assert.equal(again.status, 409, again.text);
      const cost = ok(await at.harbourReviewer(PLAN_COST));
      const priced = cost.json.batches.map((b: { lot: string | null }) => b.lot);
      assert.ok(priced.length > 0);
      assert.ok(
        priced.every((lot: string) => harbourLots.includes(lot)),
        `the shop's plan cost prices ${priced.join(', ')}`,
      );
      const mainCost = ok(await at.main(PLAN_COST));
      const mainPriced = mainCost.json.batches.map((b: { lot: string | null }) => b.lot);
      assert.ok(mainPriced.every((lot: string) => mainPlanLots.includes(lot)));
    });
  });

  describe('deliveries, stock and refusals', () => {
    it("should list a site's deliveries only, and count them", async () => {
      const harbour = ok(await at.harbourCook('/api/receipts'));
      assert.deepEqual(
        harbour.json.receipts.map((r: { lotCode: string }) => r.lotCode),
        [harbourReceipt],
      );
      assert.equal(harbour.json.total, 1);
      const group = ok(await at.groupAtHarbour('/api/receipts'));
      assert.equal(group.json.total, 1);
      const main = ok(await at.main('/api/receipts?pageSize=100'));
      assert.ok(main.json.total > 1);
      assert.ok(!main.text.includes(harbourReceipt));
      assert.equal((await at.main(`/api/receipts/${harbourReceipt}`)).status, 404);
      assert.equal((await at.harbourCook(`/api/receipts/${mainReceipt}`)).status, 404);
    });

    it("should show a site's stock on hand only", async () => {
      const harbour = ok(await at.harbourCook('/api/stock'));
      noMainLot(harbour, "the shop's stock");
      assert.ok(harbour.text.includes(harbourReceipt));
      const main = ok(await at.main('/api/stock'));
      assert.ok(main.text.includes(mainReceipt) && !main.text.includes(harbourReceipt));
    });

    it("should list a site's refused calculations only", async () => {
      const by = (response: ApiResponse) =>
        response.json.refusals.map((r: { by: { displayName: string } }) => r.by.displayName);
      assert.deepEqual(by(ok(await at.harbourReviewer('/api/refusals'))), ['harbour-cook']);
      assert.deepEqual(by(ok(await at.groupAtHarbour('/api/refusals'))), ['harbour-cook']);
      const main = by(ok(await at.main('/api/refusals')));
      assert.ok(main.length > 0 && !main.includes('harbour-cook'));
    });
  });

  describe('equipment', () => {
    before(async () => {
      // Under the name main's demo walk-in has: names are unique within a site.
      harbourEquipment = ok(
        await at.groupAtHarbour('/api/equipment', 'POST', {
          name: 'Walk-in cooler',
          kind: 'cooler',
          control: { rule: 'cold-holding', every: '4 h' },
        }),
        201,
      ).json.equipment.id;
    });

    it("should list a site's equipment only, and not find another site's by id", async () => {
      const ids = (response: ApiResponse) =>
        response.json.equipment.map((e: { id: number }) => e.id);
      assert.deepEqual(ids(ok(await at.harbourCook('/api/equipment'))), [harbourEquipment]);
      assert.deepEqual(ids(ok(await at.groupAtHarbour('/api/equipment'))), [harbourEquipment]);
      const main = ok(await at.main('/api/equipment'));
      assert.ok(main.json.equipment.length > 0 && !ids(main).includes(harbourEquipment));
      const mainId = ids(main)[0];
      assert.equal((await at.harbourCook(`/api/equipment/${mainId}/log`)).status, 404);
      assert.equal((await at.main(`/api/equipment/${harbourEquipment}/log`)).status, 404);
      const renamed = await at.main(`/api/equipment/${harbourEquipment}`, 'PATCH', {
        name: 'Cooler by the door',
      });
      assert.equal(renamed.status, 404, renamed.text);
    });

    it('should keep equipment names unique within a site, not across the group', async () => {
      const names = ok(await at.main('/api/equipment')).json.equipment.map(
        (e: { name: string }) => e.name,
      );
      assert.ok(names.includes('Walk-in cooler'));
      const twice = await at.groupAtHarbour('/api/equipment', 'POST', {
        name: 'walk-in COOLER',
        kind: 'cooler',
        control: { rule: 'cold-holding', every: '4 h' },
      });
      assert.equal(twice.status, 409, twice.text);
      assert.equal(twice.json.error.code, 'name-taken');
    });
  });

  describe('the process board and the HACCP report', () => {
    it("should show on a site's board its own batches only", async () => {
      const main = ok(await at.main('/api/process/now'));
      assert.ok(main.json.items.length > 0, 'the demo has something on its board');
      assert.ok(!main.text.includes(harbourBatch));
      noMainLot(ok(await at.harbourCook('/api/process/now')), "the shop's board");
      noMainLot(ok(await at.groupAtHarbour('/api/process/now')), "the shop's board for the group");
    });

    it("should report a site's records only, under the site's name", async () => {
      const harbour = ok(await at.harbourReviewer('/api/reports/haccp'));
      noMainLot(harbour, "the shop's report");
      assert.equal(harbour.json.kitchen, OTHER_SITE.name);
      assert.ok(harbour.text.includes(harbourBatch) && harbour.text.includes(harbourReceipt));
      assert.equal(harbour.json.refusals.length, 1);
      const csv = await at.harbourReviewer('/api/reports/haccp.csv');
      noMainLot(csv, "the shop's report as CSV");
      const main = ok(await at.main('/api/reports/haccp'));
      assert.ok(main.json.batches.length > 0);
      assert.ok(!main.text.includes(harbourBatch) && !main.text.includes(harbourReceipt));
    });
  });

  describe('costs and the blend', () => {
    it("should chart a formula's costs over the site's batches only", async () => {
      const path = `/api/formulas/${BELLY.formula}/costs`;
      const lots = (response: ApiResponse) =>
        response.json.points.map((p: { lot: string }) => p.lot);
      assert.deepEqual(lots(ok(await at.harbourReviewer(path))), [harbourBatch]);
      assert.deepEqual(lots(ok(await at.groupAtHarbour(path))), [harbourBatch]);
      const main = lots(ok(await at.main(path)));
      assert.ok(main.length > 0 && !main.includes(harbourBatch));
      assert.equal((await at.main(`/api/batches/${harbourBatch}/cost`)).status, 404);
    });

    it("should offer the blend the site's trims only", async () => {
      const main = ok(await at.main('/api/blends/trims'));
      assert.ok(main.json.trims.length > 0, 'the demo has trims on hand');
      // The shop received belly only, which is no trim.
      assert.deepEqual(ok(await at.harbourReviewer('/api/blends/trims')).json.trims, []);
      assert.deepEqual(ok(await at.groupAtHarbour('/api/blends/trims')).json.trims, []);
    });
  });

  describe('made-from lots', () => {
    it("should refuse a lot of another site as one that is not at this kitchen, and take the site's own", async () => {
      const pick = (lot: string) => ({ picks: [{ item: 'pork-belly', lot, amount: '4.26 kg' }] });
      const path = `/api/batches/${harbourBatch}/lots`;
      const elsewhere = await at.harbourCook(path, 'POST', pick(mainReceipt));
      assert.equal(elsewhere.status, 422, elsewhere.text);
      assert.equal(elsewhere.json.error.code, 'no-such-lot');
      assert.equal(
        elsewhere.json.error.message,
        `there is no received lot ${mainReceipt} at ${OTHER_SITE.name}`,
      );
      const suggested = ok(await at.harbourCook(path));
      noMainLot(suggested, "the shop's suggested lots");
      ok(await at.harbourCook(path, 'POST', pick(harbourReceipt)), 201);
    });
  });
});
