import type { FormArray, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import type {
  AssemblyComponent,
  BlendComponent,
  BlendFormula,
  CureFormula,
  DoughFormula,
  DoughIngredient,
  Formula,
  HoldRule,
} from '../../../shared/formula/formula-types.ts';
import { allergenText } from '../../../shared/formula/allergen-text.ts';
import { COUNT_KEYS, QUANTITY_KEYS } from './assembly-quantity';
import {
  FormulaForm,
  assemblyPartRow,
  componentRow,
  ingredientRow,
  prefermentRow,
} from './formula-form-model';
import type { HoldRateKey } from './formula-vocabulary';
import { speciesChoices } from './species-choices';

// Keys of an ingredient the table edits; anything else rides along in `rest`.
const ROW_KEYS = [
  'name',
  'pct',
  'nitrite',
  'salt',
  'accelerator',
  'flour',
  'food',
  'water_pct',
  'yeast',
  'base',
  'allergens',
];
const RATE_KEYS: readonly HoldRateKey[] = [
  'days_per_cm',
  'days_per_inch',
  'days_per_kg',
  'days_per_lb',
  'days',
];

type Loose = Record<string, unknown>;

/**
 * Shows a formula in the form; lists are rebuilt to the formula's length. Change events fire, so
 * templates follow; a caller that listens to the form must know it is not an edit.
 */
export function fillFormulaForm(
  form: FormulaForm,
  formula: Formula,
  fb: NonNullableFormBuilder,
): void {
  const f = formula as Formula & Loose;
  const c = f as Partial<CureFormula>;
  const d = f as Partial<DoughFormula>;
  const b = f as Partial<BlendFormula>;
  const hold: HoldRule = c.hold ?? {};
  const rate = RATE_KEYS.find((key) => hold[key] !== undefined);
  const ingredients = (Array.isArray(f.ingredients) ? f.ingredients : []) as Loose[];
  rebuild(form.controls.ingredients, ingredients.length, () => ingredientRow(fb));
  const preferment = d.preferment;
  rebuild(
    form.controls.dough.controls.prefermentIngredients,
    preferment?.ingredients?.length ?? 0,
    () => prefermentRow(fb),
  );
  // An assembly's components are its parts, not a blend's two trimmings.
  const components = f.kind === 'blend' && Array.isArray(b.components) ? b.components : [];
  rebuild(form.controls.blend.controls.components, Math.max(2, components.length), () =>
    componentRow(fb),
  );
  const parts = (
    f.kind === 'assembly' && Array.isArray(f['components']) ? f['components'] : []
  ) as Partial<AssemblyComponent>[];
  rebuild(form.controls.parts, parts.length, () => assemblyPartRow(fb));
  form.setValue({
    title: text(f.title),
    steps: lines(f.steps),
    cautions: lines(f.cautions),
    notes: text(f.notes),
    ingredients: ingredients.map((item) => ({
      name: text(item['name']),
      pct: num(item['pct']),
      nitrite: num(item['nitrite']),
      salt: num(item['salt']),
      accelerator: num(item['accelerator']),
      flour: item['flour'] === true,
      food: (item['food'] as DoughIngredient['food']) ?? null,
      water_pct: num(item['water_pct']),
      yeast: (item['yeast'] as DoughIngredient['yeast']) ?? null,
      base: item['base'] === true,
      allergens: Array.isArray(item['allergens']) ? allergenText(item['allergens']) : '',
      rest: Object.fromEntries(Object.entries(item).filter(([key]) => !ROW_KEYS.includes(key))),
    })),
    cure: {
      method: c.method ?? 'dry',
      product: c.product ?? 'bacon',
      species: speciesChoices(c.species),
      water_pct: num(c.brine?.water_pct),
      pump_pct: num(c.brine?.pump_pct),
      cover_pct: num(c.brine?.cover_pct),
      cover_pickup_pct: num(c.brine?.cover_pickup_pct),
      extra_pct: num(c.brine?.extra_pct),
      holdRule: rate ?? 'default',
      holdRate: rate ? num(hold[rate]) : null,
      plus_days: num(hold.plus_days),
      min_days: num(hold.min_days),
      flip_every_days: num(hold.flip_every_days),
    },
    dough: {
      hasPreferment: preferment !== undefined,
      prefermentName: text(preferment?.name),
      prefermentFlourPct: num(preferment?.flour_pct),
      prefermentIngredients: (preferment?.ingredients ?? []).map((item) => ({
        name: text(item.name),
        pct: num(item.pct),
      })),
      piece: text(d.piece),
      loss_pct: num(d.loss_pct),
      ddtTarget: text(d.ddt?.target),
      ddtFriction: text(d.ddt?.friction),
    },
    blend: {
      species: speciesChoices(b.species),
      standard: b.standard ?? null,
      components: Array.from({ length: Math.max(2, components.length) }, (_, i) => {
        const part: Partial<BlendComponent> = components[i] ?? {};
        return {
          key: text(part.key),
          name: text(part.name),
          measure: part.lean !== undefined && part.fat === undefined ? 'lean' : 'fat',
          value: num(part.fat ?? part.lean),
        };
      }),
      targetMeasure: b.target?.lean !== undefined && b.target.fat === undefined ? 'lean' : 'fat',
      targetValue: num(b.target?.fat ?? b.target?.lean),
      portion: text(b.portion),
    },
    yields: {
      trim: num(c.yields?.trim ?? b.yields?.trim),
      cure: num(c.yields?.cure ?? b.yields?.cure),
      smoke: num(c.yields?.smoke ?? b.yields?.smoke),
      cook: num(c.yields?.cook ?? b.yields?.cook),
      slice: num(c.yields?.slice ?? b.yields?.slice),
    },
    parts: parts.map((part) => {
      // The first quantity key given; a part without one is shown as portions, left empty.
      const quantity = QUANTITY_KEYS.find((key) => part[key] !== undefined) ?? 'portions';
      return {
        formula: text(part.formula),
        quantity,
        count: COUNT_KEYS.includes(quantity) ? num(part[quantity]) : null,
        amount: text(part.amount),
        slice: text(part.slice),
        thickness: text(part.thickness),
        largest_piece: text(part.largest_piece),
        on: text(part.on),
        pct: num(part.pct),
      };
    }),
  });
}

/** Resizes a form array to `length` rows. */
function rebuild<T extends FormGroup>(array: FormArray<T>, length: number, create: () => T): void {
  while (array.length > length) array.removeAt(array.length - 1);
  while (array.length < length) array.push(create());
}

function text(value: unknown): string {
  return typeof value === 'string'
    ? value
    : value === undefined || value === null
      ? ''
      : String(value);
}

function num(value: unknown): number | null {
  return typeof value === 'number' ? value : null;
}

function lines(value: unknown): string {
  return Array.isArray(value) ? value.map(text).join('\n') : '';
}
