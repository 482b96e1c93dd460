import PDFDocument from 'pdfkit';
import type { UnitSystem } from '../../shared/index.ts';
import { fontData, fontName, sheetFonts } from './sheet-fonts.ts';
import { BODY, INK, SheetLayout } from './sheet-layout.ts';
import { shareLayouts } from './sheet-text.ts';

/**
 * Margins of the area the sheet flows in, points (about 8 mm at the top, 13 mm at the sides:
 * wider than office printers leave unprinted; the foot leaves room for the footer).
 */
const MARGINS = { top: 24, bottom: 42, left: 36, right: 36 };
/** Where the footer's text sits, from the bottom edge of the page, points. */
const FOOTER_FROM_BOTTOM = 26;

/** What a sheet's document needs to know before its first page. */
export interface SheetSetup {
  /** The document title (PDF metadata) and the running header of later pages. */
  readonly title: string;
  readonly subject: string;
  /** US units print on Letter paper, metric on A4. */
  readonly units: UnitSystem;
  /** The date the file says it was made: a fixed day of the batch, so the same input gives the same file. */
  readonly created: string;
  /** The lot code (or words for none), printed in every footer and running header. */
  readonly lot: string;
  /** The right-hand side of the running header; "Lot LOT" by default. */
  readonly running?: string;
}

/** A day YYYY-MM-DD as a Date at midnight UTC. */
function utcDay(day: string): Date {
  const [year, month, date] = day.split('-').map(Number);
  return new Date(Date.UTC(year, month - 1, date));
}

/**
 * Opens a sheet: an A4 (or Letter) document with Fira Sans, the metadata, and a layout whose
 * later pages start with a running header of the title and lot.
 */
export function openSheet(setup: SheetSetup): SheetLayout {
  return sheetLayout(setup, true, false);
}

/** A page of a size of its own (a label), points, and the margins of the area it flows in. */
export interface PageSize {
  readonly size: readonly [number, number];
  readonly margins: typeof MARGINS;
}

/** A document in the sheet's fonts with its metadata, on A4 or Letter paper or a page of its own. */
function sheetDocument(
  setup: SheetSetup,
  bufferPages: boolean,
  page?: PageSize,
): PDFKit.PDFDocument {
  const doc = new PDFDocument({
    size: page ? [...page.size] : setup.units === 'us' ? 'LETTER' : 'A4',
    margins: page?.margins ?? MARGINS,
    bufferPages,
    // The sheet's own font from the start, so pdfkit never loads its built-in Helvetica. pdfkit
    // takes a font's data here as in registerFont, though its types name only a file.
    font: fontData('regular', 'latin') as unknown as string,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: setup.title,
      Subject: setup.subject,
      Author: 'Larderbook',
      Creator: 'Larderbook',
      CreationDate: utcDay(setup.created),
    },
  });
  const fonts = sheetFonts();
  for (const { name, data } of fonts) doc.registerFont(name, data);
  shareLayouts(
    doc,
    fonts.map((f) => f.name),
  );
  doc.font(fontName('regular', 'latin'));
  return doc;
}

/**
 * Opens a label: one page of its own size in the sheet's fonts, with no running header or
 * footer. Read its bytes with {@link finishLabel}.
 */
export function openLabel(setup: SheetSetup, page: PageSize): SheetLayout {
  return new SheetLayout(sheetDocument(setup, false, page), () => undefined);
}

/** Ends a label's document and returns its bytes. */
export function finishLabel(layout: SheetLayout): Promise<Buffer> {
  return documentBytes(layout.doc);
}

function sheetLayout(setup: SheetSetup, bufferPages: boolean, counting: boolean): SheetLayout {
  const doc = sheetDocument(setup, bufferPages);
  return new SheetLayout(
    doc,
    (layout) => {
      layout.draw(
        setup.title,
        { size: 8, color: INK.muted },
        layout.left,
        layout.y,
        layout.width * 0.7,
      );
      layout.draw(
        setup.running ?? `Lot ${setup.lot}`,
        { size: 8, color: INK.muted, weight: 'semibold', align: 'right' },
        layout.left,
        layout.y,
        layout.width,
      );
      layout.gap(12);
      layout.rule();
      layout.gap(8);
    },
    counting,
  );
}

