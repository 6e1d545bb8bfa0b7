/**
 * Constitutional equivalence classes by iterative refinement of atom invariants (Morgan, J. Chem. Doc. 5
 * (1965) 107, in the exact partition-refinement form): atoms in one class cannot be told apart by any
 * combination of element, charge, isotope, hydrogens, degree, radical, aromatic flag, smallest ring and the
 * same data of their neighbours, bond by bond. Topologically equivalent atoms always share a class; in rare
 * regular graphs refinement alone may leave inequivalent atoms together (the search in isomorphism.ts is exact).
 */
import type { Structure } from '../types.js';
import { prepare, refinedPartition } from './prepared.js';
import { cellIndex, partitionOf, rankKeys, refineOnce } from './refine.js';

export { atomInvariants } from './invariants.js';

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
  const prep = prepare(s, opts.aromatic);
  if (!opts.extra) return cellIndex(refinedPartition(prep));
  const p = partitionOf(rankKeys([prep.inv, opts.extra], n));
  refineOnce(prep.csr, p);
  return cellIndex(p);
}
