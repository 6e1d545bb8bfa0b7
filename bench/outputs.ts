/**
 * Outputs: (1) Markdown escaping of a hostile 600-byte descriptor (a run of `[`), ours against the former
 * escaping (kept in test/report/support/escape-before.ts; cubic on runs of `[`, 3 KB took 12 s), same run; and
 * (2) the HTML report of 10,000 flagged records opened in Debian's chromium: time until the page is usable,
 * against the baseline of the same page without its script (what reading the bytes and the embedded data costs);
 * and (3) the computed layouts of the bulk HTML report against reading and describing the same structures.
 */
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, readStructure } from '../src/chem/index.js';
import { layoutStructure } from '../src/chem/depict.js';
import { escapeMarkdown } from '../src/report/escape.js';
import { renderHtmlPage } from '../src/report/html/render.js';
import { escapeMarkdown as escapeBefore } from '../test/report/support/escape-before.js';
import { SAMPLES, sampleRow } from '../test/report/support/html-rows.js';
import type { BenchContext } from './run.js';
import { fmt, ratioLine, time } from './util.js';

/** A descriptor field gone wrong: one long word of `[` (the former escaping backtracked cubically on it). */
function hostileDescriptor(bytes: number): string {
  return ('(2R,3S)-' + '['.repeat(bytes)).slice(0, bytes);
}

export async function benchOutputs(): Promise<void> {
  const text = hostileDescriptor(600);
  const before = time('former escaping, hostile 600-byte descriptor', 1, () => escapeBefore(text));
  const ours = time('escaping, hostile 600-byte descriptor x 200', 200, () => {
    let n = 0;
    for (let i = 0; i < 200; i++) n += escapeMarkdown(text).length;
    return n;
  });
  console.log(fmt(ours.timing));
  console.log(fmt(before.timing));
  console.log(ratioLine('escaping vs former escaping', ours.timing, before.timing));
  const big = hostileDescriptor(100_000);
  console.log(fmt(time('escaping, hostile 100 KB text', 1, () => escapeMarkdown(big)).timing));

  const chromium = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (!existsSync(chromium)) {
    console.log(`html: no chromium at ${chromium}; skipped`);
    return;
  }
  const base = SAMPLES.map((s) => sampleRow(s));
  const rows = Array.from({ length: 10_000 }, (_, i) => ({
    ...base[i % base.length]!,
    id: `LX-${String(i + 1).padStart(5, '0')}`,
  }));
  const html = renderHtmlPage(rows, {
    tool: { name: 'stereogate', version: 'bench' },
    caution: 'bench',
    summary: { records: 10_000, errors: 10_000, warnings: 0, notes: 0, waived: 0 },
    byCheck: {},
  });
  const dir = join(process.cwd(), 'test-output');
  mkdirSync(dir, { recursive: true });
  const report = join(dir, 'bench-html-10k.html');
  const plain = join(dir, 'bench-html-10k-no-script.html');
  writeFileSync(report, html);
  writeFileSync(
    plain,
    html.replace(/<script>[\s\S]*?<\/script>\s*<\/body>/, '<p id="done">no script</p></body>'),
  );
  const { chromium: pw } = await import('playwright-core');
  const browser = await pw.launch({ executablePath: chromium, args: ['--no-sandbox', '--disable-gpu'] });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const open = async (file: string, ready: string): Promise<number> => {
      const t0 = performance.now();
      await page.goto('file://' + file);
      await page.waitForSelector(ready, { timeout: 120_000 });
      return performance.now() - t0;
    };
    await open(plain, '#done'); // warm the browser
    const plainMs = await open(plain, '#done');
    const reportMs = await open(report, 'body[data-ready]');
    const heap = await page.evaluate(
      () => (performance as unknown as { memory?: { usedJSHeapSize: number } }).memory?.usedJSHeapSize ?? 0,
    );
    console.log(
      `html report, 10,000 flagged records: ${(html.length / 1e6).toFixed(1)} MB, usable after ${reportMs.toFixed(0)} ms ` +
        `(target < 3,000 ms); the same page without its script ${plainMs.toFixed(0)} ms; ratio ${(reportMs / plainMs).toFixed(2)}x; ` +
        `JS heap ${(heap / 1e6).toFixed(0)} MB`,
    );
  } finally {
    await browser.close();
  }
}

/**
 * (3) The bulk HTML report's computed layouts: laying out MoleculeNet SMILES for their depictions against reading
 * and describing the same structures (the least of what their audit already cost), same run. It decides the
 * bound of computed layouts in src/bulk/html-collector.ts (the first 3,000 flagged SMILES records): the layouts
 * run in the main thread after the audit, one at a time.
 */
export function benchDepictions(ctx: BenchContext, n = 1_000): void {
  const sample = ctx.smiles.slice(0, n);
  const structures = sample
    .map((s) => readStructure(s, { format: 'smiles' }))
    .flatMap((r) => (r.ok ? [r.structure] : []));
  const base = time('read + describe, MoleculeNet SMILES', sample.length, () => {
    let units = 0;
    for (const s of sample) {
      const r = readStructure(s, { format: 'smiles' });
      if (r.ok) units += describe(r.structure).units.length;
    }
    return units;
  });
  const layout = time('2D layout for the depiction, same structures', structures.length, () => {
    let atoms = 0;
    for (const s of structures) atoms += layoutStructure(s)?.atoms.length ?? 0;
    return atoms;
  });
  console.log(fmt(base.timing));
  console.log(fmt(layout.timing));
  const perLayout = layout.timing.seconds / layout.timing.items;
  console.log(
    `depictions: a layout costs ${(base.timing.perSecond / layout.timing.perSecond).toFixed(1)}x the read + describe ` +
      `of its structure (${(perLayout * 1000).toFixed(1)} ms); 3,000 layouts ${(3_000 * perLayout).toFixed(0)} s, ` +
      `20,000 (every listed record) ${(20_000 * perLayout).toFixed(0)} s in the main thread after the audit`,
  );
}
