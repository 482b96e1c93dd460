import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/** The part of a node:test context these helpers need: a hook that runs when the test ends. */
export interface AfterHook {
  after(fn: () => void): void;
}

/** A fresh folder under the system temporary folder, removed when the test ends. */
export function makeTempDir(t: AfterHook, prefix = 'larder-cli-'): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), prefix));
  t.after(() => rmSync(dir, { recursive: true, force: true }));
  return dir;
}

/** Writes a text file into a folder and returns its full path. */
export function writeText(dir: string, name: string, text: string): string {
  const file = path.join(dir, name);
  writeFileSync(file, text);
  return file;
}

/**
 * A small valid dry-cured bacon formula. Line numbers matter to the tests that break it:
 * line 7 `ingredients:`, line 8 the salt, line 9 the curing salt, line 10 the sugar; the species
 * comes last so that adding it moved none of them.
 * Curing salt 0.25 % × 6.25 % nitrite × 1 000 000 = 156.25 ppm ingoing, under the 200 ppm limit
 * for dry-cured bacon. source: 9 CFR 424.22(b); formula of USDA FSIS Directive 7620.3, ch. 3
 */
export const DRY_BACON = `formula: 1
id: test-bacon
title: Test bacon
kind: cure
method: dry
product: bacon
ingredients:
  - { name: fine sea salt, pct: 2.25, salt: 100 }
  - { name: curing salt no. 1, pct: 0.25, nitrite: 6.25, salt: 93.75 }
  - { name: brown sugar, pct: 1.2 }
hold:
  days_per_cm: 2
  min_days: 7
species: pork
`;

/** {@link DRY_BACON} with one exact piece of text replaced; fails loudly if the piece is absent. */
export function dryBaconWith(find: string, replace: string): string {
  if (!DRY_BACON.includes(find)) throw new Error(`DRY_BACON has no "${find}"`);
  return DRY_BACON.replace(find, replace);
}

/**
 * Writes a small mix formula, ID.yaml in a fresh temporary folder, whose ingredients are the
 * given lines, the first (the base) at line 6 of the file; returns its path.
 */
export function writeMix(t: AfterHook, id: string, ingredients: readonly string[]): string {
  const lines = ['formula: 1', `id: ${id}`, `title: ${id}`, 'kind: mix', 'ingredients:'];
  return writeText(makeTempDir(t), `${id}.yaml`, [...lines, ...ingredients, ''].join('\n'));
}

/**
 * Environment that keeps git inside a temporary repository: it does not look above the
 * folder's parent for a repository, and ignores the machine's system and global settings.
 */
export function isolatedGitEnv(dir: string): Record<string, string> {
  return {
    GIT_CEILING_DIRECTORIES: path.dirname(dir),
    GIT_CONFIG_NOSYSTEM: '1',
    GIT_CONFIG_GLOBAL: os.devNull,
  };
}

/** Runs git in a folder with {@link isolatedGitEnv}; throws with git's message when it fails. */
export function git(dir: string, ...args: string[]): string {
  return execFileSync('git', args, {
    cwd: dir,
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, ...isolatedGitEnv(dir) },
  });
}

/** A new git repository in a temporary folder, with a local user so commits would work. */
export function makeGitRepo(t: AfterHook): string {
  const dir = makeTempDir(t, 'larder-git-');
  git(dir, 'init', '--quiet');
  git(dir, 'config', 'user.email', 'cook@quillmoor.invalid');
  git(dir, 'config', 'user.name', 'Quillmoor Cook');
  return dir;
}
