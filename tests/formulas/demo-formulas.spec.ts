import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  calculate,
  checkLibrary,
  failsCriticalLimit,
  formatProblem,
  formulaLibrary,
  isFormulaFileName,
  parseBatchOptions,
  planAssembly,
  readFormula,
  type BatchKind,
  type RawBatchOptions,
} from '../../shared/index.ts';

const FOLDER = 'formulas';
const files = readdirSync(FOLDER).filter(isFormulaFileName);
const texts = new Map(files.map((file) => [file, readFileSync(path.join(FOLDER, file), 'utf8')]));
const readings = files.map((file) => ({ file, reading: readFormula(texts.get(file) ?? '', file) }));
const library = formulaLibrary(readings);

/** A plausible batch for each batch kind, so every demo formula is also calculated. */
const SAMPLE: Record<BatchKind, RawBatchOptions> = {
  cure: { meat: '5 kg', thickness: '4 cm', largestPiece: '2.5 kg', start: '2026-12-02' },
  dough: { pieces: '48', room: '22 C', flourTemp: '21 C', prefermentTemp: '20 C', tap: '15 C' },
  blend: { total: '20 kg' },
  mix: { total: '2 kg' },
};

describe('the demo formulas', () => {
  it('should include every kind the brief asks for', () => {
    const kinds = files.map(
      (file) => readFormula(readFileSync(path.join(FOLDER, file), 'utf8'), file).formula,
    );
    const methods = kinds
      .filter((f) => f?.kind === 'cure')
      .map((f) => (f?.kind === 'cure' ? `${f.product}/${f.method}` : ''));
    assert.ok(methods.includes('bacon/dry'), 'a dry-cured bacon');
    assert.ok(
      methods.some((m) => m.endsWith('/brine')),
      'a brine-cured item',
    );
    assert.ok(
      methods.some((m) => m.endsWith('/pump')),
      'an injected item',
    );
    assert.ok(
      kinds.some((f) => f?.kind === 'blend' && f.portion),
      'a grind blend with portions',
    );
    assert.ok(
      kinds.some((f) => f?.kind === 'dough' && f.preferment),
      'a dough with a preferment',
    );
    assert.ok(kinds.filter((f) => f?.kind === 'mix').length >= 2, 'a sauce and a seasoning blend');
    assert.ok(
      kinds.some((f) => f?.kind === 'assembly'),
      'a menu item built from other formulas',
    );
  });

  it('should check clean against each other (every assembly names formulas that fit)', () => {
    const checked = checkLibrary(readings, (file) => texts.get(file) ?? '');
    assert.deepEqual(
      checked.flatMap((reading) => reading.problems.map(formatProblem)),
      [],
    );
  });

  for (const file of files) {
    describe(file, () => {
      const text = readFileSync(path.join(FOLDER, file), 'utf8');
      const reading = readFormula(text, file);

      it('should pass every check without warnings', () => {
        assert.deepEqual(reading.problems.map(formatProblem), []);
        assert.ok(reading.formula);
      });

      it('should point editors at the schema and be named for its id', () => {
        assert.match(
          text.split('\n')[0],
          /^# yaml-language-server: \$schema=\.\.\/shared\/schema\/formula\.schema\.json$/,
        );
        assert.equal(`${reading.formula?.id}.yaml`, file);
      });

      it('should calculate a sample batch (or plan 10 units of an assembly) inside every critical limit', () => {
        const formula = reading.formula;
        assert.ok(formula);
        if (formula.kind === 'assembly') {
          // An assembly is planned, not calculated: every batch it needs is calculated instead.
          const plan = planAssembly(formula, library, {
            count: 10,
            serviceDate: '2026-12-20',
            today: '2026-12-01',
          });
          assert.ok(plan.batches.length > 0);
          for (const batch of plan.batches) assert.equal(failsCriticalLimit(batch.result), false);
          assert.ok(plan.pullList.length > 0);
          assert.equal(plan.cautions.at(-1)?.id, 'local-codes');
          return;
        }
        const result = calculate(
          formula,
          parseBatchOptions(SAMPLE[formula.kind], formula, { today: '2026-12-02' }),
        );
        assert.equal(failsCriticalLimit(result), false);
        assert.ok(result.groups.length > 0);
        assert.equal(result.cautions.at(-1)?.id, 'local-codes');
      });
    });
  }
});
