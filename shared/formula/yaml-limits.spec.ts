import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { parse, stringify } from 'yaml';
import {
  MAX_FORMULA_BYTES,
  MAX_YAML_DEPTH,
  MAX_YAML_NODES,
  utf8Length,
  yamlLimitProblem,
  yamlShape,
} from './yaml-limits.ts';

// Limits as the product states them (formulas/README.md, "Formula syntax"): 32 levels, 5,000
// values, 256 KiB.
// source: shared/formula/yaml-limits.ts, restated here so that a changed limit fails a test
const DEPTH = 32;
const NODES = 5000;
const BYTES = 256 * 1024;

const HEAD = 'formula: 1\nid: x\ntitle: x\nkind: mix\n';

/** `levels` lists inside one another as the value of notes: on line 5 (the keys are level 1). */
function flowLists(levels: number): string {
  return `${HEAD}notes: ${'['.repeat(levels - 1)}${']'.repeat(levels - 1)}\n`;
}

/** Keys inside one another by indentation, one more space a level: key i is at column i + 1. */
function indentedKeys(levels: number): string {
  return Array.from({ length: levels }, (_, i) => `${' '.repeat(i)}k${i}:`).join('\n') + ' 1\n';
}

/** How deep a parsed value nests: a scalar 0, a list or set of keys 1 more than its deepest item. */
function depthOf(value: unknown): number {
  if (value === null || typeof value !== 'object') return 0;
  const items = Object.values(value as object);
  return 1 + Math.max(0, ...items.map(depthOf));
}

describe('the limits', () => {
  it('should be the figures the product states', () => {
    assert.equal(MAX_YAML_DEPTH, DEPTH);
    assert.equal(MAX_YAML_NODES, NODES);
    assert.equal(MAX_FORMULA_BYTES, BYTES);
  });
});

describe('yamlLimitProblem: nesting', () => {
  it('should take 32 levels of lists and refuse 33 where the 33rd opens', () => {
    assert.equal(yamlLimitProblem(flowLists(DEPTH)), undefined);
    const problem = yamlLimitProblem(flowLists(DEPTH + 1));
    // "notes: " is 7 characters, so the first "[" is column 8 and the 32nd column 39.
    assert.deepEqual(problem && [problem.limit, problem.line, problem.column], ['depth', 5, 39]);
    assert.equal(
      problem?.message,
      'the file nests lists and sets of keys more than 32 levels deep here; a formula needs only a few',
    );
  });

  it('should count sets of keys in braces as levels too', () => {
    const maps = (levels: number) =>
      `${HEAD}notes: ${'{a: '.repeat(levels - 1)}1${'}'.repeat(levels - 1)}\n`;
    assert.equal(yamlLimitProblem(maps(DEPTH)), undefined);
    // Each "{a: " is 4 characters from column 8: the 32nd "{" is column 8 + 4 × 31.
    assert.deepEqual(pick(yamlLimitProblem(maps(DEPTH + 1))), ['depth', 5, 132]);
  });

  it('should count keys nested by indentation, one level a step in', () => {
    assert.equal(yamlLimitProblem(indentedKeys(DEPTH)), undefined);
    // The 33rd key is line 33, after 32 spaces.
    assert.deepEqual(pick(yamlLimitProblem(indentedKeys(DEPTH + 1))), ['depth', 33, 33]);
  });

  it('should count lists written "- - -" on one line, each "- " a level', () => {
    const dashes = (levels: number) => `${HEAD}steps:\n  ${'- '.repeat(levels - 1)}x\n`;
    assert.equal(yamlLimitProblem(dashes(DEPTH)), undefined);
    // The 32nd "- " is at column 3 + 2 × 31 of line 6.
    assert.deepEqual(pick(yamlLimitProblem(dashes(DEPTH + 1))), ['depth', 6, 65]);
  });

  it('should count lists and keys mixed as the parser nests them', () => {
    // keys (1) → steps list (2) → a set of keys (3) → b's list (4) → [x, [y]] (5) → [y] (6).
    const text = `${HEAD}steps:\n  - a: 1\n    b:\n      - [x, [y]]\n  - c\nother: 1\n`;
    assert.equal(yamlShape(text).depth, 6);
    assert.equal(depthOf(parse(text)), 6);
  });

  it('should close a list written under its key without indenting at the next key', () => {
    // keys (1) → each key's list (2): "ingredients:\n- x" is a list at the key's own column.
    const text = `${HEAD}ingredients:\n- a\n- b\nsteps:\n- c\nnotes: d\n`;
    assert.equal(yamlShape(text).depth, 2);
    assert.equal(depthOf(parse(text)), 2);
  });

  it('should keep counting the levels around a block of text', () => {
    // keys (1) → a (2) → b (3) holds a block of text; then d (4) → e's list (5) → its list (6).
    const text = 'a:\n  b:\n    c: |\n      text\n    d:\n      e: [[x]]\n';
    assert.equal(yamlShape(text).depth, 6);
    assert.equal(depthOf(parse(text)), 6);
  });

  it('should not count brackets in quotes, comments, block text or plain text', () => {
    const brackets = '['.repeat(40);
    const texts = [
      `${HEAD}notes: "${brackets}"\n`,
      `${HEAD}notes: '${brackets} it''s ${brackets}'\n`,
      `${HEAD}notes: 1 # ${brackets}\n# ${brackets}\n`,
      `${HEAD}notes: |\n  ${brackets}\n  {{{{\nsteps: [a]\n`,
      `${HEAD}notes: >-\n  ${brackets}\n`,
      `${HEAD}notes: see ${brackets} below\n`,
      `${HEAD}notes: a long note\n  that goes on ${brackets}\n`,
      `${HEAD}notes: "a quoted note\n  on two lines ${brackets}"\n`,
    ];
    for (const text of texts) {
      assert.equal(yamlLimitProblem(text), undefined, text);
      assert.ok(yamlShape(text).depth <= 2, text);
    }
  });

  it('should not let a quote inside plain text hide nesting after it', () => {
    // "don't" is plain text: its "'" opens no quote, so the lists on the next line count.
    const text = `${HEAD}notes: don't\nsteps: ${'['.repeat(40)}${']'.repeat(40)}\n`;
    assert.deepEqual(pick(yamlLimitProblem(text)), ['depth', 6, 39]);
  });

  it('should report lines counted across Windows line ends and multi-line values', () => {
    const text = `a: "one\r\n  two"\r\nb: |\r\n  three\r\nc: ${'['.repeat(40)}`;
    // Line 5 is "c: [[[…": the first "[" is column 4, the 32nd column 35.
    assert.deepEqual(pick(yamlLimitProblem(text)), ['depth', 5, 35]);
  });

  it('should stop reading at the limit, whatever follows', () => {
    const attack = `${HEAD}notes: ${'['.repeat(127_000)}${']'.repeat(127_000)}`;
    const shape = yamlShape(attack);
    assert.equal(shape.over?.limit, 'depth');
    // The file's keys and values, then 32 lists: nothing past the one too many.
    assert.ok(shape.nodes < 50, `${shape.nodes} nodes counted`);
  });

  it('should measure the depth of any value written as YAML as the parser reads it back', () => {
    const tree = fc.letrec((tie) => ({
      node: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        fc.oneof(
          fc.integer(),
          fc.constantFrom('a', 'x y', "it's", '[b]', '#c', 'd: e', 'two\nlines ['),
        ),
        fc.array(tie('node'), { maxLength: 3 }),
        fc.dictionary(fc.constantFrom('k', 'l', 'm n'), tie('node'), { maxKeys: 3 }),
      ),
    })).node;
    fc.assert(
      // Lists under a key are written indented or not ("a:\n- x"), both as the parser reads.
      fc.property(tree, fc.boolean(), fc.boolean(), (value, flow, indentSeq) => {
        const text = stringify(value, {
          aliasDuplicateObjects: false,
          indentSeq,
          ...(flow && { collectionStyle: 'flow' as const }),
        });
        assert.equal(yamlShape(text).depth, depthOf(value), text);
      }),
    );
  });
});

