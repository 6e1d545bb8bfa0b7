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
  bond: PairSet;
  /** Mean atomic number for the duplicate of each mancude atom; 0 elsewhere. */
  dupZ: number[];
  /** Mean Rule 2 mass for the same duplicate (so an isotope label does not depend on the Kekulé form either). */
  dupMass: number[];
}

export function perceiveMancude(s: Structure, nbr: number[][], ord: number[][], mass: number[]): Mancude {
  const n = s.atoms.length;
  const bond = new PairSet(n);
  const dupZ = new Array<number>(n).fill(0);
  const dupMass = new Array<number>(n).fill(0);
  if (!nbr.some((o, a) => ord[a].some((x, i) => x === 2 && o[i] > a))) return { bond, dupZ, dupMass };
  const ring = ringBonds(n, nbr);
  const piDouble = (a: number): boolean => nbr[a].some((b, i) => ord[a][i] === 2 && ring.has(key(n, a, b)));
  const pi = new Array<boolean>(n).fill(false);
  for (let a = 0; a < n; a++) {
    const at = s.atoms[a];
    const inRing = nbr[a].some((b) => ring.has(key(n, a, b)));
    if (!inRing) continue;
    if (piDouble(a)) pi[a] = !nbr[a].some((b, i) => ord[a][i] >= 2 && !ring.has(key(n, a, b)));
    else if (!ord[a].some((o) => o >= 2)) {
      const lonePair = [7, 8, 15, 16, 34].includes(at.atomicNumber) && at.charge <= 0;
      pi[a] = (lonePair || (at.atomicNumber === 6 && at.charge === -1)) && nbr[a].length + at.hCount <= 3;
    }
  }
  // bonds on a cycle of π atoms: the conjugated (mancude) ring systems, whatever their size
  const piNbr = nbr.map((o, a) => (pi[a] ? o.filter((b) => pi[b] && ring.has(key(n, a, b))) : []));
  const piRing = ringBonds(n, piNbr);
  bond.addAll(piRing);
  for (let a = 0; a < n; a++) {
    if (!pi[a] || !piDouble(a)) continue;
    let sum = 0;
    let msum = 0;
    let cnt = 0;
    for (const b of piNbr[a]) {
      if (piRing.has(key(n, a, b)) && piDouble(b)) {
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
  return { bond, dupZ, dupMass };
}

export function key(n: number, a: number, b: number): number {
  return a * n + b;
}

/** Bonds that lie on a cycle (not bridges), both directions, by an iterative depth-first search. */
function ringBonds(n: number, nbr: number[][]): PairSet {
  const out = new PairSet(n);
  const disc = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  let t = 0;
  for (let r = 0; r < n; r++) {
    if (disc[r] >= 0 || nbr[r].length === 0) continue;
    const stack: [number, number, number][] = [[r, -1, 0]];
    disc[r] = low[r] = t++;
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      const [v, parent, i] = top;
      if (i < nbr[v].length) {
        top[2]++;
        const w = nbr[v][i];
        if (w === parent) continue;
        if (disc[w] < 0) {
          disc[w] = low[w] = t++;
          stack.push([w, v, 0]);
        } else {
          low[v] = Math.min(low[v], disc[w]);
          out.add(key(n, v, w)); // a non-tree edge closes a cycle
          out.add(key(n, w, v));
        }
      } else {
        stack.pop();
        if (parent >= 0) {
          low[parent] = Math.min(low[parent], low[v]);
          if (low[v] <= disc[parent]) {
            out.add(key(n, v, parent));
            out.add(key(n, parent, v));
          }
        }
      }
    }
  }
  return out;
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
