// Text and colour on a pdfkit page, written the way pdfkit writes them, with less work for the
// many short texts of a long report: lines wrapped once, glyph runs encoded once per document,
// a colour set only when it changes.

/** pdfkit's internals these helpers use (pdfkit 0.20; see node_modules/pdfkit/js/pdfkit.node.mjs). */
interface PdfkitInternals {
  x: number;
  y: number;
  _font: PdfkitFont;
  _fontSize: number;
  page: { height: number; fonts: Record<string, unknown> };
  _text(
    text: string,
    x: number,
    y: number,
    options: object,
    line: (text: string, options: { textWidth?: number }) => void,
  ): void;
}

interface PdfkitFont {
  readonly id: string;
  /** Each word laid out, by its text (pdfkit's EmbeddedFont). */
  layoutCache: object;
  readonly ascender: number;
  encode(text: string): [string[], GlyphPosition[]];
  ref(): unknown;
}

interface GlyphPosition {
  readonly xAdvance: number;
  readonly advanceWidth: number;
  readonly xOffset: number;
  readonly yOffset: number;
}

const internals = (doc: PDFKit.PDFDocument): PdfkitInternals => doc as unknown as PdfkitInternals;

/** A number as pdfkit writes it into a page: rounded to 6 places. */
const number = (n: number): number => Math.round(n * 1e6) / 1e6;

/** One line of a wrapped text. */
export interface TextLine {
  readonly text: string;
  /** Its width with trailing spaces left out (what a right-aligned line is set by). */
  readonly width: number;
  /** The width pdfkit's line wrapper gave it (what a centred line is set by). */
  readonly wrapped: number;
}

/**
 * Wraps a text in a width in the document's current font and size with pdfkit's own line
 * wrapper, as `heightOfString` does, and keeps the lines: drawn later one by one, they fall
 * where pdfkit would have put them.
 */
export function wrapLines(
  doc: PDFKit.PDFDocument,
  text: string,
  width: number,
  lineGap: number,
): { lines: TextLine[]; height: number } {
  const d = internals(doc);
  const { x, y } = d;
  const lines: TextLine[] = [];
  d._text(text, x, y, { width, lineGap, height: Infinity }, (line, options) => {
    lines.push({
      text: line,
      width: doc.widthOfString(line.replace(/\s+$/, '')),
      wrapped: options.textWidth ?? 0,
    });
    d.y += doc.currentLineHeight(true) + lineGap;
  });
  const height = d.y - y;
  d.x = x;
  d.y = y;
  return { lines, height };
}

/** Words laid out in each font (glyphs and advances), shared by every document, by font name. */
const layouts = new Map<string, { cache: object; documents: number }>();
/** Documents a font's laid-out words are kept for before they start over. */
const LAYOUTS_FOR = 50;

/**
 * Opens each of a document's fonts with the words already laid out in it by earlier documents.
 * pdfkit lays out (shapes, kerns) every word of a text in the font and keeps the result for the
 * document only; a report lays out the same words in two documents, and the next report again.
 * The glyphs and advances of a word depend on the font alone, not on the document.
 */
export function shareLayouts(doc: PDFKit.PDFDocument, names: readonly string[]): void {
  for (const name of names) {
    let shared = layouts.get(name);
    if (!shared || shared.documents >= LAYOUTS_FOR)
      layouts.set(name, (shared = { cache: Object.create(null) as object, documents: 0 }));
    shared.documents++;
    doc.font(name);
    internals(doc)._font.layoutCache = shared.cache;
  }
}

/** Glyph runs already encoded, by font (one document's) and text: `[<…> n …] TJ` lines. */
const encodedRuns = new WeakMap<PdfkitFont, Map<string, string | null>>();
/** Kept short of growing without end: a month's report has many texts seen once. */
const ENCODED_MOST = 20_000;

/**
 * A text's glyph runs as pdfkit's `_fragment` writes them (TJ operators with their kerning), or
 * null when a glyph is moved off its line (marks): that text is left to pdfkit.
 */
