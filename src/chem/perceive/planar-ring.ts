/**
 * trans double bonds in medium rings (8–11 atoms) are planar chiral: (E)-cyclooctene was resolved into its
 * enantiomers by Cope et al. (J. Am. Chem. Soc. 1963 — from memory). The engine does not model planar
 * chirality, so such a drawing gets its chirality left open rather than a wrong "achiral".
 */
import type { Perception } from './perceive.js';

export interface PlanarRingBond {
  atoms: [number, number];
  ringSize: number;
}

/** Defined double bonds drawn trans within a ring of 8–11 atoms (internal atom indices). */
export function transMediumRingBonds(p: Perception): PlanarRingBond[] {
  const s = p.structure;
  const out: PlanarRingBond[] = [];
  for (const e of s.stereo) {
    if (e.kind !== 'double-bond') continue;
    const [a, b] = e.ends;
    const bond = s.bonds.findIndex((x) => (x.a === a && x.b === b) || (x.a === b && x.b === a));
    const size = bond >= 0 ? p.rings.smallestRingOfBond[bond] : 0;
    if (size < 8 || size > 11) continue;
    const ring = p.rings.rings.find((r) => r.length === size && ringAdjacent(r, a, b));
    if (!ring) continue;
    const ringNbr = (x: number, other: number): number => {
      const k = ring.indexOf(x);
      const prev = ring[(k + ring.length - 1) % ring.length];
      const next = ring[(k + 1) % ring.length];
      return prev === other ? next : prev;
    };
    // The relation is stated between refs; each ref that is not the ring neighbour swaps cis and trans.
    let trans = e.relation === 'trans';
    if (e.refs[0] !== ringNbr(a, b)) trans = !trans;
    if (e.refs[1] !== ringNbr(b, a)) trans = !trans;
    if (trans) out.push({ atoms: [a, b], ringSize: size });
  }
  return out;
}

function ringAdjacent(r: number[], a: number, b: number): boolean {
  const k = r.indexOf(a);
  if (k < 0) return false;
  return r[(k + 1) % r.length] === b || r[(k + r.length - 1) % r.length] === b;
}
