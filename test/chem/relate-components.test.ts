/**
 * Drawings of several molecules related as multisets of molecules (issue 11), and salts related by their
 * charge-neutral parents. Sources: IUPAC Gold Book ("racemate": equimolar mixture of a pair of enantiomers;
 * "diastereoisomers"); classical resolution works because the salts of one enantiomer of a base with the two
 * enantiomers of an acid are diastereomers (Eliel & Wilen 1994, ch. 7, from memory); a hydrochloride and its
 * free base share one parent (common practice of registries, no source).
 */
import { describe as suite, expect, it } from 'vitest';
import { relate } from '../../src/chem/relate.js';
import { neutralise } from '../../src/chem/relate/neutral.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import { smiles } from './stereo-helpers.js';

const rel = (a: string, b: string) => relate(smiles(a), smiles(b));

suite('multi-component drawings as multisets', () => {
  it('a racemate drawn out, in either component order, is identical to itself (Gold Book "racemate")', () => {
    const r = rel('C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O', 'C[C@@H](O)C(=O)O.C[C@H](O)C(=O)O');
    expect(r.relation).toBe('identical');
    expect(r.otherComponents).toEqual({ onlyInA: [], onlyInB: [] });
    expect(
      relate(smiles('C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O'), mirror(smiles('C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O')))
        .relation,
    ).toBe('identical');
  });
  it('tetrabutylammonium (S)- vs (R)-lactate are enantiomers (the whole is mirrored)', () => {
    const r = rel(
      'CCCC[N+](CCCC)(CCCC)CCCC.C[C@H](O)C(=O)[O-]',
      'CCCC[N+](CCCC)(CCCC)CCCC.C[C@@H](O)C(=O)[O-]',
    );
    expect(r.relation).toBe('enantiomers');
    expect(r.differingUnits).toHaveLength(1);
  });
  it('(R)-1-phenylethylamine salts of (R)- and (S)-mandelic acid are diastereomers, not enantiomers nor epimers (Eliel & Wilen 1994, from memory)', () => {
    const r = rel('C[C@@H](N)c1ccccc1.O[C@@H](C(=O)O)c1ccccc1', 'C[C@@H](N)c1ccccc1.O[C@H](C(=O)O)c1ccccc1');
    expect(r).toMatchObject({ relation: 'diastereomers', epimers: false });
    expect(r.differingUnits).toHaveLength(1);
    // and the mirror image of the whole salt is its enantiomer
    const e = rel('C[C@@H](N)c1ccccc1.O[C@@H](C(=O)O)c1ccccc1', 'C[C@H](N)c1ccccc1.O[C@H](C(=O)O)c1ccccc1');
    expect(e.relation).toBe('enantiomers');
  });
  it('(R):(S) 1:2 is the mirror image of 1:2 the other way round, and not the same drawing as 2:1 written otherwise', () => {
    const r = rel(
      'C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O.C[C@@H](O)C(=O)O',
      'C[C@@H](O)C(=O)O.C[C@H](O)C(=O)O.C[C@H](O)C(=O)O',
    );
    expect(r.relation).toBe('enantiomers');
    const s = rel(
      'C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O.C[C@@H](O)C(=O)O',
      'C[C@@H](O)C(=O)O.C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O',
    );
    expect(s.relation).toBe('identical');
    expect(
      rel('C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O', 'C[C@@H](O)C(=O)O.C[C@H](O)C(=O)O.C[C@H](O)C(=O)O').relation,
    ).toBe('same-constitution');
  });
  it('a racemate drawn out vs one enantiomer: same constitution, different mixtures (no stereo relation claimed)', () => {
    const r = rel('C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O', 'C[C@H](O)C(=O)O');
    expect(r.relation).toBe('same-constitution');
    expect(r.explanation).toMatch(/different mixtures/);
  });
});

suite('salts and charge states related by their neutral parents (common practice, no source)', () => {
  it('(S)-amphetamine drawn as [NH3+] with [Cl-] vs the free base: identical parents; protonation and salt form named', () => {
    const r = rel('C[C@H]([NH3+])Cc1ccccc1.[Cl-]', 'C[C@H](N)Cc1ccccc1');
    expect(r.relation).toBe('identical');
    expect(r.otherComponents).toEqual({ onlyInA: ['[Cl-]'], onlyInB: [] });
    expect(r.formDifferences.map((d) => d.kind).sort()).toEqual(['protonation', 'salt-form']);
    expect(r.formDifferences.find((d) => d.kind === 'protonation')!.explanation).toMatch(
      /cation in A .* neutral in B/,
    );
  });
  it('the hydrochloride drawn as ions or as amine + HCl: same parent, same counter-ion', () => {
    const r = rel('C[C@H]([NH3+])Cc1ccccc1.[Cl-]', 'C[C@H](N)Cc1ccccc1.Cl');
    expect(r.relation).toBe('identical');
    expect(r.otherComponents).toEqual({ onlyInA: [], onlyInB: [] });
  });
  it('sodium (S)-lactate vs (S)- and (R)-lactic acid', () => {
    expect(rel('C[C@H](O)C(=O)[O-].[Na+]', 'C[C@H](O)C(=O)O').relation).toBe('identical');
    expect(rel('C[C@H](O)C(=O)[O-].[Na+]', 'C[C@@H](O)C(=O)O').relation).toBe('enantiomers');
  });
  it('zwitterionic L-alanine vs neutral L-alanine: identical, drawn as a zwitterion in A', () => {
    const r = rel('C[C@H]([NH3+])C(=O)[O-]', 'C[C@H](N)C(=O)O');
    expect(r.relation).toBe('identical');
    expect(r.formDifferences).toEqual([
      { kind: 'protonation', explanation: expect.stringMatching(/zwitterion in A and as neutral in B/) },
    ]);
    expect(rel('C[C@H]([NH3+])C(=O)[O-]', 'C[C@@H](N)C(=O)O').relation).toBe('enantiomers');
  });
  it('a protonated bridgehead keeps its configuration (quinuclidinium: the lone pair takes the H place)', () => {
    const r = rel('O[C@H]1C[N@@H+]2CC[C@H]1CC2.[Cl-]', 'O[C@H]1C[N@@]2CC[C@H]1CC2');
    expect(r.relation).toBe('identical');
  });
  it('nitro groups and quaternary ions are not "neutralised" (their charges are the neutral drawing)', () => {
    const nitro = neutralise(smiles('C[C@H](O)c1ccc([N+](=O)[O-])cc1'));
    expect(nitro.protonated.length + nitro.deprotonated.length).toBe(0);
    const r = rel('C[C@H](O)c1ccc([N+](=O)[O-])cc1', 'C[C@@H](O)c1ccc([N+](=O)[O-])cc1');
    expect(r).toMatchObject({ relation: 'enantiomers', formDifferences: [] });
    const q = neutralise(smiles('C[N+](C)(C)C.[Cl-]'));
    expect(q.deprotonated).toEqual([]);
    expect(q.protonated).toEqual([5]); // the chloride becomes HCl; the quaternary N stays a cation
  });
});
