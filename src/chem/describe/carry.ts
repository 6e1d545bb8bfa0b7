/**
 * One structure's configuration carried onto another of the same constitution: an isomorphism σ: A -> B maps
 * A's units onto B's (perceive `rebase`), giving the state σ(x_A) in B's units. relate() and the copies test
 * both start here.
 */
import { isomorphic } from '../graph/index.js';
import { mapToken, rebase, unitImage, type State } from '../perceive/index.js';
import { elementMapping } from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { analyse, type Analysis } from './analyse.js';

export interface Carried {
  /** A's configuration in B's units. */
  y: State;
  /** 1 where the carried configuration is defined in A. */
  yDefined: Uint8Array;
  /** For each unit of B, the unit of A mapped onto it (-1: none). */
  fromA: Int32Array;
  /** Undefined stereo on either side leaves the relation open. */
  open: boolean;
}

/** A's configuration carried onto B through the isomorphism `iso` (A atom -> B atom). */
export function carryOnto(pa: Analysis, pb: Analysis, iso: ArrayLike<number>): Carried {
  const nA = pa.p.structure.atoms.length;
  const nB = pb.p.structure.atoms.length;
  const mB = pb.p.units.length;
  const y = new Uint8Array(mB);
  const yDefined = new Uint8Array(mB);
  const fromA = new Int32Array(mB).fill(-1);
  let open = false;
  pa.p.units.forEach((u, i) => {
    const j = unitImage(pb.p, u, iso);
    const bit =
      j < 0
        ? -1
        : rebase(
            pb.p.units[j],
            u.tokens.map((t) => mapToken(t, nA, iso, nB)),
            u.bit,
          );
    if (bit < 0) {
      if (pa.reported[i]) open = true;
      return;
    }
    y[j] = bit;
    yDefined[j] = u.defined ? 1 : 0;
    fromA[j] = i;
  });
  for (let j = 0; j < mB; j++) {
    const relevant = pb.reported[j] || (fromA[j] >= 0 && pa.reported[fromA[j]]);
    if (relevant && (!yDefined[j] || !pb.defined[j]) && !planarAbsentOnASide(pb, j, y, yDefined)) open = true;
  }
  return { y, yDefined, fromA, open };
}

/**
 * A planar unit whose host double bond is drawn ring-cis on either side does not exist there: its open twist on
 * the other side cannot make the two the same, so it leaves nothing open (the hosts decide).
 */
function planarAbsentOnASide(pb: Analysis, j: number, y: State, yDefined: Uint8Array): boolean {
  const h = pb.p.planar.any ? pb.p.planar.host[j] : -1;
  if (h < 0) return false;
  const z = pb.p.planar.zBit[j];
  return (pb.defined[h] === 1 && pb.state[h] === z) || (yDefined[h] === 1 && y[h] === z);
}

/** Are two single-component structures the same, fully defined stereoisomer? */
export function sameStereoisomer(a: Structure, b: Structure): boolean {
  const pa = analyse(a);
  const pb = analyse(b);
  const iso = isomorphic(pa.p.structure, pb.p.structure);
  if (!iso) return false;
  const c = carryOnto(pa, pb, iso);
  return !c.open && elementMapping(pb.group, c.y, pb.state) >= 0;
}
