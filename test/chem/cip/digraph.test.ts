/**
 * The hierarchical digraph and the rules on structures built by hand (build.ts), no reader involved.
 * Sources: IUPAC 2013 recommendations P-92 (sections from memory), Hanson et al. 2018 (J. Chem. Inf. Model. 58,
 * 1755); hand-worked configurations say so.
 */
import { describe, expect, it } from 'vitest';
import { assignCip } from '../../../src/chem/cip/index.js';
import { buildGraph, mancudeOf } from '../../../src/chem/cip/graph.js';
import { Digraph } from '../../../src/chem/cip/digraph.js';
import { IMPLICIT_H, LONE_PAIR } from '../../../src/chem/types.js';
import { build } from './build.js';

describe('digraph construction (P-92.1.4)', () => {
  it('a double bond gives each end a duplicate of the other, with no substituents of its own', () => {
    // formaldehyde H2C=O, rooted at C
    const s = build([{ el: 'C', h: 2 }, 'O'], [[0, 1, 2]], []);
    const dg = new Digraph(buildGraph(s), 0, -1);
    const kids = dg.kids(dg.root);
    expect(kids.map((k) => [k.z, k.dup])).toEqual([
      [8, false],
      [8, true],
      [1, false],
      [1, false],
    ]);
    const o = kids[0];
    expect(dg.kids(o).map((k) => [k.z, k.dup])).toEqual([[6, true]]);
    expect(dg.kids(kids[1])).toEqual([]);
  });

  it('a ring closure gives a duplicate of the atom already on the path, at the distance of that atom (Rule 1b)', () => {
    // cyclopropane C0-C1-C2
    const s = build(
      [
        { el: 'C', h: 2 },
        { el: 'C', h: 2 },
        { el: 'C', h: 2 },
      ],
      [
        [0, 1],
        [1, 2],
        [2, 0],
      ],
      [],
    );
    const dg = new Digraph(buildGraph(s), 0, -1);
    const c1 = dg.kids(dg.root).find((k) => k.atom === 1)!;
    const c2 = dg.kids(c1).find((k) => k.atom === 2)!;
    const dupRoot = dg.kids(c2).find((k) => k.atom === 0)!;
    expect(dupRoot.dup).toBe(true);
    expect(dupRoot.dist).toBe(0);
    expect(dupRoot.depth).toBe(3);
  });

  it('mancude rings: the duplicate of pyridine C2 has atomic number (7 + 6) / 2 = 6.5, benzene C has 6 (P-92.1.4.4, from memory)', () => {
    const ring = (first: string) =>
      build(
        [first, ...'CCCCC'.split('')].map((el) => ({ el, h: el === 'N' ? 0 : 1 })),
        [
          [0, 1, 2],
          [1, 2],
          [2, 3, 2],
          [3, 4],
          [4, 5, 2],
          [5, 0],
        ],
        [],
      );
    const py = mancudeOf(buildGraph(ring('N')));
    expect(py.dupZ[1]).toBeCloseTo(6.5);
    expect(py.dupZ[5]).toBeCloseTo(6.5);
    expect(py.dupZ[3]).toBeCloseTo(6);
    expect(py.dupZ[0]).toBeCloseTo(6);
    const bz = mancudeOf(buildGraph(ring('C')));
    expect(bz.dupZ.every((z) => Math.abs(z - 6) < 1e-9)).toBe(true);
  });

  it('cyclohexa-1,3-diene is not mancude (an sp3 ring atom breaks the conjugated cycle)', () => {
    const s = build(
      ['C', 'C', 'C', 'C', 'C', 'C'].map((el, i) => ({ el, h: i < 4 ? 1 : 2 })),
      [
        [0, 1, 2],
        [1, 2],
        [2, 3, 2],
        [3, 4],
        [4, 5],
        [5, 0],
      ],
      [],
    );
    expect(mancudeOf(buildGraph(s)).bond.size).toBe(0);
  });
});

