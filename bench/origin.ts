/**
 * Origins (issue "Judge a stereo claim by how the compound was made"): the pull-request audit of 20 records
 * against a 2,000-record registry with an origin on every record, beside the same audit of the same records
 * without origins, in the same run (aim: within 1.5x). Then the mapping alone over 3,000 structures, each
 * against a precursor made by cutting one terminal atom off it and the cut piece: the slowest record and how many
 * reached the step bound (reported unmapped, never a stall).
 * Records: MoleculeNet structures (Wu et al., Chem. Sci. 2018, 9, 513) with invented claims (form: unknown).
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { runAudit } from '../src/audit/run.js';
import { readStructure } from '../src/chem/index.js';
import { extractAtoms, normalize } from '../src/chem/normalize.js';
import { traceProvenance } from '../src/chem/provenance/index.js';
import type { Structure } from '../src/chem/types.js';
import { writeSmiles } from '../src/chem/write/smiles.js';
import type { BenchContext } from './run.js';
import { fmt, timeAsync } from './util.js';

const PAIRS = 1000;
const CHANGED = 20;
const MAPPED = 3000;
const TARGET_RATIO = 1.5;

/** The structure without its last terminal heavy atom (a leaving group, as far as the bench cares), or null. */
function precursor(s: Structure): { smiles: string; piece: string } | null {
  const n = normalize(s).structure;
  const degree = new Int32Array(n.atoms.length);
  for (const b of n.bonds) {
    degree[b.a]++;
    degree[b.b]++;
  }
  let leaf = -1;
  for (let i = n.atoms.length - 1; i >= 0 && leaf < 0; i--) if (degree[i] === 1) leaf = i;
  if (leaf < 0 || n.atoms.length < 4) return null;
  const keep = n.atoms.map((_a, i) => i).filter((i) => i !== leaf);
  const a = n.atoms[leaf];
  return { smiles: writeSmiles(extractAtoms(n, keep)), piece: a.element === 'C' ? 'C' : `[${a.element}]` };
}

const rec = (id: string, smiles: string, origin: string[] | null): string =>
  `id: ${id}\nstructure:\n  smiles: ${JSON.stringify(smiles)}\nstereo:\n  form: unknown\n` +
  (origin ? `origin:\n  from: [${origin.map((o) => JSON.stringify(o)).join(', ')}]\n  control: none\n` : '');

export async function benchOrigin(ctx: BenchContext): Promise<void> {
  const items: { smiles: string; structure: Structure; pre: { smiles: string; piece: string } }[] = [];
  for (const smiles of new Set(ctx.smiles)) {
    if (items.length >= Math.max(PAIRS, MAPPED) || smiles.includes('.')) continue;
    const r = readStructure(smiles, { format: 'smiles' });
    if (!r.ok) continue;
    const pre = precursor(r.structure);
    if (pre && readStructure(pre.smiles, { format: 'smiles' }).ok)
      items.push({ smiles, structure: r.structure, pre });
  }

  // the pull-request path: products made from a registered precursor (by id) and a piece (SMILES); each precursor
  // made from a SMILES input
  const run = async (withOrigin: boolean): Promise<number> => {
    const root = mkdtempSync(join(tmpdir(), 'stereogate-bench-origin-'));
    try {
      mkdirSync(join(root, 'compounds'));
      const changed: string[] = [];
      items.slice(0, PAIRS).forEach((it, k) => {
        const p = `LX-P${String(k).padStart(5, '0')}`;
        const q = `LX-Q${String(k).padStart(5, '0')}`;
        writeFileSync(
          join(root, 'compounds', `${p}.yml`),
          rec(p, it.pre.smiles, withOrigin ? [it.pre.smiles] : null),
        );
        writeFileSync(
          join(root, 'compounds', `${q}.yml`),
          rec(q, it.smiles, withOrigin ? [p, it.pre.piece] : null),
        );
        if (k >= PAIRS - CHANGED) changed.push(`compounds/${q}.yml`);
      });
      const t = await timeAsync(
        `pull-request audit, ${CHANGED} of ${2 * PAIRS} records, origins ${withOrigin ? 'on every record' : 'absent'}`,
        CHANGED,
        () => runAudit({ root, paths: changed }),
      );
      console.log(fmt(t.timing));
      return t.timing.seconds;
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  };
  // first runs (each path's first use in this process: module loading and compilation) printed, not counted;
  // then two warm runs of each, alternating, the faster of each counted
  const cold = [await run(false), await run(true)];
  const warmBase: number[] = [];
  const warmOrigin: number[] = [];
  for (let k = 0; k < 2; k++) {
    warmBase.push(await run(false));
    warmOrigin.push(await run(true));
  }
  const base = Math.min(...warmBase);
  const withOrigins = Math.min(...warmOrigin);
  const ratio = withOrigins / base;
  console.log(
    `first runs: ${cold[0].toFixed(2)} s without, ${cold[1].toFixed(2)} s with origins (compiling the origin code once per process)`,
  );
  console.log(
    `origins on every record: ${ratio.toFixed(2)}x the same audit without (target <= ${TARGET_RATIO}x: ${ratio <= TARGET_RATIO ? 'met' : 'NOT met'})`,
  );

  // the mapping alone, per record
  let slowest = 0;
  let slowestSmiles = '';
  let bounded = 0;
  let steps = 0;
  const sample = items.slice(0, MAPPED);
  const t0 = performance.now();
  for (const it of sample) {
    const pre = readStructure(it.pre.smiles, { format: 'smiles' });
    const piece = readStructure(it.pre.piece, { format: 'smiles' });
    if (!pre.ok || !piece.ok) continue;
    const s = performance.now();
    const p = traceProvenance(it.structure, [pre.structure, piece.structure]);
    const ms = performance.now() - s;
    if (ms > slowest) {
      slowest = ms;
      slowestSmiles = it.smiles;
    }
    if (p.bounded) bounded++;
    steps = Math.max(steps, p.steps);
  }
  const total = (performance.now() - t0) / 1000;
  console.log(
    `mapping alone: ${sample.length} records in ${total.toFixed(2)} s (${((total / sample.length) * 1000).toFixed(2)} ms/record); ` +
      `slowest ${slowest.toFixed(0)} ms (${slowestSmiles.slice(0, 60)}); most steps ${steps}; reached the bound: ${bounded}`,
  );
}
