// The screenshot walk: every screen of the console, as each role, at a desk, a tablet and a phone
// width, checked with axe-core for serious and critical problems. Screenshots go to
// test-artifacts/screens/<width>/<screen>.png. One file per role runs it (accessibility*.e2e.ts),
// so that each stays within the browser tests' time limit.
import assert from 'node:assert/strict';
import { mkdirSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { after, before, it } from 'node:test';
import type { Page } from 'playwright-core';
import { REPO_ROOT } from '../helpers/run-larder.ts';
import type { DemoUser } from '../helpers/test-server.ts';
import { accessibilityProblems, describeProblems } from './accessibility.ts';
import { ARTIFACTS, startConsole, transitionsDone, type ConsoleSession } from './browser.ts';

/** A desk screen, a tablet held upright and a phone (CSS px). common practice, no source */
export const SIZES = [
  { width: 1280, height: 860 },
  { width: 820, height: 1180 },
  { width: 390, height: 844 },
] as const;

/** One screen of the console: its name in the artifacts and its address. */
interface Screen {
  readonly name: string;
  /** The address; a function for screens that need a lot or a formula of the demo. */
  readonly path: (demo: DemoRecords) => string;
}

export interface DemoRecords {
  readonly lot: string;
  readonly formula: string;
}

/** Every route of src/app/**\/*.routes.ts, by the address that shows it. */
export const SCREENS: readonly Screen[] = [
  { name: 'formulas', path: () => '/formulas' },
  { name: 'formula', path: (demo) => `/formulas/${demo.formula}` },
  { name: 'plans', path: () => '/plans' },
  { name: 'batch-log', path: () => '/batches' },
  { name: 'record-batch', path: () => '/batches/new' },
  { name: 'batch', path: (demo) => `/batches/${demo.lot}` },
  { name: 'today', path: () => '/today' },
  { name: 'sign-off-queue', path: () => '/batches?show=sign-off' },
  { name: 'equipment', path: () => '/equipment' },
  { name: 'trace', path: (demo) => `/trace?lot=${demo.lot}` },
  { name: 'deliveries', path: () => '/deliveries' },
  { name: 'haccp-report', path: () => '/reports' },
  { name: 'least-cost-blend', path: () => '/costing' },
  { name: 'people', path: () => '/people' },
  { name: 'audit', path: () => '/people/audit' },
  { name: 'outbox', path: () => '/people/outbox' },
  { name: 'not-found', path: () => '/no-such-page' },
];

/** The screens before signing in. */
export const PUBLIC_SCREENS: readonly Screen[] = [
  { name: 'sign-in', path: () => '/sign-in' },
  { name: 'set-password', path: () => '/set-password?token=not-a-real-token' },
];

/** The route paths the routes files declare, e.g. "people", "audit", ":lot". */
export function declaredRoutePaths(): string[] {
  const app = path.join(REPO_ROOT, 'src/app');
  const files = readdirSync(app, { recursive: true, encoding: 'utf8' }).filter((file) =>
    file.endsWith('.routes.ts'),
  );
  return files.flatMap((file) =>
    [...readFileSync(path.join(app, file), 'utf8').matchAll(/path: '([^']*)'(.*)/g)]
      // A redirect shows the screen it leads to, which is walked under its own address.
      .filter((match) => !match[2].includes('redirectTo'))
      .map((match) => match[1]),
  );
}

/** Lets the page settle after a change of size: layouts and animations run their course. */
async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(250);
  await transitionsDone(page);
}

/** Visits a screen, then at every size saves a screenshot and notes the problems axe finds. */
async function walk(page: Page, url: string, name: string): Promise<string[]> {
  const found: string[] = [];
  await page.setViewportSize(SIZES[0]);
  await page.goto(url, { waitUntil: 'networkidle' });
  // Every screen says what it is in a heading: a page that never drew one (a chunk that failed
  // to load, an error before the first render) would otherwise pass axe as an empty page.
  try {
    await page.locator('h1').first().waitFor({ state: 'visible', timeout: 20_000 });
  } catch {
    return [`${name}: the screen showed no heading (it did not draw)`];
  }
  for (const size of SIZES) {
    await page.setViewportSize(size);
    await settle(page);
    const folder = path.join(ARTIFACTS, 'screens', String(size.width));
    mkdirSync(folder, { recursive: true });
    await page.screenshot({ path: path.join(folder, `${name}.png`), fullPage: true });
    const problems = await accessibilityProblems(page);
    if (problems.length > 0) found.push(`at ${size.width} px:\n${describeProblems(problems)}`);
  }
  return found;
}

/**
 * Declares the walk for some of the people: the screens before signing in (null), or every screen
 * as a demo person; one test each, failing with every problem axe found, screen by screen.
 * @param who The demo people to walk as; null for the screens before signing in.
 */
export function describeScreenWalk(who: readonly (DemoUser | null)[]): void {
  const cleanups: (() => unknown)[] = [];
  let session: ConsoleSession;
  let demo: DemoRecords;

  before(async () => {
    // One server and browser for the whole walk: the hang watch times the walk, not one screen.
    const walkers = who.map((user) => user ?? 'before signing in').join(', ');
    session = await startConsole({
      after: (fn) => cleanups.push(fn),
      name: `the screenshot walk (${walkers}), all its screens`,
    });
    const rosa = session.server.as('rosa');
    const batches = await rosa.get('/api/batches?limit=1');
    const formulas = await rosa.get('/api/formulas');
    demo = { lot: batches.json.items[0].lotCode, formula: formulas.json.formulas[0].id };
  });
  after(async () => {
    for (const cleanup of cleanups.reverse()) await cleanup();
  });

  for (const user of who) {
    const title = user ? `every screen to ${user}` : 'the screens before signing in';
    it(`should show ${title} with no serious accessibility problems`, async () => {
      const page = user ? await session.page(user) : await session.page();
      const found: string[] = [];
      for (const screen of user ? SCREENS : PUBLIC_SCREENS) {
        const name = user ? `${screen.name}-${user}` : screen.name;
        const problems = await walk(page, session.server.url + screen.path(demo), name);
        if (problems.length > 0) found.push(`${name}\n${problems.join('\n')}`);
      }
      await page.context().close();
      assert.ok(found.length === 0, found.join('\n\n'));
    });
  }
}
