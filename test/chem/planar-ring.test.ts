/**
 * trans double bonds in rings of 8–11 atoms are planar chiral: (E)-cyclooctene was resolved into its enantiomers
 * by Cope et al. (J. Am. Chem. Soc. 1963 — from memory), so cyclooctene has three stereoisomers: Z and the two
 * E enantiomers (from memory). (Z)-cyclooctene is achiral (from memory); a trans double bond in a 12-membered
 * ring rotates freely through the ring (common practice, no source): no planar unit. SMILES cannot state the
 * twist, so a drawn (E)-cyclooctene is chiral with its planar unit open.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { parseMolfile } from '../../src/chem/read/index.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import type { Structure } from '../../src/chem/types.js';
import { havePythonRdkit, runPython } from '../support/python-rdkit.js';
import { smiles } from './stereo-helpers.js';

suite('trans double bonds in medium rings', () => {
  it('cyclooctene: 3 stereoisomers, Z and one E pair (Cope et al. 1963, from memory)', () => {
    expect(describe(smiles('C1CCCC=CCC1')).stereoisomers).toMatchObject({ total: 3, chiral: 2, achiral: 1 });
  });
  it('(E)-cyclooctene: chiral, its planar unit open with a remark (SMILES cannot state the twist)', () => {
    const f = describe(smiles('C1CCC/C=C/CC1'));
    expect(f.chiral).toBe(true);
    const planar = f.units.filter((u) => u.kind === 'planar');
    expect(planar).toHaveLength(1);
    expect(planar[0]).toMatchObject({ defined: false, formatCannotState: true, atoms: [5, 6] });
    expect(f.remarks.some((r) => /planar chiral/.test(r))).toBe(true);
  });
  it('(Z)-cyclooctene stays achiral, with no planar unit and no remark (from memory)', () => {
    const f = describe(smiles('C1CCC/C=C\\CC1'));
    expect(f.chiral).toBe(false);
    expect(f.units.map((u) => u.kind)).toEqual(['double-bond']);
    expect(f.remarks).toEqual([]);
  });
  it('cyclooctene with the bond left undefined: chirality open (Z is achiral, E chiral)', () => {
    expect(describe(smiles('C1CCCC=CCC1')).chiral).toBeNull();
  });
  it('(E)-cyclononene (9 atoms) is chiral too; (E)-cyclododecene (12 atoms) has no planar unit (from memory)', () => {
    expect(describe(smiles('C1CCCC/C=C/CC1')).chiral).toBe(true);
    const f = describe(smiles('C1CCCCCCCC/C=C/CC1'));
    expect(f.chiral).toBe(false);
    expect(f.stereoisomers.total).toBe(2);
  });
  it('trans in the ring is read from the ring atoms, not the drawn reference (1-methylcyclooctene)', () => {
    // methyl trans to the ring CH2 = the two ring bonds cis: (Z)-ring, achiral
    expect(describe(smiles('C/C1=C/CCCCCC1')).chiral).toBe(false);
    // methyl cis to the ring CH2 = ring bonds trans: planar chiral
    expect(describe(smiles('C/C1=C\\CCCCCC1')).chiral).toBe(true);
  });
  it('3-methylcyclooctene: 6, all chiral (C3 times Z, E-twist-a, E-twist-b; from the model above)', () => {
    expect(describe(smiles('CC1CC=CCCCC1')).stereoisomers).toMatchObject({ total: 6, chiral: 6 });
  });
  it('(E) vs (Z)-cyclooctene are diastereomers; (E) vs (E) from SMILES is open (the twist is not stated)', () => {
    expect(relate(smiles('C1CCC/C=C/CC1'), smiles('C1CCC/C=C\\CC1')).relation).toBe('diastereomers');
    expect(relate(smiles('C1CCC/C=C/CC1'), smiles('C1CCC/C=C/CC1')).relation).toBe('same-constitution');
  });
});

// RDKit (python3-rdkit 2022.09, ETKDGv3) embeds (E)-cyclononene; the sign of its ring torsion C4–C5=C6–C7
// (180° ± the twist) tells the two planar-chiral forms apart independently of our code. (It cannot embed
// (E)-cyclooctene at all — a limitation of that version, so the 9-ring is used.)
const EMBED = `
import json, sys
from rdkit import Chem
from rdkit.Chem import AllChem, rdMolTransforms as T
m = Chem.AddHs(Chem.MolFromSmiles('C1CCCC/C=C/CC1'))
p = AllChem.ETKDGv3(); p.randomSeed = 42
out = []
for c in AllChem.EmbedMultipleConfs(m, 8, p):
    out.append({'molfile': Chem.MolToMolBlock(m, confId=c), 'torsion': T.GetDihedralDeg(m.GetConformer(c), 4, 5, 6, 7)})
print(json.dumps(out))
`;

suite.skipIf(!havePythonRdkit())('(E)-cyclononene from 3D coordinates (RDKit embeddings)', () => {
  it('the twist is read from the coordinates; same twist identical, opposite twist enantiomers', () => {
    const confs = runPython<{ molfile: string; torsion: number }[]>(EMBED, null);
    const read = (m: string): Structure => {
      const r = parseMolfile(m);
      if (!r.ok) throw new Error(r.error.message);
      return r.structure;
    };
    const twisted = confs.filter((c) => Math.abs(Math.sin((c.torsion * Math.PI) / 180)) > 0.01);
    expect(twisted.length).toBeGreaterThanOrEqual(4);
    expect(new Set(twisted.map((c) => Math.sign(Math.sin((c.torsion * Math.PI) / 180)))).size).toBe(2);
    const first = read(twisted[0].molfile);
    const sign0 = Math.sign(Math.sin((twisted[0].torsion * Math.PI) / 180));
    for (const c of twisted) {
      const s = read(c.molfile);
      const f = describe(s);
      expect(f.chiral).toBe(true);
      expect(f.units.find((u) => u.kind === 'planar')?.defined).toBe(true);
      expect(relate(s, mirror(s)).relation).toBe('enantiomers');
      const same = Math.sign(Math.sin((c.torsion * Math.PI) / 180)) === sign0;
      expect(relate(first, s).relation).toBe(same ? 'identical' : 'enantiomers');
    }
  });
});
