import assert from 'node:assert/strict';
import type { Page } from 'playwright-core';
import type { ConsoleSession } from './browser.ts';

/** The tablet at the smoker. */
export const TABLET = { width: 820, height: 1180 };

/**
 * How far anything sticks out sideways, in pixels: past the window, or past the shell's content
 * pane (which scrolls on its own, so the window alone would not show it).
 */
export async function sideways(page: Page): Promise<number> {
  return page.evaluate(() =>
    Math.max(
      document.documentElement.scrollWidth - window.innerWidth,
      ...[...document.querySelectorAll('mat-sidenav-content')].map(
        (pane) => pane.scrollWidth - pane.clientWidth,
      ),
    ),
  );
}

/** Runs `look` at a desk (1280), the tablet (820) and a phone (390), then back at the tablet. */
export async function atWidths(page: Page, look: (width: number) => Promise<void>): Promise<void> {
  for (const width of [1280, 820, 390]) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
    // The chart redraws on the resize a frame later.
    await page.waitForTimeout(200);
    await look(width);
  }
  await page.setViewportSize(TABLET);
}

/**
 * A screenshot of the whole page: the content pane scrolls inside the shell, so the window is
 * made as tall as the content for the picture, then put back.
 */
export async function shoot(session: ConsoleSession, page: Page, name: string): Promise<void> {
  const size = page.viewportSize() ?? TABLET;
  const tall = await page.evaluate(() => {
    const pane = document.querySelector('mat-sidenav-content');
    return pane ? pane.scrollHeight + pane.getBoundingClientRect().top : 0;
  });
  if (tall > size.height) await page.setViewportSize({ ...size, height: Math.min(tall, 8000) });
  await session.screenshot(page, name);
  await page.setViewportSize(size);
}

/**
 * Screenshots of a screen at every width, `name-1280.png` and so on, each of the whole content;
 * fails if anything sticks out sideways at any of them.
 */
export async function shootAtWidths(
  session: ConsoleSession,
  page: Page,
  name: string,
): Promise<void> {
  await atWidths(page, async (width) => {
    assert.equal(await sideways(page), 0, `${name}: nothing sticks out sideways at ${width} px`);
    await shoot(session, page, `${name}-${width}`);
  });
}

/**
 * What scrolls sideways inside the page: each element wider than its own box that lets its
 * content scroll (a table in a frame), named by its test id or tag and classes. `sideways` does
 * not see these: the page itself stays put while the frame scrolls.
 */
export async function framesSideways(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('mat-sidenav-content *')]
      .filter((el) => {
        const overflow = getComputedStyle(el).overflowX;
        return (
          (overflow === 'auto' || overflow === 'scroll') &&
          el.scrollWidth - el.clientWidth > 1 &&
          (el as HTMLElement).offsetParent !== null
        );
      })
      .map(
        (el) =>
          el.getAttribute('data-testid') ??
          `${el.tagName.toLowerCase()}.${[...el.classList].join('.')}`,
      ),
  );
}
