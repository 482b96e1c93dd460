import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** A PDF read back: its pages' text, each page's items joined by spaces, and its metadata. */
export interface PdfText {
  readonly pages: readonly string[];
  /** Each page's width and height, points, as the reader sees them (A4 is 595 × 842). */
  readonly sizes: readonly (readonly [number, number])[];
  readonly title: string;
  /** Every page's text, joined. */
  readonly all: string;
  /** Every piece of text as the reader found it, with its type size in points. */
  readonly items: readonly { readonly text: string; readonly size: number }[];
}

/**
 * Reads a PDF's text back with pdf.js (a reader independent of the library that wrote it), so a
 * test checks what a person opening the file sees, not what the writer was asked to draw.
 */
export async function pdfText(bytes: Uint8Array): Promise<PdfText> {
  const document = await getDocument({
    data: new Uint8Array(bytes),
    useSystemFonts: false,
    disableFontFace: true,
    isEvalSupported: false,
  }).promise;
  const pages: string[] = [];
  const items: { text: string; size: number }[] = [];
  const sizes: [number, number][] = [];
  for (let i = 1; i <= document.numPages; i++) {
    const page = await document.getPage(i);
    const { width, height } = page.getViewport({ scale: 1 });
    sizes.push([Math.round(width), Math.round(height)]);
    const content = await page.getTextContent();
    const words = content.items.map((item) => ('str' in item ? item.str : '')).filter(Boolean);
    for (const item of content.items)
      if ('str' in item && item.str.trim())
        // The text matrix's vertical scale is the type size of text set upright.
        items.push({ text: item.str, size: Math.abs(item.transform[3] as number) });
    // Runs of spaces collapse, so a test matches "10.7 g" however the writer split the line.
    pages.push(words.join(' ').replace(/\s+/g, ' '));
  }
  const { info } = await document.getMetadata();
  await document.destroy();
  return {
    pages,
    sizes,
    title: String((info as { Title?: string }).Title ?? ''),
    all: pages.join('\n'),
    items,
  };
}
