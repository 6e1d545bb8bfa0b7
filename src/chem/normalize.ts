/**
 * Fold ordinary explicit hydrogen atoms into their neighbour's hCount so that every algorithm sees one form.
 *
 * An "ordinary" H atom: element H, no isotope, no charge, no radical, no map number, exactly one bond, single,
 * to a non-hydrogen atom. Isotopic (2H, 3H), charged, mapped, bridging (two bonds) or H–H hydrogens stay atoms.
 * Stereo ligands that named a folded H become IMPLICIT_H; `Atom.inputNumber` is kept, so facts still speak in
 * the input's numbering. A stereo element that named two hydrogens of one atom describes no stereo unit; it
 * stays as written and perception reports it.
 */
import { IMPLICIT_H, type StereoElement, type Structure } from './types.js';

export interface Normalized {
  structure: Structure;
  /** internal index in `structure` -> index in the input structure */
  toInput: number[];
  /** index in the input structure -> internal index, or -1 for a folded hydrogen */
  fromInput: number[];
  /** Number of hydrogen atoms folded. */
  folded: number;
}

export function normalize(s: Structure): Normalized {
  const n = s.atoms.length;
  const degree = new Int32Array(n);
  for (const b of s.bonds) {
    degree[b.a]++;
    degree[b.b]++;
  }
  const foldInto = new Int32Array(n).fill(-1);
  const foldedOn = new Int32Array(n);
  for (const b of s.bonds) {
    for (const [h, x] of [
      [b.a, b.b],
      [b.b, b.a],
    ]) {
      const a = s.atoms[h];
      if (a.atomicNumber !== 1 || a.isotope !== null || a.charge !== 0 || a.radical !== 0) continue;
      if (a.mapNumber !== null || degree[h] !== 1 || b.order !== 1 || s.atoms[x].atomicNumber === 1) continue;
      foldInto[h] = x;
    }
  }
  for (let h = 0; h < n; h++) if (foldInto[h] >= 0) foldedOn[foldInto[h]]++;
  let folded = 0;
  const fromInput = new Array<number>(n);
  const toInput: number[] = [];
  for (let i = 0; i < n; i++) {
    if (foldInto[i] >= 0) {
      fromInput[i] = -1;
      folded++;
    } else {
      fromInput[i] = toInput.length;
      toInput.push(i);
    }
  }
  if (folded === 0) return { structure: s, toInput, fromInput, folded };

  const atoms = toInput.map((i) => ({ ...s.atoms[i], hCount: s.atoms[i].hCount + foldedOn[i] }));
  const bonds = s.bonds
    .filter((b) => foldInto[b.a] < 0 && foldInto[b.b] < 0)
    .map((b) => ({ ...b, a: fromInput[b.a], b: fromInput[b.b] }));
  const lig = (x: number): number => (x < 0 ? x : foldInto[x] >= 0 ? IMPLICIT_H : fromInput[x]);
  const stereo: StereoElement[] = s.stereo.map((e): StereoElement => {
    if (e.kind === 'tetrahedral') {
      const [a, b, c, d] = e.ligands.map(lig);
      return { ...e, centre: fromInput[e.centre], ligands: [a, b, c, d] };
    }
    if (e.kind === 'double-bond') {
      return {
        ...e,
        ends: [fromInput[e.ends[0]], fromInput[e.ends[1]]],
        refs: [lig(e.refs[0]), lig(e.refs[1])],
      };
    }
    const [a, b, c, d] = e.ligands.map(lig);
    return { ...e, ends: [fromInput[e.ends[0]], fromInput[e.ends[1]]], ligands: [a, b, c, d] };
  });
  const groups = s.groups.map((g) => ({
    ...g,
    atoms: g.atoms.filter((x) => foldInto[x] < 0).map((x) => fromInput[x]),
  }));
  return { structure: { ...s, atoms, bonds, stereo, groups }, toInput, fromInput, folded };
}

/** The sub-structure on `atoms` (ascending indices of one or more whole components), stereo and groups kept. */
export function extractAtoms(s: Structure, atoms: number[]): Structure {
  const index = new Int32Array(s.atoms.length).fill(-1);
  atoms.forEach((a, k) => (index[a] = k));
  const keep = (x: number): boolean => x < 0 || index[x] >= 0;
  const lig = (x: number): number => (x < 0 ? x : index[x]);
  const stereo: StereoElement[] = [];
  for (const e of s.stereo) {
    if (e.kind === 'tetrahedral') {
      if (index[e.centre] < 0 || !e.ligands.every(keep)) continue;
      const [a, b, c, d] = e.ligands.map(lig);
      stereo.push({ ...e, centre: index[e.centre], ligands: [a, b, c, d] });
    } else if (e.kind === 'double-bond') {
      if (!e.ends.every(keep) || !e.refs.every(keep)) continue;
      stereo.push({
        ...e,
        ends: [index[e.ends[0]], index[e.ends[1]]],
        refs: [lig(e.refs[0]), lig(e.refs[1])],
      });
    } else {
      if (!e.ends.every(keep) || !e.ligands.every(keep)) continue;
      const [a, b, c, d] = e.ligands.map(lig);
      stereo.push({ ...e, ends: [index[e.ends[0]], index[e.ends[1]]], ligands: [a, b, c, d] });
    }
  }
  return {
    ...s,
    atoms: atoms.map((a) => s.atoms[a]),
    bonds: s.bonds
      .filter((b) => index[b.a] >= 0 && index[b.b] >= 0)
      .map((b) => ({ ...b, a: index[b.a], b: index[b.b] })),
    stereo,
    groups: s.groups
      .map((g) => ({ ...g, atoms: g.atoms.filter((x) => index[x] >= 0).map((x) => index[x]) }))
      .filter((g) => g.atoms.length > 0),
  };
}
