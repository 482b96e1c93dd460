import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { openDatabase } from '../../server/db/database.ts';
import { addDays } from '../../shared/index.ts';
import { addReceipts, burgerReceipts, clearStock } from '../helpers/pull-list-fixture.ts';
import { assertExit, localCook, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';

/** 120 burgers three weeks ahead: the belly starts 10 days before service, the bun the day before. */
const SERVICE = addDays(today(), 21);
const PLAN = ['plan', 'smokehouse-burger', '--count', '120', '--for', SERVICE];

/** Sea salt, honey for the bun (6 % of its flour, under 1 kg), and too little curing salt. */
const RECEIPTS = burgerReceipts(today(), SERVICE);

interface Line {
  item: string;
  status: string;
  onHand: { exact: string };
  short: { exact: string };
  needed: { exact: string };
  arriveBy: string | null;
  lastFrom: { supplier: string } | null;
}

/** The lines of the stock a plan printed as JSON, by item. */
function linesOf(run: Awaited<ReturnType<typeof runLarder>>): Map<string, Line> {
  const { stock } = stdoutJson<{ stock: { compared: boolean; lines: Line[] } }>(run);
  assert.equal(stock.compared, true);
  return new Map(stock.lines.map((line) => [line.item, line]));
}

/** What the hand-worked lots give: honey covered, curing salt 5 g on hand and the rest short. */
function assertStock(lines: Map<string, Line>): void {
  const honey = lines.get('honey');
  assert.equal(honey?.status, 'covered');
  const cure = lines.get('curing-salt-1');
  assert.ok(cure);
  assert.equal(cure.status, 'short');
  assert.equal(cure.onHand.exact, '5');
  // by hand: short = needed − the 5 g lot, by the morning the belly starts (service − 10 days)
  assert.equal(Number(cure.short.exact), Number(cure.needed.exact) - 5);
  assert.equal(cure.arriveBy, addDays(SERVICE, -10));
  assert.equal(cure.lastFrom?.supplier, 'Kestrel Cure Supply');
}

describe('larder plan: the pull list against stock', () => {
  it('should print no stock where this machine keeps no records', async () => {
    const run = await runLarder(PLAN);
    assertExit(run, 0);
    assert.doesNotMatch(run.stdout, /PULL LIST AGAINST STOCK/);
  });

  it('should compare with the lots on hand in this machine’s records, in text and JSON', async (t) => {
    const env = await localCook(t);
    const db = await openDatabase(path.join(env.LARDER_DATA, 'larderbook.sqlite'));
    try {
      await clearStock(db);
      await addReceipts(db, RECEIPTS);
    } finally {
      await db.close();
    }
    const json = await runLarder([...PLAN, '--json'], { env: { LARDER_DATA: env.LARDER_DATA } });
    assertExit(json, 0);
    assertStock(linesOf(json));

    const text = await runLarder(PLAN, { env: { LARDER_DATA: env.LARDER_DATA } });
    assertExit(text, 0);
    assert.match(text.stdout, /PULL LIST AGAINST STOCK/);
    const stock = text.stdout.slice(text.stdout.indexOf('PULL LIST AGAINST STOCK'));
    const cure = stock.split('\n').find((line) => line.includes('curing salt no. 1'));
    assert.ok(cure, text.stdout);
    assert.match(cure, /^ {2}SHORT /);
    assert.match(cure, /morning {2}Kestrel Cure Supply \(last /);
    // The belly names its meat's item (meat_item: pork-belly): its green meat is compared too;
    // the bun's tap water is not.
    assert.ok(
      stock.split('\n').some((line) => /^ {2}SHORT +green meat for Quillmoor belly/.test(line)),
      stock,
    );
    assert.match(text.stdout, /NOT COMPARED WITH STOCK\n(.*\n)*.*water/);
  });

  it('should plan on a server and compare with its stock with --server', async (t) => {
    const server = await startTestServer(t);
    await clearStock(server.context.db);
    await addReceipts(server.context.db, RECEIPTS);
    const env = { LARDER_USER: 'imke', LARDER_PASSWORD: PASSWORDS.imke };
    const run = await runLarder([...PLAN, '--server', server.url, '--json'], { env });
    assertExit(run, 0);
    assertStock(linesOf(run));
  });
});
