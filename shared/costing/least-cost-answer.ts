import type { LeastCostAnswer } from '../api/cost-record.ts';
import { formatPercent } from '../calculation/blend/blend-fat.ts';
import type { Decimal } from '../decimal.ts';
import { formatMass } from '../presentation/format-figure.ts';
import { moneyText } from '../presentation/money.ts';
import { FAT_STANDARDS, type FatStandardKey } from '../reference/fat-standards.ts';
import type { LeastCostBlend } from './least-cost-blend.ts';

/**
 * A least-cost blend as the API sends it and the command prints it: exact figures and their text
 * (weights metric, money to the cent, half-up), the standard in words.
 */
export function leastCostAnswer(
  blend: Extract<LeastCostBlend, { ok: true }>,
  ask: { targetFatPercent: Decimal; batchGrams: Decimal; standard?: FatStandardKey },
): LeastCostAnswer {
  const rule = ask.standard ? FAT_STANDARDS[ask.standard] : undefined;
  return {
    shares: blend.shares.map((share) => ({
      name: share.trim.name,
      fat: share.trim.fatPercent.toString(),
      grams: share.grams.toString(),
      weightText: formatMass(share.grams, 'metric'),
      cost: share.cost.toString(),
      costText: moneyText(share.cost),
    })),
    fat: ask.targetFatPercent.toString(),
    batchGrams: ask.batchGrams.toString(),
    batchText: formatMass(ask.batchGrams, 'metric'),
    cost: blend.cost.toString(),
    costText: moneyText(blend.cost),
    costPerKg: blend.costPerKg.toString(),
    costPerKgText: moneyText(blend.costPerKg),
    leftOut: blend.leftOut.map((trim) => trim.name),
    standard: rule
      ? `${rule.name}, ${rule.section}: at most ${formatPercent(rule.maxFatPercent)} fat`
      : null,
  };
}
