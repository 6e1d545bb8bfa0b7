/**
 * Mancude rings (P-92.1.4.4, IUPAC 2013, from memory): in a ring with the maximum number of non-cumulative double
 * bonds the digraph must not depend on the Kekulé structure drawn, so the duplicate atom each ring atom gets for
 * its ring double bond carries the mean atomic number of the ring neighbours it could be double-bonded to
 * (pyridine C2: (7 + 6) / 2 = 6.5; benzene: 6).
 *
 * Which rings count is decided here from the Kekulé structure alone, so SMILES and molfile input agree: the
 * π atoms are ring atoms with a double bond inside a ring (and none outside) or with a lone pair to give (N, O,
 * S, Se, P without a double bond, a carbanion); a bond is mancude when it lies on a cycle of π atoms, whatever
 * the ring size (benzene, pyrrole, a bridged [14]annulene periphery).
 */
import type { Structure } from '../types.js';

export interface Mancude {
  /** Per bond key (a * n + b, both orders), whether the bond lies in a mancude ring. */
  readonly bond: PairSet;
  /**
   * The same per neighbour slot: edge[off[a] + i] is 1 when the bond from a to nbr[a][i] lies in a mancude ring
   * (what the digraph reads; no key arithmetic, no table of n * n).
   */
  edge: number[];
  off: number[];
  /** Mean atomic number for the duplicate of each mancude atom; 0 elsewhere. */
  dupZ: number[];
  /** Mean Rule 2 mass for the same duplicate (so an isotope label does not depend on the Kekulé form either). */
  dupMass: number[];
}

export function perceiveMancude(s: Structure, nbr: number[][], ord: number[][], mass: number[]): Mancude {
  const n = s.atoms.length;
  const off = new Array<number>(n + 1);
  off[0] = 0;
  for (let a = 0; a < n; a++) off[a + 1] = off[a] + nbr[a].length;
  const slots = off[n];
  const edge = new Array<number>(slots).fill(0);
  const dupZ = new Array<number>(n).fill(0);
  const dupMass = new Array<number>(n).fill(0);
  let anyDouble = false;
  for (let a = 0; a < n && !anyDouble; a++) {
    const o = nbr[a];
    const oa = ord[a];
    for (let i = 0; i < o.length; i++) {
      if (oa[i] === 2 && o[i] > a) {
        anyDouble = true;
        break;
      }
    }
  }
  if (!anyDouble) return result(n, nbr, off, edge, dupZ, dupMass);
  // ring[off[a] + i]: the bond a-nbr[a][i] lies on a cycle
  // scratch tables (module-level, reused: a typed array per call costs more than the work here)
  if (scratchRing.length < slots) {
    scratchRing = new Uint8Array(2 * slots);
    scratchSlot = new Uint8Array(2 * slots);
  }
  if (scratchPi.length < n) scratchPi = new Uint8Array(2 * n);
  const ring = scratchRing;
  ring.fill(0, 0, slots);
  ringBonds(n, nbr, off, ring, null);
  // piDouble[a]: a has a double bond inside a ring
  if (scratchPiDouble.length < n) scratchPiDouble = new Uint8Array(2 * n);
  const piDouble = scratchPiDouble;
  for (let a = 0; a < n; a++) {
    const oa = ord[a];
    const base = off[a];
    let d = 0;
    for (let i = 0; i < oa.length; i++) if (oa[i] === 2 && ring[base + i] === 1) d = 1;
    piDouble[a] = d;
  }
  const pi = scratchPi;
  pi.fill(0, 0, n);
  for (let a = 0; a < n; a++) {
    const base = off[a];
    const oa = ord[a];
    const deg = oa.length;
    let inRing = false;
    for (let i = 0; i < deg; i++) if (ring[base + i] === 1) inRing = true;
    if (!inRing) continue;
    const at = s.atoms[a];
    if (piDouble[a] === 1) {
      let outside = false;
      for (let i = 0; i < deg; i++) if (oa[i] >= 2 && ring[base + i] !== 1) outside = true;
      pi[a] = outside ? 0 : 1;
    } else {
      let multiple = false;
      for (let i = 0; i < deg; i++) if (oa[i] >= 2) multiple = true;
      if (!multiple) {
        const z = at.atomicNumber;
        const lonePair = (z === 7 || z === 8 || z === 15 || z === 16 || z === 34) && at.charge <= 0;
        pi[a] = (lonePair || (z === 6 && at.charge === -1)) && deg + at.hCount <= 3 ? 1 : 0;
      }
    }
  }
  // bonds on a cycle of π atoms: the conjugated (mancude) ring systems, whatever their size; the π subgraph is
  // the slots of nbr whose both atoms are π atoms and whose bond is a ring bond
  const piSlot = scratchSlot;
  piSlot.fill(0, 0, slots);
  for (let a = 0; a < n; a++) {
    if (pi[a] !== 1) continue;
    const o = nbr[a];
    for (let i = 0; i < o.length; i++) if (pi[o[i]] === 1 && ring[off[a] + i] === 1) piSlot[off[a] + i] = 1;
  }
  ringBonds(n, nbr, off, edge, piSlot);
  for (let a = 0; a < n; a++) {
    if (pi[a] !== 1 || piDouble[a] !== 1) continue;
    let sum = 0;
    let msum = 0;
    let cnt = 0;
    const o = nbr[a];
    for (let i = 0; i < o.length; i++) {
      if (piSlot[off[a] + i] !== 1) continue;
      const b = o[i];
      if (edge[off[a] + i] === 1 && piDouble[b] === 1) {
        sum += s.atoms[b].atomicNumber;
        msum += mass[b];
        cnt++;
      }
    }
    if (cnt > 0) {
      dupZ[a] = sum / cnt;
      dupMass[a] = msum / cnt;
    }
  }
  return result(n, nbr, off, edge, dupZ, dupMass);
}

