/**
 * Perception of potential stereogenic units. Sources beside each case: IUPAC 2013 recommendations (Favre &
 * Powell, "Nomenclature of Organic Chemistry", RSC 2014) P-93.5 (stereogenic centres and units), P-93.5.1.4
 * (ring double bonds), P-93.5.7 (allenes); nitrogen inversion: Eliel & Wilen, "Stereochemistry of Organic
 * Compounds" (1994), ch. 8 (from memory).
 */
import { describe as suite, expect, it } from 'vitest';
import { normalize } from '../../src/chem/normalize.js';
import { perceive } from '../../src/chem/perceive/index.js';
import { smiles } from './stereo-helpers.js';

/** "kind:atoms(1-based input numbers):defined" for every unit. */
function units(smi: string): string[] {
  const s = normalize(smiles(smi)).structure;
  const p = perceive(s);
  return p.units.map(
    (u) => `${u.kind}:${u.atoms.map((a) => s.atoms[a].inputNumber).join('-')}:${u.defined ? 'def' : 'undef'}`,
  );
}

suite('tetrahedral centres', () => {
  it('carbon with four different ligands; CH2 and C(CH3)2 are not centres (P-93.5.1.1)', () => {
    expect(units('C[C@H](O)CC')).toEqual(['tetrahedral:2:def']);
    expect(units('CCC(C)(C)O')).toEqual([]);
  });
  it('sulfoxide S and a phosphine P carry a lone pair as fourth ligand (P-93.5.1.1.2, from memory)', () => {
    expect(units('C[S@@](=O)CC')).toEqual(['tetrahedral:2:def']);
    expect(units('C[P@](CC)c1ccccc1')).toEqual(['tetrahedral:2:def']);
    expect(units('CS(=O)(=N)CC')).toEqual(['tetrahedral:2:undef']); // sulfoximine S(VI)
  });
  it('sulfone, sulfinic acid and phosphinic acid are not centres (equal or tautomeric O ligands)', () => {
    expect(units('CS(=O)(=O)CC')).toEqual([]);
    expect(units('CCS(=O)O')).toEqual([]);
    expect(units('CP(=O)(O)CC')).toEqual([]);
  });
  it('quaternary ammonium is a centre, a tertiary amine is not (rapid inversion; Eliel & Wilen 1994, from memory)', () => {
    expect(units('C[N+](CC)(CCC)Cc1ccccc1')).toEqual(['tetrahedral:2:undef']);
    expect(units('CN(CC)CCC')).toEqual([]);
  });
  it('a drawn configuration on an amine N is reported as invertible, not as a centre', () => {
    const s = normalize(smiles('C[N@](CC)CCC')).structure;
    const p = perceive(s);
    expect(p.units).toEqual([]);
    expect(p.invertibleNitrogens.map((i) => s.atoms[i].inputNumber)).toEqual([2]);
    expect(p.remarks.join(' ')).toMatch(/inverts/);
  });
  it("aziridine N and the bridgehead N of Tröger's base are centres (slow inversion; from memory)", () => {
    expect(units('CN1CC1C')).toEqual(['tetrahedral:2:undef', 'tetrahedral:4:undef']);
    // Tröger's base: two bridgehead N, the whole molecule has one pair of enantiomers
    const troger = 'Cc1ccc2c(c1)CN1Cc3cc(C)ccc3N(C2)C1';
    expect(units(troger).filter((u) => u.startsWith('tetrahedral'))).toHaveLength(2);
  });
  it('an ordinary ring-fusion N (indolizidine) is not a centre (fused, not bridged; common practice, no source)', () => {
    expect(units('C1CCN2CCCC2C1').filter((u) => u.includes(':4:'))).toEqual([]);
  });
});

