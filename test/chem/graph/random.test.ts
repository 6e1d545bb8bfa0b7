/**
 * Property tests on random graphs (fast-check): random trees with extra ring bonds, and symmetric graphs made of
 * copies of a random branch around a centre atom. Group orders are checked against brute force over all
 * permutations; no external source is needed for these invariants.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  automorphisms,
  constitutionKey,
  equivalenceClasses,
  isomorphic,
} from '../../../src/chem/graph/index.js';
import type { Atom, Bond, BondOrder, Structure } from '../../../src/chem/types.js';
import { permute, shuffle } from './permute.js';

const ELEMENTS: [string, number][] = [
  ['C', 6],
  ['N', 7],
  ['O', 8],
];

function atom(el: number, i: number): Atom {
  const [element, atomicNumber] = ELEMENTS[el];
  return {
    element,
    atomicNumber,
    charge: 0,
    isotope: null,
    hCount: 0,
    aromatic: false,
    radical: 0,
    mapNumber: null,
    inputNumber: i + 1,
    coords: null,
  };
}

const structure = (atoms: Atom[], bonds: Bond[]): Structure => ({
  atoms,
  bonds,
  stereo: [],
  groups: [],
  chiralFlag: null,
  title: null,
  properties: {},
  dimension: 0,
});

const bond = (a: number, b: number, order: BondOrder): Bond => ({
  a,
  b,
  order,
  aromatic: false,
  wedge: null,
});

/** A random connected graph: a random tree plus a few extra bonds (no duplicates). */
const randomGraph = (maxAtoms: number) =>
  fc
    .record({
      n: fc.integer({ min: 1, max: maxAtoms }),
      seed: fc.nat(),
      extra: fc.integer({ min: 0, max: 4 }),
      doubles: fc.integer({ min: 0, max: 3 }),
    })
    .map(({ n, seed, extra, doubles }) => {
      let x = seed | 1;
      const rnd = (k: number) => {
        x = (Math.imul(x, 1103515245) + 12345) >>> 0;
        return (x >>> 8) % k;
      };
      const atoms = Array.from({ length: n }, (_, i) => atom(rnd(3), i));
      const bonds: Bond[] = [];
      const has = new Set<string>();
      const add = (a: number, b: number, o: BondOrder) => {
        const k = `${Math.min(a, b)}-${Math.max(a, b)}`;
        if (a === b || has.has(k)) return;
        has.add(k);
        bonds.push(bond(a, b, o));
      };
      for (let i = 1; i < n; i++) add(i, rnd(i), 1);
      for (let e = 0; e < extra && n > 2; e++) add(rnd(n), rnd(n), 1);
      for (let d = 0; d < doubles && bonds.length > 0; d++) bonds[rnd(bonds.length)].order = 2;
      return structure(atoms, bonds);
    });

/** k copies of a random branch bonded to one centre atom: at least k! automorphisms. */
const symmetricGraph = fc
  .record({ branch: randomGraph(3), copies: fc.integer({ min: 2, max: 3 }) })
  .map(({ branch, copies }) => {
    const atoms: Atom[] = [atom(0, 0)];
    const bonds: Bond[] = [];
    for (let c = 0; c < copies; c++) {
      const base = atoms.length;
      branch.atoms.forEach((a, i) => atoms.push({ ...a, inputNumber: base + i + 1 }));
      branch.bonds.forEach((b) => bonds.push(bond(base + b.a, base + b.b, b.order)));
      bonds.push(bond(0, base, 1));
    }
    return structure(atoms, bonds);
  });

/** Number of bond- and element-preserving bijections from s onto t, by trying every permutation. */
function bruteForceCount(s: Structure, t: Structure = s): number {
  const n = s.atoms.length;
  if (t.atoms.length !== n || t.bonds.length !== s.bonds.length) return 0;
  const code = new Map<string, number>();
  for (const b of t.bonds) code.set(`${Math.min(b.a, b.b)}-${Math.max(b.a, b.b)}`, b.order);
  let count = 0;
  const map: number[] = [];
  const used = new Array<boolean>(n).fill(false);
  const extend = (i: number) => {
    if (i === n) {
      const ok = s.bonds.every((b) => {
        const k = `${Math.min(map[b.a], map[b.b])}-${Math.max(map[b.a], map[b.b])}`;
        return code.get(k) === b.order;
      });
      if (ok) count++;
      return;
    }
    for (let j = 0; j < n; j++) {
      if (used[j] || t.atoms[j].element !== s.atoms[i].element) continue;
      used[j] = true;
      map[i] = j;
      extend(i + 1);
      used[j] = false;
    }
  };
  extend(0);
  return count;
}

const order = (s: Structure) => {
  let c = 0;
  automorphisms(s, { aromaticA: s.bonds.map(() => false), onMapping: () => (c++, true) });
  return c;
};

describe('random graphs', () => {
  it('automorphism group order equals brute force (Kekulé orders compared as written)', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          randomGraph(7),
          symmetricGraph.filter((s) => s.atoms.length <= 7),
        ),
        (s) => {
          expect(order(s)).toBe(bruteForceCount(s));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('isomorphic() agrees with brute force on pairs of random graphs of one size', () => {
    const plain = (s: Structure) => ({ ...s, bonds: s.bonds.map((b) => ({ ...b, order: 1 as BondOrder })) });
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 7 }), fc.nat(), fc.nat(), (n, s1, s2) => {
        const gen = (seed: number) =>
          fc.sample(
            randomGraph(n).filter((g) => g.atoms.length === n),
            { seed, numRuns: 1 },
          )[0];
        const a = plain(gen(s1));
        const b = plain(gen(s2));
        const viaSearch = a.atoms.length === b.atoms.length && isomorphic(a, b) !== null;
        expect(viaSearch).toBe(bruteForceCount(a, b) > 0);
      }),
      { numRuns: 200 },
    );
  });

  it('renumbering keeps key and classes, and isomorphic() finds a mapping', () => {
    fc.assert(
      fc.property(fc.oneof(randomGraph(16), symmetricGraph), fc.nat(), (s, seed) => {
        const perm = shuffle(s.atoms.length, seed);
        const t = permute(s, perm, shuffle(s.bonds.length, seed + 3), seed % 2 === 0);
        expect(constitutionKey(t)).toBe(constitutionKey(s));
        const cs = equivalenceClasses(s);
        const ct = equivalenceClasses(t);
        s.atoms.forEach((_, i) => expect(ct[perm[i]]).toBe(cs[i]));
        expect(isomorphic(s, t)).not.toBeNull();
      }),
      { numRuns: 300 },
    );
  });
});
