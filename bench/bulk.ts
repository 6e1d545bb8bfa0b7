/**
 * Bulk audit speed and memory (bulk audit issue): the MoleculeNet structures replicated to 100,000 records
 * (BENCH_BULK_RECORDS to change) with invented claims, audited with 1 and 2 workers; records per second, per
 * core, scaling, and peak resident memory per run, beside the same-run baseline of the engine issue
 * (OpenChemLib's default path on one core). Targets: >= 2,000 records/s per core, near-linear to 2 workers.
 */
import { createWriteStream, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { Molecule } from 'openchemlib';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEFAULT_CONFIG } from '../src/audit/config.js';
import { runBulkAudit } from '../src/bulk/run.js';
import { jsonlWriter } from '../src/bulk/writers.js';
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
  const base = time('baseline: OpenChemLib default path, 1 core (1,000)', sample.length, () =>
    oclDefaultPath(sample),
  ).timing;
  console.log(fmt(base));
  const results: { workers: number; t: Timing; peakMiB: number; perCpuSecond: number }[] = [];
  for (const workers of [1, 2]) {
    let peak = 0;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 200);
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    const run = await runBulkAudit({
      inputs: [csv],
      mapping: {},
      config: { ...DEFAULT_CONFIG },
      workers,
      progress: 'none',
      writers: [],
    });
    const seconds = (performance.now() - t0) / 1000;
    const cpu = process.cpuUsage(c0);
    const cpuSeconds = (cpu.user + cpu.system) / 1e6;
    clearInterval(sampler);
    peak = Math.max(peak, process.memoryUsage().rss);
    const t = {
      label: `stereogate bulk audit, ${workers} worker${workers > 1 ? 's' : ''}`,
      items: run.trailer.summary.records,
      seconds,
      perSecond: run.trailer.summary.records / seconds,
    };
    results.push({
      workers,
      t,
      peakMiB: peak / 2 ** 20,
      perCpuSecond: run.trailer.summary.records / cpuSeconds,
    });
    console.log(`${fmt(t)}   peak RSS ${(peak / 2 ** 20).toFixed(0)} MiB (whole process, workers included)`);
    // CPU time of all threads: records per CPU-second is the per-core rate even on a machine shared with others
    console.log(
      `  ${(run.trailer.summary.records / cpuSeconds).toFixed(0)} records per CPU-second (${cpuSeconds.toFixed(1)} CPU-s, all threads)`,
    );
    if (workers === 1) ctx.perRecordAuditSeconds = seconds / run.trailer.summary.records;
  }
  const one = results[0].t.perSecond;
  const two = results[1].t.perSecond;
  const perCore = results[0].perCpuSecond;
  console.log(
    `bulk, 1 worker: ${(one / base.perSecond).toFixed(1)}x the baseline (wall clock, same run); ` +
      `${perCore.toFixed(0)} records per CPU-second, all threads (target >= 2000 per core: ${perCore >= 2000 ? 'met' : 'NOT met'})`,
  );
  console.log(
    `bulk, 2 workers: ${(two / one).toFixed(2)}x the 1-worker rate (ideal 2.00 on 2 otherwise idle cores; the main thread also reads and writes)`,
  );
  rmSync(dir, { recursive: true, force: true });
}

/**
 * `npm run bench -- bulk-memory`: a large SD file (1,000,000 records unless BENCH_BULK_MEMORY_RECORDS says
 * otherwise) written from the MoleculeNet structures (each molfile made once by OpenChemLib, then replicated with
 * invented ids and claims), audited with 2 workers into a JSON Lines writer on /dev/null while the resident
 * memory of the whole process (workers included) is sampled. Target: within 1 GiB.
 */
export async function benchBulkMemory(ctx: BenchContext): Promise<void> {
  const n = Number(process.env.BENCH_BULK_MEMORY_RECORDS ?? 1_000_000);
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-bench-memory-'));
  const sd = join(dir, 'registry.sdf');
  const blocks: string[] = [];
  for (const smi of ctx.smiles) {
    try {
      blocks.push(
        Molecule.fromSmiles(smi)
          .toMolfile()
          .replace(/^[^\n]*\n/, ''),
      );
    } catch {
      // a SMILES OpenChemLib does not read is left out of the file
    }
  }
  const words = ['rac', 'racemic', 'single enantiomer', 'achiral', 'meso', '(+/-)', 'abs', 'unknown'];
  const out = createWriteStream(sd, 'utf8');
  for (let i = 0; i < n; i++) {
    const rec = `LX-${String(i + 1).padStart(7, '0')}\n${blocks[i % blocks.length]}\n> <FORM>\n${words[i % words.length]}\n\n$$$$\n`;
    if (!out.write(rec)) await new Promise<void>((res) => out.once('drain', () => res()));
  }
  await new Promise<void>((res) => out.end(() => res()));
  console.log(
    `SD file: ${n.toLocaleString('en-US')} records from ${blocks.length} distinct molfiles, ${(statSync(sd).size / 2 ** 30).toFixed(2)} GiB`,
  );
  let peak = process.memoryUsage().rss;
  const samples: number[] = [];
  const sampler = setInterval(() => {
    const rss = process.memoryUsage().rss;
    peak = Math.max(peak, rss);
    samples.push(rss);
    if (samples.length % 30 === 0)
      console.log(
        `  resident memory now ${(rss / 2 ** 20).toFixed(0)} MiB, peak ${(peak / 2 ** 20).toFixed(0)} MiB`,
      );
  }, 1000);
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const run = await runBulkAudit({
    inputs: [sd],
    mapping: { form: 'FORM' },
    config: { ...DEFAULT_CONFIG },
    workers: 2,
    progress: 'lines',
    writers: [jsonlWriter('/dev/null')],
  });
  clearInterval(sampler);
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(c0);
  const q = (f: number) => samples[Math.min(samples.length - 1, Math.floor(f * samples.length))] ?? peak;
  const mib = (b: number) => `${(b / 2 ** 20).toFixed(0)} MiB`;
  console.log(
    `${run.trailer.summary.records.toLocaleString('en-US')} records in ${seconds.toFixed(0)} s ` +
      `(${(run.trailer.summary.records / seconds).toFixed(0)} records/s, ${((cpu.user + cpu.system) / 1e6).toFixed(0)} CPU-s)`,
  );
  console.log(
    `resident memory, whole process: at 10% ${mib(q(0.1))}, 50% ${mib(q(0.5))}, 90% ${mib(q(0.9))}, peak ${mib(peak)}`,
  );
  console.log(
    `peak within 1 GiB: ${peak <= 2 ** 30 ? 'met' : 'NOT met'}; growth from 10% to 90% of the run: ${mib(q(0.9) - q(0.1))}`,
  );
  rmSync(dir, { recursive: true, force: true });
}
