import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { pdfText } from '../helpers/pdf-text.ts';
import {
  at,
  recordControlled,
  rowCount,
  startProcessServer,
  T0,
} from '../helpers/process-calls.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';
import { PASSWORDS, type TestServer } from '../helpers/test-server.ts';

/** The command signed in as a demo person, on the server or on the server's own database file. */
function as(server: TestServer, user: keyof typeof PASSWORDS, where: 'server' | 'local') {
  return {
    LARDER_USER: user,
    LARDER_PASSWORD: PASSWORDS[user],
    ...(where === 'server'
      ? { LARDER_SERVER: server.url }
      : { LARDER_DATA: path.join(server.dir, 'data'), LARDER_SERVER: undefined }),
  };
}

const DAY = T0.slice(0, 10);

describe('larder reading, readings and report', () => {
  it("should record a reading with the control's state in words, and exit 5 when it opens a deviation", async (t) => {
    const { server, clock } = await startProcessServer(t);
    const lot = await recordControlled(server.as('tobin'));
    const env = as(server, 'tobin', 'server');
    // The server's clock stands at T0 and moves on as the readings come in.
    clock.advance(61 * 60_000);
    // The fixture's smoker chamber: its own limit of 60–80 °C (tests/helpers/process-calls.ts).
    const inLimit = await runLarder(['reading', lot, 'smoker', '70C', '--at', at(0)], { env });
    assertExit(inLimit, 0);
    assert.match(inLimit.stdout, new RegExp(`Recorded 70C at smoker of lot ${lot}`));
    assert.match(inLimit.stdout, /smoker: in progress/);
    const over = await runLarder(['reading', lot, 'smoker', '185F', '--at', at(30)], { env });
    // 185 °F = 85 °C, over the chamber's 80 °C.
    assertExit(over, 5);
    assert.match(over.stdout, /DEVIATION: Smoker chamber: /);
    assert.match(over.stdout, /on hold until a corrective action/);
    const json = await runLarder(['reading', lot, 'smoker', '90C', '--at', at(60), '--json'], {
      env,
    });
    assertExit(json, 5);
    assert.equal(stdoutJson<{ deviation: { kind: string } }>(json).deviation.kind, 'reading');
    const unknown = await runLarder(['reading', lot, 'fryer', '70C', '--at', at(61)], { env });
    assertCleanFailure(unknown, 2, /fryer/);
  });

  it("should store a logger's file whole, or refuse it at the line and store nothing", async (t) => {
    const { server } = await startProcessServer(t);
    const lot = await recordControlled(server.as('tobin'));
    const env = as(server, 'tobin', 'server');
    const dir = makeTempDir(t);
    const bad = path.join(dir, 'chamber-bad.csv');
    writeFileSync(bad, `Time,Temp (°C)\n${DAY} 12:00,70\n${DAY} 12:01,warm\n`);
    const before = await rowCount(server, 'readings');
    assertCleanFailure(
      await runLarder(['readings', lot, 'smoker', bad], { env }),
      2,
      /chamber-bad\.csv: .*line 3/,
    );
    assert.equal(await rowCount(server, 'readings'), before);
    const good = path.join(dir, 'chamber.csv');
    writeFileSync(good, `Time,Temp (°C)\n${DAY} 12:00,70\n${DAY} 12:01,71\n${DAY} 12:02,72\n`);
    const stored = await runLarder(['readings', lot, 'smoker', good], {
      env: { ...env, TZ: 'UTC' },
    });
    assertExit(stored, 0);
    assert.match(
      stored.stdout,
      new RegExp(`chamber\\.csv, smoker of lot ${lot}: 3 readings stored\\.`),
    );
    // The same file again: nothing stored twice, and no failure.
    const again = await runLarder(['readings', lot, 'smoker', good], {
      env: { ...env, TZ: 'UTC' },
    });
    assertExit(again, 0);
    assert.match(again.stdout, /Nothing new: all 3 readings in this file were stored already\./);
    assert.equal(await rowCount(server, 'readings'), before + 3);
  });

  it('should write the report as a PDF for a reviewer, from the server or this machine, and refuse a cook', async (t) => {
    const { server } = await startProcessServer(t);
    const lot = await recordControlled(server.as('tobin'));
    assertExit(
      await runLarder(['reading', lot, 'smoker', '70C', '--at', at(0)], {
        env: as(server, 'tobin', 'server'),
      }),
      0,
    );
    const dir = makeTempDir(t);
    for (const where of ['server', 'local'] as const) {
      const file = path.join(dir, `haccp-${where}.pdf`);
      const run = await runLarder(['report', '--from', DAY, '--to', DAY, '--pdf', file], {
        env: as(server, 'imke', where),
      });
      assertExit(run, 0);
      const bytes = readFileSync(file);
      assert.equal(bytes.subarray(0, 5).toString(), '%PDF-');
      const { all } = await pdfText(bytes);
      assert.ok(all.includes(`LOT ${lot}`), where);
      assert.match(all, /Smoker chamber/);
      // The kitchen's own limit with its source, as the formula says.
      assert.match(all, /Quillmoor smoker validation, 2026/);
    }
    const summary = await runLarder(['report', '--from', DAY, '--to', DAY], {
      env: as(server, 'rosa', 'local'),
    });
    assertExit(summary, 0);
    assert.match(summary.stdout, new RegExp(`${lot}\\s+test-cooked-belly\\s+in-progress`));
    const cook = await runLarder(['report'], { env: as(server, 'tobin', 'server') });
    assertCleanFailure(cook, 2, /role|may not/);
  });
});
