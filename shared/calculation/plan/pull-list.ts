import { HUNDRED, type Decimal } from '../../decimal.ts';
import type { BatchFormula } from '../../formula/formula-types.ts';
import type { AmountLine, CalcResult } from '../calc-result.ts';
import { OVERALL_FORMULA_TITLE } from '../dough/calculate-dough.ts';
import { BEFORE_TRIM, yieldStages } from '../yields.ts';
import type { BatchMaterial, PullItem } from './plan-types.ts';

/** One formula's raw materials, before they are added up across the plan. */
type RawItem = BatchMaterial;

function linesToItems(lines: readonly AmountLine[], formula: string): RawItem[] {
  return lines.map((line) => ({ name: line.name, grams: line.grams, formula }));
}

/** The pull-list name of a cure's green meat. */
export function greenMeatName(title: string): string {
  return `green meat for ${title}`;
}

/**
 * The raw materials of one batch:
 * - cure: "green meat for <title>" at the green weight (with the weight before trimming when the
 *   formula has a trim yield), and every line of the cure (salts, sugar, water…);
 * - dough: the overall formula's lines, so a preferment's flour and water are counted once;
 * - blend: the trimmings (before trimming, with a trim yield) and the seasoning;
 * - mix: every line.
 * @param green a cure's green weight, grams
 */
export function pullItemsOf(formula: BatchFormula, result: CalcResult, green?: Decimal): RawItem[] {
  const id = formula.id;
  switch (formula.kind) {
    case 'cure': {
      const meat: RawItem[] = [];
      if (green) {
        const beforeTrim = yieldStages(green, formula.yields).find((s) => s.step === BEFORE_TRIM);
        meat.push({
          name: greenMeatName(formula.title),
          grams: green,
          ...(beforeTrim ? { beforeTrimGrams: beforeTrim.grams } : {}),
          formula: id,
        });
      }
      return [
        ...meat,
        ...linesToItems(
          result.groups.flatMap((g) => g.lines),
          id,
        ),
      ];
    }
    case 'dough': {
      const overall =
        result.groups.find((g) => g.title === OVERALL_FORMULA_TITLE) ??
        result.groups.find((g) => !g.lines.some((line) => line.role === 'preferment'));
      return linesToItems(overall?.lines ?? [], id);
    }
    case 'blend': {
      const trim = formula.yields?.trim;
      return result.groups.flatMap((group) =>
        group.lines.map((line) => ({
          name: line.name,
          grams: line.grams,
          ...(line.role === 'component' && trim !== undefined
            ? { beforeTrimGrams: line.grams.times(HUNDRED).div(trim) }
            : {}),
          formula: id,
        })),
      );
    }
    case 'mix':
      return linesToItems(
        result.groups.flatMap((g) => g.lines),
        id,
      );
  }
}

/** The key an ingredient is added up under: its name without case or extra spaces. */
function keyOf(name: string): string {
  return name.trim().toLowerCase().replace(/\s+/g, ' ');
}

/**
 * Adds the raw materials of every batch up by ingredient name (ignoring case and spacing),
 * keeping the first spelling met, and sorts them by name. The weight before trimming adds up
 * the trimmed weight of the items that have no trim yield, so it is always the whole amount.
 */
export function sumPullList(items: readonly RawItem[]): PullItem[] {
  const byName = new Map<
    string,
    { name: string; grams: Decimal; beforeTrim?: Decimal; usedBy: string[] }
  >();
  for (const item of items) {
    const key = keyOf(item.name);
    const found = byName.get(key);
    if (!found) {
      byName.set(key, {
        name: item.name,
        grams: item.grams,
        ...(item.beforeTrimGrams ? { beforeTrim: item.beforeTrimGrams } : {}),
        usedBy: [item.formula],
      });
      continue;
    }
    const beforeTrim =
      found.beforeTrim || item.beforeTrimGrams
        ? (found.beforeTrim ?? found.grams).plus(item.beforeTrimGrams ?? item.grams)
        : undefined;
    found.grams = found.grams.plus(item.grams);
    if (beforeTrim) found.beforeTrim = beforeTrim;
    if (!found.usedBy.includes(item.formula)) found.usedBy.push(item.formula);
  }
  return [...byName.values()]
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((item) => ({
      name: item.name,
      grams: item.grams,
      ...(item.beforeTrim ? { beforeTrimGrams: item.beforeTrim } : {}),
      usedBy: item.usedBy,
    }));
}
