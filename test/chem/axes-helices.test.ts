/**
 * Stereogenic axes and helices the input does not draw: perceived from the constitution, counted, and left open
 * (never "achiral") where the input format cannot state their configuration.
 *
 * Sources: BINOL, 1,1'-bi-2-naphthol, is resolved into (R)/(S) atropisomers; 6,6'-dinitrobiphenyl-2,2'-
 * dicarboxylic acid was the first atropisomer resolved (Christie & Kenner 1922) — both from memory. The
 * threshold of three ortho substituents is a rule of thumb (common practice, no source). Hexahelicene is resolved
 * into (P)/(M) enantiomers (Newman & Lednicer 1956, from memory); the CIP validation suite (Hanson et al.,
 * J. Chem. Inf. Model. 2018, 58, 1755) labels (P)-hexahelicene VS010 and (M) VS011.
 */
import { readFileSync } from 'node:fs';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { readSdRecords } from '../../src/chem/read/index.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import type { Structure } from '../../src/chem/types.js';
import { haveSharedData, sharedDataPath } from '../support/shared-data.js';
import { smiles } from './stereo-helpers.js';

const BINOL = 'OC1=CC=C2C=CC=CC2=C1C1=C2C=CC=CC2=CC=C1O';
const DINITRO = 'OC(=O)c1cccc([N+](=O)[O-])c1-c1c(cccc1[N+](=O)[O-])C(O)=O';
const HEXAHELICENE = 'c1ccc2c(c1)ccc1ccc3ccc4ccc5ccccc5c4c3c21';

suite('atropisomeric axes from SMILES', () => {
  it('BINOL: one axis, 2 stereoisomers (one pair), chirality open with a remark (from memory)', () => {
    const f = describe(smiles(BINOL));
    expect(f.units).toHaveLength(1);
    expect(f.units[0]).toMatchObject({ kind: 'biaryl', defined: false, formatCannotState: true });
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2, achiral: 0, pairs: 1 });
    expect(f.chiral).toBeNull();
    expect(f.meso).toBeNull();
    expect(f.mirror.chiral).toBeNull();
    expect(f.remarks.join(' ')).toContain('rule of thumb');
  });
  it("6,6'-dinitrobiphenyl-2,2'-dicarboxylic acid: one axis, one pair (Christie & Kenner 1922, from memory)", () => {
    const f = describe(smiles(DINITRO));
    expect(f.units.map((u) => u.kind)).toEqual(['biaryl']);
    expect(f.stereoisomers).toMatchObject({ total: 2, pairs: 1 });
    expect(f.chiral).toBeNull();
  });
  it("1,1'-binaphthyl counts (a fused ring at an ortho position counts twice; common practice, no source)", () => {
    expect(describe(smiles('c1ccc2ccccc2c1-c1cccc2ccccc12')).stereoisomers.total).toBe(2);
  });
  it('two ortho substituents (2,2′-dimethylbiphenyl) or a symmetric ring (2,6-dimethylphenyl) give no axis', () => {
    expect(describe(smiles('Cc1ccccc1-c1ccccc1C')).units).toEqual([]);
    expect(describe(smiles('Cc1cccc(C)c1-c1c(C)cccc1Cl')).units).toEqual([]);
    expect(describe(smiles('Cc1cccc(C)c1-c1c(C)cccc1Cl')).chiral).toBe(false);
  });
  it('the threshold is a setting: 2 makes 2,2′-dimethylbiphenyl an axis, 5 drops the dinitro acid', () => {
    const two = describe(smiles('Cc1ccccc1-c1ccccc1C'), { axisOrthoMin: 2 });
    expect(two.units.map((u) => u.kind)).toEqual(['biaryl']);
    expect(two.stereoisomers.total).toBe(2);
    expect(describe(smiles(DINITRO), { axisOrthoMin: 5 }).units).toEqual([]);
  });
  it('a molfile draws what SMILES cannot: a 2D BINOL without wedges leaves the axis undefined, not open', () => {
    const f = describe(binolMolfileWithoutWedges());
    expect(f.units).toHaveLength(1);
    expect(f.units[0].defined).toBe(false);
    expect(f.units[0].formatCannotState).toBeUndefined();
  });
});

suite('helicenes', () => {
  it('hexahelicene as SMILES: a helix, 2 stereoisomers, chiral, its sense open (Newman & Lednicer 1956, from memory)', () => {
    const f = describe(smiles(HEXAHELICENE));
    expect(f.units.map((u) => u.kind)).toEqual(['helix']);
    expect(f.units[0]).toMatchObject({ defined: false, formatCannotState: true });
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2 });
    // either sense is chiral: the helix is certain (no rule of thumb), only which one is open
    expect(f.chiral).toBe(true);
  });
  it('[4]helicene (benzo[c]phenanthrene) is no helix unit: it racemizes fast (from memory)', () => {
    expect(describe(smiles('c1ccc2c(c1)ccc1ccc3ccccc3c12')).units).toEqual([]);
  });
});

suite.skipIf(!haveSharedData('cip-validation-suite'))('helicenes from the CIP validation suite', () => {
  const record = (file: string, id: string): Structure => {
    const recs = readSdRecords(readFileSync(sharedDataPath('cip-validation-suite', file), 'utf8'));
    for (const r of recs)
      if (r.result.ok && r.result.structure.properties.STRUCTURE_ID === id) return r.result.structure;
    throw new Error(`${id} not found in ${file}`);
  };
  for (const file of ['compounds_2d.sdf', 'compounds_3d.sdf']) {
    it(`${file}: VS010 is (P), VS011 (M), each chiral; a record and its mirror image are enantiomers`, () => {
      const p = record(file, 'VS010');
      const fp = describe(p);
      expect(fp.units.map((u) => [u.kind, u.label])).toEqual([['helix', 'P']]);
      expect(fp.chiral).toBe(true);
      expect(describe(record(file, 'VS011')).units.map((u) => u.label)).toEqual(['M']);
      expect(describe(mirror(p)).units.map((u) => u.label)).toEqual(['M']);
      expect(relate(p, mirror(p)).relation).toBe('enantiomers');
      expect(relate(p, record(file, 'VS011')).relation).toBe('enantiomers');
    });
  }
});

/** BINOL from a 2D molfile with no wedges (coordinates need not be realistic for perception). */
function binolMolfileWithoutWedges(): Structure {
  const s = smiles(BINOL);
  return {
    ...s,
    dimension: 2,
    atoms: s.atoms.map((a, i) => ({ ...a, coords: [i, (i * 7) % 5, 0] as [number, number, number] })),
  };
}
