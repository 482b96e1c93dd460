import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  at,
  processOf,
  reading,
  recordControlled,
  rowCount,
  scan,
  startProcessServer,
} from '../helpers/process-calls.ts';

// source: USDA FSIS, Appendix B, Compliance Guidelines for Cooling Heat-Treated Meat and Poultry
// Products (Stabilization) (1999), option 1: from 130 °F, 80 °F must be reached within 1.5 hours.
const STAGE_1_MINUTES = 90;

describe('deadlines that pass with no reading', () => {
  it('should open a deadline deviation once when a cool misses stage 1, across two scans and a restart', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    await reading(tobin, lot, 'cook', '160 °F', at(0));
    // The clock starts at the last reading at or above 130 °F before the first one below it.
    const hot = await reading(tobin, lot, 'chill', '130 °F', at(1));
    assert.equal(hot.state.stage, null);
    clock.set(new Date(at(60)));
    const warm = await reading(tobin, lot, 'chill', '100 °F');
    assert.equal(warm.deviation, null);
    assert.equal(warm.state.status, 'in-progress');
    assert.equal(warm.state.stage.index, 1);
    assert.equal(warm.state.stage.deadline, at(1 + STAGE_1_MINUTES));

    // Just before the deadline: nothing to open, and "now" lists the stage's deadline.
    clock.set(new Date(at(STAGE_1_MINUTES)));
    assert.deepEqual((await scan(server, clock)).opened, []);
    const now = await server.as('imke').get('/api/process/now');
    assert.equal(now.status, 200, now.text);
    const stage = now.json.items.find(
      (i: { kind: string; lotCode: string }) => i.kind === 'stage-deadline' && i.lotCode === lot,
    );
    assert.equal(stage.at, at(1 + STAGE_1_MINUTES));
    assert.equal(stage.controlTitle, 'Chilling after the smoke');

    // A minute past it, with no reading at or below 80 °F: one deadline deviation.
    clock.set(new Date(at(STAGE_1_MINUTES + 2)));
    const first = await scan(server, clock);
    assert.equal(first.opened.length, 1);
    assert.equal((await scan(server, clock)).opened.length, 0);
    await server.restart();
    clock.advance(30 * 60_000);
    assert.equal((await scan(server, clock)).opened.length, 0);
    assert.equal(await rowCount(server, 'deviations'), 1);

    const record = await processOf(server, lot);
    const [deviation] = record.deviations;
    assert.equal(deviation!.kind, 'deadline');
    assert.equal(deviation!.control, 'chill');
    assert.equal(deviation!.openedBy, null);
    assert.equal(deviation!.openedAt, at(STAGE_1_MINUTES + 2));
    assert.equal(record.onHold, true);

    // The deviation comes first in "now": it holds the batch.
    const after = await server.as('tobin').get('/api/process/now');
    assert.equal(after.json.items[0].kind, 'deviation');
    assert.equal(after.json.items[0].lotCode, lot);

    // The late reading that finally reaches 80 °F is a miss of the same stage: nothing new opens.
    const late = await reading(tobin, lot, 'chill', '79 °F', at(STAGE_1_MINUTES + 30));
    assert.equal(late.deviation, null);
    assert.equal(await rowCount(server, 'deviations'), 1);
  });

  it('should list a reading overdue and one due within 15 minutes, but not one due later', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    // The fixture's smoker is read every 30 minutes.
    await reading(rosa, lot, 'smoker', '70', at(0));
    const dueOf = async () =>
      (await rosa.get('/api/process/now')).json.items.filter(
        (i: { kind: string; lotCode: string }) => i.kind === 'reading-due' && i.lotCode === lot,
      );
    clock.set(new Date(at(10)));
    assert.deepEqual(await dueOf(), []);
    clock.set(new Date(at(16)));
    const [soon] = await dueOf();
    assert.equal(soon.at, at(30));
    assert.match(soon.what, /^Smoker chamber: reading due by /);
    clock.set(new Date(at(45)));
    const [overdue] = await dueOf();
    assert.match(overdue.what, /overdue since/);
  });
});
