import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer } from '../helpers/test-server.ts';

/** A process record's parts the demo checks read. */
interface DemoRecord {
  weighings: { kind: string; name: string; correctedBy: number | null }[];
  deviations: { kind: string; action: { disposition: string } | null }[];
  controls: { control: { id: string }; state: { status: string } }[];
  verification: { by: { displayName: string } } | null;
  onHold: boolean;
  nonconforming: boolean;
  actualYields: { stage: string }[];
}

describe('the demo kitchen’s process records', () => {
  it('should show a smoked belly weighed, read, corrected and released, a batch cooling now and a belly to start', async (t) => {
    const server = await startTestServer(t);
    const imke = server.as('imke');
    const done = await imke.get('/api/batches?formula=quillmoor-belly&status=done&limit=100');
    const records: [string, DemoRecord][] = [];
    for (const item of done.json.items as { lotCode: string }[]) {
      const record = await imke.get(`/api/batches/${item.lotCode}/process`);
      if (record.json.verification) records.push([item.lotCode, record.json]);
    }
    assert.equal(records.length, 1, 'one released belly');
    const [[lot, belly]] = records;
    const sheet = (await imke.get(`/api/batches/${lot}`)).json.batch.result.groups.flatMap(
      (g: { lines: { name: string }[] }) => g.lines.map((l) => l.name),
    );
    const weighed = (kind: string) =>
      belly.weighings.filter((w) => w.kind === kind).map((w) => w.name);
    assert.deepEqual(weighed('line'), sheet);
    assert.deepEqual(weighed('stage'), ['green', 'cured', 'smoked', 'sliced']);
    assert.deepEqual(
      belly.actualYields.map((y) => y.stage),
      ['cured', 'smoked', 'sliced'],
    );
    assert.equal(belly.deviations.length, 1);
    assert.equal(belly.deviations[0].kind, 'reading');
    assert.ok(belly.deviations[0].action, 'the deviation is closed by its corrective action');
    assert.equal(belly.onHold, false);
    assert.equal(belly.nonconforming, true);
    assert.deepEqual(
      belly.controls.map((c) => [c.control.id, c.state.status]),
      [
        ['cure-room', 'met'],
        ['smoker', 'missed'],
        ['chill', 'met'],
      ],
    );
    assert.equal(belly.verification?.by.displayName, 'Imke Tressaly (food safety)');

    const now = await imke.get('/api/process/now');
    const deadline = now.json.items.find((i: { kind: string }) => i.kind === 'stage-deadline');
    assert.ok(deadline, now.text);
    // A deadline on another day names the day first ("by Fri 4 Dec, 00:09" late in the evening).
    assert.match(deadline.what, /must reach .* by (\w{3} \d{1,2} \w{3}, )?\d\d:\d\d/);
    assert.ok(Date.parse(deadline.at) > Date.now(), 'the stage deadline is still ahead');

    const planned = await imke.get('/api/batches?formula=quillmoor-belly&status=planned');
    assert.equal(planned.json.items.length, 1);
    const start = await server
      .as('tobin')
      .post(`/api/batches/${planned.json.items[0].lotCode}/start`, {
        batch: { meat: '4.52 kg', thickness: '4 cm' },
      });
    assert.equal(start.status, 200, start.text);
    assert.match(start.json.warnings[0], /day earlier than planned/);
  });
});
