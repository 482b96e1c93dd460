import {
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  Validators,
} from '@angular/forms';
import type {
  BlendFormula,
  CureMethod,
  CureProduct,
  FoodKey,
  YeastKind,
} from '../../../shared/formula/formula-types.ts';
import type { QuantityKey } from './assembly-quantity';
import type { HoldRateKey } from './formula-vocabulary';
import type { SpeciesWord } from './species-choices';

/** fat or lean: how a blend component or target is stated. */
export type FatMeasure = 'fat' | 'lean';

/** An optional number: null when the field is left empty. */
type Num = FormControl<number | null>;

/** One ingredient row; the columns shown depend on the kind. */
export type IngredientRow = FormGroup<{
  name: FormControl<string>;
  pct: Num;
  nitrite: Num;
  salt: Num;
  accelerator: Num;
  flour: FormControl<boolean>;
  food: FormControl<FoodKey | null>;
  water_pct: Num;
  yeast: FormControl<YeastKind | null>;
  base: FormControl<boolean>;
  /** The allergens as one line, as the law words them: "milk, fish (anchovy)". */
  allergens: FormControl<string>;
  /** Keys the form does not edit (nitrate, raw_egg…), carried through unchanged. */
  rest: FormControl<Record<string, unknown>>;
}>;

/** One row of a preferment's own formula. */
export type PrefermentRow = FormGroup<{ name: FormControl<string>; pct: Num }>;

/** One of the two trimmings of a blend. */
export type ComponentRow = FormGroup<{
  key: FormControl<string>;
  name: FormControl<string>;
  measure: FormControl<FatMeasure>;
  value: Num;
}>;

/** Cure-only fields. */
export type CureGroup = FormGroup<{
  method: FormControl<CureMethod>;
  product: FormControl<CureProduct>;
  species: FormControl<SpeciesWord[]>;
  water_pct: Num;
  pump_pct: Num;
  cover_pct: Num;
  cover_pickup_pct: Num;
  extra_pct: Num;
  holdRule: FormControl<HoldRateKey | 'default'>;
  holdRate: Num;
  plus_days: Num;
  min_days: Num;
  flip_every_days: Num;
}>;

/** Dough-only fields. */
export type DoughGroup = FormGroup<{
  hasPreferment: FormControl<boolean>;
  prefermentName: FormControl<string>;
  prefermentFlourPct: Num;
  prefermentIngredients: FormArray<PrefermentRow>;
  piece: FormControl<string>;
  loss_pct: Num;
  ddtTarget: FormControl<string>;
  ddtFriction: FormControl<string>;
}>;

/** Blend-only fields. */
export type BlendGroup = FormGroup<{
  species: FormControl<SpeciesWord[]>;
  standard: FormControl<BlendFormula['standard'] | null>;
  components: FormArray<ComponentRow>;
  targetMeasure: FormControl<FatMeasure>;
  targetValue: Num;
  portion: FormControl<string>;
}>;

/**
 * One part of an assembly: the formula it names and how much of it goes into one unit, by one
 * quantity key; a count for portions, pieces, slices and units, a weight for amount, a percent
 * with the part it goes on for pct. Slice goes with slices; thickness and heaviest piece size a
 * cure's hold.
 */
export type AssemblyPartRow = FormGroup<{
  formula: FormControl<string>;
  quantity: FormControl<QuantityKey>;
  count: Num;
  amount: FormControl<string>;
  slice: FormControl<string>;
  thickness: FormControl<string>;
  largest_piece: FormControl<string>;
  /** With pct: the formula id of the part this one goes on. */
  on: FormControl<string>;
  /** With on: percent of that part's green weight. */
  pct: Num;
}>;

/** Weight after each step, % of the weight before it (cures and blends). */
export type YieldsGroup = FormGroup<{
  trim: Num;
  cure: Num;
  smoke: Num;
  cook: Num;
  slice: Num;
}>;

/** The structured form of a formula of any kind; only the kind's own group is shown. */
export type FormulaForm = FormGroup<{
  title: FormControl<string>;
  /** One step per line. */
  steps: FormControl<string>;
  /** One caution per line. */
  cautions: FormControl<string>;
  notes: FormControl<string>;
  ingredients: FormArray<IngredientRow>;
  cure: CureGroup;
  dough: DoughGroup;
  blend: BlendGroup;
  yields: YieldsGroup;
  /** An assembly's parts. */
  parts: FormArray<AssemblyPartRow>;
}>;

