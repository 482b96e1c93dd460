import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { postscriptName, sfntOfWoff } from './woff-font.ts';

/** The two weights a sheet uses: regular text, and semibold for headings and what to weigh. */
export type FontWeight = 'regular' | 'semibold';

/** The Fira Sans subsets the console ships (Fontsource), in the order a character is looked for. */
const SUBSETS = ['latin', 'latin-ext'] as const;
type Subset = (typeof SUBSETS)[number];

const WEIGHT_FILE: Readonly<Record<FontWeight, string>> = { regular: '400', semibold: '600' };

/**
 * Characters neither subset has, spelled with ones they do. Formula files are free text, so a
 * name or a step may hold anything; the core's own sentences keep to these fonts.
 */
const SPELLED: Readonly<Record<string, string>> = {
  '→': '->',
  '←': '<-',
  '≤': '<=',
  '≥': '>=',
  '≠': '!=',
  '≈': '~',
  '✓': 'v',
  '⅓': '1/3',
  '⅔': '2/3',
};

const require = createRequire(import.meta.url);

const fonts = new Map<string, { data: Buffer; postscript: string | undefined }>();

/** A font of one weight and subset, found through the package's own exports, unwrapped (once). */
function font(weight: FontWeight, subset: Subset) {
  const key = `${subset}-${WEIGHT_FILE[weight]}`;
  let found = fonts.get(key);
  if (!found) {
    const file = require.resolve(`@fontsource/fira-sans/files/fira-sans-${key}-normal.woff`);
    const data = sfntOfWoff(readFileSync(file));
    found = { data, postscript: postscriptName(data) };
    fonts.set(key, found);
  }
  return found;
}

/**
 * The font of one weight and subset as a document is given it: the OpenType font inside the
 * package's WOFF file (woff-font.ts), read and unwrapped once for every sheet.
 */
export function fontData(weight: FontWeight, subset: Subset): Buffer {
  return font(weight, subset).data;
}

/**
 * The name a font is registered under in a document. The regular Latin font, which the document
 * opens first as its default, goes by the PostScript name inside it, as pdfkit keeps it: pdfkit
 * keeps a font under the name it is first asked for, and asked for under a second name it opens
 * the whole font again on every call (it finds it equal to the open one and returns before
 * keeping the name) — most of the time of a long report went there.
 */
export function fontName(weight: FontWeight, subset: Subset): string {
  const postscript = weight === 'regular' && subset === 'latin' && font(weight, subset).postscript;
  return postscript || `fira-${WEIGHT_FILE[weight]}-${subset}`;
}

/** Every font a sheet may use, to register with a document: name and data. */
export function sheetFonts(): { name: string; data: Buffer }[] {
  return (Object.keys(WEIGHT_FILE) as FontWeight[]).flatMap((weight) =>
    SUBSETS.map((subset) => ({ name: fontName(weight, subset), data: fontData(weight, subset) })),
  );
}

type Ranges = readonly (readonly [number, number])[];
let coverage: Readonly<Record<Subset, Ranges>> | undefined;

/** The code points each subset holds, from the unicode ranges Fontsource publishes. */
function subsetRanges(): Readonly<Record<Subset, Ranges>> {
  if (coverage) return coverage;
  const table = JSON.parse(
    readFileSync(require.resolve('@fontsource/fira-sans/unicode.json'), 'utf8'),
  ) as Record<string, string>;
  const parse = (text: string): Ranges =>
    text.split(',').map((part) => {
      const [low, high = low] = part.trim().replace(/^U\+/i, '').split('-');
      return [parseInt(low, 16), parseInt(high, 16)] as const;
    });
  coverage = { latin: parse(table.latin), 'latin-ext': parse(table['latin-ext']) };
  return coverage;
}

function subsetOf(char: string): Subset | undefined {
  const point = char.codePointAt(0) ?? 0;
  const ranges = subsetRanges();
  return SUBSETS.find((subset) =>
    ranges[subset].some(([low, high]) => point >= low && point <= high),
  );
}

/** Text the fonts can draw: known symbols spelled out, accents dropped, anything else "?". */
export function drawable(text: string): string {
  let out = '';
  for (const char of text) {
    if (subsetOf(char)) out += char;
    else if (SPELLED[char]) out += SPELLED[char];
    else {
      const bare = char.normalize('NFKD').replace(/\p{M}/gu, '');
      out += bare && [...bare].every((c) => subsetOf(c)) ? bare : '?';
    }
  }
  return out;
}

/** One stretch of text drawn with one font. */
export interface FontRun {
  readonly font: string;
  readonly text: string;
}

/**
 * Splits text into runs by the subset that holds each character (Latin, then Latin Extended for
 * names such as "kiełbasa"), after {@link drawable}. Spaces stay with the run they follow.
 */
export function fontRuns(text: string, weight: FontWeight): FontRun[] {
  const runs: { font: string; text: string }[] = [];
  for (const char of drawable(text)) {
    const subset = /\s/.test(char) && runs.length ? undefined : (subsetOf(char) ?? 'latin');
    const font = subset ? fontName(weight, subset) : runs[runs.length - 1].font;
    const last = runs[runs.length - 1];
    if (last && last.font === font) last.text += char;
    else runs.push({ font, text: char });
  }
  return runs;
}
