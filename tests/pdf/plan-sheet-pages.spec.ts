import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { renderPlanSheetPdf } from '../../server/pdf/plan-sheet-pdf.ts';
import {
  formulaLibrary,
  planAssembly,
  presentPlan,
  readFormula,
  type UnitSystem,
} from '../../shared/index.ts';
import { pdfText } from '../helpers/pdf-text.ts';

// A plan on paper names every formula as a cook knows it, by its title, and prints no column that
// is empty on every line. Read back with pdf.js, as a person opening the file sees it.

const FOLDER = 'formulas';
const readings = readdirSync(FOLDER)
  .filter((name) => name.endsWith('.yaml'))
  .map((file) => ({
    file,
    reading: readFormula(readFileSync(path.join(FOLDER, file), 'utf8'), file),
  }));
const library = formulaLibrary(readings);
const formulas = readings.flatMap(({ reading }) => (reading.formula ? [reading.formula] : []));
const assemblies = formulas.filter((formula) => formula.kind === 'assembly');

/** Every demo assembly's plan for 60, served 18 Dec 2026 and planned 2 Dec, as its PDF reads. */
async function planSheets(): Promise<
  { name: string; batches: number; pages: readonly string[]; all: string }[]
> {
  const sheets = [];
  for (const assembly of assemblies) {
    const plan = planAssembly(assembly, library, {
      count: 60,
      serviceDate: '2026-12-18',
      today: '2026-12-02',
    });
    for (const units of ['metric', 'us'] as UnitSystem[]) {
      const text = await pdfText(await renderPlanSheetPdf(presentPlan(plan, units)));
      sheets.push({ name: `${assembly.id} ${units}`, batches: plan.batches.length, ...text });
    }
  }
  return sheets;
}

describe('a plan’s sheets', () => {
  it('should name every formula by its title, never by its id', async () => {
    assert.ok(assemblies.length >= 2, 'the demo burger and sandwich');
    for (const { name, batches, all } of await planSheets()) {
      for (const formula of formulas) {
        // A title is words with spaces; an id is one lower-case word with hyphens.
        assert.doesNotMatch(all, new RegExp(`(^|[^\\w-])${formula.id}([^\\w-]|$)`), name);
      }
      const titles = formulas.filter((f) => all.includes(f.title)).map((f) => f.title);
      // The menu item's and every batch's: the sliced bacon pack has one batch, the burger four.
      assert.ok(titles.length >= batches + 1, `${name}: titles printed (${titles.join('; ')})`);
    }
  });

  it('should print no column of the schedule or pull list that is empty on every line', async () => {
    for (const { name, pages } of await planSheets()) {
      const overview = pages[0];
      // The schedule: each batch's line has a start day, a title, a ready day and what it is for.
      assert.match(overview, /SCHEDULE Start Batch Ready For \d/, name);
      // The pull list's columns: "Before trim" only when some raw material is trimmed, and no
      // demo formula trims its raw material (formulas/*.yaml have no trim).
      assert.match(overview, /PULL LIST Raw material Amount Used by /, name);
      assert.doesNotMatch(overview, /Before trim/, name);
      // Every pull-list line has an amount and the titles of what uses it: a line ends in a
      // title, never in an empty cell followed by the next tick box's raw material.
      const list = overview.slice(overview.indexOf('PULL LIST'), overview.indexOf('CAUTIONS'));
      assert.doesNotMatch(list, /\d (g|kg|oz|lb)\s+(?=[a-z])/, name);
    }
  });
});
