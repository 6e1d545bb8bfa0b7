/**
 * Second look at candidates the branch rule (perceive.ts) dropped: a unit with constitutionally equivalent
 * ligands is still stereogenic when no symmetry that fixes it exchanges them by an odd permutation. Spiro and
 * propellane-type centres whose ring branches are equivalent only up to an even permutation (the "rule 6"
 * examples of Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755) are of this kind. Decided exactly by the
 * automorphisms that fix the unit's atoms: one per distinct restriction to the unit and its neighbours.
 */
import { automorphisms } from '../graph/index.js';
import type { Graph } from '../graph/index.js';
import type { Structure } from '../types.js';
import { mapToken, rebase, type PerceivedUnit } from './units.js';

/**
 * Two equivalent terminal ligands (the methyls of an isopropyl group, the O of a sulfone) are always exchanged by
 * a symmetry that moves nothing else: such a unit is never stereogenic, no search needed.
 */
export function swapsTerminalPair(u: PerceivedUnit, g: Graph, classes: Int32Array, n: number): boolean {
  for (let i = 0; i < 4; i++) {
    const a = u.tokens[i];
    if (a >= n || g.nbrs[a].length !== 1) continue;
    for (let j = i + 1; j < 4; j++) {
      const b = u.tokens[j];
      if (b < n && g.nbrs[b].length === 1 && classes[a] === classes[b] && sameSide(u, i, j)) return true;
    }
  }
  return false;
}

/**
 * Two equivalent ligands that each root a pendant tree (no ring, not leading back to the unit) are exchanged by
 * the symmetry that swaps the two trees and moves nothing else, so the unit is not stereogenic by constitution:
 * the branch points of a dendrimer, where the automorphism search per unit would cost O(atoms^2) in all.
 * (Colour refinement tells rooted trees apart, so equal classes mean isomorphic trees.) Trees larger than
 * `cap` atoms are left to the search.
 */
export function swapsPendantTrees(
  u: PerceivedUnit,
  g: Graph,
  classes: Int32Array,
  n: number,
  cap = 20000,
): boolean {
  const tree: boolean[] = [];
  for (let i = 0; i < 4; i++) {
    const a = u.tokens[i];
    tree.push(a < n && pendantTree(g, a, u.atoms, cap));
  }
  for (let i = 0; i < 4; i++) {
    if (!tree[i]) continue;
    for (let j = i + 1; j < 4; j++)
      if (tree[j] && classes[u.tokens[i]] === classes[u.tokens[j]] && sameSide(u, i, j)) return true;
  }
  return false;
}

/** Is the part reached from `a` without passing through `stop` a tree (and does it not reach `stop`)? */
function pendantTree(g: Graph, a: number, stop: number[], cap: number): boolean {
  const seen = new Set<number>([a]);
  const queue = [a];
  let edges = 0;
  for (let q = 0; q < queue.length; q++) {
    const x = queue[q];
    for (const y of g.nbrs[x]) {
      if (stop.includes(y)) {
        if (x !== a) return false; // back at the unit through another path: a ring
        continue;
      }
      edges++;
      if (!seen.has(y)) {
        if (seen.size >= cap) return false;
        seen.add(y);
        queue.push(y);
      }
    }
  }
  // each tree edge was seen from both ends
  return edges === 2 * (seen.size - 1);
}

function sameSide(u: PerceivedUnit, i: number, j: number): boolean {
  return u.kind === 'tetrahedral' || i < 2 === j < 2;
}

/** true when no automorphism fixing the unit's atoms inverts its configuration (so it can be stereogenic). */
export function survivesSymmetry(s: Structure, u: PerceivedUnit, classes: Int32Array): boolean {
  const n = s.atoms.length;
  const colour = Int32Array.from(classes);
  let top = 0;
  for (const c of classes) if (c > top) top = c;
  for (const a of u.atoms) colour[a] = ++top;
  let inverted = false;
  const res = automorphisms(s, {
    key: [...u.atoms],
    colour,
    maxResults: 2000,
    onMapping: (map: Int32Array) => {
      if (
        rebase(
          u,
          u.tokens.map((t) => mapToken(t, n, map)),
          0,
        ) === 1
      )
        inverted = true;
      return !inverted;
    },
  });
  return !inverted && res.complete;
}
