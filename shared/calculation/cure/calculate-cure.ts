import type { Decimal } from '../../decimal.ts';
import type { CureFormula, CureIngredient } from '../../formula/formula-types.ts';
import { CAUTIONS, allergenCaution } from '../../reference/cautions.ts';
import { CONCENTRATED_NITRITE_PCT, nitriteRuleFor } from '../../reference/nitrite-limits.ts';
import { collectAllergens } from '../allergens.ts';
import { cookingCaution } from '../cooking-caution.ts';
import { BatchError } from '../batch-error.ts';
import type { BatchInput } from '../batch-input.ts';
import type { CalcResult, Caution, Figure, Schedule } from '../calc-result.ts';
import { addDays } from '../dates.ts';
import { referenceFromFinished, yieldStages } from '../yields.ts';
import { brineCure } from './brine-cure.ts';
import { dryCure } from './dry-cure.ts';
import { holdSizeOf } from './hold-size.ts';
import { estimateHold } from './hold-time.ts';
import { checkIngoingLevels } from './nitrite-checks.ts';
import { pumpCure } from './pump-cure.ts';
import type { MethodOutcome } from './cure-lines.ts';

/**
 * Works out one cure batch: what to weigh, the ingoing nitrite against its limit, the hold time
 * and ready date, yields and cautions.
 * @throws BatchError when the batch sizes cannot make a batch
 */
export function calculateCure(formula: CureFormula, batch: BatchInput): CalcResult {
  const rule = nitriteRuleFor(formula.product, formula.method);
  if (!rule) {
    throw new BatchError(
      `a ${formula.product} product cannot be cured by the ${formula.method} method; use dry (mixed in)`,
    );
  }
  const { green, inputs } = greenWeight(formula, batch);
  const outcome = cureByMethod(formula, green, batch);
  const levels = {
    nitrite: outcome.ppm('nitrite'),
    nitrate: outcome.ppm('nitrate'),
    accelerator: outcome.ppm('accelerator'),
    basis: {
      nitrite: outcome.basis?.('nitrite'),
      nitrate: outcome.basis?.('nitrate'),
      accelerator: outcome.basis?.('accelerator'),
    },
  };
  const checks = checkIngoingLevels(rule, levels);

  const hold = estimateHold(formula, {
    thicknessMm: batch.thickness,
    largestPieceGrams: batch.largestPiece,
    brineStrength: outcome.heldInBrineStrength,
  });
  const warnings = [
    ...outcome.warnings,
    ...concentrationWarnings(formula),
    ...smallCuringSaltWarnings(outcome),
  ];
  let schedule: Schedule | undefined;
  let holdNeeds: CalcResult['holdNeeds'];
  if ('missing' in hold) {
    warnings.push(`No ready date: ${hold.missing}.`);
    holdNeeds = holdSizeOf(formula, outcome.heldInBrineStrength) ?? undefined;
  } else if (batch.start) {
    schedule = {
      start: batch.start,
      days: hold.days,
      ready: addDays(batch.start, hold.days),
      rule: `${hold.rule} (${hold.source})`,
      ...(formula.hold?.flip_every_days ? { flipEveryDays: formula.hold.flip_every_days } : {}),
    };
  }
  if (batch.thickness) inputs.push({ label: 'Thickness', kind: 'length', value: batch.thickness });
  if (batch.largestPiece)
    inputs.push({ label: 'Heaviest piece', kind: 'mass', value: batch.largestPiece });

  const allergens = collectAllergens(everyIngredient(formula).map((i) => i.allergens));
  const stages = yieldStages(green, formula.yields);
  return {
    formula: { id: formula.id, title: formula.title, kind: formula.kind },
    inputs: [...inputs, ...outcome.inputs],
    groups: outcome.groups,
    steps: formula.steps ?? [],
    figures: [
      {
        label: 'Ingoing sodium nitrite',
        kind: 'ppm',
        value: levels.nitrite,
        note: `on green weight, unrounded for the check${levels.basis.nitrite ? `; ${levels.basis.nitrite}` : ''}`,
      },
      ...(levels.accelerator.isZero()
        ? []
        : [
            {
              label: 'Ingoing ascorbate/erythorbate',
              kind: 'ppm' as const,
              value: levels.accelerator,
              ...(levels.basis.accelerator ? { note: levels.basis.accelerator } : {}),
            },
          ]),
      ...outcome.figures,
    ],
    checks,
    warnings,
    cautions: cureCautions(formula, allergens),
    allergens,
    ...(schedule ? { schedule } : {}),
    ...(holdNeeds ? { holdNeeds } : {}),
    ...(stages.length ? { yields: stages } : {}),
    ...(formula.notes ? { notes: formula.notes } : {}),
  };
}

