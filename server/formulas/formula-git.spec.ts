import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, it } from 'node:test';
import { isGitWorkTree } from './formula-git.ts';

describe('isGitWorkTree', () => {
  it('should count a kept folder of a repository, but not an ignored one or a plain folder', async (t) => {
    const dir = mkdtempSync(path.join(tmpdir(), 'larder-git-'));
    t.after(() => rmSync(dir, { recursive: true, force: true }));
    const env = {
      ...process.env,
      GIT_CONFIG_NOSYSTEM: '1',
      HOME: dir,
      GIT_CEILING_DIRECTORIES: path.dirname(dir),
    };
    const repo = path.join(dir, 'repo');
    mkdirSync(path.join(repo, 'formulas'), { recursive: true });
    mkdirSync(path.join(repo, 'data', 'formulas'), { recursive: true });
    mkdirSync(path.join(dir, 'plain'));
    execFileSync('git', ['init', '-q'], { cwd: repo, env });
    writeFileSync(path.join(repo, '.gitignore'), 'data/\n');
    const saved = { ...process.env };
    Object.assign(process.env, env);
    t.after(() => {
      for (const key of Object.keys(env)) if (!(key in saved)) delete process.env[key];
      Object.assign(process.env, saved);
    });
    assert.equal(await isGitWorkTree(path.join(repo, 'formulas')), true);
    assert.equal(await isGitWorkTree(path.join(repo, 'data', 'formulas')), false);
    assert.equal(await isGitWorkTree(path.join(dir, 'plain')), false);
  });
});