function result(
  n: number,
  nbr: number[][],
  off: number[],
  edge: number[],
  dupZ: number[],
  dupMass: number[],
): Mancude {
  let bond: PairSet | null = null;
  return {
    get bond(): PairSet {
      if (bond === null) {
        bond = new PairSet(n);
        for (let a = 0; a < n; a++)
          for (let i = 0; i < nbr[a].length; i++) if (edge[off[a] + i] === 1) bond.add(key(n, a, nbr[a][i]));
      }
      return bond;
    },
    edge,
    off,
    dupZ,
    dupMass,
  };
}

export function key(n: number, a: number, b: number): number {
  return a * n + b;
}

/** Mark both slots of the bond v-w (every slot of v that holds w, and of w that holds v). */
function markPair(nbr: number[][], off: number[], out: Uint8Array | number[], v: number, w: number): void {
  const nv = nbr[v];
  for (let j = 0; j < nv.length; j++) if (nv[j] === w) out[off[v] + j] = 1;
  const nw = nbr[w];
  for (let j = 0; j < nw.length; j++) if (nw[j] === v) out[off[w] + j] = 1;
}

let scratchRing = new Uint8Array(256);
let scratchSlot = new Uint8Array(256);
let scratchPi = new Uint8Array(128);
let scratchPiDouble = new Uint8Array(128);
let scratchDisc = new Int32Array(128);
let scratchLow = new Int32Array(128);
let stackV = new Int32Array(64);
let stackP = new Int32Array(64);
let stackI = new Int32Array(64);

/**
 * Bonds that lie on a cycle (not bridges), both directions, by an iterative depth-first search, written as 1 into
 * `out` per neighbour slot. With `use`, only the slots marked there are edges (a subgraph, in neighbour order).
 */
function ringBonds(
  n: number,
  nbr: number[][],
  off: number[],
  out: Uint8Array | number[],
  use: Uint8Array | null,
): void {
  if (scratchDisc.length < n) {
    scratchDisc = new Int32Array(2 * n);
    scratchLow = new Int32Array(2 * n);
  }
  const disc = scratchDisc;
  const low = scratchLow;
  disc.fill(-1, 0, n);
  if (stackV.length < n + 1) {
    stackV = new Int32Array(2 * n + 2);
    stackP = new Int32Array(2 * n + 2);
    stackI = new Int32Array(2 * n + 2);
  }
  const sv = stackV;
  const sp = stackP;
  const si = stackI;
  let t = 0;
  for (let r = 0; r < n; r++) {
    if (disc[r] >= 0) continue;
    let empty = true;
    for (let i = 0; i < nbr[r].length; i++) if (use === null || use[off[r] + i] === 1) empty = false;
    if (empty) continue;
    let top = 0;
    sv[0] = r;
    sp[0] = -1;
    si[0] = 0;
    disc[r] = low[r] = t++;
    while (top >= 0) {
      const v = sv[top];
      const parent = sp[top];
      const i = si[top];
      const nv = nbr[v];
      if (i < nv.length) {
        si[top]++;
        if (use !== null && use[off[v] + i] !== 1) continue;
        const w = nv[i];
        if (w === parent) continue;
        if (disc[w] < 0) {
          disc[w] = low[w] = t++;
          top++;
          sv[top] = w;
          sp[top] = v;
          si[top] = 0;
        } else {
          low[v] = Math.min(low[v], disc[w]);
          markPair(nbr, off, out, v, w); // a non-tree edge closes a cycle
        }
      } else {
        top--;
        if (parent >= 0) {
          low[parent] = Math.min(low[parent], low[v]);
          if (low[v] <= disc[parent]) markPair(nbr, off, out, v, parent);
        }
      }
    }
  }
}

/** A set of atom pairs (keys a * n + b): a byte table for ordinary molecules, a hash set for huge ones. */
export class PairSet {
  private readonly table: Uint8Array | null;
  private readonly set: Set<number> | null;
  size = 0;
  constructor(n: number) {
    this.table = n <= 512 ? new Uint8Array(n * n) : null;
    this.set = this.table === null ? new Set<number>() : null;
  }
  has(k: number): boolean {
    return this.table !== null ? this.table[k] === 1 : (this.set as Set<number>).has(k);
  }
  add(k: number): void {
    if (this.has(k)) return;
    this.size++;
    if (this.table !== null) this.table[k] = 1;
    else (this.set as Set<number>).add(k);
  }
  addAll(o: PairSet): void {
    if (o.table !== null) {
      for (let k = 0; k < o.table.length; k++) if (o.table[k] === 1) this.add(k);
    } else for (const k of o.set as Set<number>) this.add(k);
  }
}
