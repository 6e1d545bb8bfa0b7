/**
 * Folding explicit hydrogens. Which H atoms are ordinary follows the OpenSMILES specification (§3.1.7: an
 * explicit [H] atom is the same molecule as the hydrogen counted on its neighbour); isotopes and bridging H are
 * different species and stay atoms (common practice, no source).
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { normalize } from '../../src/chem/normalize.js';
import { IMPLICIT_H } from '../../src/chem/types.js';
import { smiles } from './stereo-helpers.js';

suite('normalize', () => {
  it('folds an ordinary [H] atom into hCount and rewrites the stereo ligand to IMPLICIT_H', () => {
    const s = smiles('[H][C@](C)(O)CC');
    const n = normalize(s);
    expect(n.folded).toBe(1);
    expect(n.structure.atoms).toHaveLength(s.atoms.length - 1);
    const e = n.structure.stereo[0];
    expect(e.kind === 'tetrahedral' && e.ligands.includes(IMPLICIT_H)).toBe(true);
    expect(n.structure.atoms[n.fromInput[1]].hCount).toBe(1);
    // input numbers survive: the centre is still atom 2
    expect(n.structure.atoms[e.kind === 'tetrahedral' ? e.centre : 0].inputNumber).toBe(2);
  });
  it('keeps deuterium, charged H and H2 as atoms', () => {
    expect(normalize(smiles('[2H]C(C)O')).folded).toBe(0);
    expect(normalize(smiles('[H+].[Cl-]')).folded).toBe(0);
    expect(normalize(smiles('[H][H]')).folded).toBe(0);
  });
  it('an explicit-H drawing gives the same facts as the bracket-H drawing', () => {
    const a = describe(smiles('C[C@@]([H])(O)CC'));
    const b = describe(smiles('C[C@@H](O)CC'));
    expect(a.stereocenters[0].label).toBe(b.stereocenters[0].label);
    expect(a.chiral).toBe(b.chiral);
    expect(a.formula).toBe(b.formula);
  });
  it('CHD with one H folded is a stereocentre (isotope makes the ligands differ)', () => {
    expect(describe(smiles('[2H][C@@H](C)O')).stereocenters).toHaveLength(1);
  });
});
