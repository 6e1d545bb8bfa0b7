/**
 * A flagged record of a bulk HTML report without a depiction says why on its card: past the bound of computed
 * layouts (the first N flagged SMILES records get one; here N = 1), or when its structure could not be read.
 * Checked in Debian's chromium as a person sees the card. Structures: textbook molecules, from memory.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { HtmlCollector } from '../../src/bulk/html-collector.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { haveBrowser, openPage, requireBrowser } from './browser.js';

describe.skipIf(!haveBrowser && !requireBrowser)('bulk HTML cards without a depiction', () => {
  it('say why: the layout bound, or an unreadable structure; the page note says it once', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sg-nopic-'));
    const csv = join(dir, 'export.csv');
    // (R)-butan-2-ol and (2R,3R)-butane-2,3-diol declared achiral (both chiral: flagged); a broken SMILES
    writeFileSync(
      csv,
      'id,smiles,stereo_form\nLX-00001,C[C@@H](O)CC,achiral\nLX-00002,C[C@@H](O)[C@H](O)C,achiral\nLX-00003,CC1CC(C,achiral\n',
    );
    const html = join(dir, 'report.html');
    await runBulkAudit({
      inputs: [csv],
      mapping: {},
      config: { ...DEFAULT_CONFIG },
      workers: 0,
      progress: 'none',
      writers: [new HtmlCollector(html, 20_000, 1)],
    });
    expect(readFileSync(html, 'utf8')).toContain(
      '1 flagged record from SMILES has no depiction: layouts are computed for the first 1',
    );
    const { browser, page, problems } = await openPage({ width: 1280, height: 900 });
    try {
      await page.goto('file://' + html);
      await page.waitForSelector('body[data-ready]');
      const card = (id: string) => page.locator(`article.rec[data-id="${id}"] figure.pic`);
      await card('LX-00001').scrollIntoViewIfNeeded();
      await page.waitForSelector('article.rec[data-id="LX-00001"] svg.mol');
      expect(await card('LX-00002').innerText()).toBe(
        'no depiction: layouts are computed for the first 1 flagged record given as SMILES only ' +
          '(molfile records are always drawn)',
      );
      expect(await card('LX-00002').locator('.nodepict').isVisible()).toBe(true);
      expect(await card('LX-00003').innerText()).toBe('no depiction: the structure could not be read');
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 60_000);
});
