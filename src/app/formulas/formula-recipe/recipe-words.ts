import type { Allergen, Formula, HoldRule } from '../../../../shared/formula/formula-types.ts';
import { durationWords } from '../../../../shared/process/control-words.ts';
import { limitWords } from '../../../../shared/process/limit-words.ts';
import { resolveControl } from '../../../../shared/process/resolve-control.ts';

/** One line of a recipe's ingredients: what, and how much of what. */
export interface RecipeLine {
  readonly name: string;
  readonly amount: string;
  /** Allergens it brings, as the formula names them. */
  readonly allergens: string | null;
}

/** A group of ingredients under a heading ("Cure", "Preferment: sponge", "Meat"). */
export interface RecipeGroup {
  readonly title: string;
  /** What the amounts are counted against, in words. */
  readonly basis: string;
  readonly lines: readonly RecipeLine[];
}

/** A process control as a cook reads it. */
export interface RecipeControl {
  readonly title: string;
  readonly step: string;
  /** The limit in words ("at most 30 °C (86 °F)"), or why it cannot be said. */
  readonly limit: string;
  readonly how: string;
  readonly ifMissed: string | null;
}

/** A formula as a recipe: its ingredients with their amounts, its timing, controls and cautions. */
export interface Recipe {
  readonly groups: readonly RecipeGroup[];
  /** Holds, lead times, piece and portion weights, targets: one sentence each. */
  readonly timing: readonly string[];
  readonly steps: readonly string[];
  readonly controls: readonly RecipeControl[];
  readonly cautions: readonly string[];
  readonly notes: string | null;
}

type AssemblyPart = Extract<Formula, { kind: 'assembly' }>['components'][number];
type Control = NonNullable<Formula['controls']>[number];

const pct = (value: number): string => `${value} %`;

function days(n: number): string {
  return `${n} ${n === 1 ? 'day' : 'days'}`;
}

function every(n: number): string {
  return n === 1 ? 'every day' : `every ${n} days`;
}

function allergenWords(allergens: readonly Allergen[] | undefined): string | null {
  if (!allergens?.length) return null;
  return allergens
    .map((a) =>
      typeof a === 'string'
        ? a
        : Object.entries(a)
            .map(([group, kind]) => `${group} (${kind})`)
            .join(', '),
    )
    .join(', ');
}

function line(name: string, amount: string, allergens?: readonly Allergen[]): RecipeLine {
  return { name, amount, allergens: allergenWords(allergens) };
}

/** A cure's hold rule in words: "Cure 2 days per cm of thickness, at least 7 days in all; …". */
export function holdWords(hold: HoldRule): string {
  const rate =
    hold.days_per_cm !== undefined
      ? `${days(hold.days_per_cm)} per cm of thickness`
      : hold.days_per_inch !== undefined
        ? `${days(hold.days_per_inch)} per inch of thickness`
        : hold.days_per_kg !== undefined
          ? `${days(hold.days_per_kg)} per kg of the heaviest piece`
          : hold.days_per_lb !== undefined
            ? `${days(hold.days_per_lb)} per lb of the heaviest piece`
            : hold.days !== undefined
              ? days(hold.days)
              : 'as long as the kitchen’s own rule says';
  const parts = [`Cure ${rate}`];
  if (hold.plus_days) parts.push(`plus ${days(hold.plus_days)}`);
  if (hold.min_days) parts.push(`at least ${days(hold.min_days)} in all`);
  const flip = hold.flip_every_days ? `; turn the pieces ${every(hold.flip_every_days)}` : '';
  return `${parts.join(', ')}${flip}.`;
}

function leadWords(leadDays: number | undefined, fallback: number): string {
  const lead = leadDays ?? fallback;
  return lead === 0 ? 'Made on the day it is served.' : `Made ${days(lead)} before it is served.`;
}

/** The title of another formula by its id, or the id when the library does not know it. */
export type TitleOf = (id: string) => string;

function partWords(part: AssemblyPart, titleOf: TitleOf): string {
  if (part.portions !== undefined) return `${part.portions} × portion`;
  if (part.pieces !== undefined) return `${part.pieces} × piece`;
  if (part.slices !== undefined)
    return `${part.slices} slices${part.slice ? ` of ${part.slice}` : ''}`;
  if (part.units !== undefined) return `${part.units} × unit`;
  if (part.on !== undefined) return `${pct(part.pct ?? 0)} of the ${titleOf(part.on)} it goes on`;
  return part.amount ?? '';
}

function cureGroups(formula: Extract<Formula, { kind: 'cure' }>): RecipeGroup[] {
  const groups: RecipeGroup[] = [
    {
      title: formula.method === 'dry' ? 'Cure' : 'Cure (in the brine)',
      basis:
        formula.method === 'brine'
          ? 'of the meat and the water together'
          : 'of the green meat weight',
      lines: formula.ingredients.map((i) => line(i.name, pct(i.pct), i.allergens)),
    },
  ];
  if (formula.cover_brine?.length) {
    groups.push({
      title: 'Cover brine',
      basis: 'of the cover brine; water is the rest',
      lines: formula.cover_brine.map((i) => line(i.name, pct(i.pct), i.allergens)),
    });
  }
  return groups;
}

