import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { after, before, describe, it } from 'node:test';
import type { TraceAnswer, TraceNode } from '../../shared/api/trace-record.ts';
import { openDatabase, type Database } from '../db/database.ts';
import { insertBatch, insertSmokehouseLots, insertUse } from '../../tests/helpers/trace-fixture.ts';
import { TraceReader } from './trace-reader.ts';
import { MOST_LEVELS } from './trace-sql.ts';

// The kitchen drawn in tests/helpers/trace-fixture.ts (insertSmokehouseLots): the trees are
// checked against that drawing, line by line.

/** A tree as indented lines: lot code, then the linking use's amount and day. */
function lines(nodes: readonly TraceNode[], indent = ''): string[] {
  return nodes.flatMap((node) => [
    `${indent}${node.lot.lotCode}${node.use ? ` ${node.use.amount} ${node.use.measure} ${node.use.usedOn}` : ''}${node.cut ? ` (${node.cut})` : ''}`,
    ...lines(node.children, `${indent}  `),
  ]);
}

describe('trace back and forward over received lots and lot uses', () => {
  let dir: string;
  let db: Database;
  let reader: TraceReader;
  let batches: Record<string, number>;
  before(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'larder-trace-'));
    db = await openDatabase(path.join(dir, 'larderbook.sqlite'));
    reader = new TraceReader(db.sequelize);
    batches = await insertSmokehouseLots(db);
  });
  after(async () => {
    await db.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should trace a burger assembly back through every level to the received lots, as drawn', async () => {
    const back = await reader.back('201206-ba-01');
    assert.equal(
      lines(back.roots).join('\n'),
      [
        '201206-BA-01',
        '  201204-BG-01 4000 g 2020-12-06',
        '    R201202-91 6000 g 2020-12-04',
        '    R201202-92 4000 g 2020-12-04',
        '  201205-SL-01 1200 g 2020-12-06',
        '    201201-SB-01 5000 g 2020-12-05',
        '      R201201-91 6000 g 2020-12-01',
        '      R201201-92 15 g 2020-12-01',
        '    201203-SB-02 3000 g 2020-12-05',
        '      R201201-91 4000 g 2020-12-03',
        '      R201203-91 2000 g 2020-12-03',
        '      R201201-92 15 g 2020-12-03',
        '  R201205-91 120 each 2020-12-06',
      ].join('\n'),
    );
    assert.equal(back.batches, 4, 'grind, sliced bacon and both smoked bellies');
    assert.equal(back.incomplete, false);
  });

  it('should name each received lot with its supplier, supplier lot and establishment number', async () => {
    const back = await reader.back('201201-SB-01');
    const belly = back.roots[0].children[0].lot;
    assert.equal(belly.kind, 'receipt');
    assert.deepEqual(
      belly.kind === 'receipt' && [
        belly.supplier,
        belly.supplierLot,
        belly.establishment,
        belly.itemName,
      ],
      ['Hollin Farm', 'HF-4471', 'M1234', 'Pork belly'],
    );
  });

  it("should trace a supplier's lot delivered twice forward to every batch, three levels down, as drawn", async () => {
    const search = { supplierLot: 'HF-4471', supplier: 'hollin farm' };
    const forward = await reader.forward(search, await reader.forwardRoots(search));
    assert.equal(
      lines(forward.roots).join('\n'),
      [
        'R201201-91',
        '  201201-SB-01 6000 g 2020-12-01',
        '    201205-SL-01 5000 g 2020-12-05',
        '      201206-BA-01 1200 g 2020-12-06',
        '  201203-SB-02 4000 g 2020-12-03',
        '    201205-SL-01 3000 g 2020-12-05 (shown-above)',
        'R201203-91',
        '  201203-SB-02 2000 g 2020-12-03 (shown-above)',
      ].join('\n'),
    );
    assert.equal(forward.batches, 4);
    const assembly = forward.roots[0].children[0].children[0].children[0].lot;
    assert.equal(assembly.kind === 'batch' && assembly.serviceDay, '2020-12-08');
  });

  it('should trace forward from one received lot and from a batch', async () => {
    const fromSalt = await reader.forward(
      { lot: 'R201201-92' },
      await reader.forwardRoots({ lot: 'r201201-92' }),
    );
    assert.deepEqual(lines(fromSalt.roots).slice(0, 2), [
      'R201201-92',
      '  201201-SB-01 15 g 2020-12-01',
    ]);
    assert.equal(fromSalt.batches, 4, 'both bellies, the bacon and the burger');
    const fromGrind = await reader.forward(
      { lot: '201204-BG-01' },
      await reader.forwardRoots({ lot: '201204-BG-01' }),
    );
    assert.deepEqual(lines(fromGrind.roots), ['201204-BG-01', '  201206-BA-01 4000 g 2020-12-06']);
  });

  it('should not follow a use recorded again: the corrected record stands', async () => {
    // The grind first recorded with the drawn kitchen's curing salt, then recorded again without
    // it: the salt's forward trace stays the four batches drawn.
    const [[salt]] = (await db.sequelize.query(
      "SELECT id FROM receipts WHERE lot_code = 'R201201-92'",
    )) as [{ id: number }[], unknown];
    const use = await insertUse(db, {
      batch: batches.bg,
      receipt: salt.id,
      item: 'curing-salt-1',
      amount: '10',
      usedOn: '2020-12-04',
    });
    await db.write((transaction) =>
      db.sequelize.query("UPDATE lot_uses SET replaced_at = '2020-12-04T10:00:00Z' WHERE id = ?", {
        replacements: [use],
        transaction,
      }),
    );
    const fromSalt = await reader.forward(
      { lot: 'R201201-92' },
      await reader.forwardRoots({ lot: 'R201201-92' }),
    );
    assert.equal(fromSalt.batches, 4);
    const back = await reader.back('201204-BG-01');
    assert.ok(!lines(back.roots).some((line) => line.includes('R201201-92')));
  });

  it('should refuse a lot or supplier lot nobody received, in words', async () => {
    await assert.rejects(
      reader.back('R991231-09'),
      /no received lot or batch with lot code R991231-09/,
    );
    await assert.rejects(
      reader.forwardRoots({ supplierLot: 'HF-4471', supplier: 'Fernlea Bakery' }),
      /no delivery of supplier lot HF-4471 from Fernlea Bakery/,
    );
  });

  it('should stop at a loop in the records and at the deepest level it follows', async () => {
    // A loop no kitchen makes, but a mistyped record could: X made from Y made from X.
    const x = await insertBatch(db, {
      lot: '201210-LX-01',
      formula: 'loop',
      title: 'Loop',
      status: 'done',
      startedOn: '2020-12-10',
    });
    const y = await insertBatch(db, {
      lot: '201210-LY-01',
      formula: 'loop',
      title: 'Loop',
      status: 'done',
      startedOn: '2020-12-10',
    });
    await insertUse(db, { batch: x, source: y, item: 'loop', amount: '1', usedOn: '2020-12-10' });
    await insertUse(db, { batch: y, source: x, item: 'loop', amount: '1', usedOn: '2020-12-10' });
    const loop: TraceAnswer = await reader.back('201210-LX-01');
    assert.deepEqual(lines(loop.roots), [
      '201210-LX-01',
      '  201210-LY-01 1 g 2020-12-10',
      '    201210-LX-01 1 g 2020-12-10 (cycle)',
    ]);
    assert.equal(loop.incomplete, true);
    // A chain longer than a trace follows: each batch made from the one before.
    let previous = await insertBatch(db, {
      lot: '201211-CH-00',
      formula: 'chain',
      title: 'Chain',
      status: 'done',
      startedOn: '2020-12-11',
    });
    for (let i = 1; i <= MOST_LEVELS + 2; i++) {
      const next = await insertBatch(db, {
        lot: `201211-CH-${String(i).padStart(2, '0')}`,
        formula: 'chain',
        title: 'Chain',
        status: 'done',
        startedOn: '2020-12-11',
      });
      await insertUse(db, {
        batch: next,
        source: previous,
        item: 'chain',
        amount: '1',
        usedOn: '2020-12-11',
      });
      previous = next;
    }
    const chain = await reader.forward(
      { lot: '201211-CH-00' },
      await reader.forwardRoots({ lot: '201211-CH-00' }),
    );
    const deepest = lines(chain.roots).at(-1) ?? '';
    assert.match(
      deepest,
      new RegExp(`^ {${2 * MOST_LEVELS}}201211-CH-${MOST_LEVELS} 1 g 2020-12-11 \\(depth\\)$`),
    );
    assert.equal(chain.batches, MOST_LEVELS);
    assert.equal(chain.incomplete, true);
  });
});
