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

function insertionSort(order: number[], cmp: (a: number, b: number) => number): number[] {
  for (let i = 1; i < order.length; i++) {
    const v = order[i];
    let j = i - 1;
    while (j >= 0 && cmp(order[j], v) < 0) {
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
  const m: number[][] = ligands.map(() => new Array<number>(k).fill(0));
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const c = rk.compareUpTo(level, ligands[i], centre, ligands[j], centre);
      m[i][j] = c;
      m[j][i] = -c;
    }
  }
  const order = insertionSort(
    ligands.map((_, i) => i),
    (a, b) => m[a][b],
  );
  const tieWithPrev = order.map((v, i) => i > 0 && m[order[i - 1]][v] === 0);
  const tied = tieWithPrev.some((t) => t);
  let pseudo = false;
  if (!tied && m.some((row) => row.some((c) => Math.abs(c) - 1 >= RULE_5))) {
    // rank again as in the mirror image (chiral descriptors inverted)
    const mm: number[][] = ligands.map(() => new Array<number>(k).fill(0));
    const saved = rk.mirror;
    rk.mirror = true;
    try {
      for (let i = 0; i < k; i++) {
        for (let j = i + 1; j < k; j++) {
          const c =
            Math.abs(m[i][j]) - 1 < RULE_5
              ? m[i][j]
              : rk.compareUpTo(level, ligands[i], centre, ligands[j], centre);
          mm[i][j] = c;
          mm[j][i] = -c;
        }
      }
    } finally {
      rk.mirror = saved;
    }
    const mirror = insertionSort(
      ligands.map((_, i) => i),
      (a, b) => mm[a][b],
    );
    const pos = new Array<number>(k);
    order.forEach((li, p) => (pos[li] = p));
    pseudo = !isEvenPermutation(mirror.map((li) => pos[li]));
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
