/**
 * Potential stereogenic axes of biaryls and heterobiaryls, from the constitution alone: an acyclic single bond
 * joining two aromatic ring atoms, each with exactly two ring neighbours (its ortho positions) and no hydrogen.
 * Whether rotation about such a bond is slow enough for atropisomers to be isolated depends on the size of the
 * ortho groups and on temperature; the usual rule of thumb asks for three or four ortho substituents (common
 * practice, no source — IUPAC defines atropisomers by isolability, not by a count). A ring fused at an ortho
 * position counts twice: the fusion atom and the peri C–H it carries both reach over the axis (1,1'-binaphthyl,
 * two such fusions, is resolvable — from memory). The minimum is a setting (`orthoMin`); a bare ring nitrogen
 * at an ortho position is no substituent.
 *
 * Example: 1,1'-bi-2-naphthol (BINOL) has four (C2-OH and C8a on each side) and 6,6'-dinitrobiphenyl-2,2'-
 * dicarboxylic acid four; 2,2'-dimethylbiphenyl has two and rotates freely at room temperature (from memory).
 */
import type { Graph, RingInfo } from '../graph/index.js';
import type { Structure } from '../types.js';

/** Default minimum number of ortho substituents (both rings together) for a potential axis. */
export const DEFAULT_AXIS_ORTHO_MIN = 3;

export interface AxisCandidate {
  ends: [number, number];
  /** [ortho of ends[0] (2), ortho of ends[1] (2)]: the unit's reference tokens. */
  tokens: [number, number, number, number];
  orthoSubstituents: number;
}

export function axisCandidates(
  s: Structure,
  g: Graph,
  rings: RingInfo,
  aromaticBond: boolean[],
  orthoMin: number,
): AxisCandidate[] {
  const out: AxisCandidate[] = [];
  const heavyDegree = (x: number): number => {
    let d = 0;
    for (const y of g.nbrs[x]) if (s.atoms[y].atomicNumber > 1) d++;
    return d;
  };
  // The two aromatic ring neighbours of an axis end (its ortho positions), or null.
  const orthoOf = (e: number, partner: number): [number, number] | null => {
    const atom = s.atoms[e];
    if (atom.hCount !== 0 || atom.charge !== 0) return null;
    const out2: number[] = [];
    for (let k = 0; k < g.nbrs[e].length; k++) {
      const x = g.nbrs[e][k];
      if (x === partner) continue;
      if (s.atoms[x].atomicNumber <= 1) return null;
      const b = g.nbrBonds[e][k];
      if (!rings.bondInRing[b] || !(aromaticBond[b] || s.bonds[b].aromatic)) return null;
      out2.push(x);
    }
    return out2.length === 2 ? [out2[0], out2[1]] : null;
  };
  // An ortho position is substituted when it carries a heavy atom besides its two ring neighbours (a
  // substituent, an exocyclic =O); a fused ring (a third ring bond) counts twice (peri position).
  const substituted = (o: number): number => {
    if (heavyDegree(o) < 3) return 0;
    let ringBonds = 0;
    for (const b of g.nbrBonds[o]) if (rings.bondInRing[b]) ringBonds++;
    return ringBonds >= 3 ? 2 : 1;
  };
  for (let k = 0; k < s.bonds.length; k++) {
    const b = s.bonds[k];
    if (b.order !== 1 || b.aromatic || aromaticBond[k] || rings.bondInRing[k]) continue;
    if (!rings.atomInRing[b.a] || !rings.atomInRing[b.b]) continue;
    const oa = orthoOf(b.a, b.b);
    if (oa === null) continue;
    const ob = orthoOf(b.b, b.a);
    if (ob === null) continue;
    const count = substituted(oa[0]) + substituted(oa[1]) + substituted(ob[0]) + substituted(ob[1]);
    if (count < orthoMin) continue;
    out.push({ ends: [b.a, b.b], tokens: [oa[0], oa[1], ob[0], ob[1]], orthoSubstituents: count });
  }
  return out;
}
