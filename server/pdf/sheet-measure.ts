// Texts measured for a sheet, remembered: a report repeats its words (control titles, limits,
// sources, people, times) on every batch, and lays itself out twice.
import { fontRuns, type FontRun, type FontWeight } from './sheet-fonts.ts';
import { wrapLines, type TextLine } from './sheet-text.ts';

/** The space between the lines of a text, points. */
export const LINE_GAP = 1.2;

/** A text's height in a width, and its lines. */
export interface Measured {
  readonly height: number;
  /** The lines of a text in one font, as pdfkit wraps them; undefined for a text in two. */
  readonly lines: readonly TextLine[] | undefined;
}

/** Kept short of growing without end over a long-running server's many sheets. */
const REMEMBERED_MOST = 20_000;

/** Texts already split into font runs, by weight and text. */
const split = new Map<FontWeight, Map<string, FontRun[]>>();
let splitCount = 0;

/** {@link fontRuns}, remembered. */
export function runsOf(text: string, weight: FontWeight): FontRun[] {
  let known = split.get(weight);
  if (!known) split.set(weight, (known = new Map()));
  let runs = known.get(text);
  if (!runs) {
    if (++splitCount > REMEMBERED_MOST) {
      split.clear();
      splitCount = 1;
      split.set(weight, (known = new Map()));
    }
    runs = fontRuns(text, weight);
    known.set(text, runs);
  }
  return runs;
}

/**
 * Texts already measured, by weight, size, width and text. Keyed a level at a time: a key made
 * of the width's digits and the text cost more than the measuring it saved.
 */
const measures = new Map<string, Map<number, Map<number, Map<string, Measured>>>>();
let measureCount = 0;

function measuresOf(weight: FontWeight, size: number, width: number): Map<string, Measured> {
  let bySize = measures.get(weight);
  if (!bySize) measures.set(weight, (bySize = new Map()));
  let byWidth = bySize.get(size);
  if (!byWidth) bySize.set(size, (byWidth = new Map()));
  let byText = byWidth.get(width);
  if (!byText) byWidth.set(width, (byText = new Map()));
  return byText;
}

/** The height and lines of a text in a weight, size and width on a document, remembered. */
export function measureText(
  doc: PDFKit.PDFDocument,
  text: string,
  weight: FontWeight,
  size: number,
  width: number,
): Measured {
  const known = measuresOf(weight, size, width);
  const found = known.get(text);
  if (found) return found;
  const runs = runsOf(text || ' ', weight);
  doc.font(runs[0].font).fontSize(size);
  let result: Measured;
  if (runs.length === 1) result = wrapLines(doc, runs[0].text, width, LINE_GAP);
  else {
    // Measured in the run's first font: the other subset differs only in a few letters.
    const joined = runs.map((run) => run.text).join('');
    result = { height: doc.heightOfString(joined, { width, lineGap: LINE_GAP }), lines: undefined };
  }
  if (++measureCount > REMEMBERED_MOST) {
    measures.clear();
    measureCount = 1;
    measuresOf(weight, size, width).set(text, result);
  } else known.set(text, result);
  return result;
}
