/**
 * Fold ordinary explicit hydrogen atoms into their neighbour's hCount so that every algorithm sees one form.
 *
 * An "ordinary" H atom: element H, no isotope, no charge, no radical, no map number, exactly one bond, single,
 * to a non-hydrogen atom. Isotopic (2H, 3H), charged, mapped, bridging (two bonds) or H–H hydrogens stay atoms.
 * Stereo ligands that named a folded H become IMPLICIT_H; `Atom.inputNumber` is kept, so facts still speak in
 * the input's numbering. A stereo element that named two hydrogens of one atom describes no stereo unit; it
 * stays as written and perception reports it.
 */
import {
  IMPLICIT_H,
  type Atom,
  type Bond,
  type StereoElement,
  type StereoGroup,
  type Structure,
} from './types.js';
import { atomWithHCount, newBond, newGroup, objectList, restructure } from './read/make.js';

export interface Normalized {
  structure: Structure;
  /** internal index in `structure` -> index in the input structure */
  toInput: number[];
  /** index in the input structure -> internal index, or -1 for a folded hydrogen */
  fromInput: number[];
  /** Number of hydrogen atoms folded. */
  folded: number;
}

/** Is atom h an ordinary hydrogen that bond b (to x) lets fold into x? */
function foldable(s: Structure, degree: Int32Array, order: number, h: number, x: number): boolean {
  const a = s.atoms[h];
  if (a.atomicNumber !== 1 || a.isotope !== null || a.charge !== 0 || a.radical !== 0) return false;
  return a.mapNumber === null && degree[h] === 1 && order === 1 && s.atoms[x].atomicNumber !== 1;
}

/** A stereo element with its atoms renumbered: `at` for the atoms it is on, `lig` for its ligands / refs. */
function remapStereo(e: StereoElement, at: (x: number) => number, lig: (x: number) => number): StereoElement {
  if (e.kind === 'tetrahedral') {
    const l = e.ligands;
    return {
      kind: e.kind,
      centre: at(e.centre),
      ligands: [lig(l[0]), lig(l[1]), lig(l[2]), lig(l[3])],
      winding: e.winding,
    };
  }
  if (e.kind === 'double-bond') {
    return {
      kind: e.kind,
      ends: [at(e.ends[0]), at(e.ends[1])],
      refs: [lig(e.refs[0]), lig(e.refs[1])],
      relation: e.relation,
    };
  }
  const l = e.ligands;
  return {
    kind: e.kind,
    subtype: e.subtype,
    ends: [at(e.ends[0]), at(e.ends[1])],
    ligands: [lig(l[0]), lig(l[1]), lig(l[2]), lig(l[3])],
    winding: e.winding,
  };
}

// Structures, atoms and bonds are built by the factories of read/make.ts (never by object spreads), so that
// every Structure has one hidden class whichever reader or step made it.
export function normalize(s: Structure): Normalized {
  const n = s.atoms.length;
  const m = s.bonds.length;
  const degree = new Int32Array(n);
  for (let k = 0; k < m; k++) {
    const b = s.bonds[k];
    degree[b.a]++;
    degree[b.b]++;
  }
  const foldInto = new Int32Array(n).fill(-1);
  const foldedOn = new Int32Array(n);
  for (let k = 0; k < m; k++) {
    const b = s.bonds[k];
    if (foldable(s, degree, b.order, b.a, b.b)) foldInto[b.a] = b.b;
    if (foldable(s, degree, b.order, b.b, b.a)) foldInto[b.b] = b.a;
  }
  for (let h = 0; h < n; h++) if (foldInto[h] >= 0) foldedOn[foldInto[h]]++;
  let folded = 0;
  const fromInput: number[] = [];
  const toInput: number[] = [];
  for (let i = 0; i < n; i++) {
    if (foldInto[i] >= 0) {
      fromInput.push(-1);
      folded++;
    } else {
      fromInput.push(toInput.length);
      toInput.push(i);
    }
  }
  if (folded === 0) return { structure: s, toInput, fromInput, folded };

  const atoms = objectList<Atom>();
  for (const i of toInput) atoms.push(atomWithHCount(s.atoms[i], s.atoms[i].hCount + foldedOn[i]));
  const bonds = objectList<Bond>();
  for (let k = 0; k < m; k++) {
    const b = s.bonds[k];
    if (foldInto[b.a] < 0 && foldInto[b.b] < 0)
      bonds.push(newBond(fromInput[b.a], fromInput[b.b], b.order, b.aromatic, b.wedge));
  }
  const at = (x: number): number => fromInput[x];
  const lig = (x: number): number => (x < 0 ? x : foldInto[x] >= 0 ? IMPLICIT_H : fromInput[x]);
  const stereo = objectList<StereoElement>();
  for (const e of s.stereo) stereo.push(remapStereo(e, at, lig));
  const groups = objectList<StereoGroup>();
  for (const g of s.groups) {
    const ga: number[] = [];
    for (const x of g.atoms) if (foldInto[x] < 0) ga.push(fromInput[x]);
    groups.push(newGroup(g.type, g.id, ga));
  }
  return { structure: restructure(s, atoms, bonds, stereo, groups), toInput, fromInput, folded };
}

/** The sub-structure on `atoms` (ascending indices of one or more whole components), stereo and groups kept. */
export function extractAtoms(s: Structure, atoms: number[]): Structure {
  const index = new Int32Array(s.atoms.length).fill(-1);
  atoms.forEach((a, k) => (index[a] = k));
  const keep = (x: number): boolean => x < 0 || index[x] >= 0;
  const at = (x: number): number => index[x];
  const lig = (x: number): number => (x < 0 ? x : index[x]);
  const stereo = objectList<StereoElement>();
  for (const e of s.stereo) {
    if (e.kind === 'tetrahedral') {
      if (index[e.centre] < 0 || !e.ligands.every(keep)) continue;
    } else if (e.kind === 'double-bond') {
      if (!e.ends.every(keep) || !e.refs.every(keep)) continue;
    } else if (!e.ends.every(keep) || !e.ligands.every(keep)) continue;
    stereo.push(remapStereo(e, at, lig));
  }
  const subAtoms = objectList<Atom>();
  for (const a of atoms) subAtoms.push(s.atoms[a]);
  const bonds = objectList<Bond>();
  for (const b of s.bonds)
    if (index[b.a] >= 0 && index[b.b] >= 0)
      bonds.push(newBond(index[b.a], index[b.b], b.order, b.aromatic, b.wedge));
  const groups = objectList<StereoGroup>();
  for (const g of s.groups) {
    const ga: number[] = [];
    for (const x of g.atoms) if (index[x] >= 0) ga.push(index[x]);
    if (ga.length > 0) groups.push(newGroup(g.type, g.id, ga));
  }
  return restructure(s, subAtoms, bonds, stereo, groups);
}
