import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { REPO_ROOT } from '../helpers/run-larder.ts';
import { closeBrowser, watchForHang, watchRequests } from './hang-watch.ts';
import {
  PASSWORDS,
  startTestServer,
  type DemoUser,
  type TestServer,
} from '../helpers/test-server.ts';

/** Debian's Chromium; the tests never download a browser. */
const CHROMIUM = process.env.LARDER_CHROMIUM ?? '/usr/bin/chromium';
/** Where screenshots of the main screens are kept as test artifacts. */
export const ARTIFACTS = path.join(REPO_ROOT, 'test-artifacts');

interface AfterHook {
  after(fn: () => unknown): void;
  /** The test's name, for the word a stuck test leaves (hang-watch.ts). */
  readonly name?: string;
}

/** A running server with the built console, and a browser to drive it. */
export interface ConsoleSession {
  readonly server: TestServer;
  readonly browser: Browser;
  /** A fresh page (own cookies) signed in as a demo person, or at the sign-in page. */
  page(user?: DemoUser): Promise<Page>;
  /** Saves a screenshot of a page under test-artifacts/. */
  screenshot(page: Page, name: string): Promise<void>;
}

/**
 * Console errors a page logged, except a 401 (a refused sign-in, a session that ended); asking
 * who is signed in answers 200 even when nobody is (the sign-in tests check that strictly).
 */
export function collectConsoleErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' && !/status of 401/.test(message.text()))
      errors.push(message.text());
  });
  page.on('pageerror', (error) => errors.push(error.message));
  return errors;
}

/** Signs in through the form, as a person would. */
export async function signIn(page: Page, user: DemoUser): Promise<void> {
  await page.getByLabel('Username').fill(user);
  await page.getByLabel('Password').fill(PASSWORDS[user]);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** Headless Debian Chromium, with nothing of its own going out to the network; closed at the end. */
export async function launchChromium(t: AfterHook): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    // Well inside the runner's limit for the whole file, so a browser that never starts says so.
    timeout: 60_000,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  t.after(() => closeBrowser(browser));
  return browser;
}

/**
 * Starts the real server (temporary database, demo data, the built console from dist/console)
 * and headless Chromium; both stop when the test ends. No request leaves 127.0.0.1.
 * @param options.now the server's clock, for tests that move time on (a cooling deadline)
 * @param options.env further settings, e.g. LARDER_MODE=production for an install that is no demo
 */
export async function startConsole(
  t: AfterHook,
  { env = {}, ...options }: { now?: () => Date; env?: Record<string, string> } = {},
): Promise<ConsoleSession> {
  const server = await startTestServer(
    t,
    { LARDER_CONSOLE: path.join(REPO_ROOT, 'dist/console/browser'), ...env },
    options,
  );
  const browser = await launchChromium(t);
  mkdirSync(ARTIFACTS, { recursive: true });
  watchForHang(t, browser, ARTIFACTS);
  return {
    server,
    browser,
    page: async (user) => {
      const context = await browser.newContext({
        viewport: { width: 1280, height: 860 },
        acceptDownloads: true,
      });
      // Anything not on the test server is refused: fonts and icons must ship with the app.
      await context.route(
        (url) => url.hostname !== '127.0.0.1',
        (route) => route.abort(),
      );
      const page = await context.newPage();
      watchRequests(page);
      await page.goto(`${server.url}/`, { waitUntil: 'networkidle' });
      if (user) await signIn(page, user);
      return page;
    },
    screenshot: async (page, name) => {
      await transitionsDone(page);
      await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
    },
  };
}

/** Chooses an option of a Material select, found by its test id, by the option's visible text. */
export async function choose(page: Page, testId: string, option: RegExp): Promise<void> {
  await page.getByTestId(testId).click();
  await page.getByRole('option', { name: option }).click();
}

/**
 * Waits until the dialog opened last has taken the keyboard focus. A dialog moves focus to its
 * first field when its opening animation ends; text typed before that, under load, can land in
 * that first field instead of the one it was meant for.
 */
export async function dialogSettled(page: Page): Promise<void> {
  await page.waitForFunction(() => {
    const dialogs = document.querySelectorAll('mat-dialog-container');
    const last = dialogs[dialogs.length - 1];
    return last !== undefined && last.contains(document.activeElement);
  });
}

/**
 * Waits until no CSS transition is running: a resize below the tablet width slides the navigation
 * shut, and a picture taken on its way shows it half drawn over the screen.
 */
export async function transitionsDone(page: Page): Promise<void> {
  // A resize is answered a frame or two later (the layout's media queries, then the drawer). A
  // page that draws no frames (hidden, or stuck) would never answer: a second is the most to wait.
  await page.evaluate(
    () =>
      new Promise<void>((done) => {
        requestAnimationFrame(() => requestAnimationFrame(() => done()));
        setTimeout(done, 1000);
      }),
  );
  await page.waitForFunction(() =>
    document
      .getAnimations()
      .every((a) => !(a instanceof CSSTransition) || a.playState !== 'running'),
  );
}
