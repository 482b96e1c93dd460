import { Lexer } from 'yaml';
import type { FormulaProblem } from './formula-problem.ts';

/**
 * Largest formula text read, in bytes of UTF-8 (256 KiB). The largest formula the schema allows
 * (60 ingredients with every allergen, 40 steps and 20 cautions of 500 characters, 4,000
 * characters of notes) is 46 kB in Latin letters and 124 kB in a script of three-byte
 * characters (tests/formulas/formula-limits-headroom.spec.ts); the demo formulas are about 1 kB.
 * common practice, no source
 */
export const MAX_FORMULA_BYTES = 256 * 1024;

/**
 * Most levels of lists and sets of keys a formula's YAML may nest, the file's own keys being
 * level 1. Real formulas go four deep (keys → ingredients → one ingredient → its allergens);
 * 32 leaves room for any hand-written file while the parser's work stays small (it grows with
 * the depth, and 127,000 levels ran the server's heap out). common practice, no source
 */
export const MAX_YAML_DEPTH = 32;

/**
 * Most keys, values and list items a formula's YAML may hold, counting every scalar, alias and
 * collection, and every entry mark ("-", "?", ":", ","), so an empty item counts too. The
 * largest formula the schema allows counts 2,185 and the demo formulas 63 to 193; the parser's
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
 * Measures a YAML text's nesting and node count with the yaml package's lexer, which reads
 * quotes, comments and block scalars exactly as the parser will, without building anything; it
 * stops at the first limit passed, so a hostile text costs no more than the limit's worth.
 * Flow collections ("[", "{") count one level each wherever they open; block collections are
 * counted by the column their first key or "- " stands at, as the parser nests them.
 * @param limits counting stops where the depth or the node count would pass these
 */
