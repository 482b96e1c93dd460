import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { LineCounter } from 'yaml';
import { parseYamlWithinLimits } from './parse-yaml.ts';

describe('parseYamlWithinLimits', () => {
  it('should parse a text within the limits with the options given', () => {
    const lineCounter = new LineCounter();
    const parsed = parseYamlWithinLimits('a: 1\nb: [x, y]\n', { lineCounter });
    assert.ok(parsed.ok);
    assert.deepEqual(parsed.document.toJS(), { a: 1, b: ['x', 'y'] });
    // "b" starts line 2: offset 5, right after "a: 1\n".
    assert.deepEqual(lineCounter.linePos(5), { line: 2, col: 1 });
  });

  it('should give the problem, and no document, for a text past a limit', () => {
    const parsed = parseYamlWithinLimits(`notes: ${'['.repeat(100_000)}`);
    assert.equal(parsed.ok, false);
    assert.ok(!parsed.ok && parsed.problem.limit === 'depth');
    assert.equal('document' in parsed, false);
  });
});
