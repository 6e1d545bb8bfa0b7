/**
 * The HTML report in a real browser: Debian's chromium driven by playwright-core. Loads with no console errors,
 * filters and search work, and a screenshot is saved to test-output/ for review.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { haveBrowser, openPage, requireBrowser } from './browser.js';
import { renderHtml } from '../../src/report/html/render.js';
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
const svg =
  '<svg xmlns="http://www.w3.org/2000/svg" width="60" height="30"><text x="5" y="20">R</text></svg>';
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
    const html = renderHtml(result, { depictions: new Map([[0, svg]]), notes: ['input: demo.sdf'] });
    expect(html).not.toContain('<script>alert(1)');
    const dir = join(process.cwd(), 'test-output');
    mkdirSync(dir, { recursive: true });
    const file = join(dir, 'html-report.html');
    writeFileSync(file, html);
    const { browser, page, problems } = await openPage();
    try {
      await page.goto('file://' + file);
      const visible = async () => page.locator('article.rec:not([hidden])').count();
      expect(await visible()).toBe(3); // LX-00003 has no findings
      await page.selectOption('#filter-check', 'ratio-and-ee');
      expect(await visible()).toBe(2);
      await page.selectOption('#filter-severity', 'note');
      expect(await visible()).toBe(1);
      expect(await page.locator('article.rec:not([hidden]) h3').textContent()).toBe('LX-00004');
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
      await page.fill('#search', '');
      expect(await page.locator('article.rec img').count()).toBe(1);
      // the injected script text shows as text, it did not run
      expect(await page.locator('article.rec').first().textContent()).toContain('<script>alert(1)</script>');
      await page.screenshot({ path: join(dir, 'html-report.png'), fullPage: true });
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
