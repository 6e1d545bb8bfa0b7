/**
 * Depictions for reports: a 2D drawing (SVG) of a structure with OUR computed CIP labels written at the atoms.
 * Layout and drawing come from OpenChemLib's depictor; the molecule is handed over as a SMILES in which every
 * atom carries its index as an atom-map number, so each OpenChemLib atom is matched to ours exactly, whatever
 * order the SMILES writer visits atoms in. The map numbers are cleared before drawing.
 */
import { Molecule } from 'openchemlib';
import { normalize } from './normalize.js';
import type { Structure } from './types.js';
import { writeSmiles } from './write/smiles.js';

export interface DepictLabel {
  /** Internal atom index in the structure given to depict(). */
  atom: number;
  text: string;
}

export interface DepictOptions {
  width?: number;
  height?: number;
  /** Unique id for the SVG element (several depictions on one page). */
  id?: string;
}

/** SVG text, or null when the structure cannot be drawn (the report then says "no depiction"). */
export function depict(s: Structure, labels: DepictLabel[], opts: DepictOptions = {}): string | null {
  try {
    const norm = normalize(s);
    const copy: Structure = {
      ...norm.structure,
      atoms: norm.structure.atoms.map((a, i) => ({ ...a, mapNumber: i + 1 })),
    };
    const smiles = writeSmiles(copy);
    const mol = Molecule.fromSmiles(smiles);
    const byOurs = new Map<number, number>();
    for (let i = 0; i < mol.getAllAtoms(); i++) {
      const m = mol.getAtomMapNo(i);
      if (m > 0) byOurs.set(m - 1, i);
      mol.setAtomMapNo(i, 0, false);
    }
    for (const l of labels) {
      const internal = norm.fromInput[l.atom] ?? -1;
      const target = byOurs.get(internal);
      // ']' makes OpenChemLib draw the custom label beside the atom symbol instead of replacing it
      if (target !== undefined) mol.setAtomCustomLabel(target, `]${l.text}`);
    }
    return mol.toSVG(opts.width ?? 320, opts.height ?? 240, opts.id ?? 'mol', {
      autoCrop: true,
      autoCropMargin: 12,
      suppressChiralText: true,
      suppressCIPParity: true,
      suppressESR: true,
      noStereoProblem: true,
    });
  } catch {
    return null;
  }
}