export function yamlShape(
  text: string,
  limits: { depth: number; nodes: number } = { depth: MAX_YAML_DEPTH, nodes: MAX_YAML_NODES },
): YamlShape {
  let offset = 0;
  let line = 1;
  let lineStart = 0;
  let flow = 0;
  // The block collections open around the current token: the column each stands at.
  const blocks: { column: number; kind: 'seq' | 'map' }[] = [];
  let nodes = 0;
  let depth = 0;
  let atLineStart = true;
  // Where the node a ":" may turn into a key began, and whether one is about to begin.
  let nodeColumn = 0;
  let nodeNext = false;
  // The next token is a scalar's own text; the one after a block scalar header is its content.
  let scalarNext = false;
  let blockScalarNext = false;
  let over: YamlShape['over'];

  const deeper = (column: number): void => {
    const level = blocks.length + flow;
    depth = Math.max(depth, level);
    if (level > limits.depth && !over) over = { limit: 'depth', line, column: column + 1 };
  };
  const openSeq = (column: number): void => {
    const top = blocks[blocks.length - 1];
    if (top?.column === column && top.kind === 'seq') return;
    blocks.push({ column, kind: 'seq' });
    deeper(column);
  };
  const openMap = (column: number): void => {
    let top = blocks[blocks.length - 1];
    // A key at the column of a list ends that list: it was the value of the key before.
    if (top?.column === column && top.kind === 'seq') {
      blocks.pop();
      top = blocks[blocks.length - 1];
    }
    if (top?.column === column && top.kind === 'map') return;
    blocks.push({ column, kind: 'map' });
    deeper(column);
  };

  for (const token of new Lexer().lex(text)) {
    const column = offset - lineStart;
    const source = scalarNext;
    scalarNext = false;
    if (!source && (token === SCALAR || token === DOCUMENT || token === FLOW_END)) {
      if (token === SCALAR) {
        scalarNext = true;
        // A block scalar's content starts on the next line, but it is no key: it closes nothing.
        if (blockScalarNext) blockScalarNext = false;
        else if (flow === 0 && (atLineStart || nodeNext)) startNode();
        count();
      } else if (token === FLOW_END) flow = 0;
    } else {
      if (!source) structure(token, column);
      offset += token.length;
      const newline = token.lastIndexOf('\n');
      if (newline !== -1) {
        for (let i = token.indexOf('\n'); i !== -1; i = token.indexOf('\n', i + 1)) line += 1;
        lineStart = offset - token.length + newline + 1;
        atLineStart = true;
      }
    }
    if (over) break;
  }
  return { depth, nodes, ...(over && { over }) };

  function count(): void {
    nodes += 1;
    if (nodes > limits.nodes && !over)
      over = { limit: 'nodes', line, column: offset - lineStart + 1 };
  }

  function startNode(): void {
    const column = offset - lineStart;
    if (atLineStart) {
      atLineStart = false;
      while (blocks.length > 0 && blocks[blocks.length - 1].column > column) blocks.pop();
    }
    nodeColumn = column;
    nodeNext = false;
  }

  /** One token that is text of the file (not a scalar's content). */
  function structure(token: string, column: number): void {
    const first = token[0];
    if (token === '' || first === '\n' || first === '\r' || first === ' ' || first === '\t') return;
    if (first === '#' || first === '%' || first === '\ufeff') return;
    if (token === '---' || token === '...') {
      // A new document starts from nothing; its nodes still count.
      blocks.length = 0;
      flow = 0;
      atLineStart = false;
      nodeNext = true;
      return;
    }
    if (flow > 0) {
      atLineStart = false;
      if (token === '[' || token === '{') {
        flow += 1;
        count();
        deeper(column);
      } else if (token === ']' || token === '}') flow -= 1;
      else if (first === '"' || first === "'" || first === '*' || token === ':' || token === ',')
        count();
      return;
    }
    switch (token) {
      case '-':
        startNode();
        count();
        openSeq(column);
        nodeNext = true;
        return;
      case '?':
        startNode();
        count();
        openMap(column);
        nodeNext = true;
        return;
      case ':':
        // At the start of a line, ":" gives the value of a "?" key at its own column.
        if (atLineStart) startNode();
        count();
        openMap(nodeColumn);
        nodeNext = true;
        return;
      case ']':
      case '}':
      case ',':
        // Stray outside a list or set of keys: the parser reports them; they nest nothing.
        atLineStart = false;
        return;
    }
    if (atLineStart || nodeNext) startNode();
    if (token === '[' || token === '{') {
      flow = 1;
      count();
      deeper(column);
    } else if (first === '"' || first === "'" || first === '*') count();
    else if (first === '|' || first === '>') blockScalarNext = true;
    // Anchors (&a) and tags (!t) come before a node, counted when it comes.
  }
}

/**
 * Whether a formula text is within what a formula can be: at most MAX_FORMULA_BYTES, nesting at
 * most MAX_YAML_DEPTH levels, at most MAX_YAML_NODES nodes. Checked before any parse, since
 * parsing is what a hostile text exhausts. Pure: no I/O, the same in the console.
 * @returns the problem, in words a cook can act on, or undefined when the text is within limits
 */
export function yamlLimitProblem(text: string): YamlLimitProblem | undefined {
  // A UTF-16 unit is at most three bytes: a shorter text cannot be too large and is not counted.
  if (text.length * 3 > MAX_FORMULA_BYTES && utf8Length(text) > MAX_FORMULA_BYTES) {
    return { limit: 'size', line: 0, column: 0, message: TOO_LARGE_MESSAGE };
  }
  const { over } = yamlShape(text);
  if (!over) return undefined;
  const message =
    over.limit === 'depth'
      ? `the file nests lists and sets of keys more than ${MAX_YAML_DEPTH} levels deep here; a formula needs only a few`
      : `the file holds more than ${MAX_YAML_NODES.toLocaleString('en')} keys, values and list items; this is one too many, and a formula has a few hundred`;
  return { ...over, message };
}

/** A limit problem as a problem of the formula file `file`, as the reader and the API give it. */
export function limitFormulaProblem(problem: YamlLimitProblem, file: string): FormulaProblem {
  const { line, column, message } = problem;
  return { file, line, column, path: [], message, severity: 'error' };
}
