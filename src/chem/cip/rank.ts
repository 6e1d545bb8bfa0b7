/**
 * Ranking the ligands of one stereogenic unit by the sequence rules, and turning a ranking plus the input's
 * configuration into a descriptor (P-92.1.1: R/S by the sense of 1→2→3 seen with 4 pointing away; P-93.5.7.1,
 * from memory: an axis seen as an elongated tetrahedron, near ligands before far ones, aR ≡ M, aS ≡ P).
 */
import type { CipNode } from './digraph.js';
import type { Ranker } from './compare.js';
import { RULE_5 } from './rules.js';

export interface Ranking {
  /** Ligand indices, highest first. */
  order: number[];
  /** Some neighbours in `order` tie under every rule applied. */
  tied: boolean;
  /** The mirror image ranks the ligands by an odd permutation of this order: pseudoasymmetric (lower-case). */
  pseudo: boolean;
  /** tieWithPrev[i]: order[i] ties with order[i-1]. */
  tieWithPrev: boolean[];
}

/** Indices 0..k-1 ordered highest first by the pairwise results m[a * k + b] (> 0: a above b); stable. */
function orderBy(m: number[], k: number): number[] {
  const order = new Array<number>(k);
  for (let i = 0; i < k; i++) order[i] = i;
  for (let i = 1; i < k; i++) {
    const v = order[i];
    let j = i - 1;
    while (j >= 0 && m[order[j] * k + v] < 0) {
      order[j + 1] = order[j];
      j--;
    }
    order[j + 1] = v;
  }
  return order;
}

/**
 * Rank the branches `ligands` of `centre` (each explored away from `centre`) under rules up to `level`.
 * Pseudoasymmetry: reflection inverts every chiral descriptor, so the ligands are ranked again as in the mirror
 * image (only comparisons that Rule 5 or later decided can change); when the mirror-image ranking is an odd
 * permutation of this one the descriptor does not change on reflection: the unit is pseudoasymmetric (r/s).
 */
export function rankLigands(rk: Ranker, centre: CipNode, ligands: CipNode[], level: number): Ranking {
  const k = ligands.length;
  // pairwise results, m[i * k + j] (a flat table: k is at most 4)
  const m = new Array<number>(k * k).fill(0);
  let late = false;
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const c = rk.compareUpTo(level, ligands[i], centre, ligands[j], centre);
      m[i * k + j] = c;
      m[j * k + i] = -c;
      if (Math.abs(c) - 1 >= RULE_5) late = true;
    }
  }
  const order = orderBy(m, k);
  const tieWithPrev = new Array<boolean>(k);
  let tied = false;
  for (let i = 0; i < k; i++) {
    const t = i > 0 && m[order[i - 1] * k + order[i]] === 0;
    tieWithPrev[i] = t;
    if (t) tied = true;
  }
  let pseudo = false;
  if (!tied && late) {
    // rank again as in the mirror image (chiral descriptors inverted)
    const mm = new Array<number>(k * k).fill(0);
    const saved = rk.mirror;
    rk.mirror = true;
    try {
      for (let i = 0; i < k; i++) {
        for (let j = i + 1; j < k; j++) {
          const c0 = m[i * k + j];
          const c =
            Math.abs(c0) - 1 < RULE_5 ? c0 : rk.compareUpTo(level, ligands[i], centre, ligands[j], centre);
          mm[i * k + j] = c;
          mm[j * k + i] = -c;
        }
      }
    } finally {
      rk.mirror = saved;
    }
    const mirror = orderBy(mm, k);
    const pos = new Array<number>(k);
    for (let p = 0; p < k; p++) pos[order[p]] = p;
    const perm = new Array<number>(k);
    for (let p = 0; p < k; p++) perm[p] = pos[mirror[p]];
    pseudo = !isEvenPermutation(perm);
  }
  return { order, tied, pseudo, tieWithPrev };
}

function isEvenPermutation(p: number[]): boolean {
  const seen = p.map(() => false);
  let swaps = 0;
  for (let i = 0; i < p.length; i++) {
    if (seen[i]) continue;
    let j = i;
    let len = 0;
    while (!seen[j]) {
      seen[j] = true;
      j = p[j];
      len++;
    }
    swaps += len - 1;
  }
  return swaps % 2 === 0;
}

/**
 * R or S for ligands listed in SMILES order with `winding` (looking from ligand 0, ligands 1-3 anticlockwise
 * for '@'), given their rank positions (0 = highest). R: looking from the lowest ligand, 1→2→3 run
 * anticlockwise, i.e. the list [4, 1, 2, 3] has winding '@'.
 */
export function handedness(winding: '@' | '@@', rankOf: number[]): 'R' | 'S' {
  const byRank = [0, 0, 0, 0];
  rankOf.forEach((r, i) => (byRank[r] = i));
  const target = [byRank[3], byRank[0], byRank[1], byRank[2]];
  const same = isEvenPermutation(target);
  const w = same ? winding : winding === '@' ? '@@' : '@';
  return w === '@' ? 'R' : 'S';
}
