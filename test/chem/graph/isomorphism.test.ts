import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { automorphisms, findIsomorphisms, isomorphic, isomorphism } from '../../../src/chem/graph/index.js';
import type { Structure } from '../../../src/chem/types.js';
import { build } from './build.js';
import { permute, shuffle } from './permute.js';
import { c60 } from './solids.js';

function all(
  s: Structure,
  extra: Partial<Parameters<typeof automorphisms>[1]> = {},
): { maps: Int32Array[]; complete: boolean } {
  const maps: Int32Array[] = [];
  const r = automorphisms(s, { ...extra, onMapping: (m) => (maps.push(m), true) });
  return { maps, complete: r.complete };
}

/** Every bond of a has an image bond of the same order in b (aromatic sets compared as in the search). */
function isMapping(a: Structure, b: Structure, map: Int32Array): boolean {
  if (new Set(map).size !== a.atoms.length) return false;
  const bonds = new Set(b.bonds.map((x) => `${Math.min(x.a, x.b)}-${Math.max(x.a, x.b)}`));
  return (
    a.bonds.every((x) => bonds.has(`${Math.min(map[x.a], map[x.b])}-${Math.max(map[x.a], map[x.b])}`)) &&
    a.atoms.every((x, i) => x.element === b.atoms[map[i]].element && x.hCount === b.atoms[map[i]].hCount)
  );
}

// Group orders of the molecular graphs: the full point groups of the symmetric conformations, from point-group
// tables (from memory): benzene and cyclohexane D6h/D3d -> graph group D6 of order 12; cubane Oh 48;
// adamantane Td 24; C60 Ih 120; neopentane skeleton Td 24 (S4 on the methyls); 18-crown-6 ring D3d -> the
// hexagon's dihedral group of order 12 on the ring graph.
describe('automorphism group orders', () => {
  it.each([
    ['benzene (Kekulé drawing)', build('C1=CC=CC=C1'), 12],
    ['cyclohexane', build('C1CCCCC1'), 12],
    ['cubane', build('C12C3C4C1C5C2C3C45'), 48],
    ['adamantane', build('C1C2CC3CC1CC(C2)C3'), 24],
    ['neopentane', build('CC(C)(C)C'), 24],
    ['myo/scyllo-inositol constitution', build('OC1C(O)C(O)C(O)C(O)C1O'), 12],
    ['18-crown-6', build('C1COCCOCCOCCOCCOCCO1'), 12],
    ['methane with explicit H atoms', build('[H]C([H])([H])[H]'), 24],
    ['toluene', build('CC1=CC=CC=C1'), 2],
    ['naphthalene (Kekulé)', build('C1=CC=C2C=CC=CC2=C1'), 4],
    ['C60 (truncated icosahedron)', c60(), 120],
  ])('%s: %i', (_name, s, order) => {
    const { maps, complete } = all(s as Structure);
    expect(complete).toBe(true);
    expect(maps.length).toBe(order);
    expect(new Set(maps.map((m) => m.join(','))).size).toBe(order);
    for (const m of maps) expect(isMapping(s as Structure, s as Structure, m)).toBe(true);
  });

  it('colours restrict the mappings (toluene with one ortho carbon marked: identity only)', () => {
    const s = build('CC1=CC=CC=C1');
    expect(all(s, { colour: s.atoms.map((_, i) => (i === 2 ? 1 : 0)) }).maps.length).toBe(1);
  });

  it('the node budget stops the search and says so', () => {
    const r = all(c60(), { maxNodes: 5 });
    expect(r.complete).toBe(false);
    expect(r.maps.length).toBeLessThan(120);
  });

  it('maxResults stops the search', () => {
    const r = all(build('C12C3C4C1C5C2C3C45'), { maxResults: 5 });
    expect(r.maps.length).toBe(5);
    expect(r.complete).toBe(false);
  });
});

const SYMMETRIC = [
  'OC1C(O)C(O)C(O)C(O)C1O',
  'CC(C)(C)C(C(C)(C)C)O',
  'C12C3C4C1C5C2C3C45',
  'OC(=O)C(O)C(O)C(=O)O',
  'CC(C)C(C)C(C)C',
  'C1CC2CCC1CC2',
  'CC1=CC(C)=CC(C)=C1',
  'OC1CCC(O)CC1',
  'CC(O)C(C)(C)C(C)O',
];

