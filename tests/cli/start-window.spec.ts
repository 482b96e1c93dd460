import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { addDays } from '../../shared/index.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';

const BELLY = ['calc', 'quillmoor-belly', '--meat', '4.26kg', '--thickness', '4cm'];

/** The refusal for a start a year or more from this machine's today. source: start-window.ts */
function outOfWindow(start: string, side: 'ahead' | 'back'): RegExp {
  // Days in words, "3 Dec 2026": the range moves with this machine's today.
  const day = '\\d{1,2} [A-Z][a-z]{2} \\d{4}';
  const [year, month, date] = start.split('-').map(Number);
  const words = `${date} ${MONTHS[month - 1]} ${year}`;
  return new RegExp(
    `^larder: --start ${words} is more than a year ${side}: a batch can start from ${day} to ${day}`,
    'm',
  );
}

/** Month names as the product writes them. source: shared/presentation/date-words.ts */
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A machine database with a cook in it, and the environment to record as that cook. */
async function cook(t: { after(fn: () => unknown): void }): Promise<Record<string, string>> {
  const data = path.join(makeTempDir(t), 'data');
  assertExit(
    await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
      env: { LARDER_DATA: data, LARDER_NEW_PASSWORD: 'tobin-pass-1' },
    }),
    0,
  );
  return { LARDER_DATA: data, LARDER_USER: 'tobin', LARDER_PASSWORD: 'tobin-pass-1' };
}

describe('larder calc --start outside a year of today', () => {
  it('should refuse to work out a batch starting in 9999, 2126 or long ago (exit 2)', async () => {
    for (const [start, side] of [
      ['9999-12-31', 'ahead'],
      ['2126-12-24', 'ahead'],
      ['1990-06-01', 'back'],
    ] as const) {
      const run = await runLarder([...BELLY, '--start', start]);
      assertCleanFailure(run, 2, outOfWindow(start, side));
    }
  });

  it('should record nothing for such a start, and record one a few days back', async (t) => {
    const env = await cook(t);
    const ahead = await runLarder([...BELLY, '--start', '2126-12-24', '--record'], { env });
    assertCleanFailure(ahead, 2, outOfWindow('2126-12-24', 'ahead'));
    const back = addDays(today(), -400);
    assertCleanFailure(
      await runLarder([...BELLY, '--start', back, '--record'], { env }),
      2,
      outOfWindow(back, 'back'),
    );
    const empty = await runLarder(['batches', 'list', '--json'], { env });
    assertExit(empty, 0);
    assert.equal(stdoutJson<{ total: number }>(empty).total, 0);

    const paper = addDays(today(), -5);
    const recorded = await runLarder([...BELLY, '--start', paper, '--record', '--json'], { env });
    assertExit(recorded, 0);
    // source: our lot code format (server/README.md "Batches"): start day YYMMDD, formula
    // initials, sequence
    assert.equal(
      stdoutJson<{ lotCode: string }>(recorded).lotCode,
      `${paper.slice(2).replaceAll('-', '')}-QB-01`,
    );
  });
});

describe('larder plan for a day more than a year ahead', () => {
  it('should refuse the service day (exit 2), naming the last day it can plan for', async () => {
    const run = await runLarder([
      'plan',
      'smokehouse-burger',
      '--count',
      '120',
      '--for',
      '2126-12-24',
      '--today',
      '2026-12-02',
    ]);
    // A year (365 days) from 2026-12-02 is 2027-12-02. source: start-window.ts
    assertCleanFailure(
      run,
      2,
      /the service date 24 Dec 2126 is more than a year ahead: plan for a day up to 2 Dec 2027/,
    );
  });
});
