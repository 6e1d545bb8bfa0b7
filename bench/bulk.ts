/**
 * Bulk audit speed and memory (bulk audit issue): the MoleculeNet structures replicated to 100,000 records
 * (BENCH_BULK_RECORDS to change) with invented claims, audited with 1 and 2 workers; records per second, per
 * core, scaling, and peak resident memory per run, beside the same-run baseline of the engine issue
 * (OpenChemLib's default path on one core). Targets: >= 2,000 records/s per core, near-linear to 2 workers.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEFAULT_CONFIG } from '../src/audit/config.js';
import { runBulkAudit } from '../src/bulk/run.js';
import { STEREO_FORMS } from '../src/registry/types.js';
import { oclDefaultPath } from './baseline-ocl.js';
import type { BenchContext } from './run.js';
import { fmt, time, type Timing } from './util.js';

export async function benchBulk(ctx: BenchContext): Promise<void> {
  const n = Number(process.env.BENCH_BULK_RECORDS ?? 100_000);
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-bench-bulk-'));
  const csv = join(dir, 'registry.csv');
  const rows = ['id,smiles,stereo_form,ee'];
  for (let i = 0; i < n; i++) {
    const smi = ctx.smiles[i % ctx.smiles.length].replace(/"/g, '""');
    const form = STEREO_FORMS[i % STEREO_FORMS.length];
    rows.push(`LX-${String(i + 1).padStart(7, '0')},"${smi}",${form},${i % 3 === 0 ? '99' : ''}`);
  }
  writeFileSync(csv, rows.join('\n') + '\n');
  const sample = ctx.smiles.slice(0, 1000);
  oclDefaultPath(sample.slice(0, 50));
  const base = time('baseline: OpenChemLib default path, 1 core (1,000)', sample.length, () => oclDefaultPath(sample)).timing;
  console.log(fmt(base));
  const results: { workers: number; t: Timing; peakMiB: number }[] = [];
  for (const workers of [1, 2]) {
    let peak = 0;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 200);
    const t0 = performance.now();
    const run = await runBulkAudit({ inputs: [csv], mapping: {}, config: { ...DEFAULT_CONFIG }, workers, progress: 'none', writers: [] });
    const seconds = (performance.now() - t0) / 1000;
    clearInterval(sampler);
    peak = Math.max(peak, process.memoryUsage().rss);
    const t = { label: `stereogate bulk audit, ${workers} worker${workers > 1 ? 's' : ''}`, items: run.trailer.summary.records, seconds, perSecond: run.trailer.summary.records / seconds };
    results.push({ workers, t, peakMiB: peak / 2 ** 20 });
    console.log(`${fmt(t)}   peak RSS ${(peak / 2 ** 20).toFixed(0)} MiB (whole process, workers included)`);
    if (workers === 1) ctx.perRecordAuditSeconds = seconds / run.trailer.summary.records;
  }
  const one = results[0].t.perSecond;
  const two = results[1].t.perSecond;
  console.log(`bulk, 1 worker: ${(one / base.perSecond).toFixed(1)}x the baseline per core; ${one.toFixed(0)} records/s per core (target >= 2000: ${one >= 2000 ? 'met' : 'NOT met'})`);
  console.log(`bulk, 2 workers: ${(two / one).toFixed(2)}x the 1-worker rate (ideal 2.00 on 2 cores; the main thread also reads and writes)`);
  rmSync(dir, { recursive: true, force: true });
}
