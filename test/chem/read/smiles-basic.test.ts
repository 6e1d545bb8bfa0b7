import { describe, expect, it } from 'vitest';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { IMPLICIT_H, LONE_PAIR, type Structure } from '../../../src/chem/types.js';

function ok(s: string): Structure {
  const r = parseSmiles(s);
  if (!r.ok) throw new Error(`${s}: ${r.error.code} ${r.error.message}`);
  return r.structure;
}

describe('parseSmiles basics', () => {
  it('reads the organic subset with implicit hydrogens (OpenSMILES 3.1.5 organic subset valences)', () => {
    const s = ok('CCO');
    expect(s.atoms.map((a) => a.hCount)).toEqual([3, 2, 1]);
    expect(s.bonds.map((b) => b.order)).toEqual([1, 1]);
  });
  it('kekulizes benzene and pyrrole (OpenSMILES 3.5 aromaticity)', () => {
    const b = ok('c1ccccc1');
    expect(b.bonds.filter((x) => x.order === 2)).toHaveLength(3);
    expect(b.atoms.every((a) => a.aromatic && a.hCount === 1)).toBe(true);
    const p = ok('c1cc[nH]c1');
    expect(p.bonds.filter((x) => x.order === 2)).toHaveLength(2);
    expect(p.atoms.map((a) => a.hCount)).toEqual([1, 1, 1, 1, 1]);
  });
  it('puts the bracket H second after a preceding atom and first on a leading atom (OpenSMILES 3.9.5)', () => {
    const s = ok('N[C@@H](C)C(=O)O');
    expect(s.stereo[0]).toEqual({ kind: 'tetrahedral', centre: 1, ligands: [0, IMPLICIT_H, 2, 3], winding: '@@' });
    const t = ok('[C@@H](N)(C)C(=O)O');
    expect(t.stereo[0]).toEqual({ kind: 'tetrahedral', centre: 0, ligands: [IMPLICIT_H, 1, 2, 3], winding: '@@' });
  });
  it('gives a three-connected sulfoxide a lone pair where the H would go (OpenSMILES 3.9.5)', () => {
    const s = ok('C[S@](=O)c1ccccc1');
    expect(s.stereo[0]).toMatchObject({ centre: 1, ligands: [0, LONE_PAIR, 2, 3] });
  });
});
