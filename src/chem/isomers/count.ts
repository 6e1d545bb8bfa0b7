/**
 * The stereoisomers of a constitution, counted with Burnside's lemma (the Cauchy–Frobenius lemma) over the group
 * H that the constitutional automorphisms induce on the units' configurations (symmetry/):
 *
 *   total   = (1/|H|) Σ_{h∈H} |Fix(h)|
 *   achiral = (1/|H|) Σ_{h∈H} |Fix(h·M)|      (orbits mapped onto themselves by the reflection M)
 *
 * |Fix| of a signed permutation is 2^cycles when every cycle has an even number of flips, else 0, so the count
 * costs O(|H| · units), never 2^units. Units that are stereogenic only in some configurations (C3 of
 * 2,3,4-trihydroxyglutaric acid) need no special case: the automorphism exchanging the two ends fixes C3 and
 * flips it, which merges the two "C3 configurations" of the (2R,4R) form into one orbit.
 * Meso (IUPAC Gold Book, "meso-compound"): an achiral member of a set of diastereomers that has chiral members.
 */
import type { Count, StereoisomerCount } from '../facts.js';
import type { State } from '../perceive/index.js';
import {
  act,
  canonicalState,
  feasible,
  fixedCount,
  mirrorState,
  sameState,
  type UnitGroup,
} from '../symmetry/index.js';

// 2^53: every integer up to it is exact as a JavaScript (and JSON) number
const SAFE = 2n ** 53n;

/** A bigint as a Count: a number when it is exact as one, else its decimal digits. */
export function exactCount(b: bigint): Count {
  return b <= SAFE ? Number(b) : b.toString();
}

/** A Count read back exactly. */
export function countValue(c: Count): bigint {
  return BigInt(c);
}

const toNumber = exactCount;

export function countStereoisomers(g: UnitGroup, units: number): StereoisomerCount {
  const order = BigInt(g.perms.length);
  let fix = 0n;
  let fixM = 0n;
  for (let k = 0; k < g.perms.length; k++) {
    fix += fixedCount(g, k, false);
    fixM += fixedCount(g, k, true);
  }
  const total = fix / order;
  const achiral = fixM / order;
  const chiral = total - achiral;
  return {
    total: toNumber(total),
    chiral: toNumber(chiral),
    achiral: toNumber(achiral),
    pairs: toNumber(chiral / 2n),
    meso: chiral > 0n ? toNumber(achiral) : 0,
    units,
  };
}

export interface IsomerState {
  state: State;
  chiral: boolean;
}

/**
 * Orbit representatives (the lexicographically smallest state of each orbit), in increasing order, up to `limit`.
 * Enantiomers are listed separately (each is its own orbit under H).
 */
export function enumerateStereoisomers(g: UnitGroup, m: number, limit: number): IsomerState[] {
  const out: IsomerState[] = [];
  if (m > 52) return out;
  const x = new Uint8Array(m);
  const end = 2 ** m;
  for (let v = 0; v < end && out.length < limit; v++) {
    // big-endian bit order so that increasing v is lexicographic on the state
    let r = v;
    for (let i = m - 1; i >= 0; i--) {
      x[i] = r % 2;
      r = Math.floor(r / 2);
    }
    if (!feasible(g, x) || !sameState(canonicalState(g, x), x)) continue;
    const mx = mirrorState(g, x);
    let chiral = true;
    for (let k = 0; k < g.perms.length && chiral; k++) if (sameState(act(g, k, x), mx)) chiral = false;
    out.push({ state: Uint8Array.from(x), chiral });
  }
  return out;
}