describe('yamlLimitProblem: values', () => {
  /** A list of `items` values at the top: "[" and each item and comma count, 2 × items. */
  const list = (items: number) => `[${Array(items).fill('a').join(',')}]`;

  it('should take 5,000 keys, values and list items and refuse the one after', () => {
    assert.equal(yamlShape(list(NODES / 2)).nodes, NODES);
    assert.equal(yamlLimitProblem(list(NODES / 2)), undefined);
    const problem = yamlLimitProblem(list(NODES / 2 + 1));
    // The 5,001st is the comma after item 2,500: "[" is column 1, item i is at 2i, its comma 2i + 1.
    assert.deepEqual(pick(problem), ['nodes', 1, 5001]);
    assert.match(problem?.message ?? '', /more than 5,000 keys, values and list items/);
  });

  it('should count empty items, which the parser builds all the same', () => {
    assert.equal(yamlLimitProblem(`a:\n${'-\n'.repeat(NODES)}`)?.limit, 'nodes');
    assert.equal(yamlLimitProblem(`a: [${','.repeat(NODES)}]`)?.limit, 'nodes');
  });

  it('should count keys, values and entries of every kind', () => {
    const text = `${HEAD}key: [a, "b"]\nlist:\n  - 'q'\n  - *r\n? c\n: d\n`;
    // HEAD: four keys, four values, four ":" (12). key, ":", "[", a, ",", "b" (6; "]" closes
    // and is not counted); list, ":" (2); "-", 'q' (2); "-", *r (2); "?", c (2); ":", d (2).
    assert.equal(yamlShape(text).nodes, 12 + 6 + 2 + 2 + 2 + 2 + 2);
  });

  it('should count the nodes of every document in the text', () => {
    const text = `${list(NODES / 4)}\n---\n${list(NODES / 4 + 1)}\n`;
    assert.equal(yamlLimitProblem(text)?.limit, 'nodes');
  });
});

describe('yamlLimitProblem: size', () => {
  it('should take 256 KiB of UTF-8 and refuse one byte more, as a problem of the whole file', () => {
    const exact = `a: ${'x'.repeat(BYTES - 4)}\n`;
    assert.equal(utf8Length(exact), BYTES);
    assert.equal(yamlLimitProblem(exact), undefined);
    assert.deepEqual(yamlLimitProblem(`${exact} `), {
      limit: 'size',
      line: 0,
      column: 0,
      message: 'the file is larger than 256 KB; a formula is a few kilobytes',
    });
  });

  it('should count bytes, not characters', () => {
    // "é" is two bytes: 140,000 of them are 280,000 bytes in 140,000 characters.
    const text = `a: ${'é'.repeat(140_000)}\n`;
    assert.ok(text.length < BYTES);
    assert.equal(yamlLimitProblem(text)?.limit, 'size');
  });

  it('should count UTF-8 bytes as files hold them', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), (text) => {
        assert.equal(utf8Length(text), Buffer.byteLength(text, 'utf8'));
      }),
    );
    // A lone surrogate is written as U+FFFD, three bytes.
    assert.equal(utf8Length('\ud800'), Buffer.byteLength('\ud800', 'utf8'));
  });
});

function pick(problem: ReturnType<typeof yamlLimitProblem>): unknown[] | undefined {
  return problem && [problem.limit, problem.line, problem.column];
}
