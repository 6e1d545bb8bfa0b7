/**
 * The N bridge of tropane (8-azabicyclo[3.2.1]octane) and granatane (9-azabicyclo[3.3.1]nonane) alkaloids is an
 * ordinary tertiary amine: its substituent flips between the two faces by nitrogen inversion, so it is no
 * stereocentre (Eliel & Wilen, Stereochemistry of Organic Compounds, 1994, ch. 8 — from memory; cocaine has four
 * stereocentres C1, C2, C3, C5 and 2^4 / 2 = 8 stereoisomers, the bridgeheads being coupled — from memory).
 * A nitrogen that is a bridgehead itself (Tröger's base, quinuclidine) stays locked.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import { smiles } from './stereo-helpers.js';

const COCAINE = 'COC(=O)[C@H]1[C@@H](OC(=O)c2ccccc2)C[C@@H]2CC[C@H]1N2C';

suite('ring-bridging amine nitrogen', () => {
  it('cocaine: 8 stereoisomers, not 16; the N bridge is no unit (from memory)', () => {
    const f = describe(smiles('COC(=O)C1C(OC(=O)c2ccccc2)CC2CCC1N2C'));
    expect(f.stereoisomers).toMatchObject({ total: 8, chiral: 8, achiral: 0 });
    expect(f.units.map((u) => u.element)).toEqual(['C', 'C', 'C', 'C']);
  });
  it('(–)-cocaine drawn in full is fully defined and chiral; its mirror image is its enantiomer', () => {
    const s = smiles(COCAINE);
    const f = describe(s);
    expect(f.undefined).toBe(0);
    expect(f.chiral).toBe(true);
    expect(relate(s, mirror(s)).relation).toBe('enantiomers');
  });
  it('tropan-3-ol: 2 (tropine and pseudotropine, both achiral; from memory)', () => {
    expect(describe(smiles('CN1C2CCC1CC(O)C2')).stereoisomers).toMatchObject({ total: 2, achiral: 2 });
  });
  it('granatane N (9-methyl-9-azabicyclo[3.3.1]nonan-3-one): no N centre, 1 stereoisomer (from memory)', () => {
    const f = describe(smiles('CN1C2CCCC1CC(=O)C2'));
    expect(f.units.filter((u) => u.element === 'N')).toEqual([]);
    expect(f.stereoisomers.total).toBe(1);
  });
  it('scopolamine drawn with its centres defined has no undefined unit (the N-methyl flips)', () => {
    const f = describe(smiles('CN1[C@@H]2C[C@@H](C[C@H]1[C@H]1O[C@@H]21)OC(=O)[C@H](CO)c1ccccc1'));
    expect(f.undefined).toBe(0);
    expect(f.units.filter((u) => u.element === 'N')).toEqual([]);
  });
  it("quinuclidine-type and Tröger's base N stay centres (true bridgeheads; from memory)", () => {
    const f = describe(smiles('CC1=CC2=C(C=C1)N3CC4=C(C=CC(=C4)C)N(C2)C3'));
    expect(f.units.filter((u) => u.element === 'N')).toHaveLength(2);
    expect(f.stereoisomers.total).toBe(2);
  });
});
