import assert from 'node:assert/strict';
import type { Page } from 'playwright-core';
import type { ConsoleSession } from './browser.ts';

/** The widths a screen is looked at: a desk, the kitchen's tablet and a phone. */
export const WIDTHS = [1280, 820, 390] as const;

/** Whether the page scrolls sideways (it must not, down to a phone's 390 px). */
export function scrollsSideways(page: Page): Promise<boolean> {
  return page.evaluate(
    () => document.documentElement.scrollWidth > document.documentElement.clientWidth,
  );
}

/**
 * Screenshots of a screen at every width, `name-1280.png` and so on, each of the whole content
 * (the content pane scrolls inside the shell, so the window is made as tall as the content for
 * the picture); fails if the page scrolls sideways at any of them. The page is left at 1280 px.
 */
export async function shootAtWidths(
  session: ConsoleSession,
  page: Page,
  name: string,
): Promise<void> {
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
    await page.waitForTimeout(150);
    assert.equal(await scrollsSideways(page), false, `${name}: no sideways scroll at ${width} px`);
    const tall = await page.evaluate(() => {
      const pane = document.querySelector('mat-sidenav-content');
      return pane ? pane.scrollHeight + pane.getBoundingClientRect().top : 0;
    });
    const height = width === 390 ? 844 : 1000;
    if (tall > height) await page.setViewportSize({ width, height: Math.min(tall, 8000) });
    await session.screenshot(page, `${name}-${width}`);
  }
  await page.setViewportSize({ width: 1280, height: 860 });
}
