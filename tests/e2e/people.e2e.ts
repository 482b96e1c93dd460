import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { assertAccessible } from './accessibility.ts';
import {
  choose,
  collectConsoleErrors,
  dialogSettled,
  startConsole,
  type ConsoleSession,
} from './browser.ts';
import { SIZES } from './screen-walk.ts';

const TOBIN = 'Tobin Marrowfeld (cook)';

/** Screenshots of the page as it is at each width, as people-<name>-<width>.png. */
async function atEveryWidth(session: ConsoleSession, page: Page, name: string): Promise<void> {
  for (const size of SIZES) {
    await page.setViewportSize(size);
    await page.waitForTimeout(250);
    await session.screenshot(page, `people-${name}-${size.width}`);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    assert.ok(width <= size.width, `${name}: the page is ${width} px wide at ${size.width} px`);
  }
  await page.setViewportSize(SIZES[0]);
}

describe('people, the audit log and the outbox in the console', () => {
  it('should name each action button for the action and the person', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${session.server.url}/people`, { waitUntil: 'networkidle' });
    const row = page.getByTestId('person-row').and(page.locator('[data-username="tobin"]'));
    for (const name of [`Edit ${TOBIN}`, `Reset the password of ${TOBIN}`, `Deactivate ${TOBIN}`]) {
      const button = row.getByRole('button', { name, exact: true });
      assert.equal(await button.count(), 1, `a button a screen reader reads as “${name}”`);
    }
    await row.getByRole('button', { name: `Reset the password of ${TOBIN}` }).hover();
    await page.getByRole('tooltip').or(page.locator('.mat-mdc-tooltip')).first().waitFor();
    await atEveryWidth(session, page, 'list');
    await page.getByTestId('add-person').click();
    await page.getByTestId('person-username').waitFor();
    await page.waitForTimeout(300);
    await assertAccessible(page, 'the add-person dialog');
    assert.deepEqual(errors, []);
  });

  it('should show the audit log by name, link lots and formulas, keep refusals and filter', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    // A refused batch: 5 kg pumped to 5.6 kg is 144 ppm ingoing nitrite, over the 120 ppm
    // ceiling for pumped bacon. source: 9 CFR 424.22(b); FSIS Directive 7620.3 ch. 3
    const refused = await server.as('tobin').post('/api/batches', {
      formula: 'maple-pump-belly',
      batch: { meat: '5kg', pumpedWeight: '5.6kg' },
    });
    assert.equal(refused.status, 422, refused.text);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/people/audit`, { waitUntil: 'networkidle' });
    const rows = page.getByTestId('audit-row');
    await rows.first().waitFor();

    const refusal = rows.and(page.locator('[data-action="calculation-refused"]')).first();
    assert.match(await refusal.innerText(), /A calculation was refused/);
    assert.equal(await refusal.getByTestId('audit-who').innerText(), TOBIN);
    assert.match(await refusal.innerText(), /over the 120 ppm limit/);
    assert.equal(
      // By its title (formulas/maple-pump-belly.yaml), not its id.
      await refusal.getByRole('link', { name: 'Maple belly, injected' }).getAttribute('href'),
      '/formulas/maple-pump-belly',
    );
    // The demo's corrective action: by name, its lot linked, no record numbers in the detail.
    const corrective = rows.and(page.locator('[data-action="corrective-action"]')).first();
    assert.equal(await corrective.getByTestId('audit-who').innerText(), TOBIN);
    assert.match(await corrective.getByTestId('audit-subject').innerText(), /^Lot \d{6}-/);
    assert.doesNotMatch(await corrective.innerText(), /deviation: \d|action: \d/);
    await atEveryWidth(session, page, 'audit');

    // Who: Tobin only.
    await page.getByTestId('audit-person-filter').click();
    await page.getByRole('option', { name: TOBIN }).click();
    await page.waitForLoadState('networkidle');
    await page.waitForTimeout(400);
    const whos = await page.getByTestId('audit-who').allInnerTexts();
    assert.ok(whos.length > 0);
    assert.deepEqual(new Set(whos), new Set([TOBIN]));
    await page.getByTestId('audit-clear-filters').click();

    // To what: one formula.
    await page.getByTestId('audit-subject-filter').fill('maple-pump-belly');
    // The filtered page has arrived once every row left is the formula's (a busy machine may take
    // longer than the filter's pause to answer).
    await page.waitForFunction(() => {
      const shown = [...document.querySelectorAll<HTMLElement>('[data-testid="audit-row"]')];
      return (
        shown.length > 0 && shown.every((row) => row.dataset['action'] === 'calculation-refused')
      );
    });
    assert.deepEqual(await rows.evaluateAll((all) => all.map((row) => row.dataset['action'])), [
      'calculation-refused',
    ]);
    // When: from tomorrow on there is nothing yet.
    await page.getByTestId('audit-clear-filters').click();
    const tomorrow = new Date(Date.now() + 86_400_000);
    const day = `${tomorrow.getFullYear()}-${String(tomorrow.getMonth() + 1).padStart(2, '0')}-${String(tomorrow.getDate()).padStart(2, '0')}`;
    await page.getByTestId('audit-from-filter').fill(day);
    await page.getByTestId('audit-empty').waitFor();
    assert.match(await page.getByTestId('audit-empty').innerText(), /matches these filters/);
    await page.getByTestId('audit-clear-filters').click();

    // The lot link opens the batch's page.
    await rows.first().waitFor();
    const lotLink = corrective.getByRole('link');
    const lot = (await lotLink.innerText()).replace(/^Lot /, '');
    await lotLink.click();
    await page.waitForURL(`**/batches/${lot}`);
    assert.deepEqual(errors, []);
  });

  it('should show throttled sign-ins in the audit log', async (t) => {
    // A small limit keeps the test short. common practice, no source
    const session = await startConsole(t, { env: { LARDER_SIGN_IN_LIMIT: '2' } });
    const { server } = session;
    // Signed in before the guessing starts: a session is not a sign-in attempt, and goes on.
    const page = await session.page('rosa');
    const statuses: number[] = [];
    for (let i = 1; i <= 4; i++) {
      const response = await fetch(`${server.url}/api/session`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ username: 'imke', password: `guess-${i}` }),
      });
      statuses.push(response.status);
    }
    assert.deepEqual(statuses, [401, 401, 429, 429]);
    await page.goto(`${server.url}/people/audit`, { waitUntil: 'networkidle' });
    const throttled = page
      .getByTestId('audit-row')
      .and(page.locator('[data-action="sign-in-throttled"]'));
    await throttled.first().waitFor();
    assert.equal(await throttled.count(), 1, 'one entry, not one per refused attempt');
    assert.match(await throttled.innerText(), /Sign-ins paused after failures/);
    assert.equal(
      await throttled.getByTestId('audit-who').innerText(),
      'someone trying “imke”, the username of Imke Tressaly (food safety)',
    );
    assert.match(await throttled.innerText(), /may try again in 15 min/);
  });

  it('should say that messages are kept here, never that they were sent', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    const added = await session.server.as('rosa').post('/api/people', {
      username: 'wren',
      displayName: 'Wren Ollivane',
      email: 'wren@quillmoor.invalid',
      role: 'cook',
    });
    assert.equal(added.status, 201, added.text);
    await session.server.context.mail.delivery.idle();
    await page.goto(`${session.server.url}/people/outbox`, { waitUntil: 'networkidle' });
    const transport = page.getByTestId('outbox-transport');
    assert.match(await transport.innerText(), /Kept here — no mail server is set up/);
    assert.doesNotMatch(await transport.innerText(), /LARDER_|SMTP/);
    const row = page.getByTestId('outbox-row').first();
    assert.equal(await row.getAttribute('data-state'), 'kept');
    assert.equal(await row.getByTestId('outbox-status').innerText(), 'Kept here');
    assert.doesNotMatch(await page.locator('table').innerText(), /\bSent\b/);
    await atEveryWidth(session, page, 'outbox');
    await row.getByTestId('outbox-open').click();
    const status = page.getByTestId('outbox-message-status');
    await status.waitFor();
    assert.match(await status.innerText(), /^Kept here/);
    assert.doesNotMatch(await status.innerText(), /\bSent\b|\bon \d/);
    await page.getByTestId('outbox-message-text').waitFor();
    await assertAccessible(page, 'a message of the outbox');
    assert.deepEqual(errors, []);
  });

  it('should tell a cook and a reviewer whom a page is for and whom to ask', async (t) => {
    const session = await startConsole(t);
    const cook = await session.page('tobin');
    await cook.goto(`${session.server.url}/people/audit`, { waitUntil: 'networkidle' });
    await cook.getByRole('heading', { name: 'This page is for admins' }).waitFor();
    assert.match(new URL(cook.url()).pathname, /^\/people\/audit$/, 'the address stays');
    assert.match(
      await cook.getByTestId('not-for-you').innerText(),
      /You are signed in as a cook\. Ask Rosa Quennick \(head cook\), an admin here, if you need/,
    );
    await atEveryWidth(session, cook, 'not-for-you');
    await cook.goto(`${session.server.url}/reports`, { waitUntil: 'networkidle' });
    await cook.getByRole('heading', { name: 'This page is for admins and reviewers' }).waitFor();

    const reviewer = await session.page('imke');
    await reviewer.goto(`${session.server.url}/batches/new`, { waitUntil: 'networkidle' });
    await reviewer.getByRole('heading', { name: 'This page is for admins and cooks' }).waitFor();
    await reviewer.getByRole('link', { name: 'Go to the batch log' }).click();
    await reviewer.waitForURL(/\/batches$/);
  });

  it('should give a person a role per site of a group, and name the sites in the list', async (t) => {
    const session = await startConsole(t, { env: { LARDER_DEMO_SITES: '2' } });
    const { server } = session;
    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.goto(`${server.url}/people`, { waitUntil: 'networkidle' });
    const row = (username: string) =>
      page.getByTestId('person-row').and(page.locator(`[data-username="${username}"]`));
    const roles = async (username: string) =>
      (await row(username).getByTestId('person-role-text').innerText()).trim();
    /** Tobin's sites as the server gives them to him: [key, role] each. */
    const tobinsSites = async () =>
      (await server.as('tobin').get('/api/sites')).json.sites.map(
        (site: { key: string; role: string }) => [site.key, site.role],
      );
    // The demo's shop cook cooks at the shop and nowhere else (server/demo/demo-people.ts).
    assert.equal(await roles('maren'), 'Cook at Saltmarrow Quay shop only');
    assert.equal(await roles('tobin'), 'Cook');
    await atEveryWidth(session, page, 'sites-list');

    // Tobin stops cooking at the smokehouse and reviews at the shop only.
    await row('tobin')
      .getByRole('button', { name: `Edit ${TOBIN}` })
      .click();
    await dialogSettled(page);
    const dialog = page.getByTestId('edit-person-dialog');
    assert.match(await dialog.innerText(), /At Quillmoor Smokehouse[\s\S]*At Saltmarrow Quay shop/);
    await choose(page, 'person-role', /^None/);
    assert.match(await page.getByTestId('site-role-main').innerText(), /No role here/);
    await choose(page, 'site-role-saltmarrow', /^Reviewer$/);
    await atEveryWidth(session, page, 'sites-edit');
    await page.getByTestId('person-submit').click();
    await dialog.waitFor({ state: 'detached' });
    assert.equal(await roles('tobin'), 'Reviewer at Saltmarrow Quay shop only');

    // The server holds it: Tobin sees the shop alone, as its reviewer.
    assert.deepEqual(await tobinsSites(), [['saltmarrow', 'reviewer']]);

    // A cook at every site again, still the shop's reviewer.
    await row('tobin')
      .getByRole('button', { name: `Edit ${TOBIN}` })
      .click();
    await dialogSettled(page);
    await choose(page, 'person-role', /^Cook/);
    assert.match(await page.getByTestId('site-role-main').innerText(), /As at every site \(Cook\)/);
    await page.getByTestId('person-submit').click();
    await dialog.waitFor({ state: 'detached' });
    assert.equal(await roles('tobin'), 'Cook; Reviewer at Saltmarrow Quay shop');
    assert.deepEqual(await tobinsSites(), [
      ['main', 'cook'],
      ['saltmarrow', 'reviewer'],
    ]);

    // A reviewer for the shop alone, added so from the start.
    await page.getByTestId('add-person').click();
    await dialogSettled(page);
    await page.getByTestId('person-username').fill('quay-review');
    await page.getByTestId('person-display-name').fill('Quay reviewer');
    await choose(page, 'person-role', /^Reviewer/);
    await choose(page, 'person-site', /^Only at Saltmarrow Quay shop$/);
    await atEveryWidth(session, page, 'sites-add');
    await page.getByTestId('person-submit').click();
    await page.getByTestId('person-done').click();
    await page.getByTestId('add-person-dialog').waitFor({ state: 'detached' });
    assert.equal(await roles('quay-review'), 'Reviewer at Saltmarrow Quay shop only');
    // The message of the change before may still be on its way out.
    await page
      .locator('mat-snack-bar-container')
      .filter({ hasText: 'Quay reviewer is added as reviewer at Saltmarrow Quay shop only.' })
      .waitFor();
    assert.deepEqual(errors, []);
  });
});
