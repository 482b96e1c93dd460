import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import {
  assertCleanFailure,
  assertExit,
  localCook,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';

interface Sheet {
  formula: { kind: string };
  groups: { title: string; lines: { part: string; grams: string }[] }[];
  figures: { label: string; exact: string }[];
}

describe('larder calc for an assembly', () => {
  it('should work out a batch of packs from its parts, and refuse one with no count', async () => {
    const run = await runLarder(['calc', 'bacon-pack', '--count', '40', '--json']);
    assertExit(run, 0);
    const sheet = stdoutJson<Sheet>(run);
    assert.equal(sheet.formula.kind, 'assembly');
    // formulas/bacon-pack.yaml: 8 slices of 25 g a pack; 40 packs × 8 × 25 g = 8 000 g of belly.
    assert.deepEqual(
      sheet.groups.flatMap((g) => g.lines.map((l) => [g.title, l.part, l.grams])),
      [['Parts', 'quillmoor-belly', '8000']],
    );
    assert.equal(sheet.figures.find((f) => f.label === 'Weight of one unit')?.exact, '200');
    const text = await runLarder(['calc', 'bacon-pack', '--count', '40']);
    assertExit(text, 0);
    assert.match(text.stdout, /Quillmoor belly, dry equilibrium cure +8000 g +8 slices of 25 g/);
    assertCleanFailure(
      await runLarder(['calc', 'smokehouse-burger']),
      2,
      /give --count: how many of Smokehouse burger were made/,
    );
    assertCleanFailure(
      await runLarder(['calc', 'quillmoor-belly', '--meat', '4kg', '--count', '3']),
      2,
      /--count does not apply to a cure formula/,
    );
  });

  it('should record an assembly made today as done, and only an assembly', async (t) => {
    const env = await localCook(t);
    const recorded = await runLarder(['calc', 'bacon-pack', '--count', '12', '--record'], { env });
    assertExit(recorded, 0);
    // Lot code: the day, the formula id's initials (bacon-pack → BP), a sequence.
    // source: our lot code format (server/README.md "Batches")
    const lot = `${today().slice(2).replaceAll('-', '')}-BP-01`;
    assert.match(recorded.stdout, new RegExp(`Recorded: lot ${lot} · done · by `));
    assertCleanFailure(
      await runLarder(
        ['calc', 'quillmoor-belly', '--meat', '4kg', '--thickness', '4cm', '--record'].concat([
          '--status',
          'done',
        ]),
        { env },
      ),
      2,
      /only an assembly is recorded as done/,
    );
  });
});
