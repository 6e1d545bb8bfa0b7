/**
 * The HTML report in a real browser: Debian's chromium driven by playwright-core. Loads with no console errors,
 * filters and search work — counted by what is visible (computed style and bounding box), not by attributes —
 * and a screenshot is saved to test-output/ for review.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { haveBrowser, openPage, requireBrowser, visibleIds, visibleCards } from './browser.js';
import { renderHtml } from '../../src/report/html/render.js';
import { SAMPLES, sampleRow } from '../report/support/html-rows.js';
import type { AuditResult, Finding, RecordResult } from '../../src/audit/types.js';

function finding(check: string, severity: Finding['severity'], message: string): Finding {
  return { check, messageId: 'm', severity, message, data: {}, line: 7, field: 'stereo.form', waived: null };
}
function rec(id: string, form: string, findings: Finding[]): RecordResult {
  return {
    id,
    file: `compounds/${id}.yml`,
    computed: null,
    findings,
    passed: [],
    declared: { form, descriptors: null },
  };
}
const result: AuditResult = {
  tool: { name: 'stereogate', version: 'test' },
  caution: 'Computed result; the responsible chemist confirms.',
  summary: { records: 4, errors: 2, warnings: 1, notes: 1, waived: 0 },
  records: [
    rec('LX-00001', 'racemate', [
      finding('form-matches-structure', 'error', 'racemate but achiral <script>alert(1)</script>'),
    ]),
    rec('LX-00002', 'single-enantiomer', [finding('ratio-and-ee', 'warning', 'ee below threshold')]),
    rec('LX-00003', 'meso', []),
    rec('LX-00004', 'diastereomer-mixture', [
      finding('ratio-and-ee', 'note', '1:1 diastereomer ratio'),
      finding('structure-readable', 'error', 'unclosed ring'),
    ]),
  ],
};

describe.skipIf(!haveBrowser && !requireBrowser)('HTML report in chromium', () => {
  it('loads cleanly, filters by check/severity/form, searches by id', async () => {
    const pic = sampleRow(SAMPLES[0]!).pic!;
    const html = renderHtml(result, { pictures: new Map([[0, pic]]), notes: ['input: demo.sdf'] });
    expect(html).not.toContain('<script>alert(1)');
    const dir = join(process.cwd(), 'test-output');
    mkdirSync(dir, { recursive: true });
    const file = join(dir, 'html-report.html');
    writeFileSync(file, html);
    const { browser, page, problems } = await openPage();
    try {
      await page.goto('file://' + file);
      const visible = () => visibleCards(page);
      expect(await visible()).toBe(3); // LX-00003 has no findings
      await page.selectOption('#filter-check', 'ratio-and-ee');
      expect(await visible()).toBe(2);
      await page.selectOption('#filter-severity', 'note');
      expect(await visible()).toBe(1);
      expect(await visibleIds(page)).toEqual(['LX-00004']);
      await page.selectOption('#filter-check', '');
      await page.selectOption('#filter-severity', '');
      await page.selectOption('#filter-form', 'racemate');
      expect(await visible()).toBe(1);
      await page.selectOption('#filter-form', '');
      await page.fill('#search', 'lx-00002');
      expect(await visible()).toBe(1);
      await page.fill('#search', 'nothing-like-this');
      expect(await visible()).toBe(0);
      expect(await page.locator('#empty').isVisible()).toBe(true);
      // the "no match" line sits right under the filters, in view, not below the list
      const form = (await page.locator('#filters').boundingBox())!;
      const none = (await page.locator('#empty').boundingBox())!;
      expect(none.y).toBeGreaterThanOrEqual(form.y + form.height);
      expect(none.y - (form.y + form.height)).toBeLessThan(60);
      expect(none.y + none.height).toBeLessThan(
        page.viewportSize()!.height + (await page.evaluate(() => scrollY)),
      );
      await page.fill('#search', '');
      expect(await page.locator('#empty').isVisible()).toBe(false);
      expect(await page.locator('article.rec svg.mol').count()).toBe(1);
      // the injected script text shows as text, it did not run
      expect(await page.locator('article.rec').first().textContent()).toContain('<script>alert(1)</script>');
      await page.screenshot({ path: join(dir, 'html-report.png'), fullPage: true });
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
