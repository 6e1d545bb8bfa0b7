/**
 * Adjacency, bridges, ring sizes and preparations are kept for the structures used last. A structure changed
 * in place, or one asked about after many others, must give the answers a fresh copy gives.
 */
import { describe, expect, it } from 'vitest';
import { buildGraph, constitutionKey, equivalenceClasses, ringInfo } from '../../../src/chem/graph/index.js';
import { atomInvariants } from '../../../src/chem/graph/invariants.js';
import { bridges, smallestRings } from '../../../src/chem/graph/rings.js';
import type { Structure } from '../../../src/chem/types.js';
import { build } from './build.js';

const copy = (s: Structure): Structure => ({
  ...s,
  atoms: s.atoms.map((a) => ({ ...a })),
  bonds: s.bonds.map((b) => ({ ...b })),
});

const answers = (s: Structure) => ({
  rings: ringInfo(s),
  inv: atomInvariants(s),
  classes: Array.from(equivalenceClasses(s)),
  key: constitutionKey(s),
});

describe('reused graph-layer results', () => {
  it('one graph object per unchanged structure', () => {
    const s = build('C1CCC2CCCCC2C1');
    expect(buildGraph(s)).toBe(buildGraph(s));
  });

  it('a bond end moved in place: new graph, rings and key as for a fresh copy', () => {
    const s = build('C1CCCCC1CCC'); // cyclohexane with a propyl chain
    const before = answers(s);
    expect(before.rings.rings.map((r) => r.length)).toEqual([6]);
    const g0 = buildGraph(s);
    // Bond C8–C9 becomes C8–C1: a four-membered ring C1–C6–C7–C8 (C9 left alone).
    const tail = s.bonds.find((b) => Math.min(b.a, b.b) === 7 && Math.max(b.a, b.b) === 8)!;
    if (tail.b === 8) tail.b = 0;
    else tail.a = 0;
    expect(buildGraph(s)).not.toBe(g0);
    const after = answers(s);
    expect(after).toEqual(answers(copy(s)));
    expect(after.rings.rings.length).toBe(2);
    expect(after.key).not.toBe(before.key);
  });

  it('a bond added in place is seen', () => {
    const s = build('CCCCCC');
    expect(ringInfo(s).rings).toEqual([]);
    s.bonds.push({ ...s.bonds[0], a: 5, b: 0 });
    expect(ringInfo(s).rings.map((r) => r.length)).toEqual([6]);
    expect(answers(s)).toEqual(answers(copy(s)));
  });

  it('answers after many other structures equal fresh ones', () => {
    const smiles = [
      'c1ccccc1',
      'C1CC2CCC1C2',
      'C12C3C4C1C5C2C3C45',
      'OCC',
      'C1CCC2(CC1)CCCC2',
      'c1ccc2ccccc2c1',
    ];
    const list = smiles.map(build);
    const first = list.map(answers);
    for (let round = 0; round < 3; round++) {
      list.forEach((s, i) => expect(answers(s)).toEqual(first[i]));
      list.forEach((s, i) => expect(answers(copy(s))).toEqual(first[i]));
    }
  });

  it('smallestRings with a graph or bridges of its own', () => {
    const s = build('C1CC2CCC1C2CC1CC1'); // norbornane with a cyclopropylmethyl group
    const own = {
      ...buildGraph(copy(s)),
    };
    const expected = smallestRings(s, buildGraph(s));
    expect(smallestRings(s, own)).toEqual(expected);
    expect(smallestRings(s, own, bridges(own, s.bonds.length))).toEqual(expected);
    expect(expected.filter((x) => x > 0).sort()).toEqual([3, 3, 3, 5, 5, 5, 5, 5, 5, 5, 5]);
  });

  it('the ring sizes handed out by ringInfo are its own copy', () => {
    const s = build('C1CCCC1');
    const a = ringInfo(s);
    a.smallestRingOfBond.fill(99);
    expect(ringInfo(s).smallestRingOfBond).toEqual([5, 5, 5, 5, 5]);
    expect(atomInvariants(s)).toEqual(atomInvariants(copy(s)));
  });
});
