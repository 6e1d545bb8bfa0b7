/**
 * Geometry shared by the 2D (wedge) and 3D (coordinate) stereo readers: signed volumes, the fourth ligand of a
 * three-coordinate centre, cumulated double-bond chains, biaryl-axis candidates.
 */
import { IMPLICIT_H, LONE_PAIR, type Structure } from '../types.js';
import type { Adjacency } from './molfile-graph.js';

export type Vec = [number, number, number];

export function sub(a: Vec, b: Vec): Vec {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

export function det3(a: Vec, b: Vec, c: Vec): number {
  return (
    a[0] * (b[1] * c[2] - b[2] * c[1]) -
    a[1] * (b[0] * c[2] - b[2] * c[0]) +
    a[2] * (b[0] * c[1] - b[1] * c[0])
  );
}

export function unit(v: Vec): Vec | null {
  const l = Math.hypot(v[0], v[1], v[2]);
  return l < 1e-9 ? null : [v[0] / l, v[1] / l, v[2] / l];
}

/**
 * Signed volume of four ligand points, scaled (x6). Negative means: looking from p[0] towards the others,
 * p[1], p[2], p[3] run anticlockwise, i.e. SMILES '@' (checked in the tests against RDKit).
 */
export function signedVolume(p: readonly Vec[]): number {
  const p0 = p[0]!;
  return det3(sub(p[1]!, p0), sub(p[2]!, p0), sub(p[3]!, p0));
}

export function windingOf(vol: number): '@' | '@@' {
  return vol < 0 ? '@' : '@@';
}

/** Elements that keep a lone pair as a stereo ligand with three neighbours and no hydrogen. */
const LONE_PAIR_ELEMENTS = new Set([7, 15, 16, 33, 34]);

/**
 * The fourth ligand of a three-neighbour atom: IMPLICIT_H when it carries one hydrogen, LONE_PAIR for N, P, S,
 * As, Se without hydrogens, else null (no tetrahedral centre).
 */
export function fourthLigand(s: Structure, atom: number): number | null {
  const a = s.atoms[atom]!;
  if (a.hCount === 1) return IMPLICIT_H;
  if (a.hCount === 0 && LONE_PAIR_ELEMENTS.has(a.atomicNumber)) return LONE_PAIR;
  return null;
}

/**
 * A chain of cumulated double bonds ends[0]=x=...=x=ends[1]; one double bond is a chain with no inner atoms.
 * `toward[i]` is the chain neighbour of ends[i]. `doubleBonds` = number of double bonds.
 */
export interface Cumulene {
  ends: [number, number];
  toward: [number, number];
  inner: number[];
  bonds: number[];
}

function isDoubleNonAromatic(s: Structure, k: number): boolean {
  const b = s.bonds[k]!;
  return b.order === 2 && !b.aromatic;
}

/** Inner cumulene atom: exactly two neighbours, both through non-aromatic double bonds. */
function isInner(s: Structure, adj: Adjacency, i: number): boolean {
  const bs = adj.bnd[i]!;
  return bs.length === 2 && isDoubleNonAromatic(s, bs[0]!) && isDoubleNonAromatic(s, bs[1]!);
}

export function cumulenes(s: Structure, adj: Adjacency): Cumulene[] {
  const out: Cumulene[] = [];
  const done = new Uint8Array(s.bonds.length);
  for (let k = 0; k < s.bonds.length; k++) {
    if (done[k] || !isDoubleNonAromatic(s, k)) continue;
    const b = s.bonds[k]!;
    // walk both ways from bond k through inner atoms
    const walk = (
      from: number,
      via: number,
    ): { end: number; toward: number; atoms: number[]; bonds: number[] } | null => {
      const atoms: number[] = [];
      const bonds: number[] = [];
      let prev = via;
      let cur = from;
      let guard = 0;
      while (isInner(s, adj, cur)) {
        if (++guard > s.atoms.length) return null; // ring of cumulated bonds
        atoms.push(cur);
        const idx = adj.nbr[cur]![0] === prev ? 1 : 0;
        const next = adj.nbr[cur]![idx]!;
        bonds.push(adj.bnd[cur]![idx]!);
        prev = cur;
        cur = next;
      }
      return { end: cur, toward: prev, atoms, bonds };
    };
    const left = walk(b.a, b.b);
    const right = walk(b.b, b.a);
    done[k] = 1;
    if (left === null || right === null) continue;
    for (const x of left.bonds) done[x] = 1;
    for (const x of right.bonds) done[x] = 1;
    if (left.end === right.end) continue;
    out.push({
      ends: [left.end, right.end],
      toward: [left.toward, right.toward],
      inner: [...left.atoms.reverse(), ...right.atoms],
      bonds: [...left.bonds.reverse(), k, ...right.bonds],
    });
  }
  return out;
}

/** Neighbours of `atom` other than `except`. */
export function others(adj: Adjacency, atom: number, except: number): number[] {
  const out: number[] = [];
  for (const n of adj.nbr[atom]!) if (n !== except) out.push(n);
  return out;
}

/** Orders a double-bond end's substituents: non-hydrogen atoms first, then by index. */
export function preferHeavy(s: Structure, subs: number[]): number[] {
  return [...subs].sort((x, y) => {
    const hx = s.atoms[x]!.atomicNumber === 1 ? 1 : 0;
    const hy = s.atoms[y]!.atomicNumber === 1 ? 1 : 0;
    return hx - hy || x - y;
  });
}

/**
 * Biaryl-axis candidates: a single, non-aromatic bond whose two ends each have exactly three neighbours, both
 * other bonds of each end lie in rings, and each end has a double or aromatic ring bond (sp2 ring atom).
 * Returns [bond index, ortho atoms of end a (2), ortho atoms of end b (2)].
 */
export function biarylCandidates(
  s: Structure,
  adj: Adjacency,
  ring: readonly boolean[],
): [number, number[], number[]][] {
  const out: [number, number[], number[]][] = [];
  const sp2RingEnd = (e: number, partner: number): number[] | null => {
    if (adj.nbr[e]!.length !== 3) return null;
    const orth: number[] = [];
    let unsat = false;
    for (let j = 0; j < 3; j++) {
      const n = adj.nbr[e]![j]!;
      if (n === partner) continue;
      const bk = adj.bnd[e]![j]!;
      if (!ring[bk]) return null;
      const bd = s.bonds[bk]!;
      if (bd.aromatic || bd.order === 2) unsat = true;
      orth.push(n);
    }
    return unsat && orth.length === 2 ? orth : null;
  };
  for (let k = 0; k < s.bonds.length; k++) {
    const b = s.bonds[k]!;
    if (b.order !== 1 || b.aromatic) continue;
    const oa = sp2RingEnd(b.a, b.b);
    if (oa === null) continue;
    const ob = sp2RingEnd(b.b, b.a);
    if (ob === null) continue;
    // A ring bond is kept (bridged biaryls) unless it lies in a ring of at most six sp2 atoms: then it is a
    // bond of a Kekulé aromatic ring, not an axis.
    if (ring[k] && inSmallSp2Ring(s, adj, k)) continue;
    out.push([k, oa, ob]);
  }
  return out;
}

/** Is bond k on a cycle of at most six atoms that all have a double or aromatic bond? (BFS, depth-limited) */
function inSmallSp2Ring(s: Structure, adj: Adjacency, k: number): boolean {
  const sp2 = (i: number): boolean =>
    adj.bnd[i]!.some((x) => s.bonds[x]!.order === 2 || s.bonds[x]!.aromatic);
  const { a, b } = s.bonds[k]!;
  let frontier = [a];
  const seen = new Set([a]);
  for (let depth = 1; depth <= 5; depth++) {
    const next: number[] = [];
    for (const v of frontier) {
      for (let j = 0; j < adj.nbr[v]!.length; j++) {
        const w = adj.nbr[v]![j]!;
        if (adj.bnd[v]![j] === k || seen.has(w) || !sp2(w)) continue;
        if (w === b) return true;
        seen.add(w);
        next.push(w);
      }
    }
    frontier = next;
  }
  return false;
}

export { IMPLICIT_H, LONE_PAIR };
