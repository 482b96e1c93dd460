import { Lexer } from 'yaml';
import type { FormulaProblem } from './formula-problem.ts';

/**
 * Largest formula text read, in bytes of UTF-8 (256 KiB). The largest formula the schema allows
 * (60 ingredients with ten allergens each named with its kind, 40 steps and 20 cautions of 500
 * characters, 4,000 characters of notes) is 72 kB in Latin letters and 186 kB in a script of
 * three-byte characters (tests/formulas/formula-limits-headroom.spec.ts); the demo formulas are
 * about 1 kB.
 * common practice, no source
 */
export const MAX_FORMULA_BYTES = 256 * 1024;

/**
 * Most levels of lists and sets of keys a formula's YAML may nest, the file's own keys being
 * level 1. Real formulas go five deep (keys → ingredients → one ingredient → its allergens → a
 * fish with its species); 32 leaves room for any hand-written file while the parser's work stays
 * small (it grows with the depth, and 127,000 levels ran the server's heap out).
 * common practice, no source
 */
export const MAX_YAML_DEPTH = 32;

/**
 * Most keys, values and list items a formula's YAML may hold, counting every scalar, alias and
 * collection, and every entry mark ("-", "?", ":", ","), so an empty item counts too. The
 * largest formula the schema allows counts 4,105 and the demo formulas 63 to 193; the parser's
 * time grows faster than the count (20,000 empty list items took it 1.5 s, 5,000 keys of one
 * map 1.3 s, on the 2-CPU development machine). common practice, no source
 */
export const MAX_YAML_NODES = 5000;

/** Most aliases a formula may expand; guards against "billion laughs" files. common practice, no source */
export const MAX_ALIAS_COUNT = 50;

/** What a file larger than MAX_FORMULA_BYTES is told, wherever its size is found out. */
export const TOO_LARGE_MESSAGE = `the file is larger than ${MAX_FORMULA_BYTES / 1024} KB; a formula is a few kilobytes`;

/** Which limit a text passes. */
export type YamlLimit = 'size' | 'depth' | 'nodes';

/** A text refused before parsing, with where the limit is passed (line 0 for the whole file). */
export interface YamlLimitProblem {
  readonly limit: YamlLimit;
  /** 1-based; 0 when the problem is the whole file (its size). */
  readonly line: number;
  /** 1-based; 0 with line 0. */
  readonly column: number;
  readonly message: string;
}

/** How deep a YAML text nests and how many nodes it holds, as the guard counts them. */
export interface YamlShape {
  /** The deepest nesting reached (the file's own keys are level 1). */
  readonly depth: number;
  readonly nodes: number;
  /** Where counting stopped because a limit was passed. */
  readonly over?: {
    readonly limit: 'depth' | 'nodes';
    readonly line: number;
    readonly column: number;
  };
}

/** The length of a text in UTF-8 bytes, as it is stored in a file; pure (no Buffer in the console). */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code < 0x80) bytes += 1;
    else if (code < 0x800) bytes += 2;
    else if (code >= 0xd800 && code <= 0xdbff && isLowSurrogate(text.charCodeAt(i + 1))) {
      // A surrogate pair is one character of four bytes.
      bytes += 4;
      i += 1;
    } else bytes += 3; // a lone surrogate is written as U+FFFD, three bytes
  }
  return bytes;
}

function isLowSurrogate(code: number): boolean {
  return code >= 0xdc00 && code <= 0xdfff;
}

// The lexer's own markers: they stand for no text of the file.
const SCALAR = '\x1f';
const DOCUMENT = '\x02';
const FLOW_END = '\x18';

/**
 * Measures a YAML text's nesting and node count from the yaml package's lexer tokens, fed one at
 * a time: the lexer reads quotes, comments and block scalars exactly as the parser will. Flow
 * collections ("[", "{") count one level each wherever they open; block collections are counted
 * by the column their first key or "- " stands at, as the parser nests them. Once a limit is
 * passed, feed() says so and counts nothing more.
 */
