import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, it, type TestContext } from 'node:test';
import { startTestServer, type ApiClient, type TestServer } from '../helpers/test-server.ts';

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

async function save(
  client: ApiClient,
  id: string,
  change: (yaml: string) => string,
  message: string,
): Promise<{ before: string; after: string; response: Awaited<ReturnType<ApiClient['get']>> }> {
  const got = await client.get(`/api/formulas/${id}`);
  const after = change(got.json.yaml);
  assert.notEqual(after, got.json.yaml);
  const response = await client.request(
    'PUT',
    `/api/formulas/${id}`,
    { yaml: after, message },
    { 'if-match': got.headers.get('etag') ?? '' },
  );
  assert.equal(response.status, 200, response.text);
  return { before: got.json.yaml, after, response };
}

describe('formula history', () => {
  it('should list revisions newest first and give the YAML of each', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const first = await save(
      rosa,
      'house-sauce',
      (y) => y.replace('pct: 25 }', 'pct: 30 }'),
      'One',
    );
    const second = await save(rosa, 'house-sauce', (y) => y.replace('pct: 8 }', 'pct: 9 }'), 'Two');
    const list = await server.as('imke').get('/api/formulas/house-sauce/revisions');
    assert.equal(list.status, 200);
    assert.deepEqual(
      list.json.revisions.map((r: { source: string; message: string; revision: string }) => [
        r.source,
        r.message,
        r.revision,
      ]),
      [
        ['save', 'Two', sha256(second.after)],
        ['save', 'One', sha256(first.after)],
        ['disk', 'found on disk', sha256(first.before)],
      ],
    );
    assert.equal(list.json.revisions[0].author.displayName, 'Rosa Quennick (head cook)');
    assert.equal(list.json.currentRevision, sha256(second.after));

    const old = await server
      .as('tobin')
      .get(`/api/formulas/house-sauce/revisions/${sha256(first.before)}`);
    assert.equal(old.status, 200);
    assert.equal(old.json.yaml, first.before);
    assert.equal(old.json.current, false);
    const unknown = await rosa.get(`/api/formulas/house-sauce/revisions/${'c'.repeat(64)}`);
    assert.equal(unknown.status, 404);
    const malformed = await rosa.get('/api/formulas/house-sauce/revisions/not-a-revision');
    assert.equal(malformed.status, 400);
    const none = await rosa.get('/api/formulas/no-such-formula/revisions');
    assert.equal(none.status, 404);
  });

  it('should diff two revisions line by line, with line numbers on each side', async (t) => {
    const server = await startTestServer(t);
    const rosa = await server.signIn('rosa'); // one sign-in, not a password check per request
    const { before, after } = await save(
      rosa,
      'house-sauce',
      (y) =>
        y.replace('  - { name: chili sauce, pct: 25 }\n', '  - { name: chili sauce, pct: 30 }\n'),
      'More chili',
    );
    const diff = await server
      .as('imke')
      .get(`/api/formulas/house-sauce/diff?from=${sha256(before)}`);
    assert.equal(diff.status, 200);
    assert.equal(diff.json.from.yaml, before);
    assert.equal(diff.json.to.yaml, after);
    assert.equal(diff.json.to.revision, sha256(after));
    assert.equal(diff.json.changed, true);
    // The chili sauce is the second ingredient: line 9 of house-sauce.yaml.
    const changes = diff.json.lines.filter((line: { kind: string }) => line.kind !== 'same');
    assert.deepEqual(changes, [
      { kind: 'removed', text: '  - { name: chili sauce, pct: 25 }', oldLine: 9, newLine: null },
      { kind: 'added', text: '  - { name: chili sauce, pct: 30 }', oldLine: null, newLine: 9 },
    ]);
    // Every line of the file once, plus the added one (the final newline starts no line).
    assert.equal(diff.json.lines.length, before.split('\n').length);
    // One hunk: three lines of context either side of the change, from line 6.
    assert.equal(diff.json.hunks.length, 1);
    assert.equal(diff.json.hunks[0].oldStart, 6);
    assert.equal(diff.json.hunks[0].newStart, 6);
    assert.equal(diff.json.hunks[0].lines.length, 8);

    const backwards = await rosa.get(
      `/api/formulas/house-sauce/diff?from=${sha256(after)}&to=${sha256(before)}`,
    );
    assert.equal(
      backwards.json.lines.find((l: { kind: string }) => l.kind === 'added').text,
      '  - { name: chili sauce, pct: 25 }',
    );
    const same = await rosa.get(`/api/formulas/house-sauce/diff?from=${sha256(after)}`);
    assert.equal(same.json.changed, false);
    assert.deepEqual(same.json.hunks, []);
    assert.equal((await rosa.get('/api/formulas/house-sauce/diff')).status, 400);
    assert.equal(
      (await rosa.get(`/api/formulas/house-sauce/diff?from=${'d'.repeat(64)}`)).status,
      404,
    );
  });
});

