/**
 * Depiction data: a molfile keeps its own coordinates and wedges (CTfile format: V3000 atom lines x y z, bond
 * CFG=1 wedge / 3 hash); a SMILES gets a computed layout whose atoms carry the SMILES input numbering, so CIP
 * labels and undefined-unit marks land on the right atoms.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { describe as describeStructure, readStructure } from '../../src/chem/index.js';
import { layoutStructure } from '../../src/chem/depict.js';
import { pictureData } from '../../src/report/html/picture.js';

function read(text: string) {
  const r = readStructure(text, { format: text.includes('\n') ? 'molfile' : 'smiles' });
  if (!r.ok) throw new Error(r.error.message);
  return r.structure;
}

describe('layoutStructure', () => {
  it('keeps a 2D molfile as drawn: its coordinates, its wedge, its atom numbers', () => {
    const mol = readFileSync('fixtures/demo-registry/compounds/LX-00009.mol', 'utf8');
    const layout = layoutStructure(read(mol))!;
    expect(layout.origin).toBe('drawn');
    expect(layout.atoms).toHaveLength(15);
    // V3000 atom lines of the file: "1 C 5.250000 -1.299038", "11 C -3.000000 0.000000"
    expect(layout.atoms[0]).toMatchObject({ x: 5.25, y: -1.299038, element: 'C', n: 1 });
    expect(layout.atoms[10]).toMatchObject({ x: -3, y: 0, n: 11 });
    const wedges = layout.bonds.filter((b) => b.style !== 'plain');
    const cfg = [...mol.matchAll(/^M {2}V30 \d+ \d+ (\d+) (\d+) CFG=(\d)/gm)];
    expect(wedges).toHaveLength(cfg.length);
    for (const [, a, b, c] of cfg) {
      const w = wedges.find((x) => x.a === Number(a) - 1 && x.b === Number(b) - 1)!;
      expect(w.style).toBe(c === '1' ? 'wedge' : c === '3' ? 'hash' : 'wavy');
    }
  });

  it('lays out a SMILES with its input numbering, so labels sit on the right atoms', () => {
    // (R)-butan-2-ol: atom 2 is the stereocentre, bonded to atoms 1, 3 (O) and 4
    const s = read('C[C@@H](O)CC');
    const layout = layoutStructure(s)!;
    expect(layout.origin).toBe('computed');
    expect(layout.atoms.map((a) => a.n).sort()).toEqual([1, 2, 3, 4, 5]);
    const byN = (n: number) => layout.atoms.findIndex((a) => a.n === n);
    const bonded = (p: number, q: number) =>
      layout.bonds.some((b) => (b.a === byN(p) && b.b === byN(q)) || (b.a === byN(q) && b.b === byN(p)));
    expect(layout.atoms[byN(3)]!.element).toBe('O');
    expect(bonded(2, 3) && bonded(2, 1) && bonded(2, 4) && bonded(4, 5)).toBe(true);
    // the stereocentre carries the one wedge or hash, at its narrow end
    const stereo = layout.bonds.filter((b) => b.style === 'wedge' || b.style === 'hash');
    expect(stereo).toHaveLength(1);
    expect(stereo[0]!.a).toBe(byN(2));

    const facts = describeStructure(s);
    const pic = pictureData(layout, facts.units);
    expect(pic.u).toEqual([[[byN(2)], 'R', 1]]);
    expect(pic.t[byN(3)]).toEqual(['O', 1, 0, 0]); // OH
    expect(pic.t[byN(2)]).toBe(0); // a plain carbon is a vertex
  });

  it('marks undefined units on their atoms', () => {
    // 2,3-dibromobutane without stereo marks: C2 and C3 (input atoms 2 and 4) undefined
    const s = read('CC(Br)C(Br)C');
    const pic = pictureData(layoutStructure(s)!, describeStructure(s).units);
    const undefinedAtoms = pic.u.filter((u) => u[2] === 0).map((u) => pic.n[u[0][0]!]);
    expect(undefinedAtoms.sort()).toEqual([2, 4]);
  });
});
