// Angular's forms are partially compiled: the JIT compiler finishes them outside an Angular build.
import '@angular/compiler';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { FormBuilder } from '@angular/forms';
import type { AssemblyFormula } from '../../../shared/formula/formula-types.ts';
import { fillFormulaForm } from './fill-formula-form.ts';
import { assemblyPartRow, createFormulaForm } from './formula-form-model.ts';
import { formulaFromForm } from './formula-from-form.ts';
import { parseFormulaYaml, writeFormulaYaml } from './formula-yaml.ts';

const BURGER = readFileSync(
  new URL('../../../formulas/smokehouse-burger.yaml', import.meta.url),
  'utf8',
);

/** The smokehouse burger in a filled form. */
function burgerForm() {
  const formula = parseFormulaYaml(BURGER) as AssemblyFormula;
  const fb = new FormBuilder().nonNullable;
  const form = createFormulaForm(fb);
  fillFormulaForm(form, formula, fb);
  return { form, formula, fb };
}

describe('an assembly in the structured form', () => {
  it('should show each part with its one quantity key, and no blend trimmings', () => {
    const { form } = burgerForm();
    assert.deepEqual(
      form.controls.parts.getRawValue().map((part) => [part.formula, part.quantity]),
      [
        ['chuck-grind', 'portions'],
        ['pit-bun', 'pieces'],
        ['quillmoor-belly', 'slices'],
        ['house-sauce', 'amount'],
      ],
    );
    assert.deepEqual(form.controls.parts.at(2).getRawValue(), {
      formula: 'quillmoor-belly',
      quantity: 'slices',
      count: 3,
      amount: '',
      slice: '25 g',
      thickness: '4 cm',
      largest_piece: '',
      on: '',
      pct: null,
    });
    assert.ok(form.controls.blend.controls.components.getRawValue().every((c) => c.key === ''));
  });

  it('should write a changed count into the YAML line of that part only', () => {
    const { form, formula } = burgerForm();
    form.controls.parts.at(0).controls.count.setValue(3);
    const text = writeFormulaYaml(BURGER, formulaFromForm(form, formula));
    assert.match(text, /- \{ formula: chuck-grind, portions: 3 \}/);
    assert.equal(text.replace('portions: 3', 'portions: 2'), BURGER);
  });

  it('should drop the slice weight when a part goes from slices to a finished weight', () => {
    const { form, formula } = burgerForm();
    const belly = form.controls.parts.at(2).controls;
    belly.quantity.setValue('amount');
    belly.amount.setValue('75 g');
    const parts = (formulaFromForm(form, formula) as AssemblyFormula).components;
    assert.deepEqual(parts[2], { formula: 'quillmoor-belly', amount: '75 g', thickness: '4 cm' });
  });

  it('should leave a cure’s sizes out of a part counted in portions, pieces or units', () => {
    const { form, formula } = burgerForm();
    const belly = form.controls.parts.at(2).controls;
    belly.formula.setValue('corned-beef-sandwich');
    belly.quantity.setValue('units');
    belly.count.setValue(1);
    const parts = (formulaFromForm(form, formula) as AssemblyFormula).components;
    assert.deepEqual(parts[2], { formula: 'corned-beef-sandwich', units: 1 });
  });

  it('should show a part applied to another by its percent and the part it goes on, and write both back', () => {
    const { form, formula, fb } = burgerForm();
    const rub = assemblyPartRow(fb);
    rub.controls.formula.setValue('brisket-rub');
    rub.controls.quantity.setValue('pct');
    rub.controls.pct.setValue(1.5);
    rub.controls.on.setValue('quillmoor-belly');
    rub.controls.amount.setValue('3 g');
    form.controls.parts.push(rub);
    const written = formulaFromForm(form, formula) as AssemblyFormula;
    assert.deepEqual(written.components.at(-1), {
      formula: 'brisket-rub',
      on: 'quillmoor-belly',
      pct: 1.5,
    });
    const again = createFormulaForm(fb);
    fillFormulaForm(again, written, fb);
    const { quantity, pct, on } = again.controls.parts.at(-1).getRawValue();
    assert.deepEqual({ quantity, pct, on }, { quantity: 'pct', pct: 1.5, on: 'quillmoor-belly' });
  });

  it('should add a part and remove one', () => {
    const { form, formula, fb } = burgerForm();
    form.controls.parts.removeAt(3);
    const added = assemblyPartRow(fb);
    added.controls.formula.setValue('brisket-rub');
    added.controls.quantity.setValue('amount');
    added.controls.amount.setValue(' 3 g ');
    form.controls.parts.push(added);
    const parts = (formulaFromForm(form, formula) as AssemblyFormula).components;
    assert.deepEqual(parts.at(-1), { formula: 'brisket-rub', amount: '3 g' });
    assert.equal(parts.length, 4);
    assert.ok(!parts.some((part) => part.formula === 'house-sauce'));
  });
});
