import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { collectConsoleErrors, startConsole } from './browser.ts';

// A production install needs a real secret of at least 32 characters (server/config.ts).
const PRODUCTION = { LARDER_MODE: 'production', LARDER_SESSION_SECRET: 'x'.repeat(40) };

/** Every error the page logs, a 401 too, and every API answer of 400 or more. */
function everyError(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('response', (response) => {
    if (response.status() >= 400) errors.push(`${response.status()} ${response.url()}`);
  });
  return errors;
}

/** Opens the console at its address, as a person does, and waits for the sign-in page. */
async function openAfresh(page: Page, url: string): Promise<void> {
  await page.goto(`${url}/`, { waitUntil: 'networkidle' });
  await page.waitForURL(/\/sign-in/);
  await page.getByRole('button', { name: 'Sign in', exact: true }).waitFor();
}

describe('signing in to the console', () => {
  for (const [user, role] of [
    ['rosa', 'Admin'],
    ['tobin', 'Cook'],
    ['imke', 'Reviewer'],
  ] as const) {
    it(`should sign ${user} in as ${role}, show who is signed in, and sign out`, async (t) => {
      const session = await startConsole(t);
      const page = await session.page();
      const errors = collectConsoleErrors(page);
      await page.getByLabel('Username').fill(user);
      await page
        .getByLabel('Password')
        .fill(`quillmoor-${user === 'rosa' ? 'admin' : user === 'tobin' ? 'cook' : 'review'}`);
      await page.getByRole('button', { name: 'Sign in' }).click();
      const who = page.getByTestId('signed-in-as');
      await who.waitFor();
      assert.match(await who.innerText(), new RegExp(role));
      assert.match(await who.innerText(), /Demo/);
      const areas = await page
        .getByRole('navigation')
        .or(page.getByLabel('Areas'))
        .first()
        .innerText();
      assert.match(areas, /Formulas/);
      assert.match(areas, /Batch log/);
      assert.match(areas, /Today/);
      assert.equal(/People/.test(areas), user === 'rosa', 'only admins see People');
      if (user === 'rosa') await session.screenshot(page, 'shell-admin');
      await page.getByRole('button', { name: 'Your account' }).click();
      await page.getByRole('menuitem', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in/);
      assert.deepEqual(errors, []);
    });
  }

  it('should fit the top bar of every role on a 390 px phone, with no sideways scrolling', async (t) => {
    const session = await startConsole(t);
    for (const user of ['rosa', 'tobin', 'imke'] as const) {
      const page = await session.page(user);
      // A common phone width (390 × 844 CSS px). common practice, no source
      await page.setViewportSize({ width: 390, height: 844 });
      await page.goto(`${session.server.url}/plans`, { waitUntil: 'networkidle' });
      await page.getByRole('button', { name: 'Your account' }).waitFor();
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      assert.ok(width <= 390, `${user}: the page is ${width} px wide on a 390 px screen`);
    }
  });

  it('should refuse a wrong password with a message on screen', async (t) => {
    const session = await startConsole(t);
    const page = await session.page();
    await page.getByLabel('Username').fill('rosa');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    const alert = page.getByRole('alert');
    await alert.waitFor();
    assert.match(await alert.innerText(), /wrong username or password/);
    await session.screenshot(page, 'sign-in-refused');
  });

  it('should ship its fonts and icons: nothing is loaded from outside', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const outside: string[] = [];
    page.on('request', (request) => {
      if (!request.url().startsWith(session.server.url)) outside.push(request.url());
    });
    await page.reload({ waitUntil: 'networkidle' });
    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts]
        .filter((font) => font.status === 'loaded')
        .map((font) => font.family.replace(/"/g, ''));
    });
    assert.ok(fonts.includes('Fira Sans'), fonts.join());
    assert.ok(fonts.includes('Material Symbols Outlined'), fonts.join());
    assert.deepEqual(outside, []);
  });

  it('should open the sign-in page with no error in the browser console', async (t) => {
    const session = await startConsole(t);
    const page = await session.page();
    const errors = everyError(page);
    await openAfresh(page, session.server.url);
    await page.reload({ waitUntil: 'networkidle' });
    assert.deepEqual(errors, []);
  });

  it('should say it is the demo and fill in a demo sign-in when one is chosen', async (t) => {
    const session = await startConsole(t);
    const page = await session.page();
    const errors = everyError(page);
    await openAfresh(page, session.server.url);
    const demo = page.getByTestId('demo-sign-ins');
    await demo.waitFor();
    const text = await demo.innerText();
    assert.match(text, /This is a demo/);
    assert.match(text, /Quillmoor Smokehouse and its people are invented/);
    // The names, roles and passwords of server/demo/demo-people.ts.
    for (const line of [
      /Rosa Quennick \(head cook\)\s+admin[^]*username\s+rosa, password\s+quillmoor-admin/,
      /Tobin Marrowfeld \(cook\)\s+cook[^]*username\s+tobin, password\s+quillmoor-cook/,
      /Imke Tressaly \(food safety\)\s+reviewer[^]*username\s+imke, password\s+quillmoor-review/,
    ])
      assert.match(text, line);
    for (const [width, name] of [
      [1280, 'sign-in-demo'],
      [820, 'sign-in-demo-tablet'],
      [390, 'sign-in-demo-phone'],
    ] as const) {
      await page.setViewportSize({ width, height: 900 });
      await session.screenshot(page, name);
      const scroll = await page.evaluate(() => document.documentElement.scrollWidth);
      assert.ok(scroll <= width, `${width} px: the page is ${scroll} px wide`);
    }
    await page.getByRole('button', { name: /^Fill in Tobin Marrowfeld \(cook\)/ }).click();
    assert.equal(await page.getByLabel('Username').inputValue(), 'tobin');
    assert.equal(await page.getByLabel('Password').inputValue(), 'quillmoor-cook');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    const who = page.getByTestId('signed-in-as');
    await who.waitFor();
    assert.match(await who.innerText(), /Cook/);
    assert.deepEqual(errors, []);
  });

  it('should show no demo and no demo sign-ins on an install that is not the demo', async (t) => {
    // The test server has the demo people in its database in every mode: they must not show.
    const session = await startConsole(t, { env: PRODUCTION });
    const page = await session.page();
    const errors = everyError(page);
    await openAfresh(page, session.server.url);
    const text = await page.locator('main').innerText();
    assert.doesNotMatch(text, /demo|quillmoor|Rosa|password quillmoor/i);
    assert.equal(await page.getByTestId('demo-sign-ins').count(), 0);
    await session.screenshot(page, 'sign-in-production');
    assert.deepEqual(errors, []);
  });
});
