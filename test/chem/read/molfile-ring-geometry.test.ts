/**
 * Double bonds in small rings: their drawn geometry is forced, so a 2D molfile records no configuration for them
 * (kept for rings of 8 or more and for acyclic bonds). Reference: RDKit MinimalLib (npm @rdkit/rdkit) draws
 * each molecule (get_molblock lays out 2D coordinates; Kekulé bonds, CTfile V2000) and reads its own molblock;
 * the double-bond configurations it keeps (/ \ in its canonical SMILES) must be exactly ours. Smallest ring
 * for a stereogenic double bond: 8 (trans-cyclooctene, from memory).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { MainModule } from '@rdkit/rdkit';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { writeSmiles } from '../../../src/chem/write/smiles.js';
import { ok } from './molfile-examples.js';
import { loadRDKit, rdkitCanonical } from './smiles-rdkit-helper.js';

describe('2D molfiles: no double-bond configuration from rings under 8 atoms (checked with RDKit)', () => {
  let rd: MainModule;
  beforeAll(async () => {
    rd = await loadRDKit();
  });
  const drawn = (smiles: string): string => {
    const m = rd.get_mol(smiles)!;
    const mb = m.get_molblock();
    m.delete();
    return mb;
  };
  const cases: [string, number][] = [
    ['Cc1ccccc1C', 0], // Kekulé benzene with ortho substituents
    ['Cc1cccc2ccccc12', 0], // naphthalene
    ['CC1=C(C)CCCC1', 0], // cyclohexene
    ['CC1=C(C)CCC1', 0], // cyclopentene
    ['OC(=O)c1ccc[nH]1', 0], // pyrrole
    ['C/C1=C(/C)CCCCCC1', 1], // cyclooctene: 8-ring, kept
    [String.raw`C/C=C\C1=CCCCC1`, 1], // acyclic bond kept, ring bond skipped
    ['C/C=C/C', 1],
  ];
  it.each(cases)('%s: %i double-bond configuration(s)', (smiles, expected) => {
    const mb = drawn(smiles);
    const s = ok(parseMolfile(mb));
    const dbs = s.stereo.filter((e) => e.kind === 'double-bond');
    expect(dbs.length).toBe(expected);
    const rdkitSide = rdkitCanonical(rd, mb)!;
    expect((rdkitSide.match(/[/\\]/g) ?? []).length > 0).toBe(expected > 0);
    expect(rdkitCanonical(rd, writeSmiles(s))).toBe(rdkitSide);
  });
});
