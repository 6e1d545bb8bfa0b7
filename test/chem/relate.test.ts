/**
 * Relations between two structures, named as the IUPAC Gold Book names them ("enantiomer", "diastereoisomer",
 * "epimer", "constitutional isomer"). The example compounds are textbook cases (Eliel & Wilen 1994, ch. 3;
 * from memory): the tartaric acids, the threose/erythrose pair, E/Z-but-2-ene, butanol isomers.
 */
import { describe as suite, expect, it } from 'vitest';
import { relate } from '../../src/chem/relate.js';
import { smiles } from './stereo-helpers.js';

const rel = (a: string, b: string) => relate(smiles(a), smiles(b));

suite('relate', () => {
  it('the same stereoisomer written from another atom is identical', () => {
    expect(rel('C[C@H](O)CC', 'CC[C@H](C)O').relation).toBe('identical'); // (Me,H,O,Et)@ = (Et,H,Me,O)@: even permutation (OpenSMILES 3.9)
    expect(rel('C[C@H](O)CC', 'O[C@@H](C)CC').relation).toBe('identical');
  });
  it('(R)- and (S)-butan-2-ol are enantiomers; every centre is named', () => {
    const r = rel('C[C@H](O)CC', 'C[C@@H](O)CC');
    expect(r.relation).toBe('enantiomers');
    expect(r.differingUnits).toHaveLength(1);
    expect(new Set([r.differingUnits[0].labelA, r.differingUnits[0].labelB])).toEqual(new Set(['R', 'S']));
  });
  it('meso- and (R,R)-tartaric acid are diastereomers differing at one centre', () => {
    const r = rel('OC(=O)[C@@H](O)[C@@H](O)C(O)=O', 'OC(=O)[C@@H](O)[C@H](O)C(O)=O');
    expect(r.relation).toBe('diastereomers');
    expect(r.differingUnits).toHaveLength(1);
  });
  it('meso-tartaric acid is identical to its mirror image written the other way round', () => {
    expect(rel('OC(=O)[C@@H](O)[C@@H](O)C(O)=O', 'OC(=O)[C@H](O)[C@H](O)C(O)=O').relation).toBe('identical');
  });
  it('threose and erythrose (2,3,4-trihydroxybutanal) are epimers at one of two centres', () => {
    const r = rel('O=C[C@H](O)[C@H](O)CO', 'O=C[C@H](O)[C@@H](O)CO');
    expect(r.relation).toBe('diastereomers');
    expect(r.epimers).toBe(true);
    expect(r.differingUnits.map((u) => u.atomsA)).toEqual([[5]]);
  });
  it('E- and Z-but-2-ene are diastereomers (not epimers: a double bond differs)', () => {
    const r = rel('C/C=C/C', 'C/C=C\\C');
    expect(r).toMatchObject({ relation: 'diastereomers', epimers: false });
    expect(r.differingUnits[0]).toMatchObject({ kind: 'double-bond', labelA: 'E', labelB: 'Z' });
  });
  it('butan-1-ol and butan-2-ol are constitutional isomers; butanol and propanol different compounds', () => {
    expect(rel('CCCCO', 'CCC(C)O').relation).toBe('constitutional-isomers');
    expect(rel('CCCCO', 'CCCO').relation).toBe('different-compounds');
  });
  it('undefined stereo leaves it open', () => {
    expect(rel('CC(O)CC', 'C[C@H](O)CC').relation).toBe('same-constitution');
  });
  it('salts: parents related in neutral form, the counter-ions listed apart (HCl drawn as Cl or as [Cl-] is one counter-ion)', () => {
    const r = rel('C[C@H](N)C(=O)O.Cl', 'C[C@@H](N)C(=O)O.[Na+].[Cl-]');
    expect(r.relation).toBe('enantiomers');
    expect(r.otherComponents).toEqual({ onlyInA: [], onlyInB: ['[Na+]'] });
    expect(r.formDifferences.map((d) => d.kind)).toEqual(['salt-form']);
  });
  it('an achiral counter-ion stays apart; a chiral component both drawings hold is related with the parent', () => {
    const r = rel('CCN.C[C@H](O)C(=O)O', 'CCN.C[C@@H](O)C(=O)O');
    expect(r.relation).toBe('enantiomers');
    // the larger amine is the parent here; the lactic acids of opposite configuration make the whole enantiomeric
    const s = rel('C[C@H](O)C(=O)O.CC(C)(C)CCCN', 'C[C@@H](O)C(=O)O.CC(C)(C)CCCN');
    expect(s.relation).toBe('enantiomers');
    expect(s.otherComponents).toEqual({ onlyInA: [], onlyInB: [] });
  });
});