/** Draws the footer "Larderbook · LOT · page N of M" at the foot of the current page. */
function footer(layout: SheetLayout, text: string): void {
  const { doc } = layout;
  const page = doc.page;
  const keep = page.margins.bottom;
  // Text below the bottom margin would make pdfkit start a page of its own.
  page.margins.bottom = 0;
  const y = page.height - FOOTER_FROM_BOTTOM;
  doc
    .moveTo(layout.left, y - 6)
    .lineTo(layout.right, y - 6)
    .lineWidth(0.4)
    .strokeColor(INK.rule)
    .stroke();
  doc
    .font(fontName('regular', 'latin'))
    .fontSize(BODY - 1.5)
    .fillColor(INK.muted)
    .text(text, layout.left, y, { width: layout.width, lineBreak: false });
  page.margins.bottom = keep;
}

/**
 * Opens a sheet written page by page: each page goes out as soon as the next one starts, with
 * its footer "Larderbook · LOT · page N of M" drawn first, so a long report never sits in memory
 * whole. The page count M comes from a first pass ({@link countingSheet}) over the same layout.
 * Read the bytes from `layout.doc` (a readable stream) and end it with {@link endStreamedSheet}.
 */
export function openStreamedSheet(setup: SheetSetup, pages: number): SheetLayout {
  const layout = sheetLayout(setup, false, false);
  const { doc } = layout;
  const addPage = doc.addPage.bind(doc);
  let page = 1;
  doc.addPage = (options) => {
    // pdfkit may start a page in the middle of a text: it goes on in its own font and size.
    const { _font: font, _fontSize: size, x, y } = doc as unknown as Record<string, never>;
    footer(layout, footerWords(setup.lot, page++, pages));
    Object.assign(doc, { _font: font, _fontSize: size, x, y });
    return addPage(options);
  };
  streamedPages.set(layout, { lot: setup.lot, page: () => page });
  return layout;
}

/** A streamed or counting sheet's lot words and the page it is on. */
const streamedPages = new WeakMap<SheetLayout, { lot: string; page: () => number }>();

function footerWords(lot: string, page: number, pages: number): string {
  return `Larderbook · ${lot} · page ${page} of ${pages}`;
}

/** Draws the last page's footer of a streamed sheet and ends its document. */
export function endStreamedSheet(layout: SheetLayout, pages: number): void {
  const streamed = streamedPages.get(layout);
  footer(layout, footerWords(streamed?.lot ?? '', streamed?.page() ?? pages, pages));
  layout.doc.end();
}

/**
 * Opens a sheet that only counts its pages: the same layout, measured and never drawn, its
 * document's bytes thrown away. Lay the sheet out on it, then read {@link countedPages}.
 */
export function countingSheet(setup: SheetSetup): SheetLayout {
  const layout = sheetLayout(setup, false, true);
  let pages = 1;
  layout.doc.on('pageAdded', () => pages++);
  layout.doc.on('data', () => undefined);
  streamedPages.set(layout, { lot: setup.lot, page: () => pages });
  return layout;
}

/** The pages a counting sheet has laid out, and ends it. */
export function countedPages(layout: SheetLayout): number {
  const pages = streamedPages.get(layout)?.page() ?? 1;
  layout.doc.end();
  return pages;
}

/**
 * Writes the footer "Larderbook · LOT · page N of M" on every page, ends the document and
 * returns its bytes.
 */
export function finishSheet(layout: SheetLayout, lot: string): Promise<Buffer> {
  const { doc } = layout;
  const { start, count } = doc.bufferedPageRange();
  for (let i = start; i < start + count; i++) {
    doc.switchToPage(i);
    footer(layout, footerWords(lot, i - start + 1, count));
  }
  return documentBytes(doc);
}

/** Ends a document and resolves with its bytes. */
function documentBytes(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
