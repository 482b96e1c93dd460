// `npm run test:pg`: the API and fault suites that pass on PostgreSQL so far (listed in
// tests/postgres-suites-passing-so-far.txt, which grows until it names them all), run against a
// throw-away cluster started for them and stopped afterwards, whether they pass or not.
// `--browser` (`npm run test:e2e:pg`): the browser suites instead, every one, on the console
// `ng build` made, one at a time as `npm run test:e2e` runs them.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { startCluster, stopCluster } from './pg-cluster.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const LIST = path.join(root, 'tests/postgres-suites-passing-so-far.txt');

const browser = process.argv.includes('--browser');

/** The spec files of the list (one a line, # starts a comment), or every browser suite. */
const suites = browser
  ? readdirSync(path.join(root, 'tests/e2e'))
      .filter((name) => name.endsWith('.e2e.ts'))
      .sort()
      .map((name) => `tests/e2e/${name}`)
  : readFileSync(LIST, 'utf8')
      .split('\n')
      .map((line) => line.replace(/#.*/, '').trim())
      .filter(Boolean);
/**
 * The runner's limits. The API suites get ten minutes a test, not five (a suite's describe counts
 * as one test: so does its whole file), as a server that seeds its own demo on PostgreSQL takes
 * several times longer (one round trip a statement). The browser suites keep their own
 * (package.json's test:e2e), one file at a time.
 */
const runnerArgs = browser
  ? ['--test-timeout=300000', '--test-concurrency=1']
  : ['--test-timeout=600000'];

// A cluster already running (LARDER_TEST_PG_URL, as a developer may have one) is used as it is.
const given = process.env.LARDER_TEST_PG_URL;
const { url, dir } = given ? { url: given, dir: null } : await startCluster();
// Each test database is copied from one migrated template, made once for this run by the first
// test that needs it (tests/helpers/test-database.ts) and dropped at the end: migrating every
// test server's database from nothing took most of a second each.
const ownTemplate = !process.env.LARDER_TEST_PG_TEMPLATE;
const template =
  process.env.LARDER_TEST_PG_TEMPLATE || `larder_template_${randomBytes(6).toString('hex')}`;

/** Drops this run's template, the demos seeded from it and any unfinished forms of them. */
async function dropTemplate() {
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  try {
    // With the seeded demos made from it (tests/helpers/demo-template.ts), named after it.
    const { rows } = await admin.query(
      'SELECT datname FROM pg_database WHERE starts_with(datname, $1) OR starts_with(datname, $2)',
      [template, template.slice(0, 40)],
    );
    for (const { datname } of rows)
      await admin.query(`DROP DATABASE IF EXISTS ${datname} WITH (FORCE)`);
  } finally {
    await admin.end();
  }
}

let stopped = false;
const stop = () => {
  if (stopped || !dir) return;
  stopped = true;
  stopCluster(dir);
};
// An interrupted run stops its cluster too: nothing is left behind.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'])
  process.on(signal, () => {
    stop();
    process.exit(130);
  });
try {
  process.stdout.write(
    `PostgreSQL ${browser ? 'browser ' : ''}suites (${suites.length}) on ${dir ? `a throw-away cluster in ${dir}` : 'the cluster of LARDER_TEST_PG_URL'}\n`,
  );
  const code = await new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', '--test', ...runnerArgs, ...suites], {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, LARDER_TEST_PG_URL: url, LARDER_TEST_PG_TEMPLATE: template },
    });
    child.once('exit', (exitCode, signal) => resolve(exitCode ?? (signal ? 1 : 0)));
  });
  process.exitCode = code;
} finally {
  // A cluster of this run's own goes as a whole; on a given one the template must go by itself.
  if (!dir && ownTemplate)
    await dropTemplate().catch((error) =>
      process.stderr.write(`could not drop the template ${template}: ${error.message}\n`),
    );
  stop();
}
