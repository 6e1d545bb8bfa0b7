/**
 * Size caps on structure input, applied by readStructure (the one entry the record audit, the bulk audit and the
 * CLI share): a SMILES or molfile text longer than the cap, a structure with more atoms or more components
 * (dot-separated parts) than the cap is refused with a reader error saying which cap and by how much. The caps
 * are far above any registered small molecule, salt or hydrate (common practice, no source: registries hold
 * compounds of a few hundred atoms), and low enough that perception, symmetry and CIP labelling of anything
 * under them stay within the per-record time limit.
 */
import type { ReadError, Structure } from '../types.js';

export interface ReadLimits {
  /** Characters of SMILES text (CXSMILES extension and title included). */
  maxSmilesChars: number;
  /** Characters of molfile text. */
  maxMolfileChars: number;
  /** Atoms of one structure, explicit hydrogens included. */
  maxAtoms: number;
  /** Connected components (salt parts, counterions, solvent molecules) of one structure. */
  maxComponents: number;
}

export const READ_LIMITS: Readonly<ReadLimits> = Object.freeze({
  maxSmilesChars: 20_000,
  maxMolfileChars: 4 * 2 ** 20,
  maxAtoms: 2_000,
  maxComponents: 50,
});

const count = (n: number): string => n.toLocaleString('en-US');

/** The text-length cap, checked before anything is parsed; null when the text is within it. */
export function textTooLong(
  text: string,
  format: 'smiles' | 'molfile',
  limits: ReadLimits,
): ReadError | null {
  const max = format === 'smiles' ? limits.maxSmilesChars : limits.maxMolfileChars;
  if (text.length <= max) return null;
  return {
    code: format === 'smiles' ? 'smiles-too-long' : 'molfile-too-long',
    message:
      `the ${format === 'smiles' ? 'SMILES' : 'molfile'} is ${count(text.length)} characters long, over the ` +
      `limit of ${count(max)}; it was not read`,
    at: format === 'smiles' ? { offset: max } : { line: 1 },
  };
}

/** The atom-count cap for a molfile, from its counts line, before the atom block is read. */
export function tooManyAtoms(atoms: number, limits: ReadLimits, at: ReadError['at']): ReadError | null {
  if (atoms <= limits.maxAtoms) return null;
  return {
    code: 'too-many-atoms',
    message: `the structure has ${count(atoms)} atoms, over the limit of ${count(limits.maxAtoms)}; it was not analysed`,
    at,
  };
}

/** The atom and component caps on a structure as read; null when it is within them. Linear time. */
export function structureTooLarge(s: Structure, limits: ReadLimits): ReadError | null {
  const atoms = tooManyAtoms(s.atoms.length, limits, {});
  if (atoms !== null) return atoms;
  const parts = componentCount(s);
  if (parts <= limits.maxComponents) return null;
  return {
    code: 'too-many-components',
    message:
      `the structure has ${count(parts)} separate components (parts joined by '.'), over the limit of ` +
      `${count(limits.maxComponents)}; it was not analysed`,
    at: {},
  };
}

/** Connected components by union-find over the bonds. */
function componentCount(s: Structure): number {
  const n = s.atoms.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]!]!;
      x = parent[x]!;
    }
    return x;
  };
  let parts = n;
  for (const b of s.bonds) {
    const x = find(b.a);
    const y = find(b.b);
    if (x !== y) {
      parent[x] = y;
      parts--;
    }
  }
  return parts;
}
