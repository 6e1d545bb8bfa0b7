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
  /** Rule 5 ordered an odd number of pairs: the unit is pseudoasymmetric (its descriptor is lower-case). */
  pseudo: boolean;
  /** tieWithPrev[i]: order[i] ties with order[i-1]. */
  tieWithPrev: boolean[];
}

/** Rank the branches `ligands` of `centre` (each explored away from `centre`) under rules up to `level`. */
export function rankLigands(rk: Ranker, centre: CipNode, ligands: CipNode[], level: number): Ranking {
  const order = ligands.map((_, i) => i);
  const cmp = (a: number, b: number): number => rk.compareUpTo(level, ligands[a], centre, ligands[b], centre);
  for (let i = 1; i < order.length; i++) {
    const v = order[i];
    let j = i - 1;
    while (j >= 0 && cmp(order[j], v) < 0) {
      order[j + 1] = order[j];
      j--;
    }
    order[j + 1] = v;
  }
  let tied = false;
  let rule5Pairs = 0;
  const tieWithPrev = order.map(() => false);
  for (let i = 1; i < order.length; i++) {
    const c = cmp(order[i - 1], order[i]);
    if (c === 0) {
      tied = true;
      tieWithPrev[i] = true;
    } else if (Math.abs(c) - 1 === RULE_5) rule5Pairs++;
  }
  // Reflection swaps every pair that Rule 5 orders: an odd number of swaps keeps the descriptor (pseudoasymmetry)
  return { order, tied, pseudo: rule5Pairs % 2 === 1, tieWithPrev };
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
