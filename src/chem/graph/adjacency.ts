/**
 * Adjacency lists of a Structure: for each atom its neighbours and, in parallel, the index of the bond that
 * joins them. Hydrogens counted in `hCount` are not atoms and do not appear here; explicit H atoms do.
 */
import type { Structure } from '../types.js';

export interface Graph {
  n: number;
  nbrs: Int32Array[];
  /** Bond index parallel to `nbrs`. */
  nbrBonds: Int32Array[];
}

/** Builds the neighbour lists. Bonds with an out-of-range end or joining an atom to itself are ignored. */
export function buildGraph(s: Structure): Graph {
  const n = s.atoms.length;
  const deg = new Int32Array(n);
  const ok = (i: number, j: number) => i >= 0 && j >= 0 && i < n && j < n && i !== j;
  for (const b of s.bonds) {
    if (!ok(b.a, b.b)) continue;
    deg[b.a]++;
    deg[b.b]++;
  }
  // One buffer for all lists; each atom's list is a view into it.
  let total = 0;
  for (let i = 0; i < n; i++) total += deg[i];
  const flatNbrs = new Int32Array(total);
  const flatBonds = new Int32Array(total);
  const nbrs: Int32Array[] = new Array(n);
  const nbrBonds: Int32Array[] = new Array(n);
  let at = 0;
  for (let i = 0; i < n; i++) {
    nbrs[i] = flatNbrs.subarray(at, at + deg[i]);
    nbrBonds[i] = flatBonds.subarray(at, at + deg[i]);
    at += deg[i];
  }
  const fill = new Int32Array(n);
  s.bonds.forEach((b, k) => {
    if (!ok(b.a, b.b)) return;
    nbrs[b.a][fill[b.a]] = b.b;
    nbrBonds[b.a][fill[b.a]++] = k;
    nbrs[b.b][fill[b.b]] = b.a;
    nbrBonds[b.b][fill[b.b]++] = k;
  });
  return { n, nbrs, nbrBonds };
}
