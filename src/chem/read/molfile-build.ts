/**
 * The part of molfile reading shared by V2000 and V3000: from the atoms and bonds as read to a finished
 * Structure (Kekulé bonds, implicit hydrogens, a valence check, dimension, stereo from wedges or from 3D
 * coordinates).
 */
import type { Atom, Bond, ReadError, ReadResult, StereoGroup, Structure } from '../types.js';
import { implicitHydrogens, isMetal, valenceProblem } from './valence.js';
import { adjacency } from './molfile-graph.js';
import { kekulizeAromatic } from './molfile-kekulize.js';
import { stereoFrom2d } from './stereo-2d.js';
import { stereoFrom3d } from './stereo-3d.js';
import { newStructure, objectList } from './make.js';

/** A connection table as read, before hydrogens, Kekulé orders and stereo are worked out. */
export interface RawMolecule {
  atoms: Atom[];
  bonds: Bond[];
  /** Explicit valence per atom (V2000 vvv field, V3000 VAL=), null when not given. */
  valences: (number | null)[];
  /** Absolute line number of each atom's line (for messages). */
  atomLines: number[];
  groups: StereoGroup[];
  chiralFlag: boolean;
  title: string | null;
  warnings: ReadError[];
}

export function finishMolecule(raw: RawMolecule): ReadResult {
  const { atoms, bonds, warnings } = raw;
  const adj = adjacency(atoms.length, bonds);

  let anyAromatic = false;
  for (const b of bonds) {
    if (b.aromatic) {
      anyAromatic = true;
      atoms[b.a]!.aromatic = true;
      atoms[b.b]!.aromatic = true;
    }
  }
  if (anyAromatic) {
    const failed = kekulizeAromatic(atoms, bonds, adj, raw.valences);
    if (failed !== -1) {
      return {
        ok: false,
        error: {
          code: 'molfile-kekulize-failed',
          message:
            `aromatic bonds (type 4) cannot be given alternating single and double bonds: atom ${failed + 1} ` +
            `(${atoms[failed]!.element}) is left without a double bond`,
          at: { line: raw.atomLines[failed] },
        },
      };
    }
  }

  for (let i = 0; i < atoms.length; i++) {
    const atom = atoms[i]!;
    let sum = 0;
    let oxo = 0;
    let multiple = 0;
    let metal = 0;
    for (const k of adj.bnd[i]!) {
      const b = bonds[k]!;
      sum += b.order;
      if (b.order >= 2) multiple++;
      if (isMetal(atoms[b.a === i ? b.b : b.a]!.atomicNumber)) metal += b.order;
      if (b.order === 2 && atoms[b.a === i ? b.b : b.a]!.atomicNumber === 8) oxo++;
    }
    const v = raw.valences[i];
    // The valence field counts bonds plus hydrogens; unpaired electrons are not part of it (as RDKit writes it).
    if (v !== null && v !== undefined) atom.hCount = Math.max(0, v - sum);
    else
      atom.hCount =
        atom.atomicNumber === 0 ? 0 : implicitHydrogens(atom.atomicNumber, atom.charge, sum, atom.radical);
    const problem = valenceProblem(atom.atomicNumber, atom.charge, sum, atom.hCount, oxo, multiple, metal);
    if (problem !== null) {
      return {
        ok: false,
        error: {
          code: 'molfile-valence',
          message: `atom ${i + 1}: ${problem}`,
          at: { line: raw.atomLines[i] },
        },
      };
    }
  }

  let dimension: 0 | 2 | 3 = 0;
  for (const atom of atoms) {
    const c = atom.coords!;
    if (c[2] !== 0) {
      dimension = 3;
      break;
    }
    if (c[0] !== 0 || c[1] !== 0) dimension = 2;
  }

  const structure: Structure = newStructure(
    atoms,
    bonds,
    objectList(),
    raw.groups,
    raw.chiralFlag,
    raw.title,
    {},
    dimension,
  );
  if (dimension === 3) structure.stereo = stereoFrom3d(structure, adj, warnings, raw.atomLines);
  else if (dimension === 2) structure.stereo = stereoFrom2d(structure, adj, warnings, raw.atomLines);
  else if (bonds.some((b) => b.wedge === 'up' || b.wedge === 'down') && atoms.length > 1) {
    warnings.push({
      code: 'molfile-wedges-without-coordinates',
      message: 'wedge bonds are drawn but all coordinates are zero, so no configuration can be read',
      at: { line: raw.atomLines[0] },
    });
  }
  return { ok: true, structure, warnings };
}
