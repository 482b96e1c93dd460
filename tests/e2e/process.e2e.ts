import assert from 'node:assert/strict';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import type { Page } from 'playwright-core';
import { handClock } from '../helpers/mail.ts';
import { CONTROLLED, controlledFormulaYaml } from '../helpers/process-calls.ts';
import type { TestServer } from '../helpers/test-server.ts';
import { collectConsoleErrors, startConsole, type ConsoleSession } from './browser.ts';

const MINUTE = 60_000;
/** The tablet at the smoker. */
const TABLET = { width: 820, height: 1180 };

/** The controlled formula in the server's folder, and a batch of it in progress today. */
async function controlledBatch(server: TestServer, today: string): Promise<string> {
  writeFileSync(path.join(server.formulasDir, `${CONTROLLED}.yaml`), controlledFormulaYaml());
  server.context.formulas.changed();
  const recorded = await server.as('tobin').post('/api/batches', {
    formula: CONTROLLED,
    batch: { meat: '4.26kg', thickness: '4cm', start: today },
    status: 'in-progress',
  });
  assert.equal(recorded.status, 201, recorded.text);
  return recorded.json.batch.lotCode as string;
}

/** The card of one control on the batch page. */
const card = (page: Page, control: string) =>
  page.locator(`[data-testid="control-card"][data-control="${control}"]`);

/** Types a reading into a control's big box and taps Record reading; waits for it to be listed. */
async function readAt(page: Page, control: string, value: string): Promise<void> {
  const box = card(page, control);
  const before = await box.getByTestId('reading-row').count();
  await box.getByTestId('reading-value').fill(value);
  await box.getByTestId('record-reading').click();
  await box.getByTestId('reading-row').nth(before).waitFor();
}

/** The page at a width; whether anything sticks out sideways. */
async function sideways(page: Page): Promise<number> {
  return page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
}

async function shoot(session: ConsoleSession, page: Page, name: string): Promise<void> {
  await session.screenshot(page, name);
}

