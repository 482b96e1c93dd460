import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { renderBatchSheet } from '../../cli/output/batch-sheet.ts';
import { Decimal } from '../../shared/decimal.ts';
import {
  calculate,
  isFormulaFileName,
  parseBatchOptions,
  presentResult,
  readFormula,
  type BatchKind,
  type Formula,
  type PresentedResult,
  type RawBatchOptions,
} from '../../shared/index.ts';

// One weight, one figure: on every demo formula's sheet a total adds up its printed lines, and a
// weight printed in more than one place (a dough in its final-dough and overall tables and in the
// figures, a sponge in its own table and in the final dough, a mix's total weight) reads the same
// everywhere. own rule (larderbook issue 12, item 17); the arithmetic is checked by hand below.

const FOLDER = 'formulas';
const formulas = readdirSync(FOLDER)
  .filter(isFormulaFileName)
  .map((file) => readFormula(readFileSync(path.join(FOLDER, file), 'utf8'), file).formula)
  .filter((formula): formula is Formula => formula !== undefined && formula.kind !== 'assembly');

/** Batches of several sizes for each kind, so that rounding falls both ways. */
const BATCHES: Record<BatchKind, RawBatchOptions[]> = {
  cure: [
    { meat: '5 kg', thickness: '4 cm', largestPiece: '2.5 kg', start: '2026-12-02' },
    { meat: '13.7 kg', thickness: '6 cm', largestPiece: '4.1 kg', start: '2026-12-02' },
  ],
  dough: [{ pieces: '48' }, { pieces: '7' }, { pieces: '311' }, { total: '2345.67 g' }],
  blend: [{ total: '5 kg' }, { total: '20 kg' }, { total: '1234 g' }],
  mix: [{ total: '5 kg' }, { total: '2 kg' }, { total: '777 g' }],
};

/** A printed amount in its unit's base (grams or ounces): "12.345 kg", "2 lb 3.4 oz", "95.9 g". */
function printed(text: string): Decimal {
  const pounds = /^(\d+) lb (\d+(?:\.\d+)?) oz$/.exec(text);
  if (pounds) return new Decimal(pounds[1]).times(16).plus(pounds[2]);
  const plain = /^(-?\d+(?:\.\d+)?) (kg|g|oz)$/.exec(text);
  assert.ok(plain, `an amount: "${text}"`);
  return new Decimal(plain[1]).times(plain[2] === 'kg' ? 1000 : 1);
}

const isAmount = (text: string): boolean => /^(\d+ lb )?-?\d+(\.\d+)? (kg|g|oz)$/.test(text);

function sheets(): { name: string; result: PresentedResult }[] {
  const out: { name: string; result: PresentedResult }[] = [];
  for (const formula of formulas) {
    if (formula.kind === 'assembly') continue;
    for (const raw of BATCHES[formula.kind]) {
      const result = calculate(formula, parseBatchOptions(raw, formula, { today: '2026-12-02' }));
      for (const units of ['metric', 'us'] as const) {
        out.push({
          name: `${formula.id} ${JSON.stringify(raw)} ${units}`,
          result: presentResult(result, units),
        });
      }
    }
  }
  return out;
}

describe('printed totals on every demo formula', () => {
  const all = sheets();

  it('should make every printed total the sum of its printed lines', () => {
    for (const { name, result } of all) {
      for (const group of result.groups) {
        if (!group.total) continue;
        const lines = group.lines.reduce(
          (sum, line) => sum.plus(printed(line.amount)),
          new Decimal(0),
        );
        assert.equal(
          printed(group.total.amount).toString(),
          lines.toString(),
          `${name}: ${group.title}`,
        );
      }
    }
  });

  it('should print one weight with one figure everywhere it appears', () => {
    for (const { name, result } of all) {
      // exact grams (to 1e-9 g) → every figure printed for that weight, in g or oz (a column
      // that reads in kilograms prints 4629 g as 4.629 kg: the same figure)
      const seen = new Map<string, Set<string>>();
      const note = (exact: string, text: string): void => {
        const key = new Decimal(exact).toDecimalPlaces(9).toString();
        const figure = `${printed(text).toString()}${text.endsWith('oz') ? ' oz' : ' g'}`;
        seen.set(key, (seen.get(key) ?? new Set()).add(figure));
      };
      for (const group of result.groups) {
        for (const line of group.lines) note(line.grams, line.amount);
        if (group.total) note(group.total.grams, group.total.weight);
      }
      for (const figure of [...result.inputs, ...result.figures]) {
        if (figure.exact !== undefined && isAmount(figure.value)) note(figure.exact, figure.value);
      }
      for (const [exact, texts] of seen) {
        assert.equal(texts.size, 1, `${name}: ${exact} g printed as ${[...texts].join(' and ')}`);
      }
    }
  });

  it('should print the exact weight beside a total whose lines add up to another figure', () => {
    for (const { name, result } of all) {
      const text = renderBatchSheet(result).split('\n');
      for (const group of result.groups) {
        if (!group.total) continue;
        const { label, amount, weight } = group.total;
        const row = text.find(
          (line) =>
            line.startsWith(`  ${label} `) &&
            line.includes(` ${amount}  (`) &&
            /\((total|adds up the lines as printed; .*)\)$/.test(line),
        );
        assert.ok(row, `${name}: the ${label} row`);
        if (weight === amount) assert.match(row, /\(total\)$/, name);
        else assert.ok(row.includes(`the exact weight is ${weight}`), `${name}: ${row}`);
      }
    }
  });

  it('should print the milk-and-honey bun as one dough and one sponge', () => {
    const bun = formulas.find((formula) => formula.id === 'pit-bun');
    assert.ok(bun);
    const result = presentResult(
      calculate(bun, parseBatchOptions({ pieces: '48' }, bun, { today: '2026-12-02' })),
      'metric',
    );
    // 48 × 90 g ÷ (1 − 0.03) = 4453.608 g of dough; flour 4453.608 ÷ 1.87 = 2381.609 g; the
    // sponge is 30 % of it, 714.483 g, × 180.3 % = 1288.212 g.
    // source: "Bread Formula Construction" (2011) for the loss; Bread Bakers Guild of America
    // formula layout standards (2009) for baker's percent and the prefermented flour
    const [sponge, final, overall] = result.groups;
    assert.equal(sponge.total?.weight, '1288.2 g');
    assert.equal(final.lines.find((line) => line.role === 'preferment')?.amount, '1288.2 g');
    assert.equal(final.total?.weight, '4453.6 g');
    assert.equal(overall.total?.weight, '4453.6 g');
    assert.equal(result.figures.find((f) => f.label === 'Mixed dough')?.value, '4453.6 g');
    // 4453.608 − 48 × 90 = 133.608 g
    assert.match(result.portions?.sentence ?? '', /the other 133\.6 g is the loss allowance/);
    // The sponge's lines as printed: 714 + 572 + 2.1 = 1288.1 g
    assert.equal(sponge.total?.amount, '1288.1 g');
  });
});