function encodedRun(font: PdfkitFont, text: string): string | null {
  let known = encodedRuns.get(font);
  if (!known) encodedRuns.set(font, (known = new Map()));
  const found = known.get(text);
  if (found !== undefined) return found;
  const [encoded, positions] = font.encode(text);
  const commands: string[] = [];
  let last = 0;
  const segment = (cur: number): void => {
    if (last < cur) {
      const kern = positions[cur - 1].xAdvance - positions[cur - 1].advanceWidth;
      commands.push(`<${encoded.slice(last, cur).join('')}> ${number(-kern)}`);
    }
    last = cur;
  };
  let run: string | null = null;
  if (!positions.some((p) => p.xOffset || p.yOffset)) {
    positions.forEach((p, i) => {
      if (p.xAdvance - p.advanceWidth !== 0) segment(i + 1);
    });
    segment(positions.length);
    run = commands.length ? `[${commands.join(' ')}] TJ` : '';
  }
  if (known.size >= ENCODED_MOST) known.clear();
  known.set(text, run);
  return run;
}

/**
 * Draws one line of text with its top-left corner at x, y in the document's current font, size
 * and fill colour, writing the same operators as pdfkit's `text(…, { lineBreak: false })` in one
 * go; the glyphs of a text already drawn in this document are not encoded again.
 */
export function drawLine(doc: PDFKit.PDFDocument, text: string, x: number, y: number): void {
  const d = internals(doc);
  const line = text.replace(/\n/g, '');
  if (!line) return;
  const font = d._font;
  const run = encodedRun(font, line);
  if (run === null) {
    doc.text(line, x, y, { lineBreak: false });
    return;
  }
  const { page } = d;
  page.fonts[font.id] ??= font.ref();
  const size = d._fontSize;
  const top = page.height - y - (font.ascender / 1000) * size;
  write(
    doc,
    `q\n1 0 0 -1 0 ${number(page.height)} cm\nBT\n1 0 0 1 ${number(x)} ${number(top)} Tm\n` +
      `/${font.id} ${number(size)} Tf\n${run}${run ? '\n' : ''}ET\nQ`,
  );
}

/**
 * Adds operators to the page's content as bytes, as pdfkit's `addContent` would (a line each),
 * but converted by Node at once rather than by pdfkit a character at a time. They are ASCII.
 */
function write(doc: PDFKit.PDFDocument, operators: string): void {
  doc.addContent(Buffer.from(`${operators}\n`, 'latin1'));
}

/**
 * Sets fill and stroke colours only when they change: pdfkit writes the colour again for every
 * text and rule. What is set is forgotten on a new page (or on going back to one) and restored
 * with the graphics state.
 */
export function rememberColours(doc: PDFKit.PDFDocument): void {
  let fill: unknown;
  let stroke: unknown;
  const stack: [unknown, unknown][] = [];
  const fillColor = doc.fillColor.bind(doc);
  const strokeColor = doc.strokeColor.bind(doc);
  const save = doc.save.bind(doc);
  const restore = doc.restore.bind(doc);
  doc.fillColor = (color, opacity) => {
    if (opacity !== undefined || typeof color !== 'string') fill = undefined;
    else if (color === fill) return doc;
    else fill = color;
    return fillColor(color, opacity);
  };
  doc.strokeColor = (color, opacity) => {
    if (opacity !== undefined || typeof color !== 'string') stroke = undefined;
    else if (color === stroke) return doc;
    else stroke = color;
    return strokeColor(color, opacity);
  };
  doc.save = () => {
    stack.push([fill, stroke]);
    return save();
  };
  doc.restore = () => {
    [fill, stroke] = stack.pop() ?? [undefined, undefined];
    return restore();
  };
  doc.on('pageAdded', () => {
    fill = undefined;
    stroke = undefined;
  });
  // Going back to a page (to write its footer) finds it in the colours its own text left.
  const switchToPage = doc.switchToPage.bind(doc);
  doc.switchToPage = (page) => {
    fill = undefined;
    stroke = undefined;
    return switchToPage(page);
  };
}

/** A straight line from one point to another, as pdfkit's moveTo, lineTo, lineWidth and stroke write it. */
export function strokeLine(
  doc: PDFKit.PDFDocument,
  [x1, y1]: readonly [number, number],
  [x2, y2]: readonly [number, number],
  weight: number,
  color: string,
): void {
  doc.strokeColor(color);
  write(
    doc,
    `${number(x1)} ${number(y1)} m\n${number(x2)} ${number(y2)} l\n${number(weight)} w\nS`,
  );
}
