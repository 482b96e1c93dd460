import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { after, describe, it } from 'node:test';
import sqlite3 from 'sqlite3';
import { sqliteCommitMark } from './commit-mark.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'larder-commit-mark-'));
after(() => rmSync(dir, { recursive: true, force: true }));

function open(file: string): sqlite3.Database {
  return new sqlite3.Database(file);
}
function run(db: sqlite3.Database, sql: string): Promise<unknown[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, (error, rows) => (error ? reject(error) : resolve(rows))),
  );
}
function close(db: sqlite3.Database): Promise<void> {
  return new Promise((resolve, reject) => db.close((error) => (error ? reject(error) : resolve())));
}

// source: sqlite.org/walformat.html, "The WAL-Index Format": the -shm file starts with two copies
// of the WAL-index header, whose iChange is "incremented with each transaction"; readers leave it.
describe('the commit mark of a SQLite file', () => {
  it('should change with every commit of another connection, and not with reads', async () => {
    const file = path.join(dir, 'marks.db');
    const writer = open(file);
    await run(writer, 'PRAGMA journal_mode = WAL');
    await run(writer, 'CREATE TABLE t (x INTEGER)');
    const reader = open(file);
    const marks = sqliteCommitMark(file);
    const mark = marks.read;

    const first = mark();
    assert.ok(first, 'a WAL file in use has a mark');
    await run(reader, 'SELECT * FROM t');
    assert.equal(mark(), first, 'a read leaves it');

    await run(writer, 'BEGIN');
    await run(writer, 'INSERT INTO t VALUES (1)');
    assert.equal(mark(), first, 'a transaction not yet committed leaves it');
    await run(writer, 'COMMIT');
    const second = mark();
    assert.notEqual(second, first, 'a commit changes it');

    await run(reader, 'INSERT INTO t VALUES (2)');
    assert.notEqual(mark(), second, 'so does one by any connection');
    const third = mark();
    await run(writer, 'PRAGMA wal_checkpoint(TRUNCATE)');
    await run(reader, 'INSERT INTO t VALUES (3)');
    assert.notEqual(mark(), third, 'and one after the log was emptied');
    marks.close();
    await close(reader);
    await close(writer);
  });

  it('should give no mark where there is no -shm file to read', async () => {
    const file = path.join(dir, 'rollback.db');
    const db = open(file);
    await run(db, 'CREATE TABLE t (x INTEGER)');
    assert.equal(sqliteCommitMark(file).read(), undefined, 'a rollback journal, not WAL');
    await close(db);
    assert.equal(sqliteCommitMark(path.join(dir, 'none.db')).read(), undefined, 'no file');
  });
});
