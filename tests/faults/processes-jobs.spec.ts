import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { dataQuery, makeDataDir, startServerProcess } from './server-process.ts';

/** Waits until `ready` holds, trying every half second for up to a minute. */
async function until(ready: () => Promise<boolean>, what: string): Promise<void> {
  for (let tries = 0; tries < 120; tries++) {
    if (await ready()) return;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  assert.fail(`${what} did not happen within a minute`);
}

describe('the once-only jobs of a server of two processes', () => {
  it('should send each reminder the demo has due exactly once', async (t) => {
    const data = makeDataDir(t);
    const server = await startServerProcess(t, data, { env: { LARDER_PROCESSES: '2' } });
    assert.match(server.output(), /Processes: 2 sharing the port/);
    // The demo's held batches have reminders due today (flip, ready, overdue): the first run
    // at start sends them. Count once the audit log has them and a few more seconds have passed
    // for a second sender to show itself.
    await until(
      async () =>
        (await dataQuery(data, "SELECT id FROM audit_events WHERE action = 'reminder-send'"))
          .length > 0,
      'a reminder',
    );
    await new Promise((resolve) => setTimeout(resolve, 3000));
    const decided = await dataQuery<{ n: number }>(
      data,
      'SELECT COUNT(*) AS n FROM reminders_sent',
    );
    const audited = await dataQuery<{ n: number }>(
      data,
      "SELECT COUNT(*) AS n FROM audit_events WHERE action = 'reminder-send'",
    );
    assert.ok(decided[0].n > 0);
    assert.equal(audited[0].n, decided[0].n, 'one audit entry per reminder decided');
    const twice = await dataQuery<{ person_id: number; kind: string; related: string; n: number }>(
      data,
      `SELECT person_id, kind, related, subject, COUNT(*) AS n FROM outbox
       WHERE kind LIKE 'reminder-%' GROUP BY person_id, kind, related, subject HAVING COUNT(*) > 1`,
    );
    assert.deepEqual(twice, [], 'no person is sent the same reminder twice');
    await server.stop();
    assert.doesNotMatch(server.output(), /connection manager was closed|SQLITE_MISUSE/);
  });
});
