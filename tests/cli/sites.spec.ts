import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { addDays } from '../../shared/index.ts';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { localRecordsEnv } from '../helpers/local-records-env.ts';
import { bellyCalc } from '../helpers/cli-belly.ts';

// Yesterday on this machine's clock: a start must lie within a year of it.
const START = addDays(today(), -1);
const BELLY = bellyCalc(START);

interface SiteList {
  sites: { key: string; name: string }[];
}

/** The lot codes `larder batches list` prints as JSON, with its further arguments. */
async function lots(env: Record<string, string>, ...more: string[]): Promise<string[]> {
  const list = await runLarder(['batches', 'list', '--json', ...more], { env });
  assertExit(list, 0);
  return stdoutJson<{ items: { lotCode: string }[] }>(list).items.map((b) => b.lotCode);
}

describe('larder sites and --site', () => {
  it('should list the first site, add a second and refuse a key taken or malformed', async (t) => {
    const env = await localRecordsEnv(t);
    const first = await runLarder(['sites', '--json'], { env });
    assertExit(first, 0);
    // Migration 021's first site. source: server/sites/main-site.ts
    assert.deepEqual(
      stdoutJson<SiteList>(first).sites.map((s) => s.key),
      ['main'],
    );
    const added = await runLarder(['sites', 'add', 'harbour', '--name', 'Harbour Street shop'], {
      env,
    });
    assertExit(added, 0);
    assert.match(added.stdout, /Added the site Harbour Street shop \(harbour\)/);
    const table = await runLarder(['sites'], { env });
    assertExit(table, 0);
    assert.match(table.stdout, /harbour\s+Harbour Street shop/);
    assertCleanFailure(
      await runLarder(['sites', 'add', 'harbour', '--name', 'Again'], { env }),
      2,
      /there is a site "harbour" already/,
    );
    assertCleanFailure(
      await runLarder(['sites', 'add', 'Harbour Shop', '--name', 'Bad'], { env }),
      2,
      /a site key is 1 to 32 lower-case letters/,
    );
  });

  it('should record and list a batch at the site named, and keep it out of the main log', async (t) => {
    const records = await localRecordsEnv(t);
    assertExit(
      await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'tobin-pass-1' },
      }),
      0,
    );
    const env = { ...records, LARDER_USER: 'tobin', LARDER_PASSWORD: 'tobin-pass-1' };
    assertExit(await runLarder(['sites', 'add', 'harbour', '--name', 'Harbour'], { env }), 0);
    const atMain = await runLarder([...BELLY, '--record', '--json'], { env });
    assertExit(atMain, 0);
    const mainLot = stdoutJson<{ lotCode: string }>(atMain).lotCode;
    const atShop = await runLarder([...BELLY, '--record', '--json', '--site', 'harbour'], { env });
    assertExit(atShop, 0);
    const shopLot = stdoutJson<{ lotCode: string }>(atShop).lotCode;
    assert.notEqual(shopLot, mainLot, 'lot codes stay unique across the group');
    assert.deepEqual(await lots(env, '--site', 'harbour'), [shopLot]);
    assert.deepEqual(await lots(env), [mainLot]);
    assertExit(await runLarder(['batches', 'show', shopLot, '--site', 'harbour'], { env }), 0);
    assertCleanFailure(await runLarder(['batches', 'show', shopLot], { env }), 2, /no batch/);
    assertCleanFailure(
      await runLarder(['batches', 'list', '--site', 'nowhere'], { env }),
      2,
      /no site "nowhere"/,
    );
  });

  it('should add a cook whose role holds at one site only, and refuse a site that does not exist', async (t) => {
    const records = await localRecordsEnv(t);
    assertExit(
      await runLarder(['sites', 'add', 'harbour', '--name', 'Harbour'], { env: records }),
      0,
    );
    const added = await runLarder(['users', 'add', 'pell', '--role', 'cook', '--site', 'harbour'], {
      env: { ...records, LARDER_NEW_PASSWORD: 'pell-pass-01' },
    });
    assertExit(added, 0);
    assert.match(added.stdout, /Added pell \(cook at harbour only\)/);
    const env = { ...records, LARDER_USER: 'pell', LARDER_PASSWORD: 'pell-pass-01' };
    // Their one site is the default: the batch is the shop's.
    const recorded = await runLarder([...BELLY, '--record', '--json'], { env });
    assertExit(recorded, 0);
    const lot = stdoutJson<{ lotCode: string }>(recorded).lotCode;
    assert.deepEqual(await lots(env, '--site', 'harbour'), [lot]);
    // No role at the main kitchen: it is not theirs to name. A site is the command line's
    // fault (2), not the formula's (3).
    assertCleanFailure(
      await runLarder([...BELLY, '--record', '--site', 'main'], { env }),
      2,
      /no site "main" of yours/,
    );
    assertCleanFailure(
      await runLarder(['users', 'add', 'wren', '--role', 'cook', '--site', 'nowhere'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'wren-pass-01' },
      }),
      2,
      /no site "nowhere"; larder sites lists them/,
    );
    const people = await runLarder(['users', 'list', '--json'], { env: records });
    assertExit(people, 0);
    const names = stdoutJson<{ username: string }[]>(people).map((p) => p.username);
    assert.ok(names.includes('pell') && !names.includes('wren'), names.join(', '));
  });
});

