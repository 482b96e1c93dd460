import type { FontWeight } from './sheet-fonts.ts';
import { LINE_GAP, measureText, runsOf, type Measured } from './sheet-measure.ts';
import { drawLine, rememberColours, strokeLine } from './sheet-text.ts';

/** The sheet's palette: the console's warm rust, olive and paper tones, in print strength. */
export const INK = {
  text: '#2a211c',
  muted: '#6b5d54',
  rule: '#d9cbc2',
  rust: '#974824',
  rustTint: '#fbebe4',
  paper: '#f7f1ec',
  pass: '#3f5a1e',
  passTint: '#e3efcc',
  warn: '#7a4f00',
  warnTint: '#fbe7c0',
  fail: '#ba1a1a',
  failTint: '#ffdad6',
  white: '#ffffff',
  black: '#000000',
} as const;

/** How a piece of text is set. */
export interface TextStyle {
  readonly weight?: FontWeight;
  /** Size in points. */
  readonly size?: number;
  readonly color?: string;
  readonly align?: 'left' | 'right' | 'center';
}

/** A table column: its share of the width (points when `fixed`), and how its text aligns. */
export interface Column {
  readonly width: number;
  readonly fixed?: boolean;
  readonly align?: 'left' | 'right' | 'center';
}

/** Text in a cell, with an optional second line under it in its own style (a tag, a note). */
export interface CellText {
  readonly text: string;
  readonly style?: TextStyle;
  readonly sub?: { readonly text: string; readonly style?: TextStyle };
}

/** One table cell: text, or a box to tick when the line is weighed. */
export type Cell = string | CellText | 'tick-box';

/** A table row with its cells' text and style worked out, and its height. */
interface LaidRow {
  readonly row: Row;
  readonly cells: readonly (CellText | undefined)[];
  readonly height: number;
}

/** One table row. */
export interface Row {
  readonly cells: readonly Cell[];
  /** A background, e.g. the warm band of a curing-salt line. */
  readonly fill?: string;
  /** Set in semibold (a total). */
  readonly strong?: boolean;
  /** A heavier rule above the row (before a total). */
  readonly ruleAbove?: boolean;
  /** Kept on one page with the row before it: a total never stands alone. */
  readonly keepWithPrevious?: boolean;
}

/** Body text size, points. */
export const BODY = 9;
/** Small print: notes, sources, table headings, points. */
export const SMALL = BODY - 1;
const CELL_PAD_X = 5;
const CELL_PAD_Y = 2;
/** The side of a tick box, points. */
export const TICK = 9;

/**
 * Lays a sheet out down the page on a pdfkit document: text in the sheet's fonts, tables whose
 * header row repeats on every page they run onto, blocks kept together, and a running header on
 * every page after the first. Positions are top-down points, as pdfkit uses them.
 */
export class SheetLayout {
  /** Where the next block starts. */
  y: number;
  readonly left: number;
  readonly width: number;
  private readonly top: number;
  private readonly bottom: number;

  /**
   * @param doc the document, with its margins set to the area the sheet flows in
   * @param running draws the running header of every page after the first
   * @param counting lays out without drawing: a first pass that only counts the pages
   */
  constructor(
    readonly doc: PDFKit.PDFDocument,
    running: (layout: SheetLayout) => void,
    readonly counting = false,
  ) {
    const { margins, width, height } = doc.page;
    this.left = margins.left;
    this.width = width - margins.left - margins.right;
    this.top = margins.top;
    this.bottom = height - margins.bottom;
    this.y = doc.y;
    rememberColours(doc);
    // pdfkit adds a page itself when a text runs past the bottom; both ways start the same.
    doc.on('pageAdded', () => {
      this.y = this.top;
      running(this);
    });
  }

  /** The right edge of the text area. */
  get right(): number {
    return this.left + this.width;
  }

  /** Room left on this page, points. */
  get room(): number {
    return this.bottom - this.y;
  }

  /** Starts a new page when less than `height` is left on this one; says whether it did. */
  ensure(height: number): boolean {
    if (height <= this.room || this.y <= this.top + 1) return false;
    this.doc.addPage();
    return true;
  }