function doughGroups(formula: Extract<Formula, { kind: 'dough' }>): RecipeGroup[] {
  const groups: RecipeGroup[] = [];
  const preferment = formula.preferment;
  if (preferment) {
    groups.push({
      title: `Preferment: ${preferment.name}`,
      basis: `of its own flour (${pct(preferment.flour_pct)} of all the flour)`,
      lines: preferment.ingredients.map((i) => line(i.name, pct(i.pct))),
    });
  }
  groups.push({
    title: 'Dough',
    basis: 'of the flour (the flour is 100 %)',
    lines: formula.ingredients.map((i) => line(i.name, pct(i.pct), i.allergens)),
  });
  return groups;
}

function blendGroups(formula: Extract<Formula, { kind: 'blend' }>): RecipeGroup[] {
  const groups: RecipeGroup[] = [
    {
      title: 'Meat',
      basis: 'trimmings, mixed to the target fat',
      lines: formula.components.map((c) =>
        line(c.name, c.fat !== undefined ? `${pct(c.fat)} fat` : `${pct(c.lean ?? 0)} lean`),
      ),
    },
  ];
  if (formula.ingredients?.length) {
    groups.push({
      title: 'Seasoning',
      basis: 'of the meat weight',
      lines: formula.ingredients.map((i) => line(i.name, pct(i.pct), i.allergens)),
    });
  }
  return groups;
}

function groupsOf(formula: Formula, titleOf: TitleOf): RecipeGroup[] {
  switch (formula.kind) {
    case 'cure':
      return cureGroups(formula);
    case 'dough':
      return doughGroups(formula);
    case 'blend':
      return blendGroups(formula);
    case 'mix': {
      const base = formula.ingredients.find((i) => i.base);
      return [
        {
          title: 'Ingredients',
          basis: base ? `of the ${base.name}` : 'of the whole',
          lines: formula.ingredients.map((i) => line(i.name, pct(i.pct), i.allergens)),
        },
      ];
    }
    case 'assembly':
      return [
        {
          title: 'Parts of one unit',
          basis: 'each made from its own formula',
          lines: formula.components.map((c) => line(titleOf(c.formula), partWords(c, titleOf))),
        },
      ];
  }
}

function timingOf(formula: Formula): string[] {
  switch (formula.kind) {
    case 'cure':
      return [
        ...(formula.hold ? [holdWords(formula.hold)] : []),
        `When the cure is done, ${days(formula.lead_days ?? 1)} to finish before it is served.`,
      ];
    case 'dough':
      return [
        ...(formula.piece ? [`Pieces of ${formula.piece}.`] : []),
        ...(formula.loss_pct
          ? [`${pct(formula.loss_pct)} extra dough for what is lost in mixing and dividing.`]
          : []),
        ...(formula.ddt ? [`The dough should come off the mixer at ${formula.ddt.target}.`] : []),
        leadWords(formula.lead_days, formula.preferment ? 1 : 0),
      ];
    case 'blend': {
      const target = formula.target;
      const aim =
        target.fat !== undefined ? `${pct(target.fat)} fat` : `${pct(target.lean ?? 0)} lean`;
      return [
        `Mixed to ${aim}.`,
        ...(formula.portion ? [`Portions of ${formula.portion}.`] : []),
        leadWords(formula.lead_days, 0),
      ];
    }
    case 'mix':
      return [leadWords(formula.lead_days, 0)];
    case 'assembly':
      return [];
  }
}

/** A formula's control in words; one that cannot be resolved says so rather than failing. */
function controlOf(control: Control): RecipeControl {
  try {
    const resolved = resolveControl(control);
    return {
      title: control.title,
      step: control.step,
      limit: limitWords(resolved.limit, resolved.unit),
      how: resolved.everyS ? `check every ${durationWords(resolved.everyS)}` : 'check once',
      ifMissed: resolved.ifMissed,
    };
  } catch {
    return {
      title: control.title,
      step: control.step,
      limit: 'its limit cannot be read: an admin must fix the formula',
      how: control.every ? `check every ${control.every}` : 'check once',
      ifMissed: control.if_missed ?? null,
    };
  }
}

/**
 * A formula read as a recipe, for the people who use it rather than edit it.
 * @param titleOf the titles of the formulas an assembly's parts are made from
 */
export function recipeOf(formula: Formula, titleOf: TitleOf = (id) => id): Recipe {
  return {
    groups: groupsOf(formula, titleOf),
    timing: timingOf(formula),
    steps: formula.steps ?? [],
    controls: (formula.controls ?? []).map(controlOf),
    cautions: formula.cautions ?? [],
    notes: formula.notes ?? null,
  };
}
