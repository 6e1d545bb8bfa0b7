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
