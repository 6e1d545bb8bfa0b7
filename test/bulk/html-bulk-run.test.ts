/**
 * The HTML report of a real bulk run, in a real browser (Debian's chromium driven by playwright-core): a small
 * Larkspur Chemistry Lab export of textbook molecules (structures from memory) with invented claims, audited
 * through the bulk command. The page loads with no console errors, every flagged record with a readable
 * structure has its depiction, the filters and the search work, the checks that could not run are shown (once
 * for the run, and on the record's card), and a screenshot is saved to test-output/.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { haveBrowser, openPage, requireBrowser, visibleCards, visibleIds } from './browser.js';
import { bulkAudit } from '../../src/cli/commands/bulk-audit.js';
import { memoryIo } from '../cli/io.js';

const out = join(process.cwd(), 'test-output');
const rows: [id: string, smiles: string, form: string, descriptors: string][] = [
  ['LX-00001', 'C[C@@H](O)CC', 'abs', '(R)'], // (R)-butan-2-ol, claim right
  ['LX-00002', 'C[C@@H](O)CC', 'abs', '(S)'], // (R)-butan-2-ol declared (S): descriptor wrong
  ['LX-00003', 'OC(=O)[C@@H](O)[C@@H](O)C(=O)O', 'racemic', ''], // meso-tartaric acid declared racemic
  ['LX-00004', 'OC(=O)[C@@H](O)[C@H](O)C(=O)O', 'single enantiomer', '(2R,3R)'], // one tartaric acid enantiomer; invented descriptors
  ['LX-00005', 'C[C@H](N)C(=O)O', 'RAC', ''], // L-alanine drawn as one enantiomer, declared racemic
  ['LX-00006', 'CC(C)C', 'achiral', ''], // isobutane
  ['LX-00007', 'C/C=C/C', 'achiral', '(Z)'], // (E)-but-2-ene declared (Z)
  ['LX-00008', 'CC1CC(C', 'achiral', ''], // broken SMILES
  ['LX-00009', 'N[C@@H](Cc1ccccc1)C(=O)O', 'chiral', ''], // L-phenylalanine, a form word not understood
  ['LX-00010', 'C[C@H]1CCCC[C@@H]1C', 'meso', ''], // trans-1,2-dimethylcyclohexane declared meso
];

describe.skipIf(!haveBrowser && !requireBrowser)('HTML report of a bulk run in chromium', () => {
  it('loads cleanly with depictions; check, severity, form filters and the id search work', async () => {
    mkdirSync(out, { recursive: true });
    const csv = join(out, 'larkspur-export.csv');
    writeFileSync(
      csv,
      ['REG_NO,SMILES,STEREO,DESCRIPTORS', ...rows.map((r) => r.map((c) => `"${c}"`).join(','))].join('\n') +
        '\n',
    );
    const html = join(out, 'bulk-report.html');
    const jsonl = join(out, 'bulk-report.jsonl');
    const io = memoryIo();
    await bulkAudit(
      [
        csv,
        '--map-id',
        'REG_NO',
        '--map-structure',
        'SMILES',
        '--map-form',
        'STEREO',
        '--map-descriptors',
        'DESCRIPTORS',
      ].concat(['--progress', 'none', '--workers', '1', '--html', html, '--jsonl', jsonl]),
      io,
    );
    const records = (await import('node:fs'))
      .readFileSync(jsonl, 'utf8')
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    const flagged = records.filter(
      (r) => r.kind === 'record' && r.findings.some((f: { waived: unknown }) => !f.waived),
    );
    const drawable = flagged.filter((r) => r.computed !== null);
    expect(flagged.length).toBeGreaterThanOrEqual(6);

    const { browser, page, problems } = await openPage({ width: 1280, height: 900 });
    try {
      await page.goto('file://' + html);
      const visible = () => visibleCards(page);
      expect(await visible()).toBe(flagged.length);
      // every flagged record whose structure was read has a depiction, drawn once in view, with a size
      for (const card of await page.locator('article.rec figure.pic').all())
        await card.scrollIntoViewIfNeeded();
      await page.waitForFunction(
        (n) => document.querySelectorAll('article.rec svg.mol').length === n,
        drawable.length,
      );
      const sizes = await page
        .locator('article.rec svg.mol')
        .evaluateAll((svgs) => svgs.map((s) => s.getBoundingClientRect().width));
      expect(sizes.every((w) => w > 50)).toBe(true);
      // the legacy word as written beside the mapped form
      expect(await page.locator('article.rec[data-id="LX-00005"] .side').first().textContent()).toContain(
        'racemate (written "RAC")',
      );
      const idsOf = () => visibleIds(page);
      const withCheck = (c: string) =>
        flagged
          .filter((r) =>
            r.findings.some((f: { check: string; waived: unknown }) => f.check === c && !f.waived),
          )
          .map((r) => r.id);

      await page.selectOption('#filter-check', 'descriptors-match-structure');
      expect(await idsOf()).toEqual(withCheck('descriptors-match-structure'));
      expect(await idsOf()).toContain('LX-00002');
      await page.selectOption('#filter-check', '');
      await page.selectOption('#filter-severity', 'error');
      const errors = flagged.filter((r) =>
        r.findings.some((f: { severity: string; waived: unknown }) => f.severity === 'error' && !f.waived),
      );
      expect(await visible()).toBe(errors.length);
      await page.selectOption('#filter-severity', '');
      await page.selectOption('#filter-form', 'racemate');
      expect(await idsOf()).toEqual(flagged.filter((r) => r.declared.form === 'racemate').map((r) => r.id));
      await page.selectOption('#filter-form', '');
      await page.fill('#search', 'lx-00003');
      expect(await idsOf()).toEqual(['LX-00003']);
      // the record's position in the export: record 3 is on line 4 (after the header)
      expect(await page.locator('article.rec .file').textContent()).toMatch(/record 3, line 4$/);
      await page.fill('#search', '');
      expect(await visible()).toBe(flagged.length);
      // the checks that could not run on the broken SMILES: listed once for the run, and on its card
      const notRun = page.locator('section[aria-label="checks not run"]');
      expect(await notRun.isVisible()).toBe(true);
      const notRunText = (await notRun.innerText()).replace(/\s+/g, ' ');
      expect(notRunText).toContain(
        'form-matches-structure 1 record (LX-00008) the structure could not be read (see structure-readable)',
      );
      const card = page.locator('article.rec[data-id="LX-00008"] li.notrun', {
        hasText: 'form-matches-structure',
      });
      expect(await card.isVisible()).toBe(true);
      expect(await card.innerText()).toMatch(
        /^not run\s*form-matches-structure: the structure could not be read \(see structure-readable\)$/i,
      );
      await page.screenshot({ path: join(out, 'bulk-report.png'), fullPage: true });
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 120_000);
});
