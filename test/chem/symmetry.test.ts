/**
 * Chirality, meso and the mirror-image evidence. Meso follows the IUPAC Gold Book entry "meso-compound"
 * (achiral member of a set of diastereoisomers that also includes chiral members); the example configurations
 * are textbook cases (Eliel & Wilen, "Stereochemistry of Organic Compounds", 1994, ch. 3 and 11; from memory).
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import { writeSmiles } from '../../src/chem/write/smiles.js';
import { smiles } from './stereo-helpers.js';

const facts = (smi: string) => describe(smiles(smi));

suite('chirality of fully defined structures', () => {
  it('(2S)-butan-2-ol is chiral, with no improper symmetry', () => {
    const f = facts('C[C@H](O)CC');
    expect(f.chiral).toBe(true);
    expect(f.meso).toBe(false);
    expect(f.mirror.fixedAtoms).toEqual([]);
  });
  it('meso-tartaric acid: achiral, meso; the symmetry exchanges C2 and C3 across their bond', () => {
    // written symmetrically, equal windings give the meso form ((2R,3S): CIP labels checked below)
    const f = facts('OC(=O)[C@@H](O)[C@@H](O)C(O)=O');
    expect(f.chiral).toBe(false);
    expect(f.meso).toBe(true);
    expect(f.mirror.fixedBonds).toEqual([[4, 6]]);
    expect(f.stereocenters.map((c) => c.label).sort()).toEqual(['R', 'S']);
  });
  it('(R,R)-tartaric acid is chiral and not meso', () => {
    const f = facts('OC(=O)[C@@H](O)[C@H](O)C(O)=O');
    expect(f.chiral).toBe(true);
    expect(f.meso).toBe(false);
    expect(new Set(f.stereocenters.map((c) => c.label)).size).toBe(1);
  });
  it('cis-1,2-dimethylcyclohexane is meso; trans is chiral', () => {
    expect(facts('C[C@H]1CCCC[C@H]1C')).toMatchObject({ chiral: false, meso: true });
    expect(facts('C[C@H]1CCCC[C@@H]1C')).toMatchObject({ chiral: true, meso: false });
  });
  it('cis- and trans-1,4-dimethylcyclohexane are achiral and not meso; the plane holds C1 and C4', () => {
    for (const smi of ['C[C@H]1CC[C@@H](C)CC1', 'C[C@H]1CC[C@H](C)CC1']) {
      const f = facts(smi);
      expect(f.chiral).toBe(false);
      expect(f.meso).toBe(false);
      expect(f.mirror.fixedAtoms).toEqual(expect.arrayContaining([2, 5]));
      expect(f.mirror.explanation).toMatch(/mirror plane through C2, C5/);
    }
  });
  it('(E,E)-hexa-2,4-diene is achiral: no stereocentre, reflection changes nothing', () => {
    expect(facts('C/C=C/C=C/C')).toMatchObject({ chiral: false, meso: false });
  });
  it('an allene with two different ends on each terminus is chiral (IUPAC 2013 P-93.5.7.1.1)', () => {
    expect(facts('CC=[C@]=CC').chiral).toBe(true);
  });
  it('C3 of (2R,4R)-trihydroxyglutaric acid is not stereogenic: the drawn C3 is dropped with a remark (P-93.5.1.3)', () => {
    const f = facts('OC(=O)[C@H](O)[C@H](O)[C@@H](O)C(O)=O');
    expect(f.chiral).toBe(true);
    expect(f.stereocenters.map((c) => [c.atom, c.label])).toEqual([
      [4, 'R'],
      [8, 'R'],
    ]);
    expect(f.remarks.join(' ')).toMatch(/C6 is drawn with a configuration but is not stereogenic/);
  });
  it('the two meso forms of trihydroxyglutaric acid carry a pseudoasymmetric C3, r and s (P-93.5.1.3)', () => {
    const r = facts('OC(=O)[C@@H](O)[C@@H](O)[C@@H](O)C(O)=O');
    const s = facts('OC(=O)[C@@H](O)[C@H](O)[C@@H](O)C(O)=O');
    for (const [f, label] of [
      [r, 'r'],
      [s, 's'],
    ] as const) {
      expect(f).toMatchObject({ chiral: false, meso: true });
      const c3 = f.units.find((u) => u.atoms[0] === 6);
      expect(c3).toMatchObject({ pseudoasymmetric: true, label });
    }
  });
});

suite('geometrically impossible drawings', () => {
  it('trans-fused bicyclo[3.1.0]hexane is flagged; the cis form (achiral, as RDKit also finds) is not', () => {
    // RDKit MinimalLib: canonical SMILES of C1C[C@H]2C[C@H]2C1 equals that of its mirror image (achiral, cis)
    expect(facts('C1C[C@H]2C[C@H]2C1')).toMatchObject({ chiral: false, remarks: [] });
    expect(facts('C1C[C@@H]2C[C@H]2C1').remarks.join(' ')).toMatch(/cannot both hold/);
  });
  it('(1R,4R)-camphor as drawn is possible; inverting one bridgehead alone is not (from memory)', () => {
    expect(facts('CC1(C)[C@@H]2CC[C@@]1(C)C(=O)C2').remarks).toEqual([]);
    expect(facts('CC1(C)[C@H]2CC[C@@]1(C)C(=O)C2').remarks.join(' ')).toMatch(/cannot both hold/);
  });
});

suite('impossible drawings found in real data (MoleculeNet, Wu et al. 2018)', () => {
  // Benztropine and aldrin are achiral (meso-type) compounds (from memory); RDKit MinimalLib calls both drawings
  // chiral (canonical SMILES differs from the mirror's), so the drawn bridgehead configurations match no real isomer.
  it.each([
    ['benztropine, clintox.csv row 606', 'C[NH+]1[C@@H]2CC[C@@H]1CC(C2)OC(c3ccccc3)c4ccccc4'],
    ['aldrin, tox21.csv row 1598', 'ClC1=C(Cl)[C@]2(Cl)[C@H]3[C@H]([C@H]4C=C[C@H]3C4)[C@@]1(Cl)C2(Cl)Cl'],
  ])('%s is flagged', (_name, smi) => {
    expect(facts(smi).remarks.join(' ')).toMatch(/cannot both hold/);
  });
});

suite('chirality with undefined units', () => {
  it('2-butanol undefined: every completion is chiral, so chiral = true; one undefined unit', () => {
    expect(facts('CC(O)CC')).toMatchObject({ chiral: true, undefined: 1 });
  });
  it('tartaric acid undefined: open (RR/SS chiral, RS meso)', () => {
    expect(facts('OC(=O)C(O)C(O)C(O)=O')).toMatchObject({ chiral: null, meso: null, undefined: 2 });
  });
  it('1,4-dimethylcyclohexane undefined: every completion achiral', () => {
    expect(facts('CC1CCC(C)CC1')).toMatchObject({ chiral: false, meso: false });
  });
});

suite('mirror()', () => {
  it('inverts tetrahedral and axial windings and keeps cis/trans', () => {
    const s = smiles('C/C=C/[C@H](O)C=[C@]=CC');
    const m = mirror(s);
    expect(writeSmiles(m)).toBe('C/C=C/[C@@H](O)C=[C@@]=CC');
    expect(mirror(m)).toEqual(s);
  });
});

suite('enhanced stereo (CXSMILES groups)', () => {
  it('an AND group over every centre is a racemate; OR a relative configuration; none absolute', () => {
    expect(facts('C[C@H](O)[C@@H](C)Cl |&1:1,3|').enhanced.meaning).toBe('racemic');
    expect(facts('C[C@H](O)[C@@H](C)Cl |o1:1,3|').enhanced.meaning).toBe('relative');
    expect(facts('C[C@H](O)[C@@H](C)Cl').enhanced.meaning).toBe('absolute');
    expect(facts('C[C@H](O)[C@@H](C)Cl |&1:1,&2:3|').enhanced.meaning).toBe('mixture');
    expect(facts('CCO').enhanced.meaning).toBe('none');
  });
  it('group membership is reported per unit', () => {
    const f = facts('C[C@H](O)[C@@H](C)Cl |o1:1,3|');
    expect(f.units.map((u) => u.group)).toEqual([
      { type: 'or', id: 1 },
      { type: 'or', id: 1 },
    ]);
  });
});
