/**
 * SMILES stereo marks -> stereo elements. OpenSMILES specification, stereochemistry (tetrahedral `@`/`@@`,
 * extended tetrahedral allenes, `/` `\` double-bond configuration). Ligand order is the written order at the
 * atom: the preceding atom, then implicit/bracket H, then ring closures in the order their digits appear, then
 * branches and the following atom. A three-connected centre gets a LONE_PAIR second in its list (see below).
 */
import {
  IMPLICIT_H,
  LONE_PAIR,
  type AxialStereo,
  type DoubleBondStereo,
  type ReadError,
  type StereoElement,
  type TetrahedralStereo,
} from '../types.js';
import type { SmilesGraph } from './smiles-parse.js';

/** Neighbours of `i` in written order with its hydrogens inserted where OpenSMILES puts them. */
function ligandsOf(g: SmilesGraph, hCount: ArrayLike<number>, i: number): number[] {
  const list: number[] = [];
  const h = hCount[i]!;
  const from = g.nbrStart[i]!;
  const stop = g.nbrStart[i + 1]!;
  // the hydrogens go after the preceding atom, else first
  const at = from + (g.preceded[i] === 1 && stop > from ? 1 : 0);
  for (let e = from; e < stop; e++) {
    if (e === at) for (let k = 0; k < h; k++) list.push(IMPLICIT_H);
    list.push(g.nbrAtom[e]!);
  }
  if (at === stop) for (let k = 0; k < h; k++) list.push(IMPLICIT_H);
  return list;
}

function degree(g: SmilesGraph, i: number): number {
  return g.nbrStart[i + 1]! - g.nbrStart[i]!;
}

function warn(code: string, message: string, offset: number): ReadError {
  return { code, message, at: { offset } };
}

/** An inner cumulene atom: exactly two neighbours, both by non-aromatic double bonds, no hydrogens. */
function isCumuleneInner(
  g: SmilesGraph,
  order: ArrayLike<number>,
  hCount: ArrayLike<number>,
  i: number,
): boolean {
  if (degree(g, i) !== 2 || hCount[i] !== 0) return false;
  const b0 = g.nbrBond[g.nbrStart[i]!]!;
  const b1 = g.nbrBond[g.nbrStart[i]! + 1]!;
  return order[b0] === 2 && order[b1] === 2 && g.bondAromatic[b0] !== 1 && g.bondAromatic[b1] !== 1;
}

/** Walks from `from` through `to` along cumulated double bonds; returns [terminal, its chain neighbour, bonds]. */
function walkCumulene(
  g: SmilesGraph,
  order: ArrayLike<number>,
  hCount: ArrayLike<number>,
  from: number,
  to: number,
): [number, number, number] {
  let prev = from;
  let cur = to;
  let doubles = 1;
  let guard = g.atoms.length;
  while (isCumuleneInner(g, order, hCount, cur) && guard-- > 0) {
    const e = g.nbrStart[cur]!;
    const next = g.nbrAtom[e] === prev ? g.nbrAtom[e + 1]! : g.nbrAtom[e]!;
    if (next === from) break; // cumulated ring, no terminal
    prev = cur;
    cur = next;
    doubles++;
  }
  return [cur, prev, doubles];
}

export function buildStereo(
  g: SmilesGraph,
  order: ArrayLike<number>,
  hCount: ArrayLike<number>,
  warnings: ReadError[],
): StereoElement[] {
  const out: StereoElement[] = [];
  const n = g.atoms.length;
  for (let i = 0; i < n; i++) {
    const a = g.atoms[i]!;
    if (a.chirality === null) continue;
    if (a.chirality === 'other') {
      warnings.push(
        warn(
          'smiles-stereo-unsupported',
          'square-planar, trigonal-bipyramidal and octahedral marks are ignored',
          a.offset,
        ),
      );
      continue;
    }
    if (isCumuleneInner(g, order, hCount, i)) {
      const ax = allene(g, order, hCount, i, a.chirality);
      if (ax) out.push(ax);
      else
        warnings.push(
          warn('smiles-stereo-ignored', 'allene mark ignored: each end needs two substituents', a.offset),
        );
      continue;
    }
    const lig = ligandsOf(g, hCount, i);
    // Three ligands: the lone pair goes second, i.e. where an implicit H would stand after a preceding atom.
    // For a leading atom (`[S@](C)(=O)c1ccccc1`) that is not the H-first slot: RDKit reads such a centre from
    // its three written neighbours alone (checked: it equals `C[S@](=O)c1ccccc1`), and OpenSMILES is silent.
    if (lig.length === 3) lig.splice(1, 0, LONE_PAIR);
    if (lig.length !== 4) {
      warnings.push(
        warn(
          'smiles-stereo-ignored',
          `chirality mark ignored: the atom has ${lig.length} neighbours, a tetrahedral centre needs 3 or 4`,
          a.offset,
        ),
      );
      continue;
    }
    const t: TetrahedralStereo = {
      kind: 'tetrahedral',
      centre: i,
      ligands: lig as [number, number, number, number],
      winding: a.chirality,
    };
    out.push(t);
  }
  doubleBonds(g, order, hCount, warnings, out);
  return out;
}

