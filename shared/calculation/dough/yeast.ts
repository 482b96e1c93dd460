import type { Decimal } from '../../decimal.ts';
import type { YeastKind } from '../../formula/formula-types.ts';
import {
  DEFAULT_YEAST_FACTORS,
  YEAST_KIND_LABEL,
  type YeastFactors,
} from '../../reference/yeast-factors.ts';
import type { DoughLine } from './dough-line.ts';

/**
 * Converts an amount of yeast from one kind to another by weight, through its fresh-yeast
 * equivalent. Works the same for grams and for baker's percentages.
 * @param amount the amount of the `from` kind
 * @param from the kind the amount is of
 * @param to the kind wanted
 * @param factors the conversion set; the published set (active dry 0.40, instant 0.33 × fresh)
 *   unless given
 * @example convertYeast(dec(30), 'fresh', 'instant') // 9.9
 */
export function convertYeast(
  amount: Decimal,
  from: YeastKind,
  to: YeastKind,
  factors: YeastFactors = DEFAULT_YEAST_FACTORS,
): Decimal {
  if (from === to) return amount;
  // Multiply before dividing: fresh → instant then stays an exact 0.33 × amount.
  return amount.times(factors.perGramFresh[to]).div(factors.perGramFresh[from]);
}

/** A yeast kind as it reads in a sentence: "instant yeast". */
export function yeastLabel(kind: YeastKind): string {
  return YEAST_KIND_LABEL[kind];
}

function capitalized(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * A dough line converted to another kind of yeast; lines that are not yeast, or already of that
 * kind, come back unchanged. The grams and the percentage convert alike, the name becomes the
 * new kind and the note says what the formula asked for.
 */
export function convertYeastLine(
  line: DoughLine,
  to: YeastKind,
  factors: YeastFactors = DEFAULT_YEAST_FACTORS,
): DoughLine {
  const from = line.yeast;
  if (from === undefined || from === to) return line;
  // Keep the formula's own name in the note unless it only repeats the kind ("instant yeast").
  const ownName = line.name.trim().toLowerCase() === yeastLabel(from) ? '' : ` (${line.name})`;
  return {
    ...line,
    name: capitalized(yeastLabel(to)),
    grams: convertYeast(line.grams, from, to, factors),
    percent: convertYeast(line.percent, from, to, factors),
    yeast: to,
    note: `converted from ${line.grams.toFixed(1)} g ${yeastLabel(from)}${ownName}, ${factors.name}`,
  };
}
