/**
 * trans double bonds in rings of 8–11 atoms: (E)-cyclooctene is planar chiral and was resolved by Cope et al.
 * (J. Am. Chem. Soc. 1963 — from memory); the engine does not model planar chirality, so chirality is left
 * open (null) with a remark, never called achiral. (Z)-cyclooctene is achiral (from memory); a trans double bond
 * in a 12-membered ring rotates freely through the ring (common practice, no source): not flagged.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { smiles } from './stereo-helpers.js';

suite('trans double bonds in medium rings', () => {
  it('(E)-cyclooctene: chirality open with a remark (Cope et al. 1963, from memory)', () => {
    const f = describe(smiles('C1CCC/C=C/CC1'));
    expect(f.chiral).toBeNull();
    expect(f.meso).toBeNull();
    expect(f.mirror.chiral).toBeNull();
    expect(f.remarks.some((r) => /planar chiral/.test(r) && /ring of 8 atoms/.test(r))).toBe(true);
  });
  it('(Z)-cyclooctene stays achiral (from memory)', () => {
    const f = describe(smiles('C1CCC/C=C\\CC1'));
    expect(f.chiral).toBe(false);
    expect(f.remarks.some((r) => /planar chiral/.test(r))).toBe(false);
  });
  it('(E)-cyclononene (9 atoms) is open too; (E)-cyclododecene (12 atoms) is not flagged (from memory)', () => {
    expect(describe(smiles('C1CCCC/C=C/CC1')).chiral).toBeNull();
    expect(describe(smiles('C1CCCCCCC/C=C/CC1')).chiral).toBe(false);
  });
  it('trans in the ring is read from the ring atoms, not the drawn reference (1-methylcyclooctene)', () => {
    // methyl trans to the ring CH2 = the two ring bonds cis: (Z)-ring, achiral
    expect(describe(smiles('C/C1=C/CCCCCC1')).chiral).toBe(false);
    // methyl cis to the ring CH2 = ring bonds trans: planar chiral, open
    expect(describe(smiles('C/C1=C\\CCCCCC1')).chiral).toBeNull();
  });
});