export class YamlShapeCounter {
  private offset = 0;
  private line = 1;
  private lineStart = 0;
  private flow = 0;
  // The block collections open around the current token: the column each stands at.
  private readonly blocks: { column: number; kind: 'seq' | 'map' }[] = [];
  private nodes = 0;
  private depth = 0;
  private atLineStart = true;
  // Where the node a ":" may turn into a key began, and whether one is about to begin.
  private nodeColumn = 0;
  private nodeNext = false;
  // The next token is a scalar's own text; the one after a block scalar header is its content.
  private scalarNext = false;
  private blockScalarNext = false;
  private over: YamlShape['over'];

  /** @param limits counting stops where the depth or the node count would pass these */
  constructor(
    private readonly limits: { readonly depth: number; readonly nodes: number } = {
      depth: MAX_YAML_DEPTH,
      nodes: MAX_YAML_NODES,
    },
  ) {}

  /** What has been counted so far, and where a limit was passed. */
  get shape(): YamlShape {
    return { depth: this.depth, nodes: this.nodes, ...(this.over && { over: this.over }) };
  }

  /**
   * Counts the next lexer token.
   * @returns false once a limit has been passed: the text must go no further
   */
  feed(token: string): boolean {
    if (this.over) return false;
    const source = this.scalarNext;
    this.scalarNext = false;
    if (!source && (token === SCALAR || token === DOCUMENT || token === FLOW_END)) {
      if (token === SCALAR) {
        this.scalarNext = true;
        // A block scalar's content starts on the next line, but it is no key: it closes nothing.
        if (this.blockScalarNext) this.blockScalarNext = false;
        else if (this.flow === 0 && (this.atLineStart || this.nodeNext)) this.startNode();
        this.count();
      } else if (token === FLOW_END) this.flow = 0;
    } else {
      if (!source) this.structure(token, this.offset - this.lineStart);
      this.offset += token.length;
      const newline = token.lastIndexOf('\n');
      if (newline !== -1) {
        for (let i = token.indexOf('\n'); i !== -1; i = token.indexOf('\n', i + 1)) this.line += 1;
        this.lineStart = this.offset - token.length + newline + 1;
        this.atLineStart = true;
      }
    }
    return this.over === undefined;
  }

  private count(): void {
    this.nodes += 1;
    if (this.nodes > this.limits.nodes && !this.over)
      this.over = { limit: 'nodes', line: this.line, column: this.offset - this.lineStart + 1 };
  }

  private deeper(column: number): void {
    const level = this.blocks.length + this.flow;
    this.depth = Math.max(this.depth, level);
    if (level > this.limits.depth && !this.over)
      this.over = { limit: 'depth', line: this.line, column: column + 1 };
  }

  private openSeq(column: number): void {
    const top = this.blocks[this.blocks.length - 1];
    if (top?.column === column && top.kind === 'seq') return;
    this.blocks.push({ column, kind: 'seq' });
    this.deeper(column);
  }

  private openMap(column: number): void {
    let top = this.blocks[this.blocks.length - 1];
    // A key at the column of a list ends that list: it was the value of the key before.
    if (top?.column === column && top.kind === 'seq') {
      this.blocks.pop();
      top = this.blocks[this.blocks.length - 1];
    }
    if (top?.column === column && top.kind === 'map') return;
    this.blocks.push({ column, kind: 'map' });
    this.deeper(column);
  }

  private startNode(): void {
    const column = this.offset - this.lineStart;
    if (this.atLineStart) {
      this.atLineStart = false;
      // A line less indented than open collections closes them.
      while (this.blocks.length > 0 && this.blocks[this.blocks.length - 1].column > column)
        this.blocks.pop();
    }
    this.nodeColumn = column;
    this.nodeNext = false;
  }

