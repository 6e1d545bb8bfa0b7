/**
 * The registry at scale (issue 14): the same records audited as a CSV export (bulk, 2 workers) with the
 * registry-wide checks (duplicates, enantiomer pairs, rotation signs over the key index) and without them (one
 * shard of one, which leaves them not run), and as a folder of record files (runAudit). Ratios in one run:
 * targets bulk with/without <= 1.2x, folder/CSV <= 1.5x. Records: MoleculeNet structures (Wu et al., Chem.
 * Sci. 2018, 9, 513) replicated to BENCH_REGISTRY_RECORDS (default 20,000; the 200,000 is an option, not
 * the default, on a shared 2-core machine), every fifth record with an invented rotation; claims invented.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEFAULT_CONFIG } from '../src/audit/config.js';
import { runAudit } from '../src/audit/run.js';
import { runBulkAudit } from '../src/bulk/run.js';
import type { BenchContext } from './run.js';
import { fmt, timeAsync } from './util.js';

export async function benchRegistry(ctx: BenchContext): Promise<void> {
  const n = Number(process.env.BENCH_REGISTRY_RECORDS ?? 20_000);
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-bench-registry-'));
  try {
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
    const bulk = (shard: { index: number; count: number } | null) =>
      runBulkAudit({
        inputs: [csv],
        mapping: { rotation: 'rotation' },
        config: { ...DEFAULT_CONFIG },
        workers: 2,
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
      `bulk with / without registry-wide checks: ${r1.toFixed(2)}x (target <= 1.2x: ${r1 <= 1.2 ? 'met' : 'NOT met'})`,
    );
    const rss0 = process.memoryUsage().rss;
    const folderRun = await timeAsync('folder audit (runAudit, record files)', n, () =>
      runAudit({ root: folder }),
    );
    console.log(fmt(folderRun.timing));
    const r2 = folderRun.timing.seconds / withPhase.timing.seconds;
    console.log(
      `folder / CSV: ${r2.toFixed(2)}x (target <= 1.5x: ${r2 <= 1.5 ? 'met' : 'NOT met'}); ` +
        `RSS of this process after the folder audit ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MiB ` +
        `(before ${(rss0 / 2 ** 20).toFixed(0)} MiB)`,
    );
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
