/**
 * Stereoisomer counts of whole constitutions (Burnside counting over the induced symmetry group).
 * Textbook values: E. L. Eliel, S. H. Wilen, "Stereochemistry of Organic Compounds", Wiley 1994, ch. 3
 * (tartaric acid, trihydroxyglutaric acids, aldohexoses, hexadienes) and ch. 11 (cyclohexanes, inositols) —
 * the figures are from memory of that text and the standard literature.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe.js';
import { smiles } from './stereo-helpers.js';

const count = (smi: string) => describe(smiles(smi)).stereoisomers;

suite('stereoisomer counts of textbook constitutions', () => {
  it('tartaric acid: 3, one meso form and one enantiomer pair (Eliel & Wilen 1994, from memory)', () => {
    expect(count('OC(=O)C(O)C(O)C(O)=O')).toMatchObject({
      total: 3,
      chiral: 2,
      achiral: 1,
      pairs: 1,
      meso: 1,
      units: 2,
    });
  });
  it('inositol: 9, seven meso forms and one pair (chiro-inositol) (Eliel & Wilen 1994, from memory)', () => {
    expect(count('OC1C(O)C(O)C(O)C(O)C1O')).toMatchObject({
      total: 9,
      chiral: 2,
      achiral: 7,
      pairs: 1,
      meso: 7,
    });
  });
  it('2,3,4-trihydroxyglutaric acid: 4, two meso (C3 r/s) and one pair (Eliel & Wilen 1994, from memory)', () => {
    expect(count('OC(=O)C(O)C(O)C(O)C(O)=O')).toMatchObject({
      total: 4,
      chiral: 2,
      achiral: 2,
      meso: 2,
      units: 3,
    });
  });
  it('pentane-2,3,4-triol behaves the same way: 4, two meso (from memory)', () => {
    expect(count('CC(O)C(O)C(O)C')).toMatchObject({ total: 4, chiral: 2, achiral: 2, meso: 2 });
  });
  it('open-chain aldohexoses: 16, eight enantiomer pairs (D/L glucose, mannose, ...; from memory)', () => {
    expect(count('O=CC(O)C(O)C(O)C(O)CO')).toMatchObject({
      total: 16,
      chiral: 16,
      achiral: 0,
      pairs: 8,
      meso: 0,
    });
  });
  it('1,4-dimethylcyclohexane: 2 (cis, trans), both achiral, neither meso (Gold Book "meso-compound")', () => {
    expect(count('CC1CCC(C)CC1')).toMatchObject({ total: 2, chiral: 0, achiral: 2, meso: 0 });
  });
  it('1,2-dimethylcyclohexane: 3, cis is meso, trans a pair (Eliel & Wilen 1994, from memory)', () => {
    expect(count('CC1CCCCC1C')).toMatchObject({ total: 3, chiral: 2, achiral: 1, meso: 1 });
  });
  it('hexa-2,4-diene: 3 (EE, EZ, ZZ), all achiral (Eliel & Wilen 1994, from memory)', () => {
    expect(count('CC=CC=CC')).toMatchObject({ total: 3, chiral: 0, achiral: 3, meso: 0 });
  });
  it('octa-2,4,6-triene: 6 (terminal bonds equivalent, central one too; from memory: 2^3 less 2 mirror pairs)', () => {
    expect(count('CC=CC=CC=CC')).toMatchObject({ total: 6, achiral: 6 });
  });
  it('penta-2,3-diene (an allene): one enantiomer pair (IUPAC 2013 P-93.5.7.1.1)', () => {
    expect(count('CC=C=CC')).toMatchObject({ total: 2, chiral: 2, achiral: 0 });
  });
  it('hexa-2,3,4-triene (odd cumulene): cis and trans, both achiral (IUPAC 2013 P-93.4.2.3)', () => {
    expect(count('CC=C=C=CC')).toMatchObject({ total: 2, chiral: 0, achiral: 2 });
  });
  it('2-butanol: one pair; butane: one stereoisomer, achiral', () => {
    expect(count('CC(O)CC')).toMatchObject({ total: 2, chiral: 2, achiral: 0 });
    expect(count('CCCC')).toMatchObject({ total: 1, chiral: 0, achiral: 1, units: 0 });
  });
  it('cyclobutane-1,2,3,4-tetracarboxylic acid: 4 stereoisomers, all achiral (from memory)', () => {
    expect(count('OC(=O)C1C(C(O)=O)C(C(O)=O)C1C(O)=O')).toMatchObject({ total: 4, chiral: 0, achiral: 4 });
  });
  it('20 unrelated stereocentres give 2^20 without enumeration (common practice, no source)', () => {
    const r = count(`N${'C(O)'.repeat(20)}Cl`);
    expect(r.units).toBe(20);
    expect(r.total).toBe(2 ** 20);
  });
});
