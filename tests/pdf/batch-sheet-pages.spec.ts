import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { renderBatchSheetPdf, type SheetRecord } from '../../server/pdf/batch-sheet-pdf.ts';
import {
  calculate,
  parseBatchOptions,
  presentResult,
  readFormula,
  type BatchKind,
  type Formula,
  type PresentedResult,
  type RawBatchOptions,
  type UnitSystem,
} from '../../shared/index.ts';
import { pdfText, type PdfText } from '../helpers/pdf-text.ts';

// A cook pins the cure's sheet up beside the cure: one page, on either paper size. The sheets are
// read back with pdf.js, an independent reader, so the tests see what a person opening them sees.

/** A formula that makes a batch of its own (not an assembly of others). */
type Batched = Exclude<Formula, { kind: 'assembly' }>;

const FOLDER = 'formulas';
const formulas = readdirSync(FOLDER)
  .filter((name) => name.endsWith('.yaml'))
  .map((file) => readFormula(readFileSync(path.join(FOLDER, file), 'utf8'), file).formula)
  .filter((formula): formula is Batched => formula !== undefined && formula.kind !== 'assembly');

/** A plausible batch of each kind (as tests/formulas/demo-formulas.spec.ts makes them). */
const SAMPLE: Record<BatchKind, RawBatchOptions> = {
  cure: { meat: '5 kg', thickness: '4 cm', largestPiece: '2.5 kg', start: '2026-12-02' },
  dough: { pieces: '48', room: '22 C', flourTemp: '21 C', prefermentTemp: '20 C', tap: '15 C' },
  blend: { total: '20 kg' },
  mix: { total: '2 kg' },
};

/** Paper sizes in points. source: ISO 216 (A4, 210 × 297 mm); ANSI/ASME Y14.1 (Letter, 8.5 × 11 in) */
const PAPER: Record<UnitSystem, readonly [number, number]> = {
  metric: [595, 842],
  us: [612, 792],
};

const LOT = '261202-QB-01';

/** A recorded batch, signed off: the header's QR code and facts and the sign-off line all print. */
function recordOf(formula: Formula, result: PresentedResult): SheetRecord {
  return {
    lotCode: LOT,
    formula: { id: formula.id, revision: 'ab'.repeat(32), title: formula.title },
    status: 'done',
    operator: { id: 2, displayName: 'Tobin Marrowfeld (cook)' },
    startedOn: '2026-12-02',
    readyOn: result.schedule?.ready ?? null,
    signedOff: {
      by: { id: 3, displayName: 'Imke Tressaly (food safety)' },
      at: '2026-12-12T09:30:00Z',
    },
  };
}

function formulaNamed(id: string): Batched {
  const formula = formulas.find((f) => f.id === id);
  assert.ok(formula, id);
  return formula;
}

/** The sheet of a formula's batch, recorded or not, read back. */
async function sheetOf(
  formula: Formula,
  raw: RawBatchOptions,
  units: UnitSystem,
  recorded = true,
): Promise<{ text: PdfText; result: PresentedResult }> {
  const result = presentResult(
    calculate(formula, parseBatchOptions(raw, formula, { today: '2026-12-02' })),
    units,
  );
  const record = recorded ? recordOf(formula, result) : undefined;
  return { text: await pdfText(await renderBatchSheetPdf(result, record)), result };
}

/** Text without its spaces: a line may break anywhere, and pdf.js joins its pieces with one. */
const squeezed = (text: string): string => text.replace(/\s+/g, '');

describe('the cure sheet of the house bacon on one page', () => {
  const belly = formulaNamed('quillmoor-belly');
  // The belly as the demo records it (4.26 kg, 4 cm: an 8-day hold, three turns), and a thick one
  // (6 cm: 2 days per cm = 12 days, five turns). source: formulas/quillmoor-belly.yaml hold rule
  const batches: { raw: RawBatchOptions; turns: string[] }[] = [
    {
      raw: { meat: '4.26 kg', thickness: '4 cm', start: '2026-12-02' },
      turns: ['day 2, 4 Dec', 'day 4, 6 Dec', 'day 6, 8 Dec'],
    },
    {
      raw: { meat: '13.7 kg', thickness: '6 cm', start: '2026-12-02' },
      turns: ['day 2, 4 Dec', 'day 6, 8 Dec', 'day 10, 12 Dec'],
    },
  ];

  for (const units of ['metric', 'us'] as const) {
    for (const { raw, turns } of batches) {
      for (const recorded of [true, false]) {
        const name = `${units === 'us' ? 'Letter' : 'A4'}, ${raw.thickness}, ${recorded ? 'recorded' : 'a calculation'}`;
        it(`should print everything on exactly one page (${name})`, async () => {
          const { text, result } = await sheetOf(belly, raw, units, recorded);
          assert.deepEqual(text.sizes, [PAPER[units]], 'one page of the paper for the units');
          const page = text.pages[0];
          if (recorded) assert.match(page, new RegExp(`Lot ${LOT}`));
          for (const caution of result.cautions)
            assert.ok(squeezed(page).includes(squeezed(caution.text)), caution.text);
          for (const turn of turns) assert.ok(page.includes(turn), turn);
          assert.match(page, /PASS Ingoing sodium nitrite · critical limit/);
          assert.match(page, /Weighed by .*Date .*Checked by .*Date/);
          assert.match(page, /page 1 of 1/);
        });
      }
    }
  }
});

describe('every demo formula’s sheet', () => {
  it('should print every caution of the batch, on Letter and on A4', async () => {
    for (const formula of formulas) {
      for (const units of ['metric', 'us'] as const) {
        const { text, result } = await sheetOf(formula, SAMPLE[formula.kind], units);
        assert.ok(result.cautions.length > 0, `${formula.id} has cautions`);
        const all = squeezed(text.all);
        for (const caution of result.cautions) {
          assert.ok(
            all.includes(squeezed(caution.text)),
            `${formula.id} ${units}: ${caution.text}`,
          );
        }
      }
    }
  });

  it('should head every page after the first with the product and lot code, and count the pages', async () => {
    for (const formula of formulas) {
      for (const units of ['metric', 'us'] as const) {
        const { text } = await sheetOf(formula, SAMPLE[formula.kind], units);
        const count = text.pages.length;
        text.pages.forEach((page, i) => {
          assert.match(page, new RegExp(`page ${i + 1} of ${count}$`), `${formula.id} ${units}`);
          if (i > 0)
            assert.ok(
              page.startsWith(`${formula.title} Lot ${LOT}`),
              `${formula.id} ${units} page ${i + 1}`,
            );
        });
      }
    }
  });

  it('should take the bun dough with its sponge onto a second page of two, headed with its lot', async () => {
    // The bun prints its sponge, final dough and overall formula as three tables, the water
    // temperature figures and nine steps: more than a page. source: formulas/pit-bun.yaml
    for (const units of ['metric', 'us'] as const) {
      const { text } = await sheetOf(formulaNamed('pit-bun'), SAMPLE.dough, units);
      assert.equal(text.pages.length, 2, units);
      assert.match(text.pages[1], /^Milk and honey bun, with sponge Lot 261202-QB-01 /);
      assert.match(text.pages[1], /page 2 of 2$/);
    }
  });
});
