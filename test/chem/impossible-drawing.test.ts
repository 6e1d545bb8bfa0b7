/**
 * A drawing whose bridgehead configurations cannot both hold is no stereoisomer: it must not be called chiral,
 * achiral or meso. Tröger's base has one pair of enantiomers and no meso form (its two bridgehead N are coupled
 * by the methano bridge; resolved by Prelog & Wieland 1944 — from memory). Meso in the Gold Book sense (IUPAC
 * Gold Book, "meso-compounds") needs an achiral member of a set that includes chiral members.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { smiles } from './stereo-helpers.js';

const TROGER_BAD = 'CC1=CC2=C(C=C1)[N@]3CC4=C(C=CC(=C4)C)[N@](C2)C3';
const TROGER_OK = 'CC1=CC2=C(C=C1)[N@]3CC4=C(C=CC(=C4)C)[N@@](C2)C3';

suite("impossible drawings (Tröger's base)", () => {
  it('inconsistent bridgeheads: chiral and meso null, the remark kept (Prelog & Wieland 1944, from memory)', () => {
    const f = describe(smiles(TROGER_BAD));
    expect(f.chiral).toBeNull();
    expect(f.meso).toBeNull();
    expect(f.mirror.chiral).toBeNull();
    expect(f.mirror.fixedAtoms).toEqual([]);
    expect(f.remarks.some((r) => /cannot both hold/.test(r))).toBe(true);
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2, meso: 0 });
  });
  it('the consistent drawing is chiral and not meso (from memory)', () => {
    const f = describe(smiles(TROGER_OK));
    expect(f.chiral).toBe(true);
    expect(f.meso).toBe(false);
    expect(f.remarks.some((r) => /cannot both hold/.test(r))).toBe(false);
  });
  it('meso is true only where the count holds a meso form (Gold Book meso; Eliel & Wilen 1994, from memory)', () => {
    for (const smi of [
      TROGER_BAD,
      TROGER_OK,
      'O[C@@H](C(O)=O)[C@H](O)C(O)=O', // meso-tartaric acid
      'C[C@H]1CC[C@@H](C)CC1', // cis-1,4-dimethylcyclohexane: achiral, no chiral isomer
      'OC1C(O)C(O)C(O)C(O)C1O',
    ]) {
      const f = describe(smiles(smi));
      if (f.meso === true) expect(f.stereoisomers.meso, smi).toBeGreaterThan(0);
    }
    expect(describe(smiles('O[C@@H](C(O)=O)[C@H](O)C(O)=O')).meso).toBe(true);
  });
});
