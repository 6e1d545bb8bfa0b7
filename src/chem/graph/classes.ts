/**
 * Constitutional equivalence classes by iterative refinement of atom invariants (Morgan, J. Chem. Doc. 5
 * (1965) 107, in the exact partition-refinement form): atoms in one class cannot be told apart by any
 * combination of element, charge, isotope, hydrogens, degree, radical, ring/aromatic flags and the
 * same data of their neighbours, bond by bond. Topologically equivalent atoms always share a class; in rare
 * regular graphs refinement alone may leave inequivalent atoms together (the search in isomorphism.ts is exact).
 */
import type { Structure } from '../types.js';
import { conjugatedRingBonds } from './aromaticity.js';
import { buildGraph } from './adjacency.js';
import { csrOf } from './csr.js';
import { cellIndex, partitionOf, rankKeys, Refiner } from './refine.js';
import { bridges } from './rings.js';

/** Element, charge, isotope, hydrogens, degree, radical, aromatic and ring flags, packed into one number. */
export function atomInvariants(s: Structure, aromatic?: boolean[]): number[] {
  return invariantsWith(s, aromatic);
}

/** As atomInvariants; `inRing` (per atom) may be passed when the caller has ring information. */
export function invariantsWith(s: Structure, aromatic?: readonly boolean[], inRing?: ArrayLike<boolean>): number[] {
  const n = s.atoms.length;
  const g = buildGraph(s);
  const arom = aromatic ?? conjugatedRingBonds(s, g);
  let ring = inRing;
  if (!ring) {
    const bridge = bridges(g, s.bonds.length);
    const r = new Array<boolean>(n).fill(false);
    for (let i = 0; i < n; i++) for (const k of g.nbrBonds[i]) if (!bridge[k]) r[i] = true;
    ring = r;
  }
  const aromaticAtom = new Array<boolean>(n).fill(false);
  for (let i = 0; i < n; i++) for (const k of g.nbrBonds[i]) if (arom[k]) aromaticAtom[i] = true;
  return s.atoms.map((a, i) => {
    let v = clamp(a.atomicNumber, 0, 127);
    v = v * 32 + clamp(a.charge + 16, 0, 31);
    v = v * 512 + clamp(a.isotope ?? 0, 0, 511);
    v = v * 32 + clamp(a.hCount, 0, 31);
    v = v * 32 + clamp(g.nbrs[i].length, 0, 31);
    v = v * 4 + clamp(a.radical, 0, 3);
    v = v * 2 + (aromaticAtom[i] ? 1 : 0);
    v = v * 2 + (ring![i] ? 1 : 0);
    return v;
  });
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

export interface ClassOptions {
  /** Extra colour per atom (e.g. stereo descriptors); atoms of different colour never share a class. */
  extra?: ArrayLike<number>;
  /** Aromatic flag per bond; when absent, conjugatedRingBonds() (Kekulé-independent) is used. */
  aromatic?: boolean[];
}

/** Class id per atom: dense ranks of the refined invariant (0 = lowest), independent of atom order. */
export function equivalenceClasses(s: Structure, opts: ClassOptions = {}): Int32Array {
  const n = s.atoms.length;
  if (n === 0) return new Int32Array(0);
  const aromatic = opts.aromatic ?? conjugatedRingBonds(s);
  const inv = invariantsWith(s, aromatic);
  const p = partitionOf(rankKeys(opts.extra ? [inv, opts.extra] : [inv], n));
  new Refiner(csrOf([{ s, aromatic }])).refine(p);
  return cellIndex(p);
}
