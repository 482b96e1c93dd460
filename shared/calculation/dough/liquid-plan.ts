import { Decimal, HUNDRED, ONE, ZERO, sum } from '../../decimal.ts';
import type { FoodKey } from '../../formula/formula-types.ts';
import type { Figure } from '../calc-result.ts';
import type { DoughLine } from './dough-line.ts';
import { celsius } from './temperature-plan.ts';
import { ICE_MELT_DEGREES_C, iceFraction, waterTemperatureWith } from './water-temperature.ts';

/**
 * Foods poured or beaten into a dough as its liquid, which the desired-dough-temperature rule's
 * "water" stands for, so they go in at the liquid temperature. Sour cream, yogurt, butter, honey
 * and the syrups are spooned or softened rather than tempered, and are left out.
 * common practice, no source; text read for milk counting as the rule's liquid: "Dough
 * Temperature", starreveld.com/Baking/Dough_Temperature.html ("water/liquids … (milk, or other
 * liquids)")
 */
export const LIQUID_FOODS: ReadonlySet<FoodKey> = new Set<FoodKey>([
  'water',
  'milk-whole',
  'milk-2pct',
  'milk-skim',
  'buttermilk',
  'cream-heavy',
  'egg-whole',
  'egg-white',
  'egg-yolk',
]);

/**
 * The coldest a liquid other than water is brought to: ice-cold, 0 °C, since below it would
 * freeze (whole milk at about −0.5 °C: from memory). The water, which can be part ice, makes up
 * the rest.
 */
export const COLDEST_OTHER_LIQUID_C = ZERO;

/** How the liquids of the dough mixed now reach the liquid temperature. */
export interface LiquidPlan {
  readonly figures: Figure[];
  readonly warnings: string[];
  /** Share of the plain water to weigh as ice, when the tap water is too warm. */
  readonly iceFraction?: Decimal;
}

function isOtherLiquid(line: DoughLine): boolean {
  const food = line.ingredient?.food;
  return line.role === 'ingredient' && food !== undefined && LIQUID_FOODS.has(food);
}

/** "a", "a and b", "a, b and c". */
function listed(names: readonly string[]): string {
  return names.length < 2
    ? names.join('')
    : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

function temperature(label: string, value: Decimal, note: string): Figure {
  return { label, kind: 'temperature', value, note };
}

/**
 * Shares the liquid temperature out among the liquids of the dough mixed now: milk, egg and the
 * other liquids are brought to it (no colder than 0 °C); the plain water takes what is left, as
 * tap water and ice (a heat balance, see `iceFraction`) when the tap is too warm. When even all
 * the water as ice cannot do it, says so and leaves the water lines as they are.
 * @param lines the lines weighed at the mixer (the final dough with a preferment)
 * @param liquidC the liquid temperature the rule gives, °C
 * @param rule the rule in words, for the note
 * @param tap the tap water temperature, °C, when given
 */
export function planLiquids(
  lines: readonly DoughLine[],
  liquidC: Decimal,
  rule: string,
  tap: Decimal | undefined,
): LiquidPlan {
  const waterGrams = sum(lines.filter((line) => line.role === 'water').map((line) => line.grams));
  const others = lines.filter(isOtherLiquid);
  if (others.length === 0) {
    const figures = [temperature('Water temperature', liquidC, rule)];
    const ice = planIce(liquidC, tap, waterGrams, '');
    if (ice.fraction && waterGrams.isZero()) {
      return {
        figures,
        warnings: [
          'The water must be colder than the tap, but there is no plain water (food: water) in the dough ' +
            'mixed now to replace with ice: chill the liquids or the flour instead.',
        ],
      };
    }
    return withIceShare(figures, ice);
  }

  const names = listed(others.map((line) => line.name));
  const othersC = Decimal.max(liquidC, COLDEST_OTHER_LIQUID_C);
  const figures = [
    temperature('Liquid temperature', liquidC, `${rule}; every liquid together`),
    temperature(
      `Bring ${names} to`,
      othersC,
      othersC.equals(liquidC)
        ? 'before mixing'
        : 'ice-cold: colder they would freeze; the water, part ice, makes up the rest',
    ),
  ];
  if (waterGrams.isZero()) {
    const warnings = liquidC.lessThan(COLDEST_OTHER_LIQUID_C)
      ? [
          `The liquids would have to be ${celsius(liquidC)}, below freezing, and there is no plain water in the ` +
            'dough mixed now to take ice: chill the flour (or the preferment), or mix in a cooler room.',
        ]
      : [];
    return { figures, warnings };
  }
  // Compared, not worked out, when the others go in at the liquid temperature: the division
  // would differ from it in the 40th digit.
  const waterC = othersC.equals(liquidC)
    ? liquidC
    : waterTemperatureWith(
        liquidC,
        waterGrams,
        others.map((line) => ({ grams: line.grams, celsius: othersC })),
      );
  figures.push(
    temperature(
      'Water temperature',
      waterC,
      waterC.equals(liquidC)
        ? 'the same as the other liquids'
        : `colder than the other liquids, to make up for ${names} at 0 °C`,
    ),
  );
  return withIceShare(
    figures,
    planIce(waterC, tap, waterGrams, ` (${names} counted at ${celsius(othersC)})`),
  );
}

interface IcePlan {
  readonly fraction?: Decimal;
  readonly warnings: string[];
}

function withIceShare(figures: Figure[], ice: IcePlan): LiquidPlan {
  if (!ice.fraction) return { figures, warnings: ice.warnings };
  const share: Figure = {
    label: 'Ice share of the water',
    kind: 'percent',
    value: ice.fraction.times(HUNDRED),
    note: `(tap − water) ÷ (tap + ${ICE_MELT_DEGREES_C.toString()}), ice at 0 °C`,
  };
  return { figures: [...figures, share], warnings: ice.warnings, iceFraction: ice.fraction };
}

function planIce(
  waterC: Decimal,
  tap: Decimal | undefined,
  waterGrams: Decimal,
  counted: string,
): IcePlan {
  const belowFreezing = waterC.lessThan(ZERO);
  if (tap === undefined) {
    if (!belowFreezing) return { warnings: [] };
    return {
      warnings: [
        `The water would have to be ${celsius(waterC)}, below freezing: give --tap to work out ice, or chill the flour.`,
      ],
    };
  }
  if (!waterC.lessThan(tap)) return { warnings: [] };
  const fraction = iceFraction(tap, waterC);
  if (fraction.greaterThanOrEqualTo(ONE)) {
    const needed = waterGrams.isZero()
      ? ''
      : ` It would take ${waterGrams.times(fraction).toFixed(1)} g of ice, and there is ${waterGrams.toFixed(1)} g of water.`;
    return {
      warnings: [
        `The water alone cannot bring the dough to its temperature: it would have to be ${celsius(waterC)}${counted}, ` +
          `colder than even all ice makes it.${needed} Chill the flour (or the preferment) or mix in a cooler room; ` +
          'the water lines were left as they are.',
      ],
    };
  }
  const warnings = belowFreezing
    ? [
        `The water would have to be ${celsius(waterC)}, below freezing: part of the ice must melt in the mixer. ` +
          'Check the dough temperature at the end of mixing, or chill the flour.',
      ]
    : [];
  return { fraction, warnings };
}
