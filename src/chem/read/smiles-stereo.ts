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
  const list = g.nbr[i]!.slice();
  const h = hCount[i]!;
  if (h > 0) {
    const at = g.preceded[i] ? 1 : 0;
    for (let k = 0; k < h; k++) list.splice(at, 0, IMPLICIT_H);
  }
  return list;
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
  const bs = g.nbrBond[i]!;
  if (bs.length !== 2 || hCount[i] !== 0) return false;
  return (
    order[bs[0]!] === 2 && order[bs[1]!] === 2 && !g.bonds[bs[0]!]!.aromatic && !g.bonds[bs[1]!]!.aromatic
  );
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
    const nb = g.nbr[cur]!;
    const next = nb[0] === prev ? nb[1]! : nb[0]!;
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
  const nb = g.nbr[c]!;
  const ends: number[] = [];
  const ligs: number[] = [];
  const lengths: number[] = [];
  for (const first of nb) {
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
  const nb = g.nbr[t]!;
  const bs = g.nbrBond[t]!;
  for (let k = 0; k < nb.length; k++) {
    const x = nb[k]!;
    if (x === c) continue;
    const b = g.bonds[bs[k]!]!;
    if (b.dir === 0 || order[bs[k]!] !== 1) continue;
    // a '/' b: b lies above a.
    res.push({ x, up: (b.a === t) === (b.dir === 1) });
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
  const m = g.bonds.length;
  let anyDir = false;
  for (let k = 0; k < m; k++) if (g.bonds[k]!.dir !== 0) anyDir = true;
  if (!anyDir) return;
  const done = new Uint8Array(m);
  for (let k = 0; k < m; k++) {
    const b = g.bonds[k]!;
    if (order[k] !== 2 || b.aromatic || done[k]) continue;
    done[k] = 1;
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
          const nb = g.nbr[cur]!;
          const bs = g.nbrBond[cur]!;
          const idx = nb[0] === prev ? 1 : 0;
          done[bs[idx]!] = 1;
          prev = cur;
          cur = nb[idx]!;
          if (cur === s) break;
        }
      }
    }
    if (doubles % 2 === 0) continue; // allene-like: configuration is written on the central atom
    if (g.nbr[t0]!.length > 3 || g.nbr[t1]!.length > 3) continue;
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
