/**
 * Test helper: do two structures state the same stereo, given which atom of `b` is which atom of `a`?
 * Compares configurations, not ligand lists: a tetrahedral centre or allene is the same when the ligand
 * permutation parity matches the winding; a double bond when cis/trans agrees after swapping references.
 */
import { permutationParity } from '../../../src/chem/write/smiles-stereo.js';
import type { StereoElement, Structure } from '../../../src/chem/types.js';

function describeIn(a: Structure, e: StereoElement): string {
  return JSON.stringify(e) + ' in ' + a.atoms.length + ' atoms';
}

/** Lists differences; empty when `b` (atom k of b = atom map[k] of a) states exactly a's stereo. */
export function stereoDifferences(a: Structure, b: Structure, map: number[]): string[] {
  const m = (x: number): number => (x >= 0 ? map[x]! : x);
  const diffs: string[] = [];
  const bt = b.stereo.map((e) => {
    if (e.kind === 'tetrahedral')
      return { ...e, centre: m(e.centre), ligands: e.ligands.map(m) as typeof e.ligands };
    if (e.kind === 'double-bond')
      return { ...e, ends: e.ends.map(m) as [number, number], refs: e.refs.map(m) as [number, number] };
    return { ...e, ends: e.ends.map(m) as [number, number], ligands: e.ligands.map(m) as typeof e.ligands };
  });
  if (bt.length !== a.stereo.length) diffs.push(`count ${a.stereo.length} vs ${bt.length}`);
  for (const e of a.stereo) {
    if (e.kind === 'tetrahedral') {
      const f = bt.find((x) => x.kind === 'tetrahedral' && x.centre === e.centre);
      if (!f || f.kind !== 'tetrahedral') {
        diffs.push(`missing ${describeIn(a, e)}`);
        continue;
      }
      const p = permutationParity(e.ligands, f.ligands);
      if (p === null || (p === 0) !== (e.winding === f.winding)) diffs.push(`centre ${e.centre} differs`);
    } else if (e.kind === 'double-bond') {
      const f = bt.find(
        (x) => x.kind === 'double-bond' && x.ends.includes(e.ends[0]) && x.ends.includes(e.ends[1]),
      );
      if (!f || f.kind !== 'double-bond') {
        diffs.push(`missing ${describeIn(a, e)}`);
        continue;
      }
      const refs = f.ends[0] === e.ends[0] ? f.refs : [f.refs[1], f.refs[0]];
      let flips = 0;
      if (refs[0] !== e.refs[0]) flips++;
      if (refs[1] !== e.refs[1]) flips++;
      const rel = flips % 2 === 0 ? f.relation : f.relation === 'cis' ? 'trans' : 'cis';
      if (rel !== e.relation) diffs.push(`double bond ${e.ends.join('=')} differs`);
    } else {
      const f = bt.find(
        (x) => x.kind === 'axial' && x.ends.includes(e.ends[0]) && x.ends.includes(e.ends[1]),
      );
      if (!f || f.kind !== 'axial') {
        diffs.push(`missing ${describeIn(a, e)}`);
        continue;
      }
      const key = (x: number, i: number, ends: [number, number]): number =>
        x >= 0 ? x : x - 10 * (ends[i < 2 ? 0 : 1] + 1);
      const ka = e.ligands.map((x, i) => key(x, i, e.ends));
      const kb = f.ligands.map((x, i) => key(x, i, f.ends));
      const p = permutationParity(ka, kb);
      if (p === null || (p === 0) !== (e.winding === f.winding))
        diffs.push(`axis ${e.ends.join('-')} differs`);
    }
  }
  return diffs;
}
