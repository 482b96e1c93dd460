import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { addDays } from '../../shared/index.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { localRecordsEnv } from '../helpers/local-records-env.ts';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';
import { bellyCalc } from '../helpers/cli-belly.ts';

// Yesterday on this machine's clock: a start must lie within a year of it.
const START = addDays(today(), -1);
// Lot code: start date YYMMDD, the formula id's initials, a sequence. source: our lot code format
// (server/README.md "Batches")
const LOT = `${START.slice(2).replaceAll('-', '')}-QB-01`;
const BELLY = bellyCalc(START);
const REFUSED = ['calc', 'maple-pump-belly', '--meat', '10kg', '--pumped-weight', '11.2kg'];

interface RecordedBatch {
  lotCode: string;
  status: string;
  nitritePpm: string;
  result: { checks: { id: string; exact: string; limit: string; status: string }[] };
}

describe('larder calc --record and larder batches', () => {
  it('should record on this machine, list and show the batch, and refuse an over-limit cure', async (t) => {
    const records = await localRecordsEnv(t);
    assertExit(
      await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'tobin-pass-1' },
      }),
      0,
    );
    const env = { ...records, LARDER_USER: 'tobin', LARDER_PASSWORD: 'tobin-pass-1' };

    const recorded = await runLarder([...BELLY, '--record', '--json'], { env });
    assertExit(recorded, 0);
    const batch = stdoutJson<RecordedBatch>(recorded);
    assert.equal(batch.lotCode, LOT);
    // 0.25 % × 6.25 % × 10^6 = 156.25 ppm. source: USDA FSIS Directive 7620.3 ch. 3, dry-cure formula
    assert.equal(batch.nitritePpm, '156.25');

    const list = await runLarder(['batches', 'list', '--json'], { env });
    assertExit(list, 0);
    const { items } = stdoutJson<{ items: Record<string, unknown>[] }>(list);
    assert.deepEqual(
      items.map((b) => b.lotCode),
      [LOT],
    );
    // A list item carries its own nitrite ceiling as recorded, not the whole result.
    const ceiling = batch.result.checks.find((c) => c.id === 'nitrite-max');
    assert.deepEqual(items[0].nitriteMax, { limit: ceiling?.limit, status: ceiling?.status });
    assert.equal(items[0].nitritePpm, '156.25');
    assert.equal('result' in items[0], false);
    const show = await runLarder(['batches', 'show', LOT.toLowerCase()], { env });
    assertExit(show, 0);
    assert.match(show.stdout, new RegExp(`Lot ${LOT} · in-progress`));
    assert.match(show.stdout, /EVENTS/);
    // Each event names who made it: the recording cook.
    assert.match(show.stdout, /recorded\s+in-progress\s+tobin/);

    // Pumped to 12 % instead of 10 %: 144 ppm over the 120 ppm of 9 CFR 424.22(b); FSIS 7620.3 pumped formula.
    const refused = await runLarder([...REFUSED, '--record'], { env });
    assertCleanFailure(
      refused,
      4,
      /refused and was not recorded: critical limit exceeded: 144\.0 ppm/,
    );
    const after = await runLarder(['batches', 'list', '--json'], { env });
    assert.equal(stdoutJson<{ total: number }>(after).total, 1);
  });

  it('should refuse to record without credentials or as a reviewer', async (t) => {
    const records = await localRecordsEnv(t);
    assertExit(
      await runLarder(['users', 'add', 'imke', '--role', 'reviewer'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'imke-pass-12' },
      }),
      0,
    );
    assertCleanFailure(
      await runLarder([...BELLY, '--record'], { env: { ...records } }),
      2,
      /set LARDER_USER and LARDER_PASSWORD/,
    );
    assertCleanFailure(
      await runLarder([...BELLY, '--record'], {
        env: { ...records, LARDER_USER: 'imke', LARDER_PASSWORD: 'imke-pass-12' },
      }),
      2,
      /imke is a reviewer; this needs admin or cook/,
    );
  });

  it('should record on a server that the API then lists', async (t) => {
    const server = await startTestServer(t);
    const env = { LARDER_USER: 'tobin', LARDER_PASSWORD: PASSWORDS.tobin };
    const before = (await server.as('imke').get('/api/batches?formula=quillmoor-belly&limit=1'))
      .json.total as number;
    const recorded = await runLarder([...BELLY, '--record', '--server', server.url], { env });
    assertExit(recorded, 0);
    const lot = /Recorded: lot (\S+)/.exec(recorded.stdout)?.[1];
    assert.ok(lot, recorded.stdout);
    const listed = await server.as('imke').get(`/api/batches?lot=${lot}`);
    assert.equal(listed.json.items[0].lotCode, lot);
    assert.equal(
      (await server.as('imke').get('/api/batches?formula=quillmoor-belly&limit=1')).json.total,
      before + 1,
    );
    const shown = await runLarder(['batches', 'show', lot, '--server', server.url, '--json'], {
      env,
    });
    assertExit(shown, 0);
    assert.equal(stdoutJson<RecordedBatch>(shown).lotCode, lot);

    const refused = await runLarder([...REFUSED, '--record', '--server', server.url], { env });
    assertCleanFailure(refused, 4, /critical limit exceeded/);
    const wrong = await runLarder([...BELLY, '--record', '--server', server.url], {
      env: { LARDER_USER: 'tobin', LARDER_PASSWORD: 'wrong-password' },
    });
    assertCleanFailure(wrong, 2, /wrong username or password/);
  });
});
