import { Decimal } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import {
  type ContentProblem,
  contentError,
  contentWarning,
} from '../../formula/formula-problem.ts';
import { FAT_AS_SUCH_ALTERNATIVE, FAT_STANDARDS } from '../../reference/fat-standards.ts';
import { parseMass } from '../../units/mass.ts';
import { QuantityError } from '../../units/quantity-error.ts';
import { fatFrom, formatPercent, unreachableMessage } from './blend-fat.ts';
import { isReachable } from './pearson-square.ts';

/** The fat of a component or target, or a problem when it gives neither fat nor lean, or both. */
function fatOrProblem(
  value: { fat?: number; lean?: number },
  path: (string | number)[],
  problems: ContentProblem[],
): Decimal | undefined {
  const hasFat = value.fat !== undefined;
  const hasLean = value.lean !== undefined;
  if (hasFat === hasLean) {
    problems.push(
      contentError(path, 'give either fat or lean (chemical lean), not both or neither'),
    );
    return undefined;
  }
  return fatFrom(value, path.join('.'));
}

function checkPortion(portion: string, problems: ContentProblem[]): void {
  try {
    const grams = parseMass(portion);
    if (!grams.greaterThan(0)) {
      problems.push(
        contentError(['portion'], `a portion must weigh more than 0 g, not "${portion}"`),
      );
    }
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    problems.push(contentError(['portion'], error.message));
  }
}

/**
 * Checks what the schema cannot about a blend formula: the component keys are unique, the
 * target lies between the leanest and fattest components (derived: a blend is a weighted mean),
 * the portion is a mass over 0 g, and the seasoning names are unique (ignoring case). Warns when
 * the target is over the fat standard the formula names, or a component is fat added as such
 * where the standard forbids it (ground beef, 9 CFR 319.15(a)).
 * @returns the problems found; none when the formula can be used
 */
export function checkBlendFormula(formula: BlendFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const seenKeys = new Set<string>();
  const fats: Decimal[] = [];
  formula.components.forEach((component, i) => {
    if (seenKeys.has(component.key)) {
      problems.push(
        contentError(
          ['components', i, 'key'],
          `the key "${component.key}" is used by two trimmings; give each its own key`,
        ),
      );
    }
    seenKeys.add(component.key);
    const fat = fatOrProblem(component, ['components', i], problems);
    if (fat) fats.push(fat);
  });
  const target = fatOrProblem(formula.target, ['target'], problems);
  // The blend's fat lies between its leanest and fattest component, whatever the amounts.
  if (target && fats.length === formula.components.length) {
    const low = Decimal.min(...fats);
    const high = Decimal.max(...fats);
    if (!isReachable(low, high, target)) {
      const message =
        fats.length === 2
          ? unreachableMessage(fats[0], fats[1], target)
          : `${formatPercent(target)} fat cannot be made from trimmings at ${formatPercent(low)} ` +
            `to ${formatPercent(high)} fat: the target must lie between them`;
      problems.push(contentError(['target'], message));
    }
  }

  if (target && formula.standard) {
    const standard = FAT_STANDARDS[formula.standard];
    if (target.greaterThan(standard.maxFatPercent)) {
      problems.push(
        contentWarning(
          ['target'],
          `the target of ${formatPercent(target)} fat is over the ${formatPercent(standard.maxFatPercent)} ` +
            `allowed for ${standard.product} (${standard.source})`,
        ),
      );
    }
  }

  if (formula.standard && FAT_STANDARDS[formula.standard].forbidsFatAsSuch) {
    const rule = FAT_STANDARDS[formula.standard];
    const other = FAT_STANDARDS[FAT_AS_SUCH_ALTERNATIVE];
    formula.components.forEach((component, i) => {
      if (!component.fat_as_such) return;
      problems.push(
        contentWarning(
          ['components', i, 'fat_as_such'],
          `${rule.name} may not have fat added as such (${rule.section}): a batch that takes ` +
            `"${component.name}" is refused; name the standard ${other.name} (${other.section}) ` +
            'if the product is sold as that',
        ),
      );
    });
  }

  if (formula.portion !== undefined) checkPortion(formula.portion, problems);

  const seen = new Set<string>();
  (formula.ingredients ?? []).forEach((ingredient, i) => {
    const name = ingredient.name.trim().toLowerCase();
    if (seen.has(name)) {
      problems.push(
        contentError(
          ['ingredients', i, 'name'],
          `"${ingredient.name}" is listed twice in the seasoning`,
        ),
      );
    }
    seen.add(name);
  });

  return problems;
}