function allene(
  g: SmilesGraph,
  order: ArrayLike<number>,
  hCount: ArrayLike<number>,
  c: number,
  winding: '@' | '@@',
): AxialStereo | null {
  const ends: number[] = [];
  const ligs: number[] = [];
  const lengths: number[] = [];
  for (let e = g.nbrStart[c]!, stop = g.nbrStart[c + 1]!; e < stop; e++) {
    const first = g.nbrAtom[e]!;
    const [t, p, doubles] = walkCumulene(g, order, hCount, c, first);
    if (isCumuleneInner(g, order, hCount, t)) return null;
    lengths.push(doubles);
    const subs = ligandsOf(g, hCount, t).filter((x) => x !== p);
    if (subs.length !== 2) return null;
    ends.push(t);
    ligs.push(...subs);
  }
  // the mark belongs on the central atom of an even cumulene: as many double bonds on each side
  if (ends[0] === ends[1] || lengths[0] !== lengths[1]) return null;
  return {
    kind: 'axial',
    subtype: 'allene',
    ends: [ends[0]!, ends[1]!],
    ligands: ligs as [number, number, number, number],
    winding,
  };
}

/** For terminal `t` (chain neighbour `c`): marked neighbours and whether each lies "up" from t. */
function marksAt(
  g: SmilesGraph,
  order: ArrayLike<number>,
  t: number,
  c: number,
): { x: number; up: boolean }[] {
  const res: { x: number; up: boolean }[] = [];
  for (let e = g.nbrStart[t]!, stop = g.nbrStart[t + 1]!; e < stop; e++) {
    const x = g.nbrAtom[e]!;
    if (x === c) continue;
    const bi = g.nbrBond[e]!;
    const dir = g.bondDir[bi]!;
    if (dir === 0 || order[bi] !== 1) continue;
    // a '/' b: b lies above a.
    res.push({ x, up: (g.bondA[bi] === t) === (dir === 1) });
  }
  return res;
}

function doubleBonds(
  g: SmilesGraph,
  order: ArrayLike<number>,
  hCount: ArrayLike<number>,
  warnings: ReadError[],
  out: StereoElement[],
): void {
  const m = g.bondCount;
  let anyDir = false;
  for (let k = 0; k < m; k++) if (g.bondDir[k] !== 0) anyDir = true;
  if (!anyDir) return;
  const done = new Uint8Array(m);
  for (let k = 0; k < m; k++) {
    if (order[k] !== 2 || g.bondAromatic[k] === 1 || done[k]) continue;
    done[k] = 1;
    const b = { a: g.bondA[k]!, b: g.bondB[k]!, offset: g.bondOffset[k]! };
    const [t0, c0, d0] = walkCumulene(g, order, hCount, b.b, b.a);
    const [t1, c1, d1] = walkCumulene(g, order, hCount, b.a, b.b);
    const doubles = d0 + d1 - 1;
    if (doubles > 1) {
      // mark the whole chain as seen
      for (const [s, e] of [
        [b.b, b.a],
        [b.a, b.b],
      ] as const) {
        let prev = s;
        let cur = e;
        while (isCumuleneInner(g, order, hCount, cur)) {
          const e = g.nbrStart[cur]! + (g.nbrAtom[g.nbrStart[cur]!] === prev ? 1 : 0);
          done[g.nbrBond[e]!] = 1;
          prev = cur;
          cur = g.nbrAtom[e]!;
          if (cur === s) break;
        }
      }
    }
    if (doubles % 2 === 0) continue; // allene-like: configuration is written on the central atom
    if (degree(g, t0) > 3 || degree(g, t1) > 3) continue;
    const m0 = marksAt(g, order, t0, c0);
    const m1 = marksAt(g, order, t1, c1);
    if (m0.length === 0 || m1.length === 0) continue;
    if ((m0.length === 2 && m0[0]!.up === m0[1]!.up) || (m1.length === 2 && m1[0]!.up === m1[1]!.up)) {
      warnings.push(
        warn(
          'smiles-conflicting-bond-direction',
          "two '/' '\\' marks put both substituents on the same side; double-bond configuration ignored",
          b.offset,
        ),
      );
      continue;
    }
    const e: DoubleBondStereo = {
      kind: 'double-bond',
      ends: [t0, t1],
      refs: [m0[0]!.x, m1[0]!.x],
      relation: m0[0]!.up === m1[0]!.up ? 'cis' : 'trans',
    };
    out.push(e);
  }
}
