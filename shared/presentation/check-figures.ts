import { Decimal } from '../decimal.ts';
import type { LimitCheck } from '../calculation/calc-result.ts';
import { formatPercent, formatPpm } from './format-figure.ts';

function formatInUnit(value: Decimal, unit: LimitCheck['unit']): string {
  return unit === 'ppm' ? formatPpm(value) : formatPercent(value);
}

/** A check's value as printed: to 0.1 ppm (or as a percentage). */
export function shownValue(check: LimitCheck): string {
  return formatInUnit(check.value, check.unit);
}

/**
 * The value as printed beside its limit. Where rounding would tell a different story from the
 * exact comparison (156.25 printed as 156.3 beside a 156.25 ceiling it meets, or 200.0006 printed
 * as 200.0 beside a 200 ppm ceiling it exceeds), the exact figure that decided follows.
 */
export function valueBesideLimit(check: LimitCheck): string {
  const shown = shownValue(check);
  const rounded = new Decimal(shown.split(' ')[0]);
  if (rounded.comparedTo(check.limit) === check.value.comparedTo(check.limit)) return shown;
  return `${shown} (${check.value.toDecimalPlaces(4).toString()} unrounded)`;
}

/** The limit as printed: its figure in full, unrounded. */
export function limitFigure(check: LimitCheck): string {
  return check.unit === 'ppm' ? `${check.limit.toString()} ppm` : `${check.limit.toString()} %`;
}

/** The limit with the rule's own ratio beside it: "156.25 ppm (¼ oz per 100 lb chopped meat)". */
export function limitInWords(check: LimitCheck): string {
  const figure = limitFigure(check);
  return check.limitBasis ? `${figure} (${check.limitBasis})` : figure;
}

/**
 * A failed check as one line of a refusal or a formula problem: "critical limit exceeded:
 * ingoing sodium nitrite 250.0 ppm is over 200 ppm for dry-cured bacon (9 CFR 424.22(b)…)", or
 * for a level the rule requires, "critical limit not met: … is under the 550 ppm required for …".
 * A check that is not critical reads the same without the headline.
 */
export function checkProblem(check: LimitCheck): string {
  // The label follows other words: its first letter in lower case, the rest (FSIS…) as written.
  const label = check.label.charAt(0).toLowerCase() + check.label.slice(1);
  const figure = `${label} ${valueBesideLimit(check)}`;
  const limit = limitInWords(check);
  const because = `for ${check.rule} (${check.source})`;
  let sentence: string;
  if (check.comparison === 'at-most') sentence = `${figure} is over ${limit} ${because}`;
  else if (check.status === 'fail')
    sentence = `${figure} is under the ${limit} required ${because}`;
  else sentence = `${figure} is below ${limit} (${check.source})`;
  if (!check.critical || check.status !== 'fail') return sentence;
  const headline =
    check.comparison === 'at-most' ? 'critical limit exceeded' : 'critical limit not met';
  return `${headline}: ${sentence}`;
}
