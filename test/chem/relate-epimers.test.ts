/**
 * Epimers are diastereomers that differ in configuration at only one of several stereogenic centres (IUPAC
 * Gold Book, "epimers"). cis- and trans-1,4-dimethylcyclohexane are diastereomers whose two pseudoasymmetric
 * descriptors both change (1s,4s vs 1r,4r; IUPAC 2013 P-93.5.1.3, from memory): not epimers, and the differing
 * units list both. Threose/erythrose are C2 epimers (Eliel & Wilen 1994, from memory).
 */
import { describe as suite, expect, it } from 'vitest';
import { relate } from '../../src/chem/relate.js';
import { smiles } from './stereo-helpers.js';

suite('epimers and the differing-unit list', () => {
  it('cis/trans-1,4-dimethylcyclohexane: diastereomers, not epimers, both centres listed (P-93.5.1.3, from memory)', () => {
    const r = relate(smiles('C[C@H]1CC[C@@H](C)CC1'), smiles('C[C@H]1CC[C@H](C)CC1'));
    expect(r.relation).toBe('diastereomers');
    expect(r.epimers).toBe(false);
    expect(r.differingUnits.map((u) => u.atomsB[0]).sort()).toEqual([2, 5]);
    for (const u of r.differingUnits) expect(u.labelA).not.toBe(u.labelB);
    expect(r.explanation).not.toMatch(/only/);
  });
  it('every unit whose label differs is listed (labels and list agree)', () => {
    const r = relate(smiles('C[C@H]1CC[C@@H](C)CC1'), smiles('C[C@H]1CC[C@H](C)CC1'));
    const listed = new Set(r.differingUnits.map((u) => u.atomsA[0]));
    expect(listed.has(2) && listed.has(5)).toBe(true);
  });
  it('erythrose vs threose: epimers at one centre, named "atom 3 (C)" not "C3" (Eliel & Wilen 1994, from memory)', () => {
    const r = relate(smiles('O=C[C@H](O)[C@H](O)CO'), smiles('O=C[C@@H](O)[C@H](O)CO'));
    expect(r.epimers).toBe(true);
    expect(r.differingUnits).toHaveLength(1);
    expect(r.explanation).toMatch(/atom 3 \(C\)/);
    expect(r.explanation).not.toMatch(/\bC3\b/);
  });
});
