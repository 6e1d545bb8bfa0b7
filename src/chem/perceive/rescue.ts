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