describe('the process record in the console', () => {
  it('should take weights and readings at the tablet, hold a missed cooling stage, and release after review', async (t) => {
    const clock = handClock(new Date());
    const session = await startConsole(t, { now: clock.now });
    const { server } = session;
    const today = new Date().toLocaleDateString('en-CA');
    const lot = await controlledBatch(server, today);

    const cook = await session.page('tobin');
    const errors = collectConsoleErrors(cook);
    await cook.setViewportSize(TABLET);
    await cook.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await cook.getByTestId('process-record').waitFor();

    // Weights as weighed: one line changed, the rest accepted as calculated.
    const lines = cook.getByTestId('weigh-line');
    const count = await lines.count();
    assert.ok(count >= 2, 'the belly has several lines to weigh');
    const first = lines.first();
    const firstName = (await first.getAttribute('data-line')) as string;
    await first.getByTestId('weigh-value').fill('81');
    await first.getByTestId('weigh-accept').click();
    await first.getByTestId('weighed').waitFor();
    await cook.getByTestId('accept-all').click();
    await cook
      .locator('[data-testid="weigh-line"] [data-testid="weighed"]')
      .nth(count - 1)
      .waitFor();
    await cook.getByTestId('actual-nitrite').getByText(/ppm/).waitFor();
    const weighed = (await server.as('rosa').get(`/api/batches/${lot}/process`)).json;
    const changed = weighed.weighings.find((w: { name: string }) => w.name === firstName);
    assert.ok(changed, 'the changed line is on the record');
    assert.equal(
      Number(changed.grams),
      81,
      'a bare number takes the unit of the calculated amount',
    );
    assert.equal(
      weighed.weighings.filter((w: { kind: string }) => w.kind === 'line').length,
      count,
    );

    // Readings at the smoker, the cook and the start of the chill.
    await readAt(cook, 'smoker', '72');
    await readAt(cook, 'cook', '71.5');
    await readAt(cook, 'chill', '60');
    clock.advance(10 * MINUTE);
    await readAt(cook, 'chill', '50');
    const summary = await card(cook, 'chill').getByTestId('control-summary').innerText();
    assert.match(summary, /26\.7 °C/, summary);
    assert.match(summary, /\b\d{2}:\d{2}\b/, 'the stage deadline is a time on the clock');
    await card(cook, 'chill').getByTestId('control-chart').waitFor();
    await shoot(session, cook, 'process-cooling-820');

    // Past the stage's deadline, the next reading misses it: the batch is on hold.
    clock.advance(2 * 60 * MINUTE);
    await readAt(cook, 'chill', '25');
    const banner = cook.getByTestId('hold-banner');
    await banner.waitFor();
    assert.match(await banner.innerText(), /On hold/);
    await shoot(session, cook, 'process-hold-820');

    // The corrective action, with the control's own suggestion filled in.
    await banner.getByTestId('record-action').click();
    const dialog = cook.getByTestId('action-dialog');
    await dialog.waitFor();
    assert.notEqual(await dialog.getByTestId('action-restored').inputValue(), '');
    await dialog.getByTestId('action-cause').fill('The blast chiller door was left ajar.');
    await dialog
      .getByTestId('action-restored')
      .fill('Door closed, gasket checked; the belly went back in the blast chiller.');
    await dialog.getByTestId('action-prevention').fill('Door alarm set to sound after 2 minutes.');
    await dialog.getByTestId('disposition-rechilled').click();
    await dialog.getByTestId('action-weight').fill('3.9');
    await shoot(session, cook, 'process-action-820');
    await dialog.getByTestId('action-confirm').click();
    await cook.getByTestId('deviation-action').waitFor();
    assert.equal(await cook.getByTestId('hold-banner').count(), 0, 'the hold is lifted');

    // The cold holding reading, then the batch cures and is done.
    await readAt(cook, 'hold', '3');
    assert.equal(await sideways(cook), 0, 'nothing sticks out sideways at 820 px');
    for (const to of ['curing', 'done']) {
      const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, { to });
      assert.equal(moved.status, 200, moved.text);
    }

    // The reviewer verifies and releases.
    const reviewer = await session.page('imke');
    await reviewer.setViewportSize(TABLET);
    await reviewer.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await reviewer.getByTestId('verify-button').click();
    await reviewer.getByTestId('released').getByText(/Imke/).waitFor();
    const record = (await server.as('rosa').get(`/api/batches/${lot}/process`)).json;
    assert.equal(record.verification.by.displayName, 'Imke Tressaly (food safety)');
    assert.equal(record.nonconforming, true, 'the miss stays on the record');

    for (const width of [1280, 820, 390]) {
      await reviewer.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
      await reviewer.waitForTimeout(200);
      await shoot(session, reviewer, `process-batch-${width}`);
      assert.equal(await sideways(reviewer), 0, `nothing sticks out sideways at ${width} px`);
    }
    assert.deepEqual(errors, []);
  });

  it('should say why a batch still being made is not released, and list what is due now', async (t) => {
    const clock = handClock(new Date());
    const session = await startConsole(t, { now: clock.now });
    const { server } = session;
    const lot = await controlledBatch(server, new Date().toLocaleDateString('en-CA'));
    const answer = await server.as('tobin').post(`/api/batches/${lot}/readings`, {
      control: 'smoker',
      value: '70 °C',
    });
    assert.equal(answer.status, 201, answer.text);

    const reviewer = await session.page('imke');
    await reviewer.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    await reviewer.getByTestId('verify-button').click();
    const refused = reviewer.getByTestId('verify-refused');
    await refused.waitFor();
    assert.match(await refused.innerText(), /only a batch marked done can be verified/i);

    await reviewer.goto(`${server.url}/curing`, { waitUntil: 'networkidle' });
    const item = reviewer.locator(`[data-testid="attention-item"] a[data-lot="${lot}"]`).first();
    await item.waitFor();
    await reviewer.setViewportSize({ width: 390, height: 844 });
    await shoot(session, reviewer, 'curing-attention-390');
    assert.equal(await sideways(reviewer), 0, 'nothing sticks out sideways at 390 px');
    await item.click();
    await reviewer.waitForURL(new RegExp(`/batches/${lot}$`));
  });

  it('should draw a day of logger readings, one a minute, without a long stall', async (t) => {
    const clock = handClock(new Date());
    const session = await startConsole(t, { now: clock.now });
    const { server } = session;
    const lot = await controlledBatch(server, new Date().toLocaleDateString('en-CA'));
    // 1,440 chamber readings, one a minute for 24 h, all within 60–80 °C.
    const start = clock.now().getTime() - 24 * 60 * MINUTE;
    const rows = Array.from({ length: 1440 }, (_, i) => {
      const value = (70 + 6 * Math.sin(i / 40)).toFixed(1);
      return `${new Date(start + i * MINUTE).toISOString()},${value}`;
    });
    const uploaded = await server
      .as('tobin')
      .post(
        `/api/batches/${lot}/readings/upload?control=smoker`,
        ['Time,Temperature (°C)', ...rows].join('\n'),
        { 'content-type': 'text/csv' },
      );
    assert.equal(uploaded.status, 201, uploaded.text);
    assert.equal(uploaded.json.added, 1440);

    const page = await session.page('tobin');
    await page.setViewportSize(TABLET);
    await page.addInitScript(() => {
      const w = window as unknown as { longest: number };
      w.longest = 0;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries()) w.longest = Math.max(w.longest, entry.duration);
      }).observe({ type: 'longtask', buffered: true });
    });
    const began = Date.now();
    await page.goto(`${server.url}/batches/${lot}`);
    await card(page, 'smoker').getByTestId('control-chart').waitFor();
    const drawn = Date.now() - began;
    // Redraw: the page reads the record again and the chart draws the same 1,440 points.
    const redraw = await page.evaluate(async () => {
      const canvas = document.querySelector('[data-testid="control-chart"]') as HTMLCanvasElement;
      const t0 = performance.now();
      window.dispatchEvent(new Event('resize'));
      await new Promise((resolve) => requestAnimationFrame(() => resolve(null)));
      return { ms: performance.now() - t0, width: canvas.width };
    });
    const longest = await page.evaluate(() => (window as unknown as { longest: number }).longest);
    t.diagnostic(
      `1440 readings: page and chart in ${drawn} ms; a redraw frame ${redraw.ms.toFixed(1)} ms; longest task after the page opened ${longest.toFixed(0)} ms`,
    );
    // A frame at 60 Hz is about 16.7 ms; a redraw within a few frames is no jank a cook sees.
    // common practice, no source
    assert.ok(redraw.ms < 100, `a redraw took ${redraw.ms} ms`);
    await shoot(session, page, 'process-logger-820');
  });
});
