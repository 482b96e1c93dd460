import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { cookieSession, send, snapshot, type Call, type Sender } from '../helpers/api-calls.ts';
import {
  clockFrom,
  startTestServer,
  type ApiResponse,
  type TestServer,
} from '../helpers/test-server.ts';

// The server's today near the fixed start days below (a start lies within a year of today).
const SERVER_CLOCK = clockFrom('2024-03-01');

const DAY = '2024-02-29';
const belly = (i: number): Call => ({
  method: 'POST',
  path: '/api/batches',
  body: {
    formula: 'quillmoor-belly',
    batch: { meat: `${4000 + i * 10} g`, thickness: '4cm', start: DAY },
  },
});
const bun = (i: number): Call => ({
  method: 'POST',
  path: '/api/batches',
  body: { formula: 'pit-bun', batch: { pieces: String(24 + i), start: DAY }, status: 'planned' },
});

interface StoredBatch {
  lot_code: string;
  operator_id: number;
  formula_revision: string;
}

async function storedBatches(server: TestServer): Promise<StoredBatch[]> {
  return server.context.db.sequelize.query<StoredBatch>(
    'SELECT lot_code, operator_id, formula_revision FROM batches WHERE started_on = ? ORDER BY lot_code',
    { replacements: [DAY], type: QueryTypes.SELECT },
  );
}

const show = (responses: readonly ApiResponse[]): string =>
  responses.map((r) => `${r.status} ${r.text.slice(0, 160)}`).join('\n');

function assertNo5xx(responses: readonly ApiResponse[]): void {
  const failed = responses.filter((r) => r.status >= 500);
  assert.equal(failed.length, 0, show(failed));
}

