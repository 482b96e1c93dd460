import assert from 'node:assert/strict';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { addDays } from '../../shared/index.ts';
import { assertErrorEnvelope, snapshot, suiteServer } from '../helpers/api-calls.ts';

/** The server plans from its own today; a day far enough ahead for the belly's 9 days. */
const TODAY = new Date().toISOString().slice(0, 10);
const SERVICE = addDays(TODAY, 21);
const BURGERS = { assembly: 'smokehouse-burger', count: 120, for: SERVICE };

describe('POST /api/plans', () => {
  const server = suiteServer();

  it('should give every batch with its start day, the pull list and the allergens', async () => {
    const answer = await server().as('imke').post('/api/plans', BURGERS);
    assert.equal(answer.status, 200, answer.text);
    const plan = answer.json;
    // Belly: 8-day hold + 2 lead days (rinse and dry, smoke and chill); bun: sponge the evening
    // before; grind and sauce on the day. source: the demo formulas' hold rule (2 days per cm ×
    // 4 cm) and lead days (common practice, no source)
    assert.deepEqual(
      plan.batches.map((b: { start: string; formula: { id: string } }) => [b.start, b.formula.id]),
      [
        [addDays(SERVICE, -10), 'quillmoor-belly'],
        [addDays(SERVICE, -1), 'pit-bun'],
        [SERVICE, 'house-sauce'],
        [SERVICE, 'chuck-grind'],
      ],
    );
    // 120 burgers × 2 portions = 240 portions of 4 oz (113.398 g): 27 215.54 g of grind.
    // source: 1 lb = 453.59237 g (NIST SP 811)
    const grind = plan.batches.find(
      (b: { formula: { id: string } }) => b.formula.id === 'chuck-grind',
    );
    assert.equal(grind.batch.total, '27215.5422 g');
    // 9000 g sliced ÷ 0.90 (smoke) ÷ 0.94 (slice) = 10 638.30 g of green belly.
    const green = plan.pullList.find((i: { name: string }) => i.name.startsWith('green meat'));
    assert.equal(green.grams.slice(0, 8), '10638.29');
    // source: 21 U.S.C. 343(w)(2) (the species of fish); formulas/house-sauce.yaml
    assert.deepEqual(plan.allergens, ['milk', 'egg', 'fish (anchovy)', 'wheat']);
    assert.ok(plan.cautions.some((c: { text: string }) => /Curing salt is poisonous/.test(c.text)));
  });

  it('should refuse with the reason and the formula at fault, recording nothing', async () => {
    const before = await snapshot(server());
    const soon = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, for: addDays(TODAY, 3) });
    assertErrorEnvelope(soon, 'too soon');
    assert.equal(soon.status, 422);
    assert.equal(soon.json.error.code, 'plan-refused');
    assert.equal(soon.json.error.details[0].formula, 'quillmoor-belly');
    assert.match(soon.json.error.message, /already past/);
    // The message is read by a cook: the formula by its title and days in words, never ISO.
    assert.match(
      soon.json.error.message,
      /^Quillmoor belly, dry equilibrium cure must start \d{1,2} [A-Z][a-z]{2} \d{4}, /,
    );
    assert.doesNotMatch(soon.json.error.message, /\d{4}-\d{2}-\d{2}/);

    const notAssembly = await server()
      .as('tobin')
      .post('/api/plans', { ...BURGERS, assembly: 'chuck-grind' });
    assert.equal(notAssembly.status, 422);
    assert.equal(notAssembly.json.error.code, 'not-an-assembly');
    const missing = await server()
      .as('tobin')
      .post('/api/plans', { ...BURGERS, assembly: 'no-such-menu' });
    assert.equal(missing.status, 404);
    for (const body of [
      { ...BURGERS, count: 0 },
      { ...BURGERS, count: 1.5 },
      { ...BURGERS, for: '18/12/2026' },
      { ...BURGERS, extra: true },
    ]) {
      const bad = await server().as('tobin').post('/api/plans/record', body);
      assert.equal(bad.status, 400, JSON.stringify(body));
    }
    assert.deepEqual(await snapshot(server()), before);
  });

  it('should refuse an assembly that names a missing formula or goes round in a circle', async () => {
    const write = (name: string, text: string): void =>
      writeFileSync(path.join(server().formulasDir, name), text);
    const assembly = (id: string, part: string): string =>
      `formula: 1\nid: ${id}\ntitle: ${id}\nkind: assembly\ncomponents:\n  - ${part}\n`;
    write('lost.yaml', assembly('lost', '{ formula: no-such-thing, amount: 10 g }'));
    write('loop-a.yaml', assembly('loop-a', '{ formula: loop-b, units: 1 }'));
    write('loop-b.yaml', assembly('loop-b', '{ formula: loop-a, units: 1 }'));
    const lost = await server()
      .as('tobin')
      .post('/api/plans', { ...BURGERS, assembly: 'lost' });
    assert.equal(lost.status, 422);
    assert.equal(lost.json.error.code, 'invalid-formula');
    assert.match(JSON.stringify(lost.json.error.details), /no formula \\"no-such-thing\\"/);
    const loop = await server()
      .as('tobin')
      .post('/api/plans', { ...BURGERS, assembly: 'loop-a' });
    assert.equal(loop.status, 422);
    assert.match(
      JSON.stringify(loop.json.error.details),
      /loop-a → loop-b → loop-a goes round in a circle/,
    );
  });

  it('should record every batch as planned for cooks and admins, never for reviewers', async () => {
    const refused = await server().as('imke').post('/api/plans/record', BURGERS);
    assert.equal(refused.status, 403);
    const recorded = await server().as('tobin').post('/api/plans/record', BURGERS);
    assert.equal(recorded.status, 201, recorded.text);
    const batches = recorded.json.batches as {
      lotCode: string;
      status: string;
      startedOn: string;
      formula: { id: string };
      inputs: { count?: string };
    }[];
    assert.deepEqual(
      batches.map((b) => [b.startedOn, b.status]),
      [
        [addDays(SERVICE, -10), 'planned'],
        [addDays(SERVICE, -1), 'planned'],
        [SERVICE, 'planned'],
        [SERVICE, 'planned'],
        [SERVICE, 'planned'],
      ],
    );
    // Last, the 120 burgers themselves, put together on the day of service from the others.
    assert.deepEqual(
      [batches[4].formula.id, batches[4].inputs.count],
      ['smokehouse-burger', '120'],
    );
    const listed = await server().as('imke').get('/api/batches?status=planned&limit=50');
    assert.equal(listed.status, 200);
    const lots = listed.json.items.map((b: { lotCode: string }) => b.lotCode);
    for (const batch of batches) assert.ok(lots.includes(batch.lotCode), batch.lotCode);
    // The batch record says which plan it belongs to.
    const one = await server().as('imke').get(`/api/batches/${batches[0].lotCode}`);
    assert.match(one.json.batch.notes, new RegExp(`plan: smokehouse-burger ×120 for ${SERVICE}`));
  });

  it('should answer 409 with the batches already recorded, and record again only when asked', async () => {
    // Another day, so the test stands alone; a different count is still the same service.
    const day = addDays(SERVICE, 7);
    const first = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, for: day });
    assert.equal(first.status, 201, first.text);
    const lots = first.json.batches.map((b: { lotCode: string }) => b.lotCode);
    // Grind, bun, bacon and sauce, and the burgers' own batch.
    assert.equal(lots.length, 5);

    const before = await snapshot(server());
    const twice = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, count: 150, for: day });
    assertErrorEnvelope(twice, 'recorded twice');
    assert.equal(twice.status, 409);
    assert.equal(twice.json.error.code, 'plan-already-recorded');
    const detail = twice.json.error.details[0];
    assert.equal(detail.serviceDate, day);
    // The machine field keeps the ISO day; the words a cook reads say it as a day.
    assert.match(twice.json.error.message, / on \d{1,2} [A-Z][a-z]{2} \d{4}: record again/);
    assert.doesNotMatch(twice.json.error.message, /\d{4}-\d{2}-\d{2}/);
    assert.deepEqual(
      detail.batches.map((b: { lotCode: string }) => b.lotCode).sort(),
      [...lots].sort(),
    );
    assert.deepEqual(await snapshot(server()), before, 'nothing recorded the second time');

    const again = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, count: 150, for: day, again: true });
    assert.equal(again.status, 201, again.text);
    assert.equal(again.json.batches.length, 5);
    const bad = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, for: day, again: 'yes' });
    assert.equal(bad.status, 400);
  });

  it('should note in the audit log who made a plan and who recorded it, from where', async () => {
    const day = addDays(SERVICE, 28);
    const made = await server()
      .as('imke')
      .post('/api/plans', { ...BURGERS, count: 30, for: day });
    assert.equal(made.status, 200, made.text);
    const recorded = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, count: 30, for: day });
    assert.equal(recorded.status, 201, recorded.text);
    const lots = recorded.json.batches.map((b: { lotCode: string }) => b.lotCode);
    const ofDay = async (action: 'plan-make' | 'plan-record') =>
      (await server().context.audit.list({ limit: 50, action })).filter(
        (event) => (event.detail as { serviceDate?: string }).serviceDate === day,
      );
    const [make] = await ofDay('plan-make');
    assert.equal(make.actorName, 'imke');
    assert.equal(make.subject, 'smokehouse-burger');
    assert.deepEqual(make.detail, { count: 30, serviceDate: day });
    assert.equal(typeof make.ip, 'string', 'the address the plan was made from');
    const [record] = await ofDay('plan-record');
    assert.equal(record.actorName, 'tobin');
    assert.equal(record.subject, 'smokehouse-burger');
    assert.deepEqual(record.detail, { count: 30, serviceDate: day, lots, again: false });
    assert.equal(typeof record.ip, 'string');
  });

  it('should list the plans made, who made them and whether they were recorded', async () => {
    const day = addDays(SERVICE, 14);
    const shown = await server()
      .as('imke')
      .post('/api/plans', { ...BURGERS, count: 40, for: day });
    assert.equal(shown.status, 200, shown.text);
    // Shown twice: one plan made, by the first to work it out.
    await server()
      .as('tobin')
      .post('/api/plans', { ...BURGERS, count: 40, for: day });
    const recorded = await server()
      .as('tobin')
      .post('/api/plans/record', { ...BURGERS, count: 60, for: day });
    assert.equal(recorded.status, 201, recorded.text);

    const listed = await server().as('imke').get('/api/plans');
    assert.equal(listed.status, 200, listed.text);
    const mine = listed.json.plans.filter((p: { serviceDate: string }) => p.serviceDate === day);
    assert.deepEqual(
      mine.map((p: { count: number; madeBy: { displayName: string }; recorded: unknown }) => [
        p.count,
        p.recorded === null ? 'not recorded' : 'recorded',
      ]),
      [
        [60, 'recorded'],
        [40, 'not recorded'],
      ],
    );
    const forty = mine.find((p: { count: number }) => p.count === 40);
    const sixty = mine.find((p: { count: number }) => p.count === 60);
    // source: server/demo/demo-people.ts, the demo crew's names
    assert.equal(forty.madeBy.displayName, 'Imke Tressaly (food safety)');
    // Grind, bun, bacon and sauce, and the burgers' own batch.
    assert.equal(sixty.recorded.batches, 5);
    assert.equal(sixty.assembly.id, 'smokehouse-burger');
  });
});
