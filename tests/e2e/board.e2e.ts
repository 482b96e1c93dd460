import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { addDays } from '../../shared/calculation/dates.ts';
import type { TestServer } from '../helpers/test-server.ts';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { assertAccessible } from './accessibility.ts';
import { atWidths, shoot, sideways } from './screens.ts';

/** A phone held upright. */
const PHONE = { width: 390, height: 844 };

/** Today in the browser's (and the test machine's) time zone, YYYY-MM-DD. */
const today = (): string => new Date().toLocaleDateString('en-CA');

/**
 * A demo belly at 4 cm started `daysAgo` days ago and curing: 2 days per cm = 8 days to ready,
 * turned every 2 days (formulas/quillmoor-belly.yaml).
 */
async function curingBelly(server: TestServer, daysAgo: number): Promise<string> {
  const recorded = await server.as('tobin').post('/api/batches', {
    formula: 'quillmoor-belly',
    batch: { meat: '4.26kg', thickness: '4cm', start: addDays(today(), -daysAgo) },
  });
  assert.equal(recorded.status, 201, recorded.text);
  const lot = recorded.json.batch.lotCode as string;
  assert.equal(recorded.json.batch.readyOn, addDays(today(), 8 - daysAgo), 'ready in 8 days');
  const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'curing' });
  assert.equal(moved.status, 200, moved.text);
  return lot;
}

/** The card of one batch on the board. */
const cardOf = (page: Page, lot: string) =>
  page.locator(`[data-testid="curing-row"][data-lot="${lot}"]`);