  /** One token that is text of the file (not a scalar's content). */
  private structure(token: string, column: number): void {
    const first = token[0];
    if (token === '' || first === '\n' || first === '\r' || first === ' ' || first === '\t') return;
    if (first === '#' || first === '%' || first === '\ufeff') return;
    if (token === '---' || token === '...') {
      // A new document starts from nothing; its nodes still count.
      this.blocks.length = 0;
      this.flow = 0;
      this.atLineStart = false;
      this.nodeNext = true;
      return;
    }
    if (this.flow > 0) {
      this.atLineStart = false;
      if (token === '[' || token === '{') {
        this.flow += 1;
        this.count();
        this.deeper(column);
      } else if (token === ']' || token === '}') this.flow -= 1;
      else if (first === '"' || first === "'" || first === '*' || token === ':' || token === ',')
        this.count();
      return;
    }
    switch (token) {
      case '-':
        this.startNode();
        this.count();
        this.openSeq(column);
        this.nodeNext = true;
        return;
      case '?':
        this.startNode();
        this.count();
        this.openMap(column);
        this.nodeNext = true;
        return;
      case ':':
        // At the start of a line, ":" gives the value of a "?" key at its own column.
        if (this.atLineStart) this.startNode();
        this.count();
        this.openMap(this.nodeColumn);
        this.nodeNext = true;
        return;
      case ']':
      case '}':
      case ',':
        // Stray outside a list or set of keys: the parser reports them; they nest nothing.
        this.atLineStart = false;
        return;
    }
    if (this.atLineStart || this.nodeNext) this.startNode();
    if (token === '[' || token === '{') {
      this.flow = 1;
      this.count();
      this.deeper(column);
    } else if (first === '"' || first === "'" || first === '*') this.count();
    else if (first === '|' || first === '>') this.blockScalarNext = true;
    // Anchors (&a) and tags (!t) come before a node, counted when it comes.
  }
}

/**
 * Measures a YAML text's nesting and node count (YamlShapeCounter over the yaml package's
 * lexer), without building anything; it stops at the first limit passed, so a hostile text
 * costs no more than the limit's worth.
 * @param limits counting stops where the depth or the node count would pass these
 */
export function yamlShape(
  text: string,
  limits?: { readonly depth: number; readonly nodes: number },
): YamlShape {
  const counter = new YamlShapeCounter(limits);
  for (const token of new Lexer().lex(text)) if (!counter.feed(token)) break;
  return counter.shape;
}

/** The size problem of a text larger than MAX_FORMULA_BYTES; undefined when it is not. */
export function sizeProblem(text: string): YamlLimitProblem | undefined {
  // A UTF-16 unit is at most three bytes: a shorter text cannot be too large and is not counted.
  if (text.length * 3 <= MAX_FORMULA_BYTES || utf8Length(text) <= MAX_FORMULA_BYTES)
    return undefined;
  return { limit: 'size', line: 0, column: 0, message: TOO_LARGE_MESSAGE };
}

/** The problem, in words a cook can act on, of a limit passed where the counter stopped. */
export function shapeProblem(over: NonNullable<YamlShape['over']>): YamlLimitProblem {
  const message =
    over.limit === 'depth'
      ? `the file nests lists and sets of keys more than ${MAX_YAML_DEPTH} levels deep here; a formula needs only a few`
      : `the file holds more than ${MAX_YAML_NODES.toLocaleString('en')} keys, values and list items; this is one too many, and a formula has a few hundred`;
  return { ...over, message };
}

/**
 * Whether a formula text is within what a formula can be: at most MAX_FORMULA_BYTES, nesting at
 * most MAX_YAML_DEPTH levels, at most MAX_YAML_NODES nodes. Checked before any parse, since
 * parsing is what a hostile text exhausts. Pure: no I/O, the same in the console.
 * @returns the problem, in words a cook can act on, or undefined when the text is within limits
 */
export function yamlLimitProblem(text: string): YamlLimitProblem | undefined {
  const size = sizeProblem(text);
  if (size) return size;
  const { over } = yamlShape(text);
  return over && shapeProblem(over);
}

/** A limit problem as a problem of the formula file `file`, as the reader and the API give it. */
export function limitFormulaProblem(problem: YamlLimitProblem, file: string): FormulaProblem {
  const { line, column, message } = problem;
  return { file, line, column, path: [], message, severity: 'error' };
}
