import assert from 'node:assert/strict';
import path from 'node:path';
import { describe, it } from 'node:test';
import type { Receipt, StockView } from '../../shared/api/receipt.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';

/** The command signed in as a demo person, on the server or on the server's own database file. */
function as(server: TestServer, user: keyof typeof PASSWORDS, where: 'server' | 'local') {
  return {
    LARDER_USER: user,
    LARDER_PASSWORD: PASSWORDS[user],
    ...(where === 'server'
      ? { LARDER_SERVER: server.url }
      : {
          LARDER_DATA: path.join(server.dir, 'data'),
          LARDER_FORMULAS: server.formulasDir,
          LARDER_SERVER: undefined,
        }),
  };
}

const dayAfter = (days: number): string =>
  new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** A delivery of pork belly, with the door's reading given. */
const belly = (lot: string, temperature: string): string[] => [
  'receive',
  'pork-belly',
  '--supplier',
  'Test Farm Pork',
  '--supplier-lot',
  lot,
  '--establishment',
  'EST. 9012',
  '--use-by',
  dayAfter(10),
  '--quantity',
  '40 lb',
  '--cost',
  '3.10',
  '--temperature',
  temperature,
];

describe('larder receive and stock', () => {
  for (const where of ['server', 'local'] as const)
    it(`should receive a delivery within its limit and list it on hand (${where} records)`, async (t) => {
      const server = await startTestServer(t);
      const env = as(server, 'tobin', where);
      const taken = await runLarder(belly('TF-1', '38F'), { env });
      assertExit(taken, 0);
      // source: FDA Food Code 2022, §3-202.11(A): 41 °F or below; 38 °F is within
      assert.match(taken.stdout, /Received R\d{6}-01: 40 lb pork belly from Test Farm Pork/);
      assert.match(taken.stdout, /within its limit of 5 °C \(41 °F\) or colder/);
      const stock = await runLarder(['stock', '--json'], { env });
      assertExit(stock, 0);
      const item = stdoutJson<StockView>(stock).items.find((i) => i.item === 'pork-belly');
      const lot = item?.lots.find((l) => l.supplierLot === 'TF-1');
      // source: NIST SP 811 (2008), Appendix B.8: 40 lb = 18143.6948 g
      assert.equal(lot?.remaining, '18143.6948');
      assert.equal(lot?.remainingInUnit, '40');
      const table = await runLarder(['stock'], { env });
      assertExit(table, 0);
      assert.match(table.stdout, /pork belly\s+R\d{6}-01\s+Test Farm Pork\s+TF-1\s+40 lb/);
    });

  it('should not record a delivery over its limit until it is refused or taken in with a corrective action', async (t) => {
    const server = await startTestServer(t);
    const env = as(server, 'tobin', 'server');
    // source: FDA Food Code 2022, §3-202.11(A): limit 41 °F; 46 °F is over it
    const asked = await runLarder(belly('TF-2', '46F'), { env });
    assertCleanFailure(asked, 2, /over its limit of 5 °C \(41 °F\)/);
    assert.match(asked.stderr, /--refuse, or --accept/);
    const refused = await runLarder([...belly('TF-2', '46F'), '--refuse', '--json'], { env });
    assertExit(refused, 0);
    const receipt = stdoutJson<Receipt>(refused);
    assert.equal(receipt.decision, 'refused');
    assert.equal(receipt.remaining, '0');
    const taken = await runLarder(
      [
        ...belly('TF-3', '46F'),
        '--accept',
        '--cause',
        'Van cooling failed.',
        '--restored',
        'Into the walk-in at once; 4 °C within the hour.',
        '--prevention',
        'Read at the van door before unloading.',
        '--disposition',
        'rechilled',
      ],
      { env },
    );
    assertExit(taken, 0);
    assert.match(taken.stdout, /Taken in with a corrective action: rechilled/);
    const cantReceive = await runLarder(belly('TF-4', '3C'), { env: as(server, 'imke', 'server') });
    assertCleanFailure(cantReceive, 2, /forbidden|may not|role/);
  });

  it('should refuse a quantity without a unit it knows before asking anyone', async () => {
    const run = await runLarder([
      'receive',
      'pork-belly',
      '--supplier',
      'x',
      '--supplier-lot',
      'y',
      '--quantity',
      '40 bags',
    ]);
    assertCleanFailure(run, 2, /give a number and a unit/);
  });
});
