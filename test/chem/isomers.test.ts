/**
 * Stereoisomer counts of whole constitutions (Burnside counting over the induced symmetry group).
 * Textbook values: E. L. Eliel, S. H. Wilen, "Stereochemistry of Organic Compounds", Wiley 1994, ch. 3
 * (tartaric acid, trihydroxyglutaric acids, aldohexoses, hexadienes) and ch. 11 (cyclohexanes, inositols) —
 * the figures are from memory of that text and the standard literature.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
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

  it('camphor: 2 stereoisomers, not 4 — the bridgeheads of bicyclo[2.2.1] are coupled (from memory: (+)/(−)-camphor)', () => {
    expect(count('CC1(C)C2CCC1(C)C(=O)C2')).toMatchObject({ total: 2, chiral: 2, achiral: 0 });
  });
  it('norbornan-2-ol: exo and endo, each a pair, 4 in all; norbornane itself 1 (from memory)', () => {
    expect(count('OC1CC2CCC1C2')).toMatchObject({ total: 4, chiral: 4 });
    expect(count('C1CC2CCC1C2')).toMatchObject({ total: 1, achiral: 1 });
  });
  it("Tröger's base: one pair of enantiomers (two coupled bridgehead N; from memory)", () => {
    expect(count('CC1=CC2=C(C=C1)N3CC4=C(C=CC(=C4)C)N(C2)C3')).toMatchObject({ total: 2, chiral: 2 });
  });
  it('3-carene: one pair (the cyclopropane fusion is cis only; from memory)', () => {
    expect(count('CC1=CCC2C(C1)C2(C)C')).toMatchObject({ total: 2, chiral: 2 });
  });
  it('bicyclo[3.1.0]hexane: one, achiral (cis only); bicyclo[4.4.0]decane (decalin) cis and trans (from memory)', () => {
    expect(count('C1CC2CC2C1')).toMatchObject({ total: 1, achiral: 1 });
    expect(count('C1CCC2CCCCC2C1')).toMatchObject({ total: 2, achiral: 2 });
  });
  it('α-cyclodextrin: Burnside over the six rotations (5,472 achiral of 178,962,784; exact group arithmetic)', () => {
    const smi =
      'OCC1OC2OC3C(CO)OC(OC4C(CO)OC(OC5C(CO)OC(OC6C(CO)OC(OC7C(CO)OC(OC1C(O)C2O)C(O)C7O)C(O)C6O)C(O)C5O)C(O)C4O)C(O)C3O';
    // (2^30 + 2·2^5 + 2·2^10 + 2^15) / 6 and (2·2^5 + 2^15) / 6
    expect(count(smi)).toMatchObject({ units: 30, total: 178962784, achiral: 5472 });
  });
});
