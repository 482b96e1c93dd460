// Angular's forms are partially compiled: the JIT compiler finishes them outside an Angular build.
import '@angular/compiler';
import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import { describe, it } from 'node:test';
import { FormBuilder } from '@angular/forms';
import { isFormulaFileName } from '../../../shared/catalogue/catalogue-file.ts';
import { fillFormulaForm } from './fill-formula-form.ts';
import { createFormulaForm } from './formula-form-model.ts';
import { formulaFromForm } from './formula-from-form.ts';
import { parseFormulaYaml, writeFormulaYaml } from './formula-yaml.ts';

const FOLDER = new URL('../../../formulas/', import.meta.url);
// The formulas, not the catalogue of materials beside them.
const DEMO = readdirSync(FOLDER).filter(isFormulaFileName);

describe('the structured form', () => {
  for (const name of DEMO) {
    it(`should give back ${name} unchanged when nothing is edited`, () => {
      const text = readFileSync(new URL(name, FOLDER), 'utf8');
      const formula = parseFormulaYaml(text);
      assert.ok(formula);
      const fb = new FormBuilder().nonNullable;
      const form = createFormulaForm(fb);
      fillFormulaForm(form, formula, fb);
      const back = formulaFromForm(form, formula);
      assert.deepEqual(back, formula);
      assert.equal(writeFormulaYaml(text, back), text);
    });
  }
});

describe('the structured form on a pump cure with a cover brine', () => {
  const text = readFileSync(new URL('ham-pump.yaml', FOLDER), 'utf8');
  // A measured pick-up decides which FSIS formula counts the cover (immersion method one), so
  // losing it on save would change the checked nitrite. source: FSIS 7620.3 ch. 3
  const measured = text.replace('  cover_pct: 25\n', '  cover_pct: 25\n  cover_pickup_pct: 2\n');

  function filled(yaml: string) {
    const formula = parseFormulaYaml(yaml);
    assert.ok(formula);
    const fb = new FormBuilder().nonNullable;
    const form = createFormulaForm(fb);
    fillFormulaForm(form, formula, fb);
    return { form, formula };
  }

  it('should keep the measured pick-up from the cover', () => {
    const { form, formula } = filled(measured);
    assert.equal(form.controls.cure.controls.cover_pickup_pct.value, 2);
    assert.deepEqual(formulaFromForm(form, formula), formula);
  });

  it('should drop the cover brine and its pick-up when the method is no longer pump', () => {
    const { form, formula } = filled(measured);
    form.controls.cure.controls.method.setValue('brine');
    form.controls.cure.controls.water_pct.setValue(60);
    const back = formulaFromForm(form, formula);
    assert.ok(back.kind === 'cure');
    assert.equal(back.cover_brine, undefined);
    assert.deepEqual(back.brine, { water_pct: 60 });
  });
});

describe('the structured form, blend keys it has no box for', () => {
  it('should keep a component marked as fat as such, and the loss allowance', () => {
    // Dropping fat_as_such would let a ground-beef blend with loose fat pass (9 CFR 319.15(a)).
    const text = [
      'formula: 1',
      'id: loose-fat-grind',
      'title: Grind with loose fat',
      'kind: blend',
      'standard: hamburger',
      'components:',
      '  - { key: lean, name: lean 90/10 trim, fat: 10 }',
      '  - { key: suet, name: beef fat, fat: 90, fat_as_such: true }',
      '  - { key: chuck, name: chuck 80/20, lean: 80 }',
      'target: { fat: 20 }',
      'loss_pct: 2',
      '',
    ].join('\n');
    const formula = parseFormulaYaml(text);
    assert.ok(formula);
    const fb = new FormBuilder().nonNullable;
    const form = createFormulaForm(fb);
    fillFormulaForm(form, formula, fb);
    assert.deepEqual(formulaFromForm(form, formula), formula);
  });
});

describe('the structured form and process controls', () => {
  it('should keep the controls when a cure is edited and saved from the form', () => {
    const text = readFileSync(new URL('maple-pump-belly.yaml', FOLDER), 'utf8');
    const formula = parseFormulaYaml(text);
    assert.ok(formula?.controls && formula.controls.length > 0);
    const fb = new FormBuilder().nonNullable;
    const form = createFormulaForm(fb);
    fillFormulaForm(form, formula, fb);
    form.controls.title.setValue('Maple belly, injected, for brunch');
    const back = formulaFromForm(form, formula);
    assert.deepEqual(back.controls, formula.controls);
    const saved = parseFormulaYaml(writeFormulaYaml(text, back));
    assert.equal(saved?.title, 'Maple belly, injected, for brunch');
    assert.deepEqual(saved?.controls, formula.controls);
  });
});