const PCT = [Validators.required, Validators.min(0)];

/** A new, empty ingredient row. */
export function ingredientRow(fb: NonNullableFormBuilder): IngredientRow {
  return fb.group({
    name: fb.control('', Validators.required),
    pct: fb.control<number | null>(null, PCT),
    nitrite: fb.control<number | null>(null, [Validators.min(0), Validators.max(100)]),
    salt: fb.control<number | null>(null, [Validators.min(0), Validators.max(100)]),
    accelerator: fb.control<number | null>(null, [Validators.min(0), Validators.max(100)]),
    flour: fb.control(false),
    food: fb.control<FoodKey | null>(null),
    water_pct: fb.control<number | null>(null, [Validators.min(0), Validators.max(100)]),
    yeast: fb.control<YeastKind | null>(null),
    base: fb.control(false),
    allergens: fb.control(''),
    rest: fb.control<Record<string, unknown>>({}),
  });
}

/** A new, empty preferment row. */
export function prefermentRow(fb: NonNullableFormBuilder): PrefermentRow {
  return fb.group({
    name: fb.control('', Validators.required),
    pct: fb.control<number | null>(null, PCT),
  });
}

/** A new, empty blend component. */
export function componentRow(fb: NonNullableFormBuilder): ComponentRow {
  return fb.group({
    key: fb.control('', [Validators.required, Validators.pattern(/^[a-z][a-z0-9-]*$/)]),
    name: fb.control('', Validators.required),
    measure: fb.control<FatMeasure>('fat'),
    value: fb.control<number | null>(null, [Validators.required, Validators.min(0)]),
  });
}

/** A new assembly part: a formula still to choose, one portion of it. */
export function assemblyPartRow(fb: NonNullableFormBuilder): AssemblyPartRow {
  return fb.group({
    formula: fb.control('', Validators.required),
    quantity: fb.control<QuantityKey>('portions'),
    count: fb.control<number | null>(1, [Validators.min(1), Validators.max(1000)]),
    amount: fb.control(''),
    slice: fb.control(''),
    thickness: fb.control(''),
    largest_piece: fb.control(''),
    on: fb.control(''),
    pct: fb.control<number | null>(null, [Validators.min(0), Validators.max(100)]),
  });
}

/** An empty structured form for a formula of any kind. */
export function createFormulaForm(fb: NonNullableFormBuilder): FormulaForm {
  const optional = () => fb.control<number | null>(null, Validators.min(0));
  return fb.group({
    title: fb.control('', [Validators.required, Validators.maxLength(120)]),
    steps: fb.control(''),
    cautions: fb.control(''),
    notes: fb.control('', Validators.maxLength(4000)),
    ingredients: fb.array<IngredientRow>([]),
    cure: fb.group({
      method: fb.control<CureMethod>('dry'),
      product: fb.control<CureProduct>('bacon'),
      species: fb.control<SpeciesWord[]>([]),
      water_pct: optional(),
      pump_pct: optional(),
      cover_pct: optional(),
      cover_pickup_pct: optional(),
      extra_pct: optional(),
      holdRule: fb.control<HoldRateKey | 'default'>('default'),
      holdRate: optional(),
      plus_days: optional(),
      min_days: optional(),
      flip_every_days: optional(),
    }),
    dough: fb.group({
      hasPreferment: fb.control(false),
      prefermentName: fb.control(''),
      prefermentFlourPct: optional(),
      prefermentIngredients: fb.array<PrefermentRow>([]),
      piece: fb.control(''),
      loss_pct: optional(),
      ddtTarget: fb.control(''),
      ddtFriction: fb.control(''),
    }),
    blend: fb.group({
      species: fb.control<SpeciesWord[]>([]),
      standard: fb.control<BlendFormula['standard'] | null>(null),
      components: fb.array<ComponentRow>([]),
      targetMeasure: fb.control<FatMeasure>('fat'),
      targetValue: optional(),
      portion: fb.control(''),
    }),
    yields: fb.group({
      trim: optional(),
      cure: optional(),
      smoke: optional(),
      cook: optional(),
      slice: optional(),
    }),
    parts: fb.array<AssemblyPartRow>([]),
  });
}
