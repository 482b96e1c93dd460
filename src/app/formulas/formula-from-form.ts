import type {
  BlendComponent,
  CureFormula,
  CureIngredient,
  Formula,
  MixFormula,
  Yields,
} from '../../../shared/formula/formula-types.ts';
import { allergensFromText } from '../../../shared/formula/allergen-text.ts';
import type { AssemblyPartRow, FormulaForm, IngredientRow } from './formula-form-model';
import { speciesFromChoices } from './species-choices';

type Loose = Record<string, unknown>;

/**
 * The formula the form describes, built over `base` (the formula it was filled from) so that keys
 * the form does not edit are kept. Empty optional fields are left out, as a person writing the
 * file would leave them out.
 */
export function formulaFromForm(form: FormulaForm, base: Formula): Formula {
  const v = form.getRawValue();
  const common = {
    ...base,
    title: v.title.trim(),
    steps: splitLines(v.steps),
    cautions: splitLines(v.cautions),
    notes: v.notes.trim() || undefined,
  };
  const rows = form.controls.ingredients.controls;
  let formula: Loose;
  switch (base.kind) {
    case 'cure': {
      const cure = v.cure;
      const brine =
        cure.method === 'brine'
          ? { water_pct: cure.water_pct }
          : cure.method === 'pump'
            ? {
                pump_pct: cure.pump_pct,
                cover_pct: cure.cover_pct,
                cover_pickup_pct: cure.cover_pickup_pct,
                extra_pct: cure.extra_pct,
              }
            : undefined;
      const hold = {
        ...(cure.holdRule === 'default' ? {} : { [cure.holdRule]: cure.holdRate }),
        plus_days: cure.plus_days,
        min_days: cure.min_days,
        flip_every_days: cure.flip_every_days,
      };
      formula = {
        ...common,
        method: cure.method,
        product: cure.product,
        species: speciesFromChoices(cure.species),
        brine: brine && compact(brine),
        // The cover brine's own make-up is edited as YAML; it belongs to a pump cure only.
        cover_brine: cure.method === 'pump' ? (base as CureFormula).cover_brine : undefined,
        ingredients: rows.map((row) =>
          ingredientOf(row, ['nitrite', 'salt', 'accelerator']),
        ) as unknown as CureIngredient[],
        hold: compact(hold),
        yields: compact(v.yields) as Yields | undefined,
      };
      break;
    }
    case 'dough': {
      const dough = v.dough;
      formula = {
        ...common,
        ingredients: rows.map((row) => ingredientOf(row, ['flour', 'food', 'water_pct', 'yeast'])),
        preferment: dough.hasPreferment
          ? {
              name: dough.prefermentName.trim(),
              flour_pct: dough.prefermentFlourPct,
              ingredients: dough.prefermentIngredients.map((row) => ({
                name: row.name.trim(),
                pct: row.pct,
              })),
            }
          : undefined,
        piece: dough.piece.trim() || undefined,
        loss_pct: dough.loss_pct ?? undefined,
        ddt: dough.ddtTarget.trim()
          ? compact({ target: dough.ddtTarget.trim(), friction: dough.ddtFriction.trim() || null })
          : undefined,
      };
      break;
    }
    case 'blend': {
      const blend = v.blend;
      const seasoning = rows.map((row) => ingredientOf(row, []));
      formula = {
        ...common,
        species: speciesFromChoices(blend.species),
        standard: blend.standard ?? undefined,
        components: blend.components.map((part, i) => ({
          // Keys the form has no box for (fat_as_such) are kept from the row's component.
          ...keptComponentKeys(base.components[i]),
          key: part.key.trim(),
          name: part.name.trim(),
          [part.measure]: part.value,
        })),
        target: { [blend.targetMeasure]: blend.targetValue },
        ingredients: seasoning.length > 0 ? seasoning : undefined,
        portion: blend.portion.trim() || undefined,
        yields: compact(v.yields),
      };
      break;
    }
    case 'assembly':
      formula = { ...common, components: v.parts.map(partOf) };
      break;
    case 'mix':
      formula = {
        ...common,
        ingredients: rows.map((row) =>
          ingredientOf(row, ['base']),
        ) as unknown as MixFormula['ingredients'],
      };
      break;
  }
  // Process controls are edited as YAML; an empty list the file wrote ("none here") stays.
  const controls = base.controls === undefined ? {} : { controls: base.controls };
  return withoutUndefined({ ...dropEmpty(formula), ...controls }) as unknown as Formula;
}

/** One ingredient: name and pct, the kind's own keys, allergens and the untouched rest. */
function ingredientOf(row: IngredientRow, keys: readonly string[]): Loose {
  const v = row.getRawValue();
  const allergens = allergensFromText(v.allergens);
  const own: Loose = {};
  for (const key of keys) {
    const value = v[key as keyof typeof v];
    // Booleans are written only when true, as a person would write `flour: true`.
    if (value !== null && value !== false && value !== '') own[key] = value;
  }
  return {
    name: v.name.trim(),
    pct: v.pct,
    ...own,
    ...v.rest,
    allergens: allergens.length > 0 ? allergens : undefined,
  };
}

/**
 * One part of an assembly: the formula, its one quantity key with the value (pct with the part
 * it goes on), the slice weight only with slices, and a cure's sizes only with a cure's quantity
 * (slices, amount or pct), so that a part switched to another key leaves nothing behind that no
 * longer fits.
 */
function partOf(part: ReturnType<AssemblyPartRow['getRawValue']>): Loose {
  const key = part.quantity;
  const sized = key === 'slices' || key === 'amount' || key === 'pct';
  const given = (value: string): string | undefined => value.trim() || undefined;
  return {
    formula: part.formula.trim(),
    on: key === 'pct' ? given(part.on) : undefined,
    [key]:
      key === 'amount'
        ? given(part.amount)
        : key === 'pct'
          ? (part.pct ?? undefined)
          : (part.count ?? undefined),
    slice: key === 'slices' ? given(part.slice) : undefined,
    thickness: sized ? given(part.thickness) : undefined,
    largest_piece: sized ? given(part.largest_piece) : undefined,
  };
}

function compact(values: Record<string, unknown>): Loose | undefined {
  const kept = Object.entries(values).filter(([, value]) => value !== null && value !== undefined);
  return kept.length > 0 ? Object.fromEntries(kept) : undefined;
}

function dropEmpty(value: Loose): Loose {
  return Object.fromEntries(
    Object.entries(value).filter(
      ([, item]) => item !== undefined && !(Array.isArray(item) && item.length === 0),
    ),
  );
}

// Optional keys left undefined above must not reach YAML as empty values.
function withoutUndefined(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutUndefined);
  if (value === null || typeof value !== 'object') return value;
  return Object.fromEntries(
    Object.entries(value)
      .filter(([, item]) => item !== undefined)
      .map(([key, item]) => [key, withoutUndefined(item)]),
  );
}

function splitLines(value: string): string[] {
  return value
    .split('\n')
    .map((line) => line.trim())
    .filter((line) => line.length > 0);
}

/** A blend component without what the form edits (key, name, fat or lean): the keys to keep. */
function keptComponentKeys(component: BlendComponent | undefined): Partial<BlendComponent> {
  if (!component) return {};
  const { key: _key, name: _name, fat: _fat, lean: _lean, ...kept } = component;
  return kept;
}