  /** Starts a new page, with its running header, unless this one is still empty. */
  newPage(): void {
    if (this.y > this.top + 1) this.doc.addPage();
  }

  /** Moves down. */
  gap(points: number): void {
    this.y = Math.min(this.y + points, this.bottom);
  }

  /** The height a text takes in a width. */
  measure(text: string, style: TextStyle, width: number): number {
    return this.measured(text, style, width).height;
  }

  /**
   * Where the last line of a text in a width starts, down from its top, and how wide it is; for
   * a text in two fonts, undefined (its lines are not known).
   */
  lastLine(
    text: string,
    style: TextStyle,
    width: number,
  ): { top: number; width: number } | undefined {
    const { height, lines } = this.measured(text, style, width);
    const last = lines?.[lines.length - 1];
    return last && lines
      ? { top: (height * (lines.length - 1)) / lines.length, width: last.width }
      : undefined;
  }

  /** The width a text takes on one line, points. */
  widthOf(text: string, style: TextStyle): number {
    const line = this.measured(text, style, 10_000).lines?.[0];
    return line ? line.width : this.doc.widthOfString(text);
  }

  private measured(text: string, style: TextStyle, width: number): Measured {
    return measureText(this.doc, text, style.weight ?? 'regular', style.size ?? BODY, width);
  }

  /** Draws text at a place without moving the flow; returns its height. */
  draw(text: string, style: TextStyle, x: number, y: number, width: number): number {
    if (this.counting) return text ? this.measure(text, style, width) : 0;
    const runs = runsOf(text, style.weight ?? 'regular');
    if (!runs.length) return 0;
    const doc = this.doc.fillColor(style.color ?? INK.text).fontSize(style.size ?? BODY);
    const { height, lines } = this.measured(text, style, width);
    // A text in one font is placed line by line as pdfkit wrapped it when it was measured,
    // unless it runs past the foot of the page, where pdfkit would go on on the next one.
    if (lines && (lines.length === 1 || y + height <= this.bottom)) {
      doc.font(runs[0].font);
      const step = doc.currentLineHeight(true) + LINE_GAP;
      lines.forEach((line, i) => {
        const shift =
          style.align === 'right'
            ? width - line.width
            : style.align === 'center'
              ? (width - line.wrapped) / 2
              : 0;
        drawLine(doc, line.text, x + shift, y + i * step);
      });
      return height;
    }
    const options = { width, align: style.align ?? 'left', lineGap: LINE_GAP } as const;
    runs.forEach((run, i) => {
      const continued = i < runs.length - 1;
      doc.font(run.font);
      if (i === 0) doc.text(run.text, x, y, { ...options, continued });
      else doc.text(run.text, { ...options, continued });
    });
    return height;
  }

  /** A paragraph in the flow, indented by `indent`; moves past it. */
  paragraph(text: string, style: TextStyle = {}, { indent = 0, after = 4 } = {}): void {
    const width = this.width - indent;
    this.ensure(this.measure(text, style, width));
    this.y += this.draw(text, style, this.left + indent, this.y, width) + after;
  }

  /** A thin line across the text area (or from `from` to `to`). */
  rule(color: string = INK.rule, weight = 0.6, from = this.left, to = this.right): void {
    if (this.counting) return;
    strokeLine(this.doc, [from, this.y], [to, this.y], weight, color);
  }

  /** A box to tick, drawn (not a character), with its top-left corner at x, y. */
  tickBox(x: number, y: number): void {
    if (this.counting) return;
    this.doc.lineWidth(0.8).strokeColor(INK.text).rect(x, y, TICK, TICK).stroke();
  }

  /** Column edges in points across a width from the left edge. */
  private columnEdges(columns: readonly Column[], tableWidth: number): number[] {
    const fixed = columns.reduce((total, c) => total + (c.fixed ? c.width : 0), 0);
    const shares = columns.reduce((total, c) => total + (c.fixed ? 0 : c.width), 0);
    const edges = [this.left];
    for (const column of columns) {
      const width = column.fixed ? column.width : ((tableWidth - fixed) * column.width) / shares;
      edges.push(edges[edges.length - 1] + width);
    }
    return edges;
  }