describe('the daily board in the console', () => {
  it('should show a cook what is due today on a phone, and mark a batch done from its card', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const late = await curingBelly(server, 10);
    const ready = await curingBelly(server, 8);
    const turn = await curingBelly(server, 2);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    // The board is where a cook lands; its old address still leads there.
    assert.match(new URL(page.url()).pathname, /^\/today$/);
    await page.goto(`${server.url}/curing`, { waitUntil: 'networkidle' });
    assert.match(new URL(page.url()).pathname, /^\/today$/);
    await page.setViewportSize(PHONE);
    await cardOf(page, turn).waitFor();

    // What is due today comes first, each saying so in words.
    const lots = await page
      .getByTestId('board-curing')
      .getByTestId('curing-row')
      .evaluateAll((cards) => cards.map((c) => c.getAttribute('data-lot')));
    const order = [late, ready, turn].map((lot) => lots.indexOf(lot));
    assert.ok(order[0] >= 0 && order[0] < order[1] && order[1] < order[2], lots.join());
    assert.match(await cardOf(page, late).getByTestId('due-flag').innerText(), /Overdue by 2 days/);
    assert.match(await cardOf(page, ready).getByTestId('due-flag').innerText(), /Ready today/);
    assert.match(
      await cardOf(page, turn).getByTestId('due-flag').innerText(),
      /Turn today \(every 2 days\)/,
    );
    assert.equal(await cardOf(page, late).getAttribute('data-overdue'), 'true');

    // On the phone: nothing cut off or sideways, buttons big enough for a thumb.
    assert.equal(await sideways(page), 0, 'nothing sticks out sideways on a phone');
    const button = await cardOf(page, ready).getByTestId('mark-done').boundingBox();
    assert.ok(
      button && button.height >= 44 && button.x + button.width <= PHONE.width,
      'thumb size',
    );

    // Marking done asks first; keeping it curing changes nothing.
    await cardOf(page, late).getByTestId('mark-done').click();
    await page.getByTestId('mark-done-cancel').click();
    assert.equal(
      (await server.as('tobin').get(`/api/batches/${late}`)).json.batch.status,
      'curing',
    );
    await cardOf(page, ready).getByTestId('mark-done').click();
    await page.getByRole('dialog').getByText(`Mark ${ready} done?`).waitFor();
    await page.waitForTimeout(300); // the dialog's opening animation, for the picture
    await session.screenshot(page, 'board-mark-done-390');
    await page.getByTestId('mark-done-confirm').click();
    await cardOf(page, ready).waitFor({ state: 'detached' });
    assert.equal((await server.as('tobin').get(`/api/batches/${ready}`)).json.batch.status, 'done');

    await atWidths(page, async (width) => {
      await shoot(session, page, `board-${width}`);
      assert.equal(await sideways(page), 0, `nothing sticks out sideways at ${width} px`);
    });
    await cardOf(page, turn).getByTestId('open-batch').click();
    await page.waitForURL(new RegExp(`/batches/${turn}$`));
    assert.deepEqual(errors, []);
  });

  it('should let a cook mark a turn from a card on a phone, and say a missed turn in words', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    // Started 2 days ago: today is its first turning day. Started 3 days ago: its turning day
    // was yesterday, and a missed turn stays due (common practice, no source).
    const turn = await curingBelly(server, 2);
    const missed = await curingBelly(server, 3);
    const page = await session.page('tobin');
    const errors = collectConsoleErrors(page);
    await page.setViewportSize(PHONE);
    await cardOf(page, turn).waitFor();
    const yesterday = Number(addDays(today(), -1).slice(8));
    assert.match(
      await cardOf(page, missed).getByTestId('due-flag').innerText(),
      new RegExp(`Turn due since [A-Z][a-z]{2} ${yesterday} [A-Z][a-z]{2}`),
    );

    // The button says which batch it turns, and is big enough for a thumb.
    const button = page.getByRole('button', { name: new RegExp(`^Mark turned: .+, lot ${turn}$`) });
    const box = await button.boundingBox();
    assert.ok(box && box.height >= 44 && box.x + box.width <= PHONE.width, 'thumb size');
    await button.click();
    await page.getByText(`Turned — recorded for ${turn}`).waitFor();
    await cardOf(page, turn).getByTestId('turned-today').waitFor();
    assert.match(
      await cardOf(page, turn).getByTestId('turned-today').innerText(),
      /Turned today · Tobin Marrowfeld \(cook\)/,
    );
    assert.equal(await cardOf(page, turn).getByTestId('due-flag').count(), 0, 'no longer due');
    assert.equal(await cardOf(page, turn).getByTestId('mark-turned').count(), 0);
    const recorded = (await server.as('tobin').get(`/api/batches/${turn}`)).json.batch.turns;
    assert.deepEqual(
      recorded.map((r: { on: string; by: { displayName: string } }) => [r.on, r.by.displayName]),
      [[today(), 'Tobin Marrowfeld (cook)']],
    );

    // Someone else turned the missed one meanwhile: the card says so in words, then shows it.
    const rosa = await server.as('rosa').post(`/api/batches/${missed}/turns`);
    assert.equal(rosa.status, 201, rosa.text);
    await cardOf(page, missed).getByTestId('mark-turned').click();
    await cardOf(page, missed).getByTestId('card-error').waitFor();
    assert.match(
      await cardOf(page, missed).getByTestId('card-error').innerText(),
      /already turned today, by Rosa Quennick \(head cook\) at \d\d:\d\d/,
    );
    await cardOf(page, missed).getByTestId('turned-today').waitFor();
    await assertAccessible(page, 'the board with turns owed, done and refused');

    await atWidths(page, async (width) => {
      await shoot(session, page, `board-turns-${width}`);
      assert.equal(await sideways(page), 0, `nothing sticks out sideways at ${width} px`);
    });
    // The batch page lists the turn, in the product's date words.
    await page.setViewportSize(PHONE);
    await cardOf(page, turn).getByTestId('open-batch').click();
    await page.waitForURL(new RegExp(`/batches/${turn}$`));
    const listed = page.getByTestId('turn');
    await listed.first().waitFor();
    assert.match(await listed.first().innerText(), /Turned \d{1,2} [A-Z][a-z]{2} \d{4}/);
    assert.match(await listed.first().innerText(), /Tobin Marrowfeld \(cook\) · recorded/);
    await listed.first().scrollIntoViewIfNeeded();
    await session.screenshot(page, 'batch-turns-390');
    await assertAccessible(page, 'the batch page with its turns');
    // The one refusal asked for above, and nothing else.
    assert.deepEqual(
      errors.filter((e) => !/status of 409/.test(e)),
      [],
    );
  });

  it('should list what is curing, overdue first', async (t) => {
    const session = await startConsole(t);
    const page = await session.page('imke');
    await page.goto(`${session.server.url}/today`, { waitUntil: 'networkidle' });
    const rows = page.getByTestId('curing-row');
    await rows.first().waitFor();
    const overdue = await rows.evaluateAll((elements) =>
      elements.map((e) => e.getAttribute('data-overdue')),
    );
    const firstNotOverdue = overdue.indexOf('false');
    assert.ok(
      firstNotOverdue === -1 || overdue.slice(firstNotOverdue).every((v) => v === 'false'),
      overdue.join(),
    );
    // A reviewer looks and signs off: the board offers no move.
    assert.equal(await page.getByTestId('mark-done').count(), 0);
    await session.screenshot(page, 'curing-now');
  });

  it('should take a reviewer to the sign-off queue in one click, and not a cook', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const waiting = (await server.as('imke').get('/api/batches?needsSignOff=true&limit=1')).json
      .total as number;
    assert.ok(waiting > 0, 'the demo history has batches waiting for sign-off');

    const cook = await session.page('tobin');
    assert.equal(await cook.getByRole('link', { name: 'To sign off' }).count(), 0);

    const reviewer = await session.page('imke');
    const errors = collectConsoleErrors(reviewer);
    assert.match(
      await reviewer.getByTestId('board-queue-count').innerText(),
      new RegExp(`^${waiting} batch`),
    );
    await reviewer.getByRole('link', { name: 'To sign off' }).click();
    await reviewer.waitForURL(/\/batches\?show=sign-off$/);
    await reviewer.getByTestId('batch-row').first().waitFor();
    assert.match(await reviewer.getByTestId('page-range').innerText(), new RegExp(`of ${waiting}`));
    const rows = reviewer.getByTestId('batch-row');
    const marked = reviewer.locator('[data-testid="batch-row"] [data-testid="mark-sign-off"]');
    assert.equal(await marked.count(), await rows.count(), 'every row says it needs sign-off');
    assert.match(await marked.first().innerText(), /Needs sign-off/);
    assert.equal(
      await reviewer.getByRole('link', { name: 'To sign off' }).getAttribute('aria-current'),
      'page',
    );
    assert.equal(
      await reviewer.getByTestId('show-sign-off').getAttribute('aria-current'),
      'page',
      'the quick filter shows which is on',
    );
    await shoot(session, reviewer, 'sign-off-queue');
    assert.deepEqual(errors, []);
  });
});
