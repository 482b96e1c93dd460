import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { localRecordsEnv } from '../helpers/local-records-env.ts';

describe('larder users', () => {
  it('should make the first admin in a fresh database, who can then be listed', async (t) => {
    const records = await localRecordsEnv(t);
    const env = { ...records, LARDER_NEW_PASSWORD: 'first-admin-pass' };
    const add = await runLarder(
      ['users', 'add', 'chef', '--name', 'Head Chef', '--role', 'admin', '--json'],
      { env },
    );
    assertExit(add, 0);
    const person = stdoutJson<{ username: string; role: string; active: boolean }>(add);
    assert.deepEqual([person.username, person.role, person.active], ['chef', 'admin', true]);
    assert.equal(add.stdout.includes('first-admin-pass'), false, 'the password is never printed');
    const list = await runLarder(['users', 'list'], { env: { ...records } });
    assertExit(list, 0);
    assert.match(list.stdout, /chef\s+Head Chef\s+admin\s+active/);
  });

  it('should refuse a taken username, a short password and a bad role', async (t) => {
    const records = await localRecordsEnv(t);
    const env = { ...records, LARDER_NEW_PASSWORD: 'first-admin-pass' };
    assertExit(await runLarder(['users', 'add', 'chef', '--role', 'admin'], { env }), 0);
    assertCleanFailure(
      await runLarder(['users', 'add', 'chef', '--role', 'cook'], { env }),
      2,
      /the username "chef" is taken/,
    );
    assertCleanFailure(
      await runLarder(['users', 'add', 'cook1', '--role', 'cook'], {
        env: { ...records, LARDER_NEW_PASSWORD: 'short' },
      }),
      2,
      /at least 8 characters/,
    );
    assertCleanFailure(
      await runLarder(['users', 'add', 'cook1', '--role', 'chef'], { env }),
      2,
      /Allowed choices are admin, cook, reviewer/,
    );
    assertCleanFailure(
      await runLarder(['users', 'add', 'Bad Name', '--role', 'cook'], { env }),
      2,
      /the username may hold/,
    );
  });
});
