/**
 * The same-run baseline of the engine issue: OpenChemLib's default path for "is this molecule its own mirror
 * image?" — parse the SMILES with 2D coordinates, canonical id code, parse the mirror SMILES (every @ swapped
 * with @@), id code, compare.
 */
import { Molecule } from 'openchemlib';

export function mirrorSmilesText(smiles: string): string {
  return smiles.replace(/@@|@/g, (m) => (m === '@@' ? '@' : '@@'));
}

/** Returns the number of molecules processed (failures count: the work was done). */
export function oclDefaultPath(smiles: readonly string[]): { done: number; chiral: number } {
  let chiral = 0;
  let done = 0;
  for (const smi of smiles) {
    try {
      const mol = Molecule.fromSmiles(smi);
      const id = mol.getIDCode();
      const mir = Molecule.fromSmiles(mirrorSmilesText(smi));
      if (mir.getIDCode() !== id) chiral++;
    } catch {
      // unparsable for OpenChemLib: still counts as processed
    }
    done++;
  }
  return { done, chiral };
}
