import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  MAX_FORMULA_BYTES,
  MAX_YAML_DEPTH,
  MAX_YAML_NODES,
  isFormulaFileName,
  readFormula,
} from '../../shared/index.ts';
import { utf8Length, yamlShape } from '../../shared/formula/yaml-limits.ts';
import { REPO_ROOT } from '../helpers/run-larder.ts';

/**
 * The largest mix the schema allows, written as a cook would: 60 ingredients (its maxItems) each
 * with an 80-character name and ten allergens (their maxItems), each a fish, crustacean or tree
 * nut named with a 32-character kind, 40 steps and 20 cautions of 500 characters, and 4,000
 * characters of notes. source: shared/schema/formula.schema.json (maxItems, maxLength)
 */
function largestMix(letter: string): string {
  const text = (length: number) => letter.repeat(length);
  const groups = ['fish', 'crustacean-shellfish', 'tree-nuts'];
  const allergens = Array.from(
    { length: 10 },
    (_, j) => `{ ${groups[j % 3]}: ${text(30)}${String(j).padStart(2, '0')} }`,
  );
  const ingredients = Array.from(
    { length: 60 },
    (_, i) =>
      `  - { name: ${text(77)} ${String(i).padStart(2, '0')}, pct: ${i === 0 ? '100, base: true' : '1'}, raw_egg: true, allergens: [${allergens.join(', ')}] }`,
  );
  const lines = (count: number) => Array.from({ length: count }, () => `  - ${text(500)}`);
  return [
    'formula: 1',
    'id: largest-mix',
    'title: Largest mix',
    'kind: mix',
    'ingredients:',
    ...ingredients,
    'steps:',
    ...lines(40),
    'cautions:',
    ...lines(20),
    `notes: ${text(4000)}`,
    '',
  ].join('\n');
}

describe('the formula limits leave room for any formula', () => {
  it('should find every demo formula far below them: a quarter of the depth, a tenth of the values', () => {
    const folder = path.join(REPO_ROOT, 'formulas');
    for (const name of readdirSync(folder).filter(isFormulaFileName)) {
      const text = readFileSync(path.join(folder, name), 'utf8');
      const shape = yamlShape(text);
      assert.ok(shape.depth * 4 <= MAX_YAML_DEPTH, `${name}: ${shape.depth} levels`);
      assert.ok(shape.nodes * 10 <= MAX_YAML_NODES, `${name}: ${shape.nodes} values`);
      assert.ok(utf8Length(text) * 100 <= MAX_FORMULA_BYTES, `${name}: ${utf8Length(text)} bytes`);
    }
  });

  it('should read the largest formula the schema allows, with room to spare', () => {
    // "a" is one byte in UTF-8, "ä" two and "あ" three.
    for (const letter of ['a', 'ä', 'あ']) {
      const text = largestMix(letter);
      const reading = readFormula(text, 'largest-mix.yaml');
      assert.ok(
        reading.formula,
        `${letter}: ${reading.problems.map((p) => `${p.line}:${p.column} ${p.message}`).join('\n')}`,
      );
      const shape = yamlShape(text);
      // Allergens named with their kind take five values each (4,105 in all), so the room left
      // under the limits is a fifth for values and two-fifths for bytes (186 kB in "あ").
      assert.ok(shape.nodes * 1.2 <= MAX_YAML_NODES, `${letter}: ${shape.nodes} values`);
      assert.ok(
        utf8Length(text) * 1.4 <= MAX_FORMULA_BYTES,
        `${letter}: ${utf8Length(text)} bytes`,
      );
    }
  });
});
