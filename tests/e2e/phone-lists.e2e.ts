// The console's lists on a phone held upright: every one readable without scrolling sideways,
// neither the page nor a frame inside it.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { addDays } from '../../shared/calculation/dates.ts';
import { collectConsoleErrors, startConsole } from './browser.ts';
import { recordMarkedBatches } from './marked-batches.ts';
import { atWidths, framesSideways, shoot, sideways } from './screens.ts';

/** A phone held upright (CSS px). common practice, no source */
const PHONE = { width: 390, height: 844 };

/** The list screens, by name and address. */
const LISTS = [
  { name: 'batch-log', path: '/batches' },
  { name: 'sign-off-queue', path: '/batches?show=sign-off' },
  { name: 'plans', path: '/plans' },
  { name: 'people', path: '/people' },
  { name: 'audit', path: '/people/audit' },
  { name: 'outbox', path: '/people/outbox' },
  { name: 'equipment', path: '/equipment' },
  { name: 'formulas', path: '/formulas' },
] as const;

describe('the lists on a phone', () => {
  it('should show every list without anything sideways at 390 px', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    // A plan recorded and a message kept, so neither list is empty.
    const plan = await server.as('rosa').post('/api/plans/record', {
      assembly: 'smokehouse-burger',
      count: 40,
      // The belly cures 10 days before the service.
      for: addDays(new Date().toLocaleDateString('en-CA'), 14),
    });
    assert.equal(plan.status, 201, plan.text);
    const added = await server.as('rosa').post('/api/people', {
      username: 'wren',
      displayName: 'Wren Ollivane',
      email: 'wren@quillmoor.invalid',
      role: 'cook',
    });
    assert.equal(added.status, 201, added.text);
    await server.context.mail.delivery.idle();

    const page = await session.page('rosa');
    const errors = collectConsoleErrors(page);
    await page.setViewportSize(PHONE);
    const found: string[] = [];
    for (const list of LISTS) {
      await page.goto(`${server.url}${list.path}`, { waitUntil: 'networkidle' });
      await page.waitForTimeout(300);
      await shoot(session, page, `phone-${list.name}-390`);
      const page_ = await sideways(page);
      const frames = await framesSideways(page);
      if (page_ > 0) found.push(`${list.name}: the page sticks out ${page_} px`);
      if (frames.length) found.push(`${list.name}: ${frames.join(', ')} scroll sideways`);
    }
    assert.deepEqual(found, []);
    assert.deepEqual(errors, []);
  });

  it('should stack the batch log as cards on a phone, with its marks, order and pages', async (t) => {
    const session = await startConsole(t);
    const { server } = session;
    const { lateLot, failedLot } = await recordMarkedBatches(server);
    const page = await session.page('imke');
    const errors = collectConsoleErrors(page);
    await page.setViewportSize(PHONE);
    await page.goto(`${server.url}/batches`, { waitUntil: 'networkidle' });
    const list = page.getByRole('list', { name: 'Recorded batches' });
    await list.waitFor();
    assert.equal(await page.getByTestId('batch-log-table').count(), 0, 'no table on a phone');
    assert.equal(await list.getByRole('listitem').count(), 25, 'a page of 25, each an item');

    // Overdue: the card says so in a word beside its icon, with its lot and status.
    await page.getByTestId('show-overdue').click();
    await page.waitForURL(/show=overdue/);
    const lateCard = page.locator(`[data-testid="batch-row"][data-lot="${lateLot}"]`);
    await lateCard.waitFor();
    assert.equal(await lateCard.getByTestId('batch-lot-link').innerText(), lateLot);
    assert.equal(await lateCard.locator('app-batch-status-chip').innerText(), 'Curing');
    assert.match(await lateCard.getByTestId('mark-overdue').innerText(), /schedule\s*Overdue/);
    assert.match(await lateCard.innerText(), /Ready\s+\d{1,2} [A-Z][a-z]{2} \d{4}/);

    // A failed check: FAIL in words beside its icon, and only that batch.
    await page.getByTestId('show-failed').click();
    const failedCard = page.locator(`[data-testid="batch-row"][data-lot="${failedLot}"]`);
    await failedCard.waitFor();
    assert.equal(await page.getByTestId('batch-row').count(), 1);
    assert.match(await failedCard.getByTestId('checks-verdict').innerText(), /close\s*FAIL/);
    assert.equal(await failedCard.getAttribute('class'), 'card alert');

    // No column headers to sort by: the order is a select, kept in the address.
    await page.getByTestId('show-all').click();
    await page.waitForURL((url) => !url.search.includes('show='));
    await page.getByTestId('log-sort').click();
    await page.getByRole('option', { name: 'Oldest first' }).click();
    await page.waitForURL(/sort=started&order=asc/);
    await page.waitForLoadState('networkidle');
    const oldest = (await server.as('imke').get('/api/batches?sort=started&order=asc&limit=1')).json
      .items[0].lotCode as string;
    assert.equal(await page.getByTestId('batch-row').first().getAttribute('data-lot'), oldest);

    // The filters fold away; open, each box fits the phone.
    await page.getByTestId('filters-toggle').click();
    const lotBox = page.getByTestId('filter-lot');
    await lotBox.waitFor();
    await shoot(session, page, 'batch-log-filters-390');
    for (const id of ['filter-formula', 'filter-status', 'filter-lot', 'page-next']) {
      const box = await page.getByTestId(id).boundingBox();
      assert.ok(
        box && box.x >= 0 && box.x + box.width <= PHONE.width,
        `${id} fits: ${JSON.stringify(box)}`,
      );
    }
    await lotBox.fill(failedLot.slice(0, 8));
    await page.waitForURL(/lot=/);
    assert.match(await page.getByTestId('filters-toggle').innerText(), /Filters · 1 in use/);
    await page.getByTestId('filter-clear').click();
    await page.waitForURL((url) => !url.search.includes('lot='));

    await atWidths(page, async (width) => {
      await shoot(session, page, `batch-log-cards-${width}`);
      assert.equal(await sideways(page), 0, `nothing sticks out sideways at ${width} px`);
      assert.deepEqual(await framesSideways(page), [], `nothing scrolls sideways at ${width} px`);
    });

    // A lot opens its batch.
    await page.setViewportSize(PHONE);
    const first = page.getByTestId('batch-row').first();
    const lot = (await first.getAttribute('data-lot')) ?? '';
    await first.getByRole('link', { name: lot }).click();
    await page.waitForURL(new RegExp(`/batches/${lot}$`));
    assert.deepEqual(errors, []);
  });
});