describe('descriptors on hand-built structures', () => {
  // CHFClBr: atoms C0 F1 Cl2 Br3; ligands [F, H, Cl, Br]
  const chfclbr = (winding: '@' | '@@', ligands: [number, number, number, number] = [1, IMPLICIT_H, 2, 3]) =>
    build(
      [{ el: 'C', h: 1 }, 'F', 'Cl', 'Br'],
      [
        [0, 1],
        [0, 2],
        [0, 3],
      ],
      [{ kind: 'tetrahedral', centre: 0, ligands, winding }],
    );

  it('CHFClBr: looking from F, H-Cl-Br anticlockwise is R (Br > Cl > F > H, Rule 1a; worked by hand)', () => {
    expect(assignCip(chfclbr('@'))[0].label).toBe('R');
    expect(assignCip(chfclbr('@@'))[0].label).toBe('S');
  });

  it('an odd permutation of the ligand list with the same winding is the other enantiomer', () => {
    expect(assignCip(chfclbr('@', [IMPLICIT_H, 1, 2, 3]))[0].label).toBe('S');
    expect(assignCip(chfclbr('@', [2, 3, 1, IMPLICIT_H]))[0].label).toBe('R'); // even (two swaps)
  });

  it('Rule 2: deuterium above protium; ethanol-1-d, looking from CH3, H-O-D anticlockwise (worked by hand: R)', () => {
    // C0 (CH3), C1 (centre, one H), O2 (OH), H3 = deuterium atom
    const s = build(
      [
        { el: 'C', h: 3 },
        { el: 'C', h: 1 },
        { el: 'O', h: 1 },
        { el: 'H', isotope: 2 },
      ],
      [
        [0, 1],
        [1, 2],
        [1, 3],
      ],
      [{ kind: 'tetrahedral', centre: 1, ligands: [0, IMPLICIT_H, 2, 3], winding: '@' }],
    );
    // O > CH3 > D > H; from CH3 (rank 2) H, O, D anticlockwise; hand-worked -> R
    expect(assignCip(s)[0].label).toBe('R');
    const plain = build(
      [
        { el: 'C', h: 3 },
        { el: 'C', h: 2 },
        { el: 'O', h: 1 },
      ],
      [
        [0, 1],
        [1, 2],
      ],
      [{ kind: 'tetrahedral', centre: 1, ligands: [0, IMPLICIT_H, 2, IMPLICIT_H], winding: '@' }],
    );
    expect(assignCip(plain)[0].label).toBeNull(); // two protium atoms tie
  });

  it('a lone pair ranks lowest: (R)-methyl ethyl sulfoxide drawn as looking from O, CH3-C2H5-lone pair anticlockwise', () => {
    // S0, O1 (=O), C2 (CH3), C3 (CH2), C4 (CH3); S=O counts as S+-O- (no duplicate); O > Et > Me > lone pair
    const s = build(
      ['S', 'O', { el: 'C', h: 3 }, { el: 'C', h: 2 }, { el: 'C', h: 3 }],
      [
        [0, 1, 2],
        [0, 2],
        [0, 3],
        [3, 4],
      ],
      [{ kind: 'tetrahedral', centre: 0, ligands: [1, 2, 3, LONE_PAIR], winding: '@' }],
    );
    // hand-worked: from O (rank 1) Me(3), Et(2), LP(4) anticlockwise -> with LP away O->Et->Me is clockwise: R
    expect(assignCip(s)[0].label).toBe('R');
  });

  it('an amine nitrogen drawn with a configuration gets no descriptor (fast inversion; common practice, no source)', () => {
    // N-ethyl-N-methylpropan-1-amine: N0 with methyl C1, ethyl C2-C4, propyl C3-C5-C6
    const s = build(
      [
        'N',
        { el: 'C', h: 3 },
        { el: 'C', h: 2 },
        { el: 'C', h: 2 },
        { el: 'C', h: 3 },
        { el: 'C', h: 2 },
        { el: 'C', h: 3 },
      ],
      [
        [0, 1],
        [0, 2],
        [2, 4],
        [0, 3],
        [3, 5],
        [5, 6],
      ],
      [{ kind: 'tetrahedral', centre: 0, ligands: [1, 2, 3, LONE_PAIR], winding: '@' }],
    );
    expect(assignCip(s)[0].label).toBeNull();
  });
});
