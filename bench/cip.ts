/**
 * CIP labelling share (CIP labeler issue): time spent in our labeler over the MoleculeNet structures, as a share
 * of the per-record audit time measured in the same run (bulk section, 1 worker; else the in-thread describe
 * time). Target: at most a fifth.
 */
import { describe as describeStructure, labelUnits, readStructure } from '../src/chem/index.js';
import type { Structure } from '../src/chem/types.js';
import type { BenchContext } from './run.js';
import { fmt, time } from './util.js';

export async function benchCip(ctx: BenchContext): Promise<void> {
  const structures: Structure[] = [];
  for (const s of ctx.smiles) {
    const r = readStructure(s, { format: 'smiles' });
    if (r.ok) structures.push(r.structure);
  }
  for (const s of structures.slice(0, 300)) labelUnits(s);
  const label = time('CIP labelling (our labeler), all structures', structures.length, () => {
    for (const s of structures) labelUnits(s);
  }).timing;
  const desc = time('describe (includes labelling), all structures', structures.length, () => {
    for (const s of structures) describeStructure(s);
  }).timing;
  console.log(fmt(label));
  console.log(fmt(desc));
  const perLabel = label.seconds / label.items;
  const perRecord = ctx.perRecordAuditSeconds ?? desc.seconds / desc.items;
  const what = ctx.perRecordAuditSeconds
    ? 'per-record bulk audit time (1 worker)'
    : 'per-record describe time';
  const share = perLabel / perRecord;
  console.log(
    `CIP labelling share of the ${what}: ${(100 * share).toFixed(1)}% (target <= 20%: ${share <= 0.2 ? 'met' : 'NOT met'})`,
  );
}
