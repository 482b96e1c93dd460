import assert from 'node:assert/strict';
import { rmSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { addDays } from '../../shared/calculation/dates.ts';
import { clockFrom, startTestServer } from '../helpers/test-server.ts';

// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const TODAY = '2020-12-03';
const CLOCK = clockFrom(TODAY);

/** The parts' lines of an assembly batch, by part: exact grams and the words of the need. */
function partsOf(batch: {
  result: { groups: { lines: { part?: string; grams: string; note?: string }[] }[] };
}) {
  return Object.fromEntries(
    batch.result.groups
      .flatMap((group) => group.lines)
      .map((line) => [line.part, { grams: line.grams, note: line.note }]),
  );
}

describe('POST /api/batches: an assembly recorded as a batch', () => {
  it('should record 24 burgers made today with each part worked out from its formula', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const recorded = await server.as('tobin').post('/api/batches', {
      formula: 'smokehouse-burger',
      batch: { count: '24' },
    });
    assert.equal(recorded.status, 201, recorded.text);
    const { batch } = recorded.json;
    assert.equal(batch.lotCode, '201203-SB-01');
    assert.equal(batch.kind, 'assembly');
    // Put together on its day, with no hold and no controls: made, and ready, that day.
    assert.equal(batch.status, 'done');
    assert.equal(batch.readyOn, TODAY);
    assert.deepEqual(batch.inputs, { start: TODAY, count: '24' });
    // formulas/smokehouse-burger.yaml, worked by hand for 24 burgers:
    // - chuck-grind, 2 portions of 4 oz: 48 × 113.3980925 g = 5 443.10844 g (4 oz = 4 ×
    //   28.349523125 g; source: NIST Handbook 44 (2024), Appendix C, avoirdupois ounce);
    // - pit-bun, 1 piece of 90 g (pit-bun.yaml's piece): 24 × 90 g = 2 160 g;
    // - quillmoor-belly, 3 slices of 25 g: 72 × 25 g = 1 800 g of sliced bacon;
    // - house-sauce, 20 g: 24 × 20 g = 480 g.
    assert.deepEqual(partsOf(batch), {
      'chuck-grind': { grams: '5443.10844', note: '2 portions each = 48 portions of 4 oz' },
      'pit-bun': { grams: '2160', note: '1 piece each = 24 pieces of 90 g' },
      'quillmoor-belly': { grams: '1800', note: '3 slices of 25 g each = 1800 g sliced' },
      'house-sauce': { grams: '480', note: '20 g each = 480 g' },
    });
    // 5 443.10844 + 2 160 + 1 800 + 480 = 9 883.10844 g, 411.796185 g a burger.
    const figure = (label: string) =>
      batch.result.figures.find((f: { label: string }) => f.label === label)?.exact;
    assert.equal(figure('Total weight'), '9883.10844');
    assert.equal(figure('Weight of one unit'), '411.796185');
    assert.equal(batch.checksPassed, true);
  });

  it('should suggest the part’s batch with the part’s weight and record it when accepted', async (t) => {
    // On the real today, as the demo's batches are: its bellies are ready before it.
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const recorded = await tobin.post('/api/batches', {
      formula: 'bacon-pack',
      batch: { count: '4' },
    });
    const lot = recorded.json.batch.lotCode as string;
    const lots = await tobin.get(`/api/batches/${lot}/lots`);
    assert.equal(lots.status, 200, lots.text);
    assert.deepEqual(lots.json.notInCatalogue, [], 'a part is a batch, not a stock item');
    const [belly] = lots.json.suggested;
    // 4 packs × 8 slices × 25 g = 800 g, from the first belly batch on offer (the demo's).
    assert.deepEqual([belly.item, belly.source, belly.need], ['quillmoor-belly', 'batch', '800']);
    const first = belly.onHand[0].lotCode as string;
    assert.deepEqual(
      belly.takes.map((take: { lotCode: string; amount: string }) => [take.lotCode, take.amount]),
      [[first, '800']],
    );
    const accepted = await tobin.post(`/api/batches/${lot}/lots`, { accept: true });
    assert.equal(accepted.status, 201, accepted.text);
    assert.deepEqual(
      accepted.json.uses.map((use: { source: string; lotCode: string; amount: string }) => [
        use.source,
        use.lotCode,
        use.amount,
      ]),
      [['batch', first, '800']],
    );
  });

  it('should plan an assembly for a later day, and refuse to call it made', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const tobin = server.as('tobin');
    const tomorrow = addDays(TODAY, 1);
    const planned = await tobin.post('/api/batches', {
      formula: 'bacon-pack',
      batch: { count: '40', start: tomorrow },
    });
    assert.equal(planned.status, 201, planned.text);
    assert.deepEqual(
      [planned.json.batch.lotCode, planned.json.batch.status],
      ['201204-BP-01', 'planned'],
    );
    // 40 packs × 8 slices × 25 g = 8 000 g of sliced belly.
    assert.equal(partsOf(planned.json.batch)['quillmoor-belly'].grams, '8000');
    const madeTomorrow = await tobin.post('/api/batches', {
      formula: 'bacon-pack',
      batch: { count: '40', start: tomorrow },
      status: 'done',
    });
    assert.equal(madeTomorrow.status, 400, madeTomorrow.text);
    assert.equal(madeTomorrow.json.error.code, 'bad-status');
    assert.match(madeTomorrow.json.error.message, /not made yet: record it as planned/);
    // Under way on its day when the cook says so: a burger service still going.
    const underWay = await tobin.post('/api/batches', {
      formula: 'smokehouse-burger',
      batch: { count: '60' },
      status: 'in-progress',
    });
    assert.equal(underWay.json.batch.status, 'in-progress');
  });

  it('should refuse an assembly with no count, a count that is not one, and options it does not take', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const tobin = server.as('tobin');
    const packs = async () => (await tobin.get('/api/batches?formula=bacon-pack')).json.total;
    const before = await packs();
    const cases: [string, Record<string, string>, RegExp, string | null][] = [
      ['no count', {}, /give --count: how many of Sliced bacon, 200 g pack were made/, 'count'],
      ['no units at all', { count: '0' }, /--count must be between 1 and 100000/, 'count'],
      ['not a number', { count: 'forty' }, /--count: .*whole number/, 'count'],
      [
        'a blend’s option',
        { count: '4', total: '5 kg' },
        /--total does not apply to an assembly/,
        'total',
      ],
    ];
    for (const [what, batch, message, option] of cases) {
      const answer = await tobin.post('/api/batches', { formula: 'bacon-pack', batch });
      assert.equal(answer.status, 400, `${what}: ${answer.text}`);
      assert.equal(answer.json.error.code, 'bad-batch', what);
      assert.match(answer.json.error.message, message, what);
      assert.deepEqual(answer.json.error.details, option ? [{ option }] : [], what);
    }
    const reviewer = await server.as('imke').post('/api/batches', {
      formula: 'bacon-pack',
      batch: { count: '4' },
    });
    assert.equal(reviewer.status, 403);
    assert.equal(await packs(), before, 'nothing recorded');
  });

  it('should refuse an assembly whose part formula is missing, naming the part', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    rmSync(path.join(server.formulasDir, 'chuck-grind.yaml'));
    server.context.formulas.changed();
    const answer = await server.as('tobin').post('/api/batches', {
      formula: 'smokehouse-burger',
      batch: { count: '24' },
    });
    assert.equal(answer.status, 422, answer.text);
    assert.equal(answer.json.error.code, 'invalid-formula');
    assert.ok(
      answer.json.error.details.some(
        (problem: { message: string }) =>
          /chuck-grind/.test(problem.message) && problem.message.length > 0,
      ),
      answer.text,
    );
  });
});
