// On PostgreSQL the demo's seed is most of a test server's start (about 3,000 statements, one
// round trip each: 5–15 s under load). A run seeds it once every ten minutes into a database of
// its own and copies that to each test server that would seed the very same demo.
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { loadConfig } from '../../server/config.ts';
import { seedDemo } from '../../server/demo/seed-demo.ts';
import { openContext } from '../../server/main-context.ts';
import { REPO_ROOT } from './run-larder.ts';
import { TEMPLATE_LOCK, databaseUrl, makeTemplate, testPostgresTemplate } from './test-database.ts';

/**
 * Settings of a test server that change nothing the demo's seed writes. A server given any other
 * (a workflow setting, the kitchen's name, a formulas folder of its own) or a clock of its own
 * seeds its demo itself, as before.
 */
const SEED_NEUTRAL = new Set([
  'LARDER_CONSOLE',
  'LARDER_SIGN_IN_LIMIT',
  'LARDER_SESSION_SECRET',
  'LARDER_MAIL_FROM',
  'LARDER_SMTP_URL',
  'LARDER_CALC_CACHE',
  'LARDER_TRUST_PROXY',
  'LARDER_PUBLIC_URL',
  'LARDER_BUSY_TIMEOUT_MS',
  'LARDER_REMINDER_MINUTES',
  'LARDER_DEMO_SITES',
]);

/** The demo a server of these settings would seed (its number of sites), or undefined. */
export function seedableDemo(
  env: Record<string, string>,
  clock: unknown,
): { sites: 1 | 2 } | undefined {
  if (clock !== undefined || !Object.keys(env).every((key) => SEED_NEUTRAL.has(key))) return;
  const sites = env.LARDER_DEMO_SITES ?? '1';
  return sites === '1' || sites === '2' ? { sites: Number(sites) as 1 | 2 } : undefined;
}

/** Ten minutes: the demo's times (a reading "20 minutes ago") drift no more than that. */
const SLOT_MS = 10 * 60_000;

/** This process's waits for each seeded database, by name. */
const made = new Map<string, Promise<void>>();

/**
 * The name of the run's seeded demo of `sites` for this ten minutes, made now if no process of
 * the run has made it yet; undefined when the run keeps no template (a database each is then
 * migrated and seeded as it always was).
 */
export async function seededDemoTemplate(
  adminUrl: string,
  { sites }: { sites: 1 | 2 },
): Promise<string | undefined> {
  const template = testPostgresTemplate();
  if (!template) return undefined;
  const name = `${template.slice(0, 40)}_demo${sites}_${Math.floor(Date.now() / SLOT_MS)}`;
  let making = made.get(name);
  if (!making) {
    making = makeTemplate(adminUrl, template).then(() =>
      makeSeeded(adminUrl, template, name, sites),
    );
    made.set(name, making);
    making.catch(() => made.delete(name));
  }
  await making;
  return name;
}

/**
 * Copies the migrated template and seeds the demo into it as a test server does (its own copy
 * of formulas/, the demo's settings), under the run's template lock, named `name` only when done.
 */
async function makeSeeded(
  adminUrl: string,
  template: string,
  name: string,
  sites: 1 | 2,
): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-demo-template-'));
  try {
    await admin.query('SELECT pg_advisory_lock($1)', [TEMPLATE_LOCK]);
    const found = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount) return;
    const building = `${name}_building`;
    await admin.query(`DROP DATABASE IF EXISTS ${building} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${building} TEMPLATE ${template}`);
    const formulasDir = path.join(dir, 'formulas');
    cpSync(path.join(REPO_ROOT, 'formulas'), formulasDir, { recursive: true });
    const context = await openContext(
      loadConfig({
        LARDER_DB_URL: databaseUrl(adminUrl, building),
        LARDER_MODE: 'demo',
        LARDER_DATA: path.join(dir, 'data'),
        LARDER_FORMULAS: formulasDir,
        LARDER_CONSOLE: path.join(dir, 'no-console'),
        LARDER_DEMO_SITES: String(sites),
      }),
    );
    try {
      await seedDemo(context);
    } finally {
      context.formulas.close();
      await context.mail.close();
      await context.db.close();
    }
    await admin.query(`ALTER DATABASE ${building} RENAME TO ${name}`);
    await admin.query(`ALTER DATABASE ${name} ALLOW_CONNECTIONS false`);
  } finally {
    await admin.end();
    rmSync(dir, { recursive: true, force: true });
  }
}
