/** compare facts -> plain text for a chemist. */
import type { RelationFacts } from '../chem/index.js';

export function compareText(f: RelationFacts): string {
  const out: string[] = [];
  out.push(`Relation: ${f.relation}${f.epimers ? ' (epimers)' : ''}`);
  out.push(`  ${f.explanation}`);
  if (f.differingUnits.length > 0) {
    out.push(f.relation === 'enantiomers' ? 'Every stereo unit is inverted:' : 'Units that differ:');
    for (const u of f.differingUnits) {
      out.push(
        `  A ${u.atomsA.join('–')} ${u.labelA ?? '?'}  <->  B ${u.atomsB.join('–')} ${u.labelB ?? '?'}  (${u.kind})`,
      );
    }
  }
  if (f.relabelledUnits.length > 0) {
    out.push('Same configuration, other CIP descriptor:');
    for (const u of f.relabelledUnits)
      out.push(
        `  A ${u.atomsA.join('–')} ${u.labelA ?? '?'}  <->  B ${u.atomsB.join('–')} ${u.labelB ?? '?'}  (${u.kind})`,
      );
  }
  for (const d of f.formDifferences) out.push(`Form (${d.kind}): ${d.explanation}`);
  const { onlyInA, onlyInB } = f.otherComponents;
  if (onlyInA.length > 0) out.push(`Other components only in A: ${onlyInA.join(', ')}`);
  if (onlyInB.length > 0) out.push(`Other components only in B: ${onlyInB.join(', ')}`);
  return out.join('\n');
}