  /** A cell's text and style as drawn in a row, or undefined for a tick box. */
  private cellText(cell: Cell, row: Row, column: Column): CellText | undefined {
    if (cell === 'tick-box') return undefined;
    const content = typeof cell === 'string' ? { text: cell } : cell;
    const style: TextStyle = {
      ...(row.strong ? { weight: 'semibold' } : {}),
      align: column.align ?? 'left',
      ...content.style,
    };
    return { ...content, style };
  }

  /** Draws (or, with `measureOnly`, measures) a cell's text; returns its height. */
  private cellBlock(
    content: CellText,
    x: number,
    y: number,
    width: number,
    measureOnly: boolean,
  ): number {
    const style = content.style ?? {};
    let height = measureOnly
      ? this.measure(content.text, style, width)
      : this.draw(content.text, style, x, y, width);
    if (content.sub) {
      const subStyle = { align: style.align, ...content.sub.style };
      height += measureOnly
        ? this.measure(content.sub.text, subStyle, width)
        : this.draw(content.sub.text, subStyle, x, y + height, width);
    }
    return height;
  }

  /** A row ready to lay out: its cells' text and style, once, and its height. */
  private laidRow(row: Row, columns: readonly Column[], edges: readonly number[]): LaidRow {
    const cells = row.cells.map((cell, i) => this.cellText(cell, row, columns[i]));
    let height = TICK;
    cells.forEach((content, i) => {
      if (!content) return;
      const width = edges[i + 1] - edges[i] - 2 * CELL_PAD_X;
      height = Math.max(height, this.cellBlock(content, 0, 0, width, true));
    });
    return { row, cells, height: height + 2 * CELL_PAD_Y };
  }

  private drawRow({ row, cells, height }: LaidRow, edges: readonly number[]): void {
    const doc = this.doc;
    const [from, to] = [edges[0], edges[edges.length - 1]];
    if (row.fill && !this.counting)
      doc
        .rect(from, this.y, to - from, height)
        .fillColor(row.fill)
        .fill();
    if (row.ruleAbove) this.rule(INK.text, 0.9, from, to);
    cells.forEach((content, i) => {
      const x = edges[i] + CELL_PAD_X;
      const width = edges[i + 1] - edges[i] - 2 * CELL_PAD_X;
      if (row.cells[i] === 'tick-box') {
        this.tickBox(edges[i] + (edges[i + 1] - edges[i] - TICK) / 2, this.y + CELL_PAD_Y + 1);
        return;
      }
      if (content) this.cellBlock(content, x, this.y + CELL_PAD_Y, width, false);
    });
    this.y += height;
    if (!row.ruleAbove) this.rule(INK.rule, 0.4, from, to);
  }

  /**
   * A table: the header row, then the rows, each kept whole. When a row does not fit, the table
   * goes on on the next page under `continued` (its title) and the header row again.
   * @param options.width the table's width, points (the text width by default)
   */
  table(
    columns: readonly Column[],
    header: Row | undefined,
    rows: readonly Row[],
    { continued, width = this.width }: { continued?: () => void; width?: number } = {},
  ): void {
    const edges = this.columnEdges(columns, width);
    const head = header && this.laidRow(header, columns, edges);
    const drawHeader = (): void => {
      if (head) this.drawRow(head, edges);
    };
    const laid = rows.map((row) => this.laidRow(row, columns, edges));
    // The header never stands alone at the foot of a page.
    this.ensure((head?.height ?? 0) + (laid[0]?.height ?? 0));
    drawHeader();
    laid.forEach((line, i) => {
      const kept = laid[i + 1]?.row.keepWithPrevious ? laid[i + 1].height : 0;
      if (this.ensure(line.height + kept)) {
        continued?.();
        drawHeader();
      }
      this.drawRow(line, edges);
    });
  }
}
