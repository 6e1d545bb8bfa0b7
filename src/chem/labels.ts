/**
 * CIP descriptors for the defined stereo units, behind one function so the labeler can be swapped in one line.
 * Our own labeler (cip/index.ts) is in use: it scores higher on the CIP validation suite (296 of 300 records of
 * compounds_2d.sdf against OpenChemLib's 178, both measured by the CIP tests) and is about 20 times faster here.
 *
 * The OpenChemLib labeler is kept for comparison. The structure is written as SMILES with every atom carrying its internal index
 * + 1 as atom-map number, so the OCL atom -> our atom mapping is read back from the map numbers and never depends
 * on the order in which the writer or OCL puts atoms. OCL keeps an allene's descriptor on the central atom; it
 * is moved here to the two terminal atoms (the atoms the CIP validation suite labels). A biaryl axis is a bond
 * parity on the axis bond (P/M).
 */
import { Molecule } from 'openchemlib';
import type { CipLabel } from './facts.js';
import type { Structure } from './types.js';
import { writeSmiles } from './write/smiles.js';
import { assignCip, type CipResult } from './cip/index.js';

export type { CipResult };

/**
 * CIP labels of the stereo elements the structure defines (the one switch point between labelers): one result
 * per labelled element, `atoms` = 0-based indices of the centre or of the two end atoms, label null when the
 * unit is not stereogenic by the CIP rules.
 */
export function labelUnits(s: Structure): CipResult[] {
  return assignCip(s); // interim alternative: labelWithOpenChemLib(s)
}

const M = Molecule;

export function labelWithOpenChemLib(s: Structure): CipResult[] {
  if (s.stereo.length === 0 || s.atoms.length === 0) return [];
  const mapped: Structure = { ...s, atoms: s.atoms.map((a, i) => ({ ...a, mapNumber: i + 1 })), groups: [] };
  let mol: Molecule;
  try {
    mol = M.fromSmiles(writeSmiles(mapped), { noCoordinates: true });
    mol.ensureHelperArrays(M.cHelperCIP);
  } catch {
    return [];
  }
  const toOurs = (a: number): number => {
    const k = mol.getAtomMapNo(a) - 1;
    return k >= 0 && k < s.atoms.length ? k : -1;
  };
  const out: CipResult[] = [];
  const elementAt = (atoms: number[]): number =>
    s.stereo.findIndex((e) =>
      e.kind === 'tetrahedral'
        ? atoms.length === 1 && e.centre === atoms[0]
        : atoms.length === 2 && e.ends.includes(atoms[0]) && e.ends.includes(atoms[1]),
    );
  for (let a = 0; a < mol.getAtoms(); a++) {
    const p = mol.getAtomCIPParity(a);
    if (p !== M.cAtomCIPParityRorM && p !== M.cAtomCIPParitySorP) continue;
    const pseudo = mol.isAtomParityPseudo(a);
    const ours = toOurs(a);
    if (ours < 0) continue;
    if (mol.getAtomPi(a) === 2 && mol.getConnAtoms(a) === 2) {
      const ends = alleneEnds(mol, a).map(toOurs);
      if (ends.some((e) => e < 0)) continue;
      const label: CipLabel = p === M.cAtomCIPParityRorM ? (pseudo ? 'm' : 'M') : pseudo ? 'p' : 'P';
      out.push({ element: elementAt(ends), label, atoms: ends });
      continue;
    }
    const label: CipLabel = p === M.cAtomCIPParityRorM ? (pseudo ? 'r' : 'R') : pseudo ? 's' : 'S';
    out.push({ element: elementAt([ours]), label, atoms: [ours] });
  }
  for (let b = 0; b < mol.getBonds(); b++) {
    const p = mol.getBondCIPParity(b);
    if (p !== M.cBondCIPParityEorP && p !== M.cBondCIPParityZorM) continue;
    const ends = [toOurs(mol.getBondAtom(0, b)), toOurs(mol.getBondAtom(1, b))];
    if (ends.some((e) => e < 0)) continue;
    const axis = mol.getBondOrder(b) === 1;
    const label: CipLabel = axis
      ? p === M.cBondCIPParityEorP
        ? 'P'
        : 'M'
      : p === M.cBondCIPParityEorP
        ? 'E'
        : 'Z';
    out.push({ element: elementAt(ends), label, atoms: ends });
  }
  return out;
}

/** Terminal atoms of the cumulated chain through central atom `a` (OCL atom indices). */
function alleneEnds(mol: Molecule, a: number): number[] {
  const ends: number[] = [];
  for (let k = 0; k < 2; k++) {
    let prev = a;
    let cur = mol.getConnAtom(a, k);
    while (mol.getAtomPi(cur) === 2 && mol.getConnAtoms(cur) === 2) {
      const next = mol.getConnAtom(cur, 0) === prev ? mol.getConnAtom(cur, 1) : mol.getConnAtom(cur, 0);
      prev = cur;
      cur = next;
    }
    ends.push(cur);
  }
  return ends;
}
