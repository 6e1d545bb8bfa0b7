/**
 * The registry at scale (issue 14). The same records audited as a CSV export (bulk, 2 workers) with the
 * registry-wide checks (duplicates, enantiomer pairs, rotation signs over the key index) and without them (one
 * shard of one, which leaves them not run); and as a folder of record files through the same worker pool
 * (src/bulk/folder-run.ts), each measured in a process of its own (bench/registry-child.ts) for its peak RSS.
 * Ratios in one run: bulk with/without <= 1.2x; folder/CSV <= 1.5x; the folder audit's time per record at N
 * within 1.2x of that at N/10 (linear); its peak RSS under 1 GiB (the issue asks it at 200,000 records).
 * Records: MoleculeNet structures (Wu et al., Chem. Sci. 2018, 9, 513) replicated to BENCH_REGISTRY_RECORDS
 * (default 20,000; 200,000 is the issue's size, minutes on a shared 2-core machine), every fifth record with an
 * invented rotation; claims invented. At small sizes the workers' start-up dominates the time per record, so
 * the linearity ratio means something from N = 200,000 (N/10 = 20,000) on.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEFAULT_CONFIG } from '../src/audit/config.js';
import { runBulkAudit } from '../src/bulk/run.js';
import { GC_FLAG, wantsSingleThreadedGc } from '../src/cli/gc-respawn.js';
import type { RegistryChildResult } from './registry-child.js';
import type { BenchContext } from './run.js';
import { fmt, timeAsync } from './util.js';

const WORKERS = 2;

/** N records as a CSV export and as a folder of record files (the same ids, structures and claims). */
function writeRegistry(ctx: BenchContext, dir: string, n: number): { csv: string; folder: string } {
  const csv = join(dir, 'registry.csv');
  const rows = ['id,smiles,stereo_form,rotation'];
  const folder = join(dir, 'folder');
  mkdirSync(join(folder, 'compounds'), { recursive: true });
  writeFileSync(join(folder, 'stereogate.config.yml'), 'recordDirs: [compounds]\n');
  for (let i = 0; i < n; i++) {
    const smiles = ctx.smiles[i % ctx.smiles.length]!;
    const id = `LX-${String(i + 1).padStart(6, '0')}`;
    const rotation = i % 5 === 0 ? String((i % 2 ? 1 : -1) * (10 + (i % 40))) : '';
    rows.push(`${id},"${smiles}",unknown,${rotation}`);
    writeFileSync(
      join(folder, 'compounds', `${id}.yaml`),
      `id: ${id}\nstructure:\n  smiles: ${JSON.stringify(smiles)}\nstereo:\n  form: unknown\n` +
        (rotation ? `  rotation:\n    value: ${rotation}\n` : ''),
    );
  }
  writeFileSync(csv, rows.join('\n') + '\n');
  return { csv, folder };
}

function child(mode: 'folder' | 'bulk', path: string): RegistryChildResult {
  const script = new URL('./registry-child.ts', import.meta.url).pathname;
  // the process flags the command line uses for a bulk run (src/cli/gc-respawn.ts), for both
  const gc = wantsSingleThreadedGc(WORKERS, availableParallelism()) ? [GC_FLAG] : [];
  const out = spawnSync(process.execPath, [...gc, '--import', 'tsx', script, mode, path, String(WORKERS)], {
    encoding: 'utf8',
    maxBuffer: 64 * 2 ** 20,
  });
  if (out.status !== 0) throw new Error(`${mode} run failed: ${out.stderr}`);
  return JSON.parse(out.stdout.trim().split('\n').pop() as string) as RegistryChildResult;
}

function line(label: string, r: RegistryChildResult): string {
  return (
    fmt({ label, items: r.records, seconds: r.seconds, perSecond: r.records / r.seconds }) +
    `  cpu ${r.cpuSeconds.toFixed(1)} s  peak RSS ${r.peakMiB.toFixed(0)} MiB`
  );
}

const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');

export async function benchRegistry(ctx: BenchContext): Promise<void> {
  const n = Number(process.env.BENCH_REGISTRY_RECORDS ?? 20_000);
  const small = Math.max(1000, Math.round(n / 10));
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-bench-registry-'));
  try {
    const big = writeRegistry(ctx, join(dir, 'n'), n);
    // `npm run bench -- registry folder-only`: the folder targets alone (the bulk with/without pair is long)
    if (!process.argv.includes('folder-only')) {
      const bulk = (shard: { index: number; count: number } | null) =>
        runBulkAudit({
          inputs: [big.csv],
          mapping: { rotation: 'rotation' },
          config: { ...DEFAULT_CONFIG },
          workers: WORKERS,
          shard,
          progress: 'none',
          writers: [],
        });
      const without = await timeAsync('bulk CSV, registry-wide checks not run (1/1)', n, () =>
        bulk({ index: 1, count: 1 }),
      );
      const withPhase = await timeAsync('bulk CSV, registry-wide checks on', n, () => bulk(null));
      const reg = withPhase.value.trailer.registry;
      console.log(fmt(without.timing));
      console.log(fmt(withPhase.timing));
      console.log(
        `  registry-wide phase: ${reg?.status}, ${reg?.pairs.length ?? 0} pairs over ${reg?.records ?? 0} records`,
      );
      const r1 = withPhase.timing.seconds / without.timing.seconds;
      console.log(
        `bulk with / without registry-wide checks: ${r1.toFixed(2)}x (target <= 1.2x: ${verdict(r1 <= 1.2)})`,
      );
    }
    console.log(`each run below in its own process, ${WORKERS} workers`);
    const csvRun = child('bulk', big.csv);
    console.log(line('bulk CSV, registry-wide checks on', csvRun));
    const folderRun = child('folder', big.folder);
    console.log(line('folder audit (record files, worker pool)', folderRun));
    rmSync(join(dir, 'n'), { recursive: true, force: true });
    const smallRun = child('folder', writeRegistry(ctx, join(dir, 'small'), small).folder);
    console.log(line('folder audit, a tenth of the records', smallRun));
    // wall and CPU seconds (all threads): on a shared machine the CPU ratio is the steadier one
    const r2 = folderRun.seconds / csvRun.seconds;
    const c2 = folderRun.cpuSeconds / csvRun.cpuSeconds;
    console.log(
      `folder / CSV: ${r2.toFixed(2)}x wall, ${c2.toFixed(2)}x CPU (target <= 1.5x: ${verdict(r2 <= 1.5)})`,
    );
    const per = (r: RegistryChildResult, of: 'seconds' | 'cpuSeconds') => r[of] / r.records;
    const r3 = per(folderRun, 'seconds') / per(smallRun, 'seconds');
    const c3 = per(folderRun, 'cpuSeconds') / per(smallRun, 'cpuSeconds');
    console.log(
      `folder time per record at ${n} / at ${small}: ${r3.toFixed(2)}x wall, ${c3.toFixed(2)}x CPU ` +
        `(target <= 1.2x: ${verdict(r3 <= 1.2)})`,
    );
    console.log(
      `folder peak RSS at ${n} records: ${folderRun.peakMiB.toFixed(0)} MiB (target < 1024 MiB at 200,000: ` +
        `${n >= 200_000 ? verdict(folderRun.peakMiB < 1024) : 'measure with BENCH_REGISTRY_RECORDS=200000'}); ` +
        `at ${small}: ${smallRun.peakMiB.toFixed(0)} MiB`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
