/**
 * 2D layouts for depictions in reports: where each atom sits and how each bond is drawn, as plain data (the
 * report draws it). A molfile drawn in 2D keeps its own coordinates and wedges — the drawing the chemist
 * registered, not a redrawing. A SMILES (or a molfile without usable 2D coordinates) gets a layout from
 * OpenChemLib's coordinate generator; the molecule is handed over as a SMILES in which every atom carries its
 * index as an atom-map number, so each OpenChemLib atom is matched to ours exactly.
 */
import { Molecule } from 'openchemlib';
import { normalize } from './normalize.js';
import type { Structure } from './types.js';
import { writeSmiles } from './write/smiles.js';

export type BondStyle = 'plain' | 'wedge' | 'hash' | 'wavy' | 'crossed';

export interface LayoutAtom {
  x: number;
  /** Upwards, as in a molfile. */
  y: number;
  element: string;
  charge: number;
  /** Hydrogens not drawn as atoms. */
  hCount: number;
  isotope: number | null;
  /** 1-based input atom number (the numbering of describe, the findings and the CIP labels). */
  n: number;
}

export interface LayoutBond {
  /** Indexes into `atoms`; for a wedge or hash `a` is the narrow end. */
  a: number;
  b: number;
  order: number;
  style: BondStyle;
}

export interface Layout {
  /** 'drawn': the input's own 2D coordinates and wedges; 'computed': a layout made for the report. */
  origin: 'drawn' | 'computed';
  atoms: LayoutAtom[];
  bonds: LayoutBond[];
}

/** Atoms above this are not laid out (the page would show an unreadable tangle; the card says so). */
export const MAX_LAYOUT_ATOMS = 400;

/** The layout of a structure, or null when it cannot be drawn. */
export function layoutStructure(s: Structure): Layout | null {
  if (s.atoms.length === 0 || s.atoms.length > MAX_LAYOUT_ATOMS) return null;
  return s.dimension === 2 && hasSpread(s) ? drawnLayout(s) : computedLayout(s);
}

/** 2D coordinates that do not put every atom on one point. */
function hasSpread(s: Structure): boolean {
  if (s.atoms.some((a) => a.coords === null)) return false;
  if (s.atoms.length === 1) return true;
  const [x0, y0] = s.atoms[0]!.coords!;
  return s.atoms.some((a) => Math.abs(a.coords![0] - x0) + Math.abs(a.coords![1] - y0) > 1e-3);
}

function drawnLayout(s: Structure): Layout {
  const atoms = s.atoms.map((a) => ({
    x: a.coords![0],
    y: a.coords![1],
    element: a.element,
    charge: a.charge,
    hCount: a.hCount,
    isotope: a.isotope,
    n: a.inputNumber,
  }));
  const bonds = s.bonds.map((b) => {
    const style: BondStyle =
      b.wedge === 'up'
        ? 'wedge'
        : b.wedge === 'down'
          ? 'hash'
          : b.wedge === 'either'
            ? b.order === 2
              ? 'crossed'
              : 'wavy'
            : 'plain';
    return { a: b.a, b: b.b, order: b.order, style };
  });
  return { origin: 'drawn', atoms, bonds };
}

function computedLayout(s: Structure): Layout | null {
  try {
    const norm = normalize(s);
    const copy: Structure = {
      ...norm.structure,
      atoms: norm.structure.atoms.map((a, i) => ({ ...a, mapNumber: i + 1 })),
    };
    const mol = Molecule.fromSmiles(writeSmiles(copy));
    const atoms: LayoutAtom[] = [];
    for (let i = 0; i < mol.getAllAtoms(); i++) {
      const m = mol.getAtomMapNo(i);
      const input = m > 0 ? norm.toInput[m - 1] : undefined;
      const ours = input !== undefined ? s.atoms[input] : undefined;
      atoms.push({
        x: mol.getAtomX(i),
        y: -mol.getAtomY(i), // OpenChemLib's y runs downwards
        element: ours?.element ?? mol.getAtomLabel(i),
        charge: mol.getAtomCharge(i),
        hCount: mol.getImplicitHydrogens(i),
        isotope: ours?.isotope ?? null,
        n: ours?.inputNumber ?? 0,
      });
    }
    const bonds: LayoutBond[] = [];
    for (let b = 0; b < mol.getAllBonds(); b++) {
      const type = mol.getBondType(b);
      const style: BondStyle =
        type === Molecule.cBondTypeUp
          ? 'wedge'
          : type === Molecule.cBondTypeDown
            ? 'hash'
            : type === Molecule.cBondTypeCross
              ? 'crossed'
              : 'plain';
      bonds.push({ a: mol.getBondAtom(0, b), b: mol.getBondAtom(1, b), order: mol.getBondOrder(b), style });
    }
    return { origin: 'computed', atoms, bonds };
  } catch {
    return null;
  }
}
