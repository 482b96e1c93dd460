import assert from 'node:assert/strict';
import { existsSync, readdirSync, utimesSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/** A save's temporary file, as a save killed mid-way leaves it, `ageMs` old. */
function leaveTemporary(server: TestServer, name: string, ageMs: number): string {
  const file = path.join(server.formulasDir, name);
  // Half a formula, as a save killed mid-write leaves it: it must never be read as one.
  writeFileSync(file, 'formula: 1\nid: quillmoor-belly\ntitle: Half-written\nkind: cu');
  const at = new Date(Date.now() - ageMs);
  utimesSync(file, at, at);
  return file;
}

/** The files GET /api/formulas lists. */
async function listed(server: TestServer): Promise<string[]> {
  const response = await server.as('imke').get('/api/formulas');
  assert.equal(response.status, 200, response.text);
  return response.json.formulas.map((f: { file: string }) => f.file);
}

const HOUR = 3_600_000;

describe('temporary files of formula saves left in the formulas folder', () => {
  it('should never be listed, and stale ones are removed when the server starts', async (t) => {
    const server = await startTestServer(t);
    const before = await listed(server);
    const stale = leaveTemporary(server, '.x.yaml.123.tmp', HOUR);
    const belly = leaveTemporary(server, '.quillmoor-belly.yaml.0a1b2c3d4e5f.tmp', HOUR);
    // A save another process may be making right now: kept.
    const fresh = leaveTemporary(server, '.pit-bun.yaml.abc.tmp', 0);
    // Not our pattern: kept.
    const other = leaveTemporary(server, '.notes.txt.123.tmp', HOUR);

    // The folder watch has seen the new files; the list still has only the formulas.
    assert.deepEqual(await listed(server), before);
    const belly1 = await server.as('imke').get('/api/formulas/quillmoor-belly');
    assert.equal(belly1.status, 200);
    assert.notEqual(belly1.json.title, 'Half-written');

    await server.restart();
    assert.equal(existsSync(stale), false, 'the stale .x.yaml.123.tmp is removed');
    assert.equal(existsSync(belly), false, 'the stale belly temporary is removed');
    assert.equal(existsSync(fresh), true, 'a fresh one is kept');
    assert.equal(existsSync(other), true, 'another pattern is kept');
    assert.deepEqual(await listed(server), before);
    assert.ok(readdirSync(server.formulasDir).includes('quillmoor-belly.yaml'));
  });
});
