import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { collectConsoleErrors, startConsole } from './browser.ts';

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
});
