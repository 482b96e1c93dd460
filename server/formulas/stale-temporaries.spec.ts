import assert from 'node:assert/strict';
import { existsSync, mkdirSync, readdirSync, utimesSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { makeTempDir, writeText } from '../../tests/helpers/temp-files.ts';
import { writeTemporary } from '../../files/atomic-file.ts';
import {
  STALE_TEMPORARY_MS,
  isFormulaTemporary,
  removeStaleTemporaries,
} from './stale-temporaries.ts';

/** Writes a file and sets its times `ageMs` in the past. */
function writeAged(dir: string, name: string, ageMs: number): string {
  const file = writeText(dir, name, 'formula: 1\n');
  const at = new Date(Date.now() - ageMs);
  utimesSync(file, at, at);
  return file;
}

const HOUR = 3_600_000;

describe('left-over temporary files of formula saves', () => {
  it('should know the names a save writes, and nothing else', () => {
    for (const name of [
      '.x.yaml.123.tmp',
      '.quillmoor-belly.yaml.0a1b2c3d4e5f.tmp',
      '.a.yml.f.tmp',
    ]) {
      assert.equal(isFormulaTemporary(name), true, name);
    }
    for (const name of [
      'x.yaml',
      '.x.yaml',
      'x.yaml.123.tmp',
      '.x.yaml.zz.tmp',
      '.x.yaml.123.tmp.bak',
      '.sheet.pdf.123.tmp',
      '.notes.txt.123.tmp',
      '.x.yaml..tmp',
    ]) {
      assert.equal(isFormulaTemporary(name), false, name);
    }
  });

  it('should name its own temporary files so that the rule knows them', async (t) => {
    const dir = makeTempDir(t);
    const temporary = await writeTemporary(path.join(dir, 'quillmoor-belly.yaml'), 'formula: 1\n');
    assert.equal(isFormulaTemporary(path.basename(temporary)), true, temporary);
  });

  it('should remove only stale ones of its own pattern, and say which', async (t) => {
    const dir = makeTempDir(t);
    writeAged(dir, '.x.yaml.123.tmp', HOUR);
    writeAged(dir, '.quillmoor-belly.yaml.0a1b2c3d4e5f.tmp', 2 * STALE_TEMPORARY_MS);
    // A save going on right now (another process on the same folder) is left alone.
    writeAged(dir, '.pit-bun.yaml.abc.tmp', 0);
    // Not ours: other people's files and names that only look alike.
    writeAged(dir, '.notes.txt.123.tmp', HOUR);
    writeAged(dir, '.x.yaml.zz.tmp', HOUR);
    writeAged(dir, 'x.yaml', HOUR);
    writeAged(dir, 'x.yaml.123.tmp', HOUR);

    const removed = await removeStaleTemporaries(dir);
    assert.deepEqual(removed.sort(), ['.quillmoor-belly.yaml.0a1b2c3d4e5f.tmp', '.x.yaml.123.tmp']);
    assert.deepEqual(readdirSync(dir).sort(), [
      '.notes.txt.123.tmp',
      '.pit-bun.yaml.abc.tmp',
      '.x.yaml.zz.tmp',
      'x.yaml',
      'x.yaml.123.tmp',
    ]);
  });

  it('should leave a folder of the same name alone, and a missing folder be', async (t) => {
    const dir = makeTempDir(t);
    const folder = path.join(dir, '.x.yaml.123.tmp');
    writeAged(dir, 'x.yaml', 0);
    mkdirSync(folder);
    const at = new Date(Date.now() - HOUR);
    utimesSync(folder, at, at);
    assert.deepEqual(await removeStaleTemporaries(dir), []);
    assert.ok(existsSync(folder));
    assert.deepEqual(await removeStaleTemporaries(path.join(dir, 'no-such-folder')), []);
  });
});
