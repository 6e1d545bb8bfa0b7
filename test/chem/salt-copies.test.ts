/**
 * Salts holding several copies of one parent: (S)-amphetamine sulfate is a 2:1 salt (two (S)-amphetamine
 * cations per sulfate; Merck Index, dexamfetamine sulfate — from memory). The parent has one stereocentre, so
 * 2 stereoisomers, one enantiomer pair, no meso form (Eliel & Wilen 1994, counting rule 2^n, from memory).
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { relate } from '../../src/chem/relate.js';
import { smiles } from './stereo-helpers.js';

const SULFATE = 'C[C@H](N)Cc1ccccc1.C[C@H](N)Cc1ccccc1.OS(=O)(=O)O';
const HCL = 'C[C@H](N)Cc1ccccc1.Cl';

suite('identical copies of the parent', () => {
  it('(S)-amphetamine sulfate 2:1: both copies are parent, counted per copy (Merck Index, from memory)', () => {
    const f = describe(smiles(SULFATE));
    expect(f.components.map((c) => c.role)).toEqual(['parent', 'parent', 'other']);
    expect(f.components[0].copies).toBe(2);
    expect(f.components[2].copies).toBeUndefined();
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2, achiral: 0, meso: 0, units: 1 });
    expect(f.chiral).toBe(true);
    expect(f.meso).toBe(false);
    expect(f.units).toHaveLength(2); // both stereocentres are still listed
  });
  it('compare with the hydrochloride: parents identical, counter-ions listed apart', () => {
    const r = relate(smiles(SULFATE), smiles(HCL));
    expect(r.relation).toBe('identical');
    expect(r.otherComponents).toEqual({ onlyInA: ['OS(=O)(=O)O'], onlyInB: ['Cl'] });
  });
  it('molecules of opposite configuration are not copies: the racemic sulfate is a racemate drawn out (Gold Book "racemate")', () => {
    const f = describe(smiles('C[C@H](N)Cc1ccccc1.C[C@@H](N)Cc1ccccc1.OS(=O)(=O)O'));
    expect(f.components.map((c) => c.role)).toEqual(['parent', 'parent', 'other']);
    expect(f.components.every((c) => c.copies === undefined)).toBe(true);
    expect(f.mixture).toMatchObject({ kind: 'racemate', ratio: [1, 1] });
    expect(f).toMatchObject({ chiral: true, meso: false });
  });
  it('a plain 1:1 salt keeps one parent and no copies field (the JSON fields stay as they were)', () => {
    const f = describe(smiles(HCL));
    expect(f.components.map((c) => c.role)).toEqual(['parent', 'other']);
    expect('copies' in f.components[0]).toBe(false);
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2, meso: 0 });
  });
});
