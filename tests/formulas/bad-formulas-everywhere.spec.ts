import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { readFormula, type FormulaProblem } from '../../shared/index.ts';
import { RECIPES, corpusFile, isExpected } from '../fixtures/bad-formula-recipes.ts';
import { REPO_ROOT, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { startTestServer } from '../helpers/test-server.ts';

type Seen = Pick<FormulaProblem, 'line' | 'column' | 'message' | 'severity'>;

function shape(problems: readonly Seen[]): string[] {
  return problems.map((p) => `${p.severity} ${p.line}:${p.column} ${p.message}`).sort();
}

describe('the bad-formula corpus through the CLI and the API', () => {
  it('should get the same problems from larder check, the API and the core, file by file', async (t) => {
    const folder = path.join(REPO_ROOT, 'tests/fixtures/bad-formulas');
    const run = await runLarder(['check', folder, '--json']);
    assert.equal(run.code, 3, 'check fails on the corpus');
    const report = stdoutJson<{ files: { file: string; problems: Seen[] }[] }>(run);
    const byFile = new Map(
      report.files.map((entry) => [path.basename(entry.file), entry.problems]),
    );
    const server = await startTestServer(t);
    const client = server.as('imke');

    for (const recipe of RECIPES) {
      const file = corpusFile(recipe);
      const name = path.basename(file);
      const text = readFileSync(file, 'utf8');
      const core = readFormula(text, name).problems;
      const cli = byFile.get(name);
      assert.ok(cli, `the CLI checked ${name}`);
      assert.deepEqual(shape(cli), shape(core), `${name}: the CLI says what the core says`);
      const api = await client.post('/api/formulas/validate', { yaml: text });
      // A text refused unread is answered as an error, with the reader's problem in its details.
      const expected = recipe.refused ?? { status: 200, code: undefined };
      assert.equal(api.status, expected.status, `${name}: ${api.text.slice(0, 300)}`);
      assert.equal(api.json.error?.code, expected.code, name);
      const problems = (recipe.refused ? api.json.error.details : api.json.problems) as Seen[];
      if (!recipe.refused) assert.equal(api.json.usable, false, name);
      assert.deepEqual(shape(problems), shape(core), `${name}: the API says what the core says`);
      assert.ok(
        problems.some((problem) => isExpected(problem, recipe)),
        name,
      );
    }
  });
});
