/**
 * Epimers are diastereomers that have the opposite configuration at only one of two or more tetrahedral
 * stereogenic centres (IUPAC Gold Book, "epimers"): decided by configuration through the atom mapping, not by
 * CIP descriptors, which change with the neighbours. cis- and trans-1,4-dimethylcyclohexane differ in the
 * configuration of one centre, yet both pseudoasymmetric descriptors change (1s,4s vs 1r,4r; IUPAC 2013
 * P-93.5.1.3, from memory): epimers, one differing unit, one relabelled unit. myo- and scyllo-inositol differ at
 * one centre (scyllo-inositol is the epimer of myo-inositol at C2; Merck Index, from memory) while five
 * descriptors change. Threose/erythrose are C2 epimers (Eliel & Wilen 1994, from memory).
 */
import { describe as suite, expect, it } from 'vitest';
import { relate } from '../../src/chem/relate.js';
import { smiles } from './stereo-helpers.js';

suite('epimers and the differing-unit list', () => {
  it('cis/trans-1,4-dimethylcyclohexane: epimers by configuration; the other descriptor changes too and is listed apart (P-93.5.1.3, from memory)', () => {
    const r = relate(smiles('C[C@H]1CC[C@@H](C)CC1'), smiles('C[C@H]1CC[C@H](C)CC1'));
    expect(r.relation).toBe('diastereomers');
    expect(r.epimers).toBe(true);
    expect(r.differingUnits).toHaveLength(1);
    expect(r.relabelledUnits).toHaveLength(1);
    const all = [...r.differingUnits, ...r.relabelledUnits];
    expect(all.map((u) => u.atomsB[0]).sort()).toEqual([2, 5]);
    for (const u of all) expect(u.labelA).not.toBe(u.labelB);
  });
  it('scyllo- vs myo-inositol: epimers at one centre although five descriptors change (Merck Index, from memory)', () => {
    const scyllo = 'O[C@H]1[C@H](O)[C@@H](O)[C@H](O)[C@@H](O)[C@@H]1O';
    const myo = 'O[C@@H]1[C@H](O)[C@@H](O)[C@H](O)[C@@H](O)[C@@H]1O';
    const r = relate(smiles(scyllo), smiles(myo));
    expect(r).toMatchObject({ relation: 'diastereomers', epimers: true });
    expect(r.differingUnits.map((u) => u.atomsB)).toEqual([[2]]);
    expect(r.relabelledUnits.length).toBeGreaterThanOrEqual(4);
    expect(r.explanation).toMatch(/^epimers: .*only at atom 2 \(C\)/);
  });
  it('erythrose vs threose: epimers at one centre, named "atom 3 (C)" not "C3" (Eliel & Wilen 1994, from memory)', () => {
    const r = relate(smiles('O=C[C@H](O)[C@H](O)CO'), smiles('O=C[C@@H](O)[C@H](O)CO'));
    expect(r.epimers).toBe(true);
    expect(r.differingUnits).toHaveLength(1);
    expect(r.explanation).toMatch(/atom 3 \(C\)/);
    expect(r.explanation).not.toMatch(/\bC3\b/);
  });
});
