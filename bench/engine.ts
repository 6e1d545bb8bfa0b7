/**
 * Engine speed (stereo engine issue): parse + describe (stereo units, CIP labels, mirror-image analysis,
 * stereoisomer count) per structure, against the same-run baseline of OpenChemLib's default path
 * (parse with 2D coordinates, canonical id code, parse the mirror SMILES, compare). Target: >= 5x.
 */
import { describe as describeStructure, readStructure } from '../src/chem/index.js';
import { oclDefaultPath } from './baseline-ocl.js';
import type { BenchContext } from './run.js';
import { fmt, ratioLine, time } from './util.js';

export async function benchEngine(ctx: BenchContext): Promise<void> {
  const sampleSize = Math.min(ctx.smiles.length, Number(process.env.BENCH_BASELINE_SAMPLE ?? 2000));
  const stride = ctx.smiles.length / sampleSize;
  const sample = Array.from({ length: sampleSize }, (_, i) => ctx.smiles[Math.floor(i * stride)]);
  // warm-up both paths so the JIT is fair to each
  oclDefaultPath(sample.slice(0, 50));
  for (const s of sample.slice(0, 200)) {
    const r = readStructure(s, { format: 'smiles' });
    if (r.ok) describeStructure(r.structure);
  }
  const base = time('baseline: OpenChemLib default path (sample)', sample.length, () =>
    oclDefaultPath(sample),
  );
  let failed = 0;
  const ours = time('stereogate: read + describe (all structures)', ctx.smiles.length, () => {
    for (const s of ctx.smiles) {
      const r = readStructure(s, { format: 'smiles' });
      if (!r.ok) {
        failed++;
        continue;
      }
      describeStructure(r.structure);
    }
  });
  const oursSample = time('stereogate: read + describe (same sample)', sample.length, () => {
    for (const s of sample) {
      const r = readStructure(s, { format: 'smiles' });
      if (r.ok) describeStructure(r.structure);
    }
  });
  console.log(fmt(base.timing));
  console.log(fmt(ours.timing));
  console.log(fmt(oursSample.timing));
  console.log(`  (${failed} structures were rejected by the reader with a finding)`);
  console.log(ratioLine('engine, same sample', oursSample.timing, base.timing, 5));
}
