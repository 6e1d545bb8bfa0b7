/**
 * The HTML report page as a person sees it, in Debian's chromium (playwright-core): depictions from the
 * record's own molfile coordinates and wedges, CIP labels larger than atom labels, undefined stereo units marked
 * and named, atom numbers on request, drawings made only for cards in view; 10,000 flagged records in a page of
 * a few MB that builds one page of cards; usable at 400 px wide (screenshot in test-output/ to look at).
 * Structures are textbook molecules (from memory); CIP labels are our engine's (checked elsewhere against the
 * CIP validation suite).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { haveBrowser, openPage, requireBrowser, visibleIds } from '../bulk/browser.js';
import { renderHtmlPage, type HtmlPage } from '../../src/report/html/render.js';
import { SAMPLES, sampleRow } from './support/html-rows.js';

const out = join(process.cwd(), 'test-output');
const page0: HtmlPage = {
  tool: { name: 'stereogate', version: 'test' },
  caution: 'Computed result; the responsible chemist confirms.',
  summary: { records: 7, errors: 3, warnings: 2, notes: 1, waived: 0 },
  byCheck: { 'form-matches-structure': { error: 2, warning: 1, note: 0, waived: 0 } },
};

function write(name: string, html: string): string {
  mkdirSync(out, { recursive: true });
  const file = join(out, name);
  writeFileSync(file, html);
  return file;
}

describe.skipIf(!haveBrowser && !requireBrowser)('HTML report page in chromium', () => {
  it('draws each record: own molfile coordinates and wedges, CIP labels, undefined units, atom numbers', async () => {
    const rows = SAMPLES.map((s) => sampleRow(s));
    const file = write('html-page.html', renderHtmlPage(rows, page0));
    const { browser, page, problems } = await openPage({ width: 1200, height: 900 });
    try {
      await page.goto('file://' + file);
      await page.waitForSelector('body[data-ready]');
      const card = (id: string) => page.locator(`article.rec[data-id="${id}"]`);
      for (const s of SAMPLES) await card(s.id).scrollIntoViewIfNeeded();
      await page.waitForFunction((n) => document.querySelectorAll('svg.mol').length === n, SAMPLES.length);

      // the molfile record is drawn as registered: its wedge, and its atoms where its coordinates put them
      const ibu = card('LX-00009');
      expect(await ibu.locator('figcaption').textContent()).toMatch(/as drawn in the record/);
      expect(await ibu.locator('polygon.wedge').count()).toBe(1); // the molfile has one wedge bond
      expect(await card('LX-00001').locator('figcaption').textContent()).toMatch(/layout computed/);

      // CIP labels: our labels, in a larger face than the atom labels
      expect(await card('LX-00001').locator('text.cip').allTextContents()).toEqual(['R']);
      const size = (sel: string) =>
        card('LX-00001')
          .locator(sel)
          .first()
          .evaluate((e) => parseFloat(getComputedStyle(e).fontSize));
      expect(await size('text.cip')).toBeGreaterThanOrEqual(1.2 * (await size('text.el')));
      expect(await card('LX-00004').locator('text.cip').allTextContents()).toEqual(['E']);

      // undefined stereo units: marked on the drawing and named with their atoms
      expect(await card('LX-00003').locator('circle.undef').count()).toBe(2);
      expect(await card('LX-00003').locator('.side .undef').textContent()).toBe(' undefined: C2, C4');
      expect(await card('LX-00001').locator('circle.undef').count()).toBe(0);

      // atom numbers on request, in the input numbering; they follow the molfile's coordinates
      expect(await page.locator('text.num').count()).toBe(0);
      await page.check('#atom-numbers');
      const nums = ibu.locator('text.num');
      expect(await nums.count()).toBe(15); // 15 atoms in the V3000 block
      const at = async (n: string) => {
        const t = nums.filter({ hasText: new RegExp(`^${n}$`) });
        return { x: Number(await t.getAttribute('x')), y: Number(await t.getAttribute('y')) };
      };
      // molfile: atom 1 at x 5.25, atom 11 at x -3.0; atom 3 at y -2.60 lies below atom 4 at y 0 (y up)
      expect((await at('1')).x).toBeGreaterThan((await at('11')).x + 100);
      expect((await at('3')).y).toBeGreaterThan((await at('4')).y + 30);
      await page.uncheck('#atom-numbers');
      expect(await page.locator('text.num').count()).toBe(0);
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 120_000);

  it('holds 10,000 flagged records: a few MB, one page of cards built, drawings only in view', async () => {
    const base = SAMPLES.map((s) => sampleRow(s));
    const rows = Array.from({ length: 10_000 }, (_, i) => ({
      ...base[i % base.length]!,
      id: `LX-${String(i + 1).padStart(5, '0')}`,
    }));
    const html = renderHtmlPage(rows, { ...page0, summary: { ...page0.summary, records: 10_000 } });
    // common practice, no source: a page should stay within a few MB per thousand records
    expect(html.length / 10).toBeLessThan(1_000_000); // bytes per thousand flagged records
    const file = write('html-10k.html', html);
    const { browser, page, problems } = await openPage({ width: 1280, height: 900 });
    try {
      await page.goto('file://' + file);
      await page.waitForSelector('body[data-ready]', { timeout: 60_000 });
      const scriptMs = Number(await page.getAttribute('body', 'data-ready'));
      const domInteractive = await page.evaluate(
        () => (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).domInteractive,
      );
      // reported, not asserted (timings belong in `npm run bench`; this machine's 2 cores are shared)
      console.log(
        `[html 10k] ${(html.length / 1e6).toFixed(1)} MB; DOM interactive ${domInteractive.toFixed(0)} ms; ` +
          `page script ${scriptMs} ms`,
      );
      expect(await page.locator('article.rec').count()).toBe(50);
      expect(await page.locator('#page-info').textContent()).toBe('records 1–50 of 10000 (page 1 of 200)');
      // drawings are made only for the cards near the viewport
      await page.waitForFunction(() => document.querySelectorAll('svg.mol').length > 0);
      expect(await page.locator('svg.mol').count()).toBeLessThan(15);
      await page.click('#next');
      expect((await visibleIds(page))[0]).toBe('LX-00051');
      await page.fill('#search', 'LX-0999');
      expect(await visibleIds(page)).toEqual(Array.from({ length: 10 }, (_, i) => `LX-0999${i}`));
      expect(await page.locator('#pager').isVisible()).toBe(false);
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 180_000);

  it('is usable in a 400 px wide window: nothing wider than the window, drawings fit (screenshot)', async () => {
    const rows = SAMPLES.map((s) => sampleRow(s));
    const file = write('html-400px.html', renderHtmlPage(rows, page0));
    const { browser, page, problems } = await openPage({ width: 400, height: 800 });
    try {
      await page.goto('file://' + file);
      await page.waitForSelector('body[data-ready]');
      await page.check('#atom-numbers');
      await page.locator('article.rec').nth(1).scrollIntoViewIfNeeded();
      await page.waitForFunction(() => document.querySelectorAll('svg.mol').length >= 2);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(400);
      for (const box of await page.locator('svg.mol, article.rec, #filters').all()) {
        const b = (await box.boundingBox())!;
        expect(b.x).toBeGreaterThanOrEqual(0);
        expect(b.x + b.width).toBeLessThanOrEqual(400);
      }
      await page.screenshot({ path: join(out, 'html-400px.png') });
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 120_000);
});
