/**
 * Real structures as molfiles: every 8th MoleculeNet SMILES (Wu et al., "MoleculeNet: a benchmark for molecular
 * machine learning", Chem. Sci. 2018, 9, 513-530) is turned into a V2000 molblock with 2D coordinates and
 * wedges by RDKit (npm @rdkit/rdkit), read back by parseMolfile, and compared with RDKit's own reading:
 *  - tetrahedral configurations and everything else in the graph: RDKit-canonical(writeSmiles(ours)) equals
 *    RDKit's canonical SMILES of the molblock, both with double-bond marks removed (the SMILES writer's handling
 *    of ring double bonds is checked elsewhere);
 *  - double bonds: every bond RDKit marks cis/trans has a DoubleBondStereo of the same configuration here
 *    (same atom numbering, since the molblock keeps RDKit's order).
 * Drawings our reader calls ambiguous (RDKit's layout sometimes puts two neighbours on top of each other) are
 * counted and must stay rare.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { writeSmiles } from '../../../src/chem/write/smiles.js';
import type { DoubleBondStereo } from '../../../src/chem/types.js';
import { haveSharedData } from '../../support/shared-data.js';
import { loadMoleculeNet } from '../../support/moleculenet.js';
import { rdkit, type Rd } from './molfile-rdkit.js';

interface RdJsonBond {
  atoms: [number, number];
  stereo?: string;
  stereoAtoms?: [number, number];
}

describe.skipIf(!haveSharedData('moleculenet'))('MoleculeNet structures through RDKit molblocks', () => {
  let RD: Rd;
  beforeAll(async () => {
    RD = await rdkit();
  });
  const noDb = (smi: string): string => {
    const m = RD.get_mol(smi.replace(/[/\\]/g, ''));
    if (!m) return `unreadable ${smi}`;
    const s = m.get_smiles();
    m.delete();
    return s;
  };

  it('reads every molblock, and agrees with RDKit on constitution, charges, H counts and configurations', () => {
    const rows = loadMoleculeNet().filter((_, i) => i % 8 === 0);
    let compared = 0;
    let ambiguous = 0;
    const errors: string[] = [];
    const differ: string[] = [];
    const dbDiffer: string[] = [];
    for (const { smiles } of rows) {
      const m = RD.get_mol(smiles);
      if (!m) continue;
      const block = m.get_molblock();
      const json = JSON.parse(m.get_json()) as { molecules: { bonds?: RdJsonBond[] }[] };
      const ref = m.get_smiles();
      m.delete();
      const r = parseMolfile(block);
      if (!r.ok) {
        errors.push(`${smiles}: ${r.error.code}`);
        continue;
      }
      if (r.warnings.some((w) => w.code.startsWith('stereo-'))) {
        ambiguous++;
        continue;
      }
      compared++;
      const s = r.structure;
      if (noDb(writeSmiles(s)) !== noDb(ref)) differ.push(smiles);
      for (const b of json.molecules[0]!.bonds ?? []) {
        if ((b.stereo !== 'cis' && b.stereo !== 'trans') || !b.stereoAtoms) continue;
        const e = s.stereo.find(
          (x): x is DoubleBondStereo =>
            x.kind === 'double-bond' && x.ends.includes(b.atoms[0]) && x.ends.includes(b.atoms[1]),
        );
        if (!e) {
          dbDiffer.push(`${smiles}: bond ${b.atoms} missing`);
          continue;
        }
        const [r0, r1] = e.ends[0] === b.atoms[0] ? b.stereoAtoms : [b.stereoAtoms[1], b.stereoAtoms[0]];
        const flips = (e.refs[0] === r0 ? 0 : 1) + (e.refs[1] === r1 ? 0 : 1);
        const rel = flips % 2 === 0 ? e.relation : e.relation === 'cis' ? 'trans' : 'cis';
        if (rel !== b.stereo) dbDiffer.push(`${smiles}: bond ${b.atoms} ${rel} vs ${b.stereo}`);
      }
    }
    expect(errors).toEqual([]);
    expect(differ).toEqual([]);
    expect(dbDiffer).toEqual([]);
    expect(compared).toBeGreaterThan(1500);
    expect(ambiguous).toBeLessThan(compared / 200);
  });
});