/** Runs the test's server with a git that reads no system or user config (HOME is a temp dir). */
function isolateGit(t: TestContext): void {
  const saved = { HOME: process.env.HOME, GIT_CONFIG_NOSYSTEM: process.env.GIT_CONFIG_NOSYSTEM };
  const home = mkdtempSync(path.join(tmpdir(), 'larder-git-home-'));
  process.env.HOME = home;
  process.env.GIT_CONFIG_NOSYSTEM = '1';
  t.after(() => {
    for (const [key, value] of Object.entries(saved)) {
      if (value === undefined) delete process.env[key];
      else process.env[key] = value;
    }
    rmSync(home, { recursive: true, force: true });
  });
}

function gitIn(server: TestServer) {
  return (...args: string[]): string =>
    execFileSync('git', args, {
      cwd: server.formulasDir,
      encoding: 'utf8',
      env: {
        ...process.env,
        GIT_AUTHOR_NAME: 'Seed',
        GIT_AUTHOR_EMAIL: 'seed@example.invalid',
        GIT_COMMITTER_NAME: 'Seed',
        GIT_COMMITTER_EMAIL: 'seed@example.invalid',
      },
    });
}

describe('formulas in a git work tree', () => {
  it('should commit a save with the admin as author and only the saved file', async (t) => {
    isolateGit(t);
    const server = await startTestServer(t);
    const git = gitIn(server);
    git('init', '-q');
    git('add', '.');
    git('commit', '-q', '-m', 'Demo formulas');
    // Something else staged must not go into the formula's commit.
    const rub = path.join(server.formulasDir, 'brisket-rub.yaml');
    writeFileSync(rub, `${readFileSync(rub, 'utf8')}# staged, not saved\n`);
    git('add', 'brisket-rub.yaml');

    const { response } = await save(
      server.as('rosa'),
      'house-sauce',
      (y) => y.replace('pct: 25 }', 'pct: 30 }'),
      'More chili for the summer',
    );
    assert.match(response.json.commit, /^[0-9a-f]{40}$/);
    assert.deepEqual(response.json.warnings, []);
    assert.deepEqual(git('log', '-1', '--format=%H%n%an <%ae>%n%cn <%ce>%n%s').trim().split('\n'), [
      response.json.commit,
      'Rosa Quennick (head cook) <rosa@larderbook.invalid>',
      'Larderbook <larderbook@larderbook.invalid>',
      'More chili for the summer',
    ]);
    assert.equal(git('show', '--name-only', '--format=', 'HEAD').trim(), 'house-sauce.yaml');
    assert.equal(git('diff', '--cached', '--name-only').trim(), 'brisket-rub.yaml');
    const history = await server.as('rosa').get('/api/formulas/house-sauce/revisions');
    assert.equal(history.json.revisions[0].commit, response.json.commit);

    const created = await server.as('rosa').post('/api/formulas', {
      yaml: 'formula: 1\nid: plain-salt\ntitle: Plain salt\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n',
      message: 'Add plain salt',
    });
    assert.equal(created.status, 201, created.text);
    assert.equal(git('log', '-1', '--format=%s').trim(), 'Add plain salt');
    assert.equal(git('show', '--name-only', '--format=', 'HEAD').trim(), 'plain-salt.yaml');
  });

  it('should keep the save and warn when git cannot commit', async (t) => {
    isolateGit(t);
    const server = await startTestServer(t);
    const git = gitIn(server);
    git('init', '-q');
    git('add', '.');
    git('commit', '-q', '-m', 'Demo formulas');
    const hook = path.join(server.formulasDir, '.git', 'hooks', 'pre-commit');
    writeFileSync(hook, '#!/bin/sh\necho "refused by the hook" >&2\nexit 1\n');
    chmodSync(hook, 0o755);
    const { after, response } = await save(
      server.as('rosa'),
      'house-sauce',
      (y) => y.replace('pct: 25 }', 'pct: 30 }'),
      'Hook says no',
    );
    assert.equal(response.json.commit, null);
    assert.equal(response.json.warnings.length, 1);
    assert.match(response.json.warnings[0], /git could not commit/);
    assert.equal(readFileSync(path.join(server.formulasDir, 'house-sauce.yaml'), 'utf8'), after);
    assert.equal(git('log', '-1', '--format=%s').trim(), 'Demo formulas');
  });
});
