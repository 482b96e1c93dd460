import assert from 'node:assert/strict';
import { existsSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';

interface Summary {
  file: string;
  batches: number;
  people: number;
  bytes: number;
}

interface Page {
  items: { lotCode: string }[];
  total: number;
}

describe('larder backup', () => {
  it('should copy the database whole while the server records batches, and the copy reads back', async (t) => {
    const server = await startTestServer(t);
    const data = path.join(server.dir, 'data');
    const target = path.join(makeTempDir(t), 'larder-backup.sqlite');
    const today = new Date().toISOString().slice(0, 10);
    // Cooks keep recording while the backup runs: the copy is one consistent moment.
    let recording = true;
    const recorded: string[] = [];
    const writer = (async () => {
      while (recording) {
        const response = await server.as('tobin').post('/api/batches', {
          formula: 'brisket-rub',
          batch: { base: '1kg', start: today },
        });
        assert.equal(response.status, 201, response.text);
        recorded.push(response.json.batch.lotCode as string);
      }
    })();
    while (recorded.length < 3) await new Promise((resolve) => setTimeout(resolve, 20));
    const backup = await runLarder(['backup', target, '--json'], { env: { LARDER_DATA: data } });
    recording = false;
    await writer;
    assertExit(backup, 0);
    const summary = stdoutJson<Summary>(backup);
    assert.equal(summary.file, target);
    assert.equal(summary.people, 3, 'the three demo people');
    assert.ok(summary.bytes > 0);
    // Nothing half-written is left beside the copy.
    assert.deepEqual(readdirSync(path.dirname(target)), ['larder-backup.sqlite']);

    // The copy is a database larder can use: its log holds what was recorded before it was taken.
    const list = await runLarder(['batches', 'list', '--json', '--limit', '200'], {
      env: {
        LARDER_DB: target,
        LARDER_DATA: path.dirname(target),
        LARDER_USER: 'imke',
        LARDER_PASSWORD: PASSWORDS.imke,
      },
    });
    assertExit(list, 0);
    const page = stdoutJson<Page>(list);
    assert.equal(page.total, summary.batches);
    const inCopy = new Set(page.items.map((item) => item.lotCode));
    for (const lot of recorded.slice(0, 3)) assert.ok(inCopy.has(lot), `${lot} is in the copy`);
    const live = await server.as('rosa').get('/api/batches?limit=1');
    assert.ok(summary.batches <= live.json.total);
  });

  it('should never replace an existing file, nor copy a database that is not there', async (t) => {
    const dir = makeTempDir(t);
    const existing = path.join(dir, 'kept.sqlite');
    writeFileSync(existing, 'an earlier backup');
    const server = await startTestServer(t);
    const env = { LARDER_DATA: path.join(server.dir, 'data') };
    assertCleanFailure(await runLarder(['backup', existing], { env }), 2, /exists already/);
    assertCleanFailure(
      await runLarder(['backup', path.join(dir, 'new.sqlite')], {
        env: { LARDER_DATA: path.join(dir, 'nothing-here') },
      }),
      2,
      /there is no database/,
    );
    assert.equal(existsSync(path.join(dir, 'nothing-here')), false, 'no empty database was made');
  });
});