describe('concurrent requests', () => {
  it('should store all 30 concurrent records from a cook and an admin while reads and a formula save run', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const tobin = await cookieSession(server, 'tobin');
    const rosa = await cookieSession(server, 'rosa');
    // Let the history note every file first, so the save below is its only new revision.
    assert.equal((await send(server, rosa, { method: 'GET', path: '/api/formulas' })).status, 200);
    const current = await send(server, rosa, {
      method: 'GET',
      path: '/api/formulas/quillmoor-belly',
    });
    const oldRevision = current.json.revision as string;
    const newText = `${current.json.yaml as string}# Saved while the cooks were recording.\n`;
    const before = await snapshot(server);

    // Cook and admin, each over Basic and over a session: who recorded each batch.
    const senders: Sender[] = [tobin, 'tobin', rosa, 'rosa'];
    const people = (await send(server, 'rosa', { method: 'GET', path: '/api/people' })).json
      .people as { id: number; username: string }[];
    const idOf = (user: string): number => people.find((p) => p.username === user)?.id ?? -1;
    const operatorOf = (sender: Sender): number =>
      idOf(typeof sender === 'string' ? sender : sender.user);

    const records: Promise<ApiResponse>[] = [];
    const recordSenders: Sender[] = [];
    const reads: Promise<ApiResponse>[] = [];
    let save: Promise<ApiResponse> | undefined;
    for (let i = 0; i < 30; i++) {
      const sender = senders[i % senders.length];
      recordSenders.push(sender);
      records.push(send(server, sender, i % 2 === 0 ? belly(i) : bun(i)));
      if (i % 3 === 0) {
        const reader: Sender = i % 2 === 0 ? 'imke' : tobin;
        reads.push(
          send(server, reader, { method: 'GET', path: '/api/batches?limit=20' }),
          send(server, reader, { method: 'GET', path: '/api/batches.csv?kind=cure' }),
          send(server, reader, { method: 'GET', path: '/api/formulas/quillmoor-belly' }),
          send(server, reader, {
            method: 'POST',
            path: '/api/calc',
            body: { formula: 'quillmoor-belly', batch: { meat: '4kg', thickness: '4cm' } },
          }),
        );
      }
      if (i === 12)
        save = send(server, rosa, {
          method: 'PUT',
          path: '/api/formulas/quillmoor-belly',
          body: { yaml: newText, message: 'Concurrent save' },
          headers: { 'if-match': `"${oldRevision}"` },
        });
    }
    const recorded = await Promise.all(records);
    const read = await Promise.all(reads);
    const saved = await save;
    assert.ok(saved);
    assertNo5xx([...recorded, ...read, saved]);

    assert.equal(saved.status, 200, saved.text);
    const newRevision = saved.json.revision as string;
    assert.equal(
      readFileSync(path.join(server.formulasDir, 'quillmoor-belly.yaml'), 'utf8'),
      newText,
    );
    for (const response of read) assert.equal(response.status, 200, response.text.slice(0, 200));

    const created = recorded.filter((r) => r.status === 201);
    assert.equal(created.length, 30, show(recorded));
    const lots = created.map((r) => r.json.batch.lotCode as string);
    assert.equal(new Set(lots).size, lots.length, `lot codes repeat: ${lots.join(' ')}`);
    const numbered = (initials: string) =>
      Array.from({ length: 15 }, (_, i) => `240229-${initials}-${String(i + 1).padStart(2, '0')}`);
    assert.deepEqual([...lots].sort(), [...numbered('PB'), ...numbered('QB')]);

    // Every 201 is in the database, by the person who sent it, on a revision that existed.
    const stored = new Map((await storedBatches(server)).map((row) => [row.lot_code, row]));
    assert.equal(stored.size, 30);
    recorded.forEach((response, i) => {
      const lot = response.json.batch.lotCode as string;
      const row = stored.get(lot);
      assert.ok(row, `${lot} answered 201 but is not stored`);
      assert.equal(row.operator_id, operatorOf(recordSenders[i]), lot);
      assert.equal(row.formula_revision, response.json.batch.formula.revision, lot);
    });
    const bellyRevisions = new Set(
      [...stored.values()]
        .filter((r) => r.lot_code.includes('-QB-'))
        .map((r) => r.formula_revision),
    );
    for (const revision of bellyRevisions) assert.ok([oldRevision, newRevision].includes(revision));
    // Each batch names a revision the formula history holds.
    const [{ missing }] = await server.context.db.sequelize.query<{ missing: number }>(
      `SELECT COUNT(*) AS missing FROM batches b WHERE b.started_on = ? AND NOT EXISTS
         (SELECT 1 FROM formula_revisions r
          WHERE r.formula_id = b.formula_id AND r.revision = b.formula_revision)`,
      { replacements: [DAY], type: QueryTypes.SELECT },
    );
    assert.equal(missing, 0);

    const after = await snapshot(server);
    assert.equal(after.counts.batches, before.counts.batches + 30);
    assert.equal(after.counts.batch_events, before.counts.batch_events + 30);
    assert.equal(after.counts.formula_revisions, before.counts.formula_revisions + 1);
    // 30 batch-record entries and one formula-save.
    assert.equal(after.counts.audit_events, before.counts.audit_events + 31);
    const listed = await send(server, 'imke', {
      method: 'GET',
      path: '/api/batches?lot=240229&limit=200',
    });
    assert.equal(listed.json.total, 30);
  });

  it('should let only one of many concurrent moves or sign-offs of a batch through', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const rosa = await cookieSession(server, 'rosa');
    const lot = (await send(server, rosa, belly(0))).json.batch.lotCode as string;
    const many = (call: Call, sender: Sender = rosa) =>
      Promise.all(Array.from({ length: 10 }, () => send(server, sender, call)));
    const moves = await many({
      method: 'POST',
      path: `/api/batches/${lot}/status`,
      body: { to: 'curing' },
    });
    assertNo5xx(moves);
    assert.deepEqual(
      moves.map((r) => r.status).sort((a, b) => a - b),
      [200, ...Array(9).fill(409)],
      show(moves),
    );
    // Signed off by the reviewer: the admin recorded it, and nobody signs off their own batch.
    const imke = await cookieSession(server, 'imke');
    const signs = await many(
      // Still curing: a sign-off then says what was checked.
      {
        method: 'POST',
        path: `/api/batches/${lot}/sign-off`,
        body: { note: 'Cure weights checked.' },
      },
      imke,
    );
    assertNo5xx(signs);
    assert.deepEqual(
      signs.map((r) => r.status).sort((a, b) => a - b),
      [200, ...Array(9).fill(409)],
      show(signs),
    );
    const batch = (await send(server, rosa, { method: 'GET', path: `/api/batches/${lot}` })).json
      .batch;
    assert.deepEqual(
      batch.events.map((e: { type: string }) => e.type),
      ['recorded', 'status', 'sign-off'],
    );
  });

  it('should create a formula id once when many creates race, answering the rest 409', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const rosa = await cookieSession(server, 'rosa');
    const yaml = (i: number) =>
      `formula: 1\nid: race-mix\ntitle: Race ${i}\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n`;
    const creates = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        send(server, rosa, {
          method: 'POST',
          path: '/api/formulas',
          body: { yaml: yaml(i), message: 'Race' },
        }),
      ),
    );
    assertNo5xx(creates);
    assert.deepEqual(
      creates.map((r) => r.status).sort((a, b) => a - b),
      [201, ...Array(7).fill(409)],
      show(creates),
    );
    const winner = creates.findIndex((r) => r.status === 201);
    assert.equal(
      readFileSync(path.join(server.formulasDir, 'race-mix.yaml'), 'utf8'),
      yaml(winner),
    );
  });

  it('should add a username once when many adds race, answering the rest 409 username-taken', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const rosa = await cookieSession(server, 'rosa');
    const body = {
      username: 'same-name',
      displayName: 'Same',
      role: 'cook',
      password: 'long-enough-1',
    };
    const adds = await Promise.all(
      Array.from({ length: 6 }, () =>
        send(server, rosa, { method: 'POST', path: '/api/people', body }),
      ),
    );
    assert.deepEqual(
      adds.map((r) => r.status).sort((a, b) => a - b),
      [201, ...Array(5).fill(409)],
      show(adds),
    );
    for (const refused of adds.filter((r) => r.status === 409))
      assert.equal(refused.json.error.code, 'username-taken');
  });
});
