// A browser test that stops moving says where it stopped. The test runner cuts a whole file off at
// its time limit and reports only "test timed out", with nothing of the step it was on; this
// watch writes that step's trace to stderr (which the runner shows) before the cut.
import path from 'node:path';
import type { Browser, Page, Request } from 'playwright-core';

/**
 * After this long in one test, say where it is: past the slowest that pass (a screenshot walk of
 * every screen took 148 s with the API suites running beside it, as in CI), before the runner's
 * cut-off at 300 s.
 */
export const STILL_RUNNING_MS = 240_000;
/** How long each picture of a stuck page may take: a hung page may not draw at all. */
const PICTURE_MS = 5_000;

/** The part of a node:test context the watch needs. */
interface TestHooks {
  after(fn: () => unknown): void;
  readonly name?: string;
}

/** What a page is waiting for: its requests sent and not yet answered, by when they were sent. */
export function watchRequests(page: Page): void {
  const pending = new Map<Request, number>();
  page.on('request', (request) => pending.set(request, Date.now()));
  page.on('requestfinished', (request) => pending.delete(request));
  page.on('requestfailed', (request) => pending.delete(request));
  pendingOf.set(page, pending);
}
const pendingOf = new WeakMap<Page, Map<Request, number>>();

/** Resolves with `work`'s value, or with undefined once `ms` have passed. */
async function within<T>(ms: number, work: Promise<T>): Promise<T | undefined> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<undefined>((resolve) => (timer = setTimeout(resolve, ms)));
  try {
    return await Promise.race([work, late]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * Once a test has run STILL_RUNNING_MS, writes to stderr its name, each open page's address and
 * unanswered requests, and what keeps Node busy, and saves a picture of each page to
 * `artifacts/still-running-N.png`. It only reports: the runner's own limit still ends the test.
 */
export function watchForHang(t: TestHooks, browser: Browser, artifacts: string): void {
  const started = Date.now();
  const timer = setTimeout(() => void report(), STILL_RUNNING_MS);
  timer.unref();
  t.after(() => clearTimeout(timer));

  async function report(): Promise<void> {
    const lines = [
      `STILL RUNNING after ${Math.round((Date.now() - started) / 1000)} s: ${t.name ?? 'a browser test'}`,
    ];
    const pages = browser.contexts().flatMap((context) => context.pages());
    if (pages.length === 0) lines.push('  no page open (stuck before or after the browser part)');
    for (const [index, page] of pages.entries()) {
      lines.push(`  page ${index + 1}: ${page.url()}`);
      for (const [request, sent] of pendingOf.get(page) ?? [])
        lines.push(
          `    waiting ${Math.round((Date.now() - sent) / 1000)} s for ${request.method()} ${new URL(request.url()).pathname}`,
        );
      const file = path.join(artifacts, `still-running-${index + 1}.png`);
      const shot = await within(
        PICTURE_MS,
        page.screenshot({ path: file }).catch(() => null),
      );
      lines.push(shot ? `    picture: ${file}` : '    no picture: the page did not draw');
    }
    lines.push(`  Node is waiting on: ${process.getActiveResourcesInfo().join(', ')}`);
    process.stderr.write(`${lines.join('\n')}\n`);
  }
}

/** Closes the browser, but never waits more than `ms` for Chromium to go (it says so instead). */
export async function closeBrowser(browser: Browser, ms = 20_000): Promise<void> {
  const closed = await within(
    ms,
    browser.close().then(() => true),
  );
  if (!closed) process.stderr.write(`Chromium did not close within ${ms / 1000} s\n`);
}
