/**
 * Chirality marks for a chosen SMILES traversal: `@`/`@@` from the permutation parity between the stored ligand
 * list and the emitted neighbour order (OpenSMILES, tetrahedral centres), and allene `@` on the central atom
 * (OpenSMILES, extended tetrahedral). The `/` `\` marks are smiles-directions.ts.
 */
import { IMPLICIT_H, LONE_PAIR, type AxialStereo, type Structure, type TetrahedralStereo } from '../types.js';

/** What the writer's traversal decided; all indexed by atom unless said otherwise. */
export interface Emission {
  roots: number[];
  parent: Int32Array;
  parentBond: Int32Array;
  children: number[][];
  /** Ring-closure bonds (bond indices) opened / closed at each atom, in digit order. */
  ringOpen: number[][];
  ringClose: number[][];
  ringBondsAt: number[][];
  /** Neighbours in emitted order: parent, ring-closure partners in digit order, children. */
  nbrOrder: number[][];
  outIndex: Int32Array;
}

/** Even (0) or odd (1) permutation taking `from` to `to`; null if they are not the same multiset. */
export function permutationParity(from: readonly number[], to: readonly number[]): number | null {
  if (from.length !== to.length) return null;
  const used = new Uint8Array(to.length);
  const perm: number[] = [];
  for (const x of from) {
    let j = -1;
    for (let k = 0; k < to.length; k++) {
      if (!used[k] && to[k] === x) {
        j = k;
        break;
      }
    }
    if (j < 0) return null;
    used[j] = 1;
    perm.push(j);
  }
  let parity = 0;
  const seen = new Uint8Array(perm.length);
  for (let i = 0; i < perm.length; i++) {
    if (seen[i]) continue;
    let len = 0;
    for (let j = i; !seen[j]; j = perm[j]!) {
      seen[j] = 1;
      len++;
    }
    parity ^= (len - 1) & 1;
  }
  return parity;
}

/** Emitted ligand order at atom `u`: hydrogens / lone pair go right after the parent (or first). */
function emittedLigands(s: Structure, em: Emission, u: number, extra: number[]): number[] {
  const list = em.nbrOrder[u]!.slice();
  list.splice(em.parent[u]! >= 0 ? 1 : 0, 0, ...extra);
  return list;
}

function flip(w: '@' | '@@', parity: number): '@' | '@@' {
  return parity === 0 ? w : w === '@' ? '@@' : '@';
}

export function chiralMarks(s: Structure, em: Emission): Map<number, string> {
  const marks = new Map<number, string>();
  for (const st of s.stereo) {
    if (st.kind === 'tetrahedral') tetrahedral(s, em, st, marks);
    else if (st.kind === 'axial' && st.subtype === 'allene') allene(s, em, st, marks);
  }
  return marks;
}

function tetrahedral(s: Structure, em: Emission, t: TetrahedralStereo, marks: Map<number, string>): void {
  const c = t.centre;
  if (c < 0 || c >= s.atoms.length) return;
  const hs = t.ligands.filter((x) => x === IMPLICIT_H).length;
  if (hs !== Math.min(s.atoms[c]!.hCount, 4) && hs > 0) return;
  if (hs === 0 && s.atoms[c]!.hCount > 0) return;
  const extra: number[] = [];
  for (let k = 0; k < hs; k++) extra.push(IMPLICIT_H);
  const emitted = emittedLigands(s, em, c, extra);
  // the reader's convention: a lone pair stands second (smiles-stereo.ts in read/)
  if (t.ligands.includes(LONE_PAIR)) emitted.splice(1, 0, LONE_PAIR);
  const p = permutationParity(t.ligands, emitted);
  if (p === null) return;
  marks.set(c, flip(t.winding, p));
}

/** Atoms from `a` to `b` along double bonds (the cumulated chain), shortest first; null if none. */
function cumulenePath(s: Structure, a: number, b: number): number[] | null {
  const prev = new Map<number, number>([[a, -1]]);
  const queue = [a];
  for (let h = 0; h < queue.length; h++) {
    const u = queue[h]!;
    if (u === b) break;
    for (const bd of s.bonds) {
      if (bd.order !== 2) continue;
      const o = bd.a === u ? bd.b : bd.b === u ? bd.a : -1;
      if (o >= 0 && !prev.has(o)) {
        prev.set(o, u);
        queue.push(o);
      }
    }
  }
  if (!prev.has(b)) return null;
  const path: number[] = [];
  for (let x = b; x !== -1; x = prev.get(x)!) path.push(x);
  return path.reverse();
}

function allene(s: Structure, em: Emission, ax: AxialStereo, marks: Map<number, string>): void {
  const [e0, e1] = ax.ends;
  if (e0 < 0 || e1 < 0 || e0 >= s.atoms.length || e1 >= s.atoms.length) return;
  const path = cumulenePath(s, e0, e1);
  if (!path || path.length % 2 === 0) return; // need an odd number of atoms: a central atom
  const mid = (path.length - 1) / 2;
  const centre = path[mid]!;
  const cn = em.nbrOrder[centre]!;
  if (cn.length !== 2 || s.atoms[centre]!.hCount !== 0) return;
  const firstEnd = cn[0] === path[mid - 1] ? 0 : 1; // which path end the first emitted neighbour leads to
  const ends = firstEnd === 0 ? [path[0]!, path[path.length - 1]!] : [path[path.length - 1]!, path[0]!];
  const chainNb = (t: number): number => (t === path[0] ? path[1]! : path[path.length - 2]!);
  const key = (x: number, endIdx: number): number => (x >= 0 ? x : x - 10 * endIdx);
  const stored = ax.ligands.map((x, i) => key(x, i < 2 ? 0 : 1));
  const emitted: number[] = [];
  for (const t of ends) {
    const endIdx = t === e0 ? 0 : 1;
    const hs: number[] = [];
    for (let k = 0; k < s.atoms[t]!.hCount; k++) hs.push(IMPLICIT_H);
    for (const x of emittedLigands(s, em, t, hs)) if (x !== chainNb(t)) emitted.push(key(x, endIdx));
  }
  const p = permutationParity(stored, emitted);
  if (p === null) return;
  marks.set(centre, flip(ax.winding, p));
}
