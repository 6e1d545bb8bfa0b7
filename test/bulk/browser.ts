/**
 * Debian's chromium through playwright-core for the HTML report tests: where it is, whether the tests must run,
 * and a page that records console errors and uncaught page errors.
 */
import { existsSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const requireBrowser = process.env.STEREOGATE_REQUIRE_SHARED_DATA === '1';
export const haveBrowser = existsSync(CHROMIUM);
if (!haveBrowser && !requireBrowser)
  console.warn(`[stereogate tests] skipping browser test: no chromium at ${CHROMIUM}`);

/** Opens a page; `problems` collects console errors and page errors. Close `browser` when done. */
export async function openPage(viewport?: { width: number; height: number }): Promise<{
  browser: Browser;
  page: Page;
  problems: string[];
}> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = await browser.newPage(viewport ? { viewport } : {});
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') problems.push(m.text());
  });
  page.on('pageerror', (e) => problems.push(String(e)));
  return { browser, page, problems };
}

/** Cards a person can see: displayed (computed style) and with a box of some size. */
export async function visibleCards(page: Page): Promise<number> {
  return (await visibleIds(page)).length;
}

export async function visibleIds(page: Page): Promise<string[]> {
  return page
    .locator('article.rec')
    .evaluateAll((els) =>
      els
        .filter((e) => getComputedStyle(e).display !== 'none' && e.getBoundingClientRect().height > 0)
        .map((e) => e.querySelector('h3')?.textContent ?? ''),
    );
}