describe('key semantics: one mapping per distinct restriction to key ∪ N(key) (checked against full enumeration)', () => {
  it('matches the restrictions of the full automorphism group', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...SYMMETRIC),
        fc.nat(),
        fc.integer({ min: 1, max: 3 }),
        (smi, seed, size) => {
          const s = build(smi);
          const key = shuffle(s.atoms.length, seed).slice(0, size);
          const near = new Set(key);
          for (const b of s.bonds) {
            if (key.includes(b.a)) near.add(b.b);
            if (key.includes(b.b)) near.add(b.a);
          }
          const atoms = [...near].sort((x, y) => x - y);
          const restrict = (m: Int32Array) => atoms.map((i) => m[i]).join(',');
          const full = new Set(all(s).maps.map(restrict));
          const keyed = all(s, { key }).maps.map(restrict);
          expect(new Set(keyed).size).toBe(keyed.length);
          expect(new Set(keyed)).toEqual(full);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('erythromycin A: 18 stereocentres as key give the identity only; unkeyed, the N-methyl swap too', () => {
    // Structure of erythromycin A (PubChem CID 12560 isomeric SMILES, from memory); its only constitutional
    // symmetry is the exchange of the two N-methyl groups of desosamine.
    const s = build(
      'CC[C@@H]1[C@@]([C@@H]([C@H](C(=O)[C@@H](C[C@@]([C@@H]([C@H]([C@@H]([C@H](C(=O)O1)C)O[C@H]2C[C@@]([C@H]([C@@H](O2)C)O)(C)OC)C)O[C@H]3[C@@H]([C@H](C[C@H](O3)C)N(C)C)O)(C)O)C)C)O)(C)O',
    );
    const key = s.stereo.flatMap((u) => (u.kind === 'tetrahedral' ? [u.centre] : []));
    expect(key.length).toBe(18);
    expect(all(s, { key }).maps.length).toBe(1);
    expect(all(s).maps.length).toBe(2);
  });

  it('inositol with its six ring carbons as key gives the 12 ring symmetries', () => {
    const s = build('OC1C(O)C(O)C(O)C(O)C1O');
    const key = s.atoms.map((a, i) => i).filter((i) => s.atoms[i].element === 'C');
    expect(all(s, { key }).maps.length).toBe(12);
  });
});

const DRUGS = [
  'CC(=O)OC1=CC=CC=C1C(=O)O',
  'CN1C=NC2=C1C(=O)N(C)C(=O)N2C',
  'CC(C)CC1=CC=C(C=C1)C(C)C(=O)O',
  'CC(C)C1=C(C(=C(N1CCC(CC(CC(=O)O)O)O)C2=CC=C(C=C2)F)C3=CC=CC=C3)C(=O)NC4=CC=CC=C4',
  'CCC1C(C(C(C(=O)C(CC(C(C(C(C(C(=O)O1)C)OC2CC(C(C(O2)C)O)(C)OC)C)OC3C(C(CC(O3)C)N(C)C)O)(C)O)C)C)O)(C)O',
  'OC1C(O)C(O)C(O)C(O)C1O',
  'C1COCCOCCOCCOCCOCCO1',
  'NC(CC1=CC=CC=C1)C(=O)O.Cl',
];

describe('isomorphic()', () => {
  it('finds a valid mapping onto any renumbering (fast-check)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...DRUGS), fc.nat(), fc.boolean(), (smi, seed, flip) => {
        const s = build(smi);
        const t = permute(s, shuffle(s.atoms.length, seed), shuffle(s.bonds.length, seed + 1), flip);
        const m = isomorphic(s, t);
        expect(m).not.toBeNull();
        expect(isMapping(s, t, m!)).toBe(true);
      }),
      { numRuns: 150 },
    );
  });

  it('a Kekulé structure and its other Kekulé structure are isomorphic', () => {
    expect(isomorphic(build('CC1=CC=CC=C1'), build('CC1C=CC=CC=1'))).not.toBeNull();
    expect(isomorphic(build('C1=CC=C2C=CC=CC2=C1'), build('C1C=CC2=CC=CC=C2C=1'))).not.toBeNull();
  });

  it.each([
    ['1-butanol / 2-butanol', 'CCCCO', 'CCC(C)O'],
    ['ethanol / dimethyl ether', 'CCO', 'COC'],
    ['o- / m-xylene', 'CC1=C(C)C=CC=C1', 'CC1=CC(C)=CC=C1'],
    ['cyclohexane / methylcyclopentane', 'C1CCCCC1', 'CC1CCCC1'],
    ['decalin / bicyclopentyl-like (same degrees)', 'C1CCC2CCCCC2C1', 'C1CCC(C1)C1CCCC1'],
    ['propanoate / propanoic acid', 'CCC(=O)[O-]', 'CCC(=O)O'],
    ['13C-methanol / methanol', '[13CH3]O', 'CO'],
  ])('constitutional isomers and different compounds are not isomorphic: %s', (_n, x, y) => {
    expect(isomorphic(build(x), build(y))).toBeNull();
  });

  it('A onto B with colours: only atoms of equal colour are paired', () => {
    const a = build('OCCO');
    let count = 0;
    findIsomorphisms(a, a, {
      colourA: [1, 0, 0, 0],
      colourB: [0, 0, 0, 1],
      onMapping: (m) => {
        expect(m[0]).toBe(3);
        count++;
        return true;
      },
    });
    expect(count).toBe(1);
  });
});

describe('isomorphism() says when the answer is not proven', () => {
  it('a budget too small to finish leaves C60 onto a renumbered C60 undecided', () => {
    const s = c60();
    const t = permute(s, shuffle(s.atoms.length, 42));
    expect(isomorphism(s, t, 1).decided).toBe(false);
    const full = isomorphism(s, t);
    expect(full.decided).toBe(true);
    expect(isMapping(s, t, full.map!)).toBe(true);
  });
  it('a proven negative is decided', () => {
    expect(isomorphism(build('CCCCO'), build('CCC(C)O'))).toEqual({ map: null, decided: true });
  });
});
