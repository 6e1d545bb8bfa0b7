/**
 * CXSMILES enhanced-stereo groups. Field syntax from ChemAxon's published CXSMILES format description
 * (`a:` absolute, `&n:` AND, `on:` OR; 0-based atom indices in written order); RDKit writes the same fields
 * (checked: RDKit MinimalLib turns `N[C@@H](C)C(=O)O |&1:1|` into `C[C@H](N)C(=O)O |&1:1|`).
 */
import { describe, expect, it } from 'vitest';
import { parseSmiles } from '../../../src/chem/read/smiles.js';

function groups(s: string) {
  const r = parseSmiles(s);
  if (!r.ok) throw new Error(`${r.error.code} ${r.error.message}`);
  return r.structure.groups;
}

describe('CXSMILES stereo groups', () => {
  it('reads abs, AND and OR groups with their numbers', () => {
    expect(groups('C[C@H](O)[C@@H](C)[C@H](F)Cl |a:1,&1:3,o2:5|')).toEqual([
      { type: 'abs', id: 0, atoms: [1] },
      { type: 'and', id: 1, atoms: [3] },
      { type: 'or', id: 2, atoms: [5] },
    ]);
    expect(groups('C[C@H](O)[C@@H](C)O |&1:1,3|')).toEqual([{ type: 'and', id: 1, atoms: [1, 3] }]);
  });
  it('counts [H] atoms in the CXSMILES numbering, as in ours', () => {
    const r = parseSmiles('[H][C@@](C)(O)F |o1:1|');
    expect(r.ok && r.structure.groups).toEqual([{ type: 'or', id: 1, atoms: [1] }]);
    expect(r.ok && r.structure.atoms[1]!.element).toBe('C');
  });
  it('reads past coordinates, wedges, atom labels and other fields, and reads a title after the block', () => {
    const r = parseSmiles('C[C@H](O)CC |(0,0,;1.5,0,;2,1,;3,0,;4,0,),$;;;_R1;$,&1:1,c:2,wU:1.0,r| LX-00007');
    expect(r.ok && r.structure.groups).toEqual([{ type: 'and', id: 1, atoms: [1] }]);
    expect(r.ok && r.structure.title).toBe('LX-00007');
    expect(groups('CC |r|')).toEqual([]);
  });
  it('merges repeated lists of one group', () => {
    expect(groups('C[C@H](O)[C@@H](C)O |&1:1,&1:3|')).toEqual([{ type: 'and', id: 1, atoms: [1, 3] }]);
  });
  const bad: [string, string, number][] = [
    ['C[C@H](O)C |a:7|', 'cxsmiles-bad-group', 14],
    ['C[C@H](O)C |&:1|', 'cxsmiles-bad-group', 12],
    ['C[C@H](O)C |a:|', 'cxsmiles-bad-group', 14],
    ['C[C@H](O)C |a:1;2|', 'cxsmiles-bad-group', 15],
    ['C[C@H](O)C |a:1', 'cxsmiles-unclosed', 11],
  ];
  it.each(bad)('%j -> %s at %i', (smi, code, offset) => {
    const r = parseSmiles(smi);
    expect(r.ok).toBe(false);
    if (!r.ok) expect([r.error.code, r.error.at.offset]).toEqual([code, offset]);
  });
});
