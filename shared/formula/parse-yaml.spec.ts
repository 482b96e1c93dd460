import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { LineCounter, parseDocument, type Document } from 'yaml';
import { parseYamlWithinLimits } from './parse-yaml.ts';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Every demo formula and every file of the bad-formula corpus, as text. */
function sampleTexts(): string[] {
  return ['formulas', 'tests/fixtures/bad-formulas'].flatMap((folder) =>
    readdirSync(path.join(ROOT, folder))
      .filter((name) => name.endsWith('.yaml'))
      .map((name) => readFileSync(path.join(ROOT, folder, name), 'utf8')),
  );
}

/** What a reader sees of a document: its value (or why there is none), errors and warnings. */
function seen(doc: Document.Parsed): unknown {
  let value: unknown;
  try {
    value = doc.toJS({ maxAliasCount: 50 });
  } catch (error) {
    value = `throws ${(error as Error).message}`;
  }
  const problems = (list: Document.Parsed['errors'] | Document.Parsed['warnings']) =>
    list.map((e) => [e.code, e.pos, e.message]);
  return { value, errors: problems(doc.errors), warnings: problems(doc.warnings) };
}

/** The yaml package's own parseDocument and the guarded parse, side by side. */
function bothWays(text: string): { guarded: unknown; plain: unknown; lines: number[][] } {
  const ours = new LineCounter();
  const theirs = new LineCounter();
  const parsed = parseYamlWithinLimits(text, { lineCounter: ours, uniqueKeys: true });
  assert.ok(parsed.ok, text);
  const plain = parseDocument(text, { lineCounter: theirs, uniqueKeys: true, prettyErrors: false });
  return {
    guarded: seen(parsed.document),
    plain: seen(plain),
    lines: [ours.lineStarts, theirs.lineStarts],
  };
}

describe('parseYamlWithinLimits', () => {
  it('should read every demo formula and corpus file within the limits as parseDocument does', () => {
    let compared = 0;
    for (const text of sampleTexts()) {
      if (!parseYamlWithinLimits(text).ok) continue;
      const { guarded, plain, lines } = bothWays(text);
      assert.deepEqual(guarded, plain, text.slice(0, 200));
      assert.deepEqual(lines[0], lines[1], 'the same line starts');
      compared += 1;
    }
    assert.ok(compared > 100, `${compared} files compared`);
  });

  it('should read any short text as parseDocument does, broken ones and several documents included', () => {
    const piece = fc.constantFrom(
      'a',
      'b: ',
      ': ',
      '- ',
      '? ',
      '[',
      ']',
      '{',
      '}',
      ', ',
      '"q',
      "'s",
      '# c',
      '\n',
      '\n  ',
      '|\n  x',
      '&a ',
      '*a',
      '---\n',
      '...\n',
      '\t',
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 30 }), (pieces) => {
        const { guarded, plain, lines } = bothWays(pieces.join(''));
        assert.deepEqual(guarded, plain);
        assert.deepEqual(lines[0], lines[1]);
      }),
      { numRuns: 500 },
    );
  });

  it('should give the problem, and no document, for a text past a limit', () => {
    const parsed = parseYamlWithinLimits(`notes: ${'['.repeat(100_000)}`);
    assert.equal(parsed.ok, false);
    assert.ok(!parsed.ok && parsed.problem.limit === 'depth');
    assert.equal('document' in parsed, false);
  });

  it('should refuse a text larger than a formula may be without reading it', () => {
    const parsed = parseYamlWithinLimits(`a: ${'x'.repeat(300_000)}\n`);
    assert.ok(!parsed.ok && parsed.problem.limit === 'size');
  });
});