function greenWeight(
  formula: CureFormula,
  batch: BatchInput,
): { green: Decimal; inputs: Figure[] } {
  if (batch.meat && batch.want)
    throw new BatchError('give either --meat or --want, not both', 'want');
  if (batch.meat)
    return {
      green: batch.meat,
      inputs: [{ label: 'Green weight', kind: 'mass', value: batch.meat }],
    };
  if (batch.want) {
    if (!formula.yields)
      throw new BatchError(
        'this formula has no yields, so --want cannot be worked back; give --meat',
        'want',
      );
    const green = referenceFromFinished(batch.want, formula.yields);
    return {
      green,
      inputs: [
        { label: 'Finished weight wanted', kind: 'mass', value: batch.want },
        {
          label: 'Green weight',
          kind: 'mass',
          value: green,
          note: "worked back through the formula's yields",
        },
      ],
    };
  }
  throw new BatchError(
    'say how much meat: --meat with the green (trimmed, uncured) weight',
    'meat',
  );
}

function cureByMethod(formula: CureFormula, green: Decimal, batch: BatchInput): MethodOutcome {
  switch (formula.method) {
    case 'dry':
      return dryCure(formula, green);
    case 'brine':
      return brineCure(formula, green, batch.water);
    case 'pump':
      return pumpCure(formula, green, { pump: batch.pump, pumpedWeight: batch.pumpedWeight });
  }
}

/** The formula's ingredients and its cover brine's, when it has one of its own make-up. */
function everyIngredient(formula: CureFormula): CureIngredient[] {
  return [...formula.ingredients, ...(formula.cover_brine ?? [])];
}

function concentrationWarnings(formula: CureFormula): string[] {
  return everyIngredient(formula)
    .filter((i) => CONCENTRATED_NITRITE_PCT.lessThan(i.nitrite ?? 0))
    .map(
      (i) =>
        `"${i.name}" is ${i.nitrite} % sodium nitrite, far stronger than a kitchen curing salt (about 6 %). Check the label; concentrated nitrite is a poisoning hazard.`,
    );
}

/** Below this a curing-salt line is hard to weigh well on a 0.1 g scale. (common practice, no source) */
const SMALLEST_WELL_WEIGHED_GRAMS = 1;

function smallCuringSaltWarnings(outcome: MethodOutcome): string[] {
  return outcome.groups
    .flatMap((group) => group.lines)
    .filter(
      (line) => line.role === 'curing-salt' && line.grams.lessThan(SMALLEST_WELL_WEIGHED_GRAMS),
    )
    .map(
      (line) =>
        `"${line.name}" comes to ${line.grams.toFixed(2)} g: a 0.1 g scale can be off by 5 % or more at that size. Weigh it on a 0.01 g scale, or make a larger batch.`,
    );
}

function cureCautions(formula: CureFormula, allergens: CalcResult['allergens']): Caution[] {
  const carriesCure = everyIngredient(formula).some(
    (i) => (i.nitrite ?? 0) > 0 || (i.nitrate ?? 0) > 0,
  );
  const allergen = allergenCaution(allergens);
  return [
    ...(carriesCure ? [CAUTIONS.curingSaltHandling] : []),
    CAUTIONS.nitriteOnGreenWeight,
    CAUTIONS.cureUnderRefrigeration,
    ...(formula.method === 'dry' ? [] : [CAUTIONS.brineStrengthSaltOnly]),
    ...(formula.method === 'pump' ? [CAUTIONS.injectedMeat] : []),
    CAUTIONS.curedMeatIsRaw,
    cookingCaution(formula.species, formula.product === 'comminuted' ? 'ground' : 'whole'),
    ...(allergen ? [allergen] : []),
    CAUTIONS.localCodes,
  ];
}