suite('double bonds and cumulenes', () => {
  it('C=C with two different ends; terminal =CH2 and =C(CH3)2 are not units (P-93.5.1.4)', () => {
    expect(units('C/C=C/C')).toEqual(['double-bond:2-3:def']);
    expect(units('CC=C')).toEqual([]);
    expect(units('CC=C(C)C')).toEqual([]);
  });
  it('oxime C=N is a unit; an =NH imine is not (common practice, no source)', () => {
    expect(units('C/C=N/O')).toEqual(['double-bond:2-3:def']);
    expect(units('CC(CC)=N')).toEqual([]);
  });
  it('ring double bonds count only from eight-membered rings up (P-93.5.1.4.1)', () => {
    expect(units('C1CCCCC=C1')).toEqual([]);
    // from eight atoms on, a trans bond is also planar chiral: a planar unit rides on the bond (perceive/planar.ts)
    expect(units('C1CCCCCC=C1')).toEqual(['double-bond:7-8:undef', 'planar:7-8:undef']);
  });
  it('aromatic bonds are never units, in either Kekulé form', () => {
    expect(units('Cc1ccccc1C')).toEqual([]);
    expect(units('CC1=CC=CC=C1C')).toEqual([]);
  });
  it('allene: one axial unit on the terminal atoms; odd cumulene: cis/trans-like (P-93.5.7, P-93.4.2.3)', () => {
    expect(units('CC=[C@]=CC')).toEqual(['allene:2-4:def']);
    expect(units('C/C=C=C=C/C')).toEqual(['cumulene:2-5:def']);
  });
});

suite('pseudoasymmetric and para units (greatest fixed point)', () => {
  it('C3 of 2,3,4-trihydroxyglutaric acid is kept: its equivalent branches hold C2 and C4 (P-93.5.1.3)', () => {
    expect(units('OC(=O)C(O)C(O)C(O)C(O)=O')).toEqual([
      'tetrahedral:4:undef',
      'tetrahedral:6:undef',
      'tetrahedral:8:undef',
    ]);
  });
  it('C1 and C4 of 1,4-dimethylcyclohexane support each other; methylcyclohexane has none', () => {
    expect(units('CC1CCC(C)CC1')).toEqual(['tetrahedral:2:undef', 'tetrahedral:5:undef']);
    expect(units('CC1CCCCC1')).toEqual([]);
  });
  it('3-methylpentane C3 has equal ethyl branches with no unit: not a centre', () => {
    expect(units('CCC(C)CC')).toEqual([]);
  });
  it('2,6-dichlorospiro[3.3]heptane: the spiro centre with four equivalent ring ligands is kept (VS298, Hanson et al. 2018)', () => {
    expect(units('Cl[C@H]1C[C@]2(C1)C[C@H](C2)Cl')).toEqual([
      'tetrahedral:2:def',
      'tetrahedral:4:def',
      'tetrahedral:7:def',
    ]);
  });
  it('a spiro centre whose equivalent rings are exchanged only by an even permutation is kept (VS281, rule 6)', () => {
    expect(units('C1=C2[C@@]34C(=C1)CCCCC3=CC=C4CCCC2')).toEqual(['tetrahedral:3:def']);
  });
  it('isotopes tell resonance partners apart: [18O-]P(=O)(OC)[17O-] is a centre (VS177, P-93.2.4)', () => {
    expect(units('[18O-][P@@](=O)(OC)[17O-]')).toEqual(['tetrahedral:2:def']);
    expect(units('[O-]P(=O)(OC)CC')).toEqual([]);
  });
  it('tert-butyl and triethylmethyl carbons are never centres', () => {
    expect(units('CC(C)(C)O')).toEqual([]);
    expect(units('CCC(CC)(CC)C')).toEqual([]);
  });
  it('an allene ending in a 4-substituted cyclohexylidene (CIP validation suite VS231, Hanson et al. 2018)', () => {
    expect(units('CC=[C@]=C1CC[C@H](CC1)CC')).toEqual(['allene:2-4:def', 'tetrahedral:7:def']);
  });
});