describe('larder stock, trace, report and recall at a site', () => {
  it('should keep each to the site named, on this machine’s records', async (t) => {
    const records = await localRecordsEnv(t);
    assertExit(
      await runLarder(['users', 'add', 'rosa', '--role', 'admin'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'rosa-pass-1' },
      }),
      0,
    );
    const env = {
      ...records,
      LARDER_USER: 'rosa',
      LARDER_PASSWORD: 'rosa-pass-1',
      // The demo's catalogue of materials, which a delivery's item must be in (read only).
      LARDER_FORMULAS: path.join(REPO_ROOT, 'formulas'),
    };
    assertExit(await runLarder(['sites', 'add', 'harbour', '--name', 'Harbour'], { env }), 0);
    const received = await runLarder(
      [
        'receive',
        'pork-belly',
        '--supplier',
        'Harbour Farm',
        '--supplier-lot',
        'HB-SITE-1',
        '--establishment',
        'EST. 9012',
        '--quantity',
        '10 kg',
        // source: FDA Food Code 2022, §3-202.11(A): 5 °C (41 °F) or below; 3 °C is within it
        '--temperature',
        '3 °C',
        '--site',
        'harbour',
        '--json',
      ],
      { env },
    );
    assertExit(received, 0);
    const receipt = stdoutJson<{ lotCode: string }>(received).lotCode;
    const recorded = await runLarder([...BELLY, '--record', '--json', '--site', 'harbour'], {
      env,
    });
    assertExit(recorded, 0);
    const shopLot = stdoutJson<{ lotCode: string }>(recorded).lotCode;

    const stock = (...site: string[]) => runLarder(['stock', '--json', ...site], { env });
    assert.match((await stock('--site', 'harbour')).stdout, new RegExp(receipt));
    assert.doesNotMatch((await stock()).stdout, new RegExp(receipt));

    assertExit(await runLarder(['trace', shopLot, '--site', 'harbour'], { env }), 0);
    assertCleanFailure(await runLarder(['trace', shopLot], { env }), 2, new RegExp(shopLot));

    const report = (...site: string[]) =>
      runLarder(['report', '--from', START, '--to', START, '--json', ...site], { env });
    const atShop = await report('--site', 'harbour');
    assertExit(atShop, 0);
    assert.match(atShop.stdout, new RegExp(shopLot));
    assert.match(atShop.stdout, /Harbour/);
    const atMain = await report();
    assertExit(atMain, 0);
    assert.doesNotMatch(atMain.stdout, new RegExp(shopLot));

    const recall = (...site: string[]) =>
      runLarder(['recall', '--supplier-lot', 'HB-SITE-1', '--json', ...site], { env });
    const recalled = await recall('--site', 'harbour');
    assertExit(recalled, 0);
    assert.match(recalled.stdout, new RegExp(receipt));
    // At main, as a delivery nobody received: the shop's lot is not named.
    assertCleanFailure(
      await runLarder(['recall', '--supplier-lot', 'HB-SITE-1'], { env }),
      2,
      /no delivery of supplier lot HB-SITE-1 was received/,
    );
  });
});
