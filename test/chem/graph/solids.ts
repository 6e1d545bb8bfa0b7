/**
 * Cage molecules built from geometry instead of SMILES: C60 (buckminsterfullerene) as the truncated icosahedron.
 * Construction: one carbon per directed edge u→v of the icosahedron (vertices (0, ±1, ±φ) and cyclic
 * permutations, neighbours at distance 2); u→v is bonded to v→u (the 30 hexagon–hexagon bonds, double in the
 * Fries Kekulé structure) and to u→w when v and w are neighbours (the pentagon around u, single bonds).
 */
import type { Atom, Bond, Structure } from '../../../src/chem/types.js';

export function icosahedron(): number[][] {
  const p = (1 + Math.sqrt(5)) / 2;
  const v: number[][] = [];
  for (const s1 of [-1, 1])
    for (const s2 of [-1, 1]) v.push([0, s1, s2 * p], [s1, s2 * p, 0], [s2 * p, 0, s1]);
  const nbrs: number[][] = v.map(() => []);
  for (let i = 0; i < v.length; i++) {
    for (let j = 0; j < v.length; j++) {
      const d = Math.hypot(v[i][0] - v[j][0], v[i][1] - v[j][1], v[i][2] - v[j][2]);
      if (i !== j && Math.abs(d - 2) < 1e-9) nbrs[i].push(j);
    }
  }
  return nbrs;
}

export function c60(): Structure {
  const ico = icosahedron();
  const index = new Map<string, number>();
  ico.forEach((ns, u) => ns.forEach((v) => index.set(`${u}>${v}`, index.size)));
  const atoms: Atom[] = [...index.keys()].map((_, i) => ({
    element: 'C',
    atomicNumber: 6,
    charge: 0,
    isotope: null,
    hCount: 0,
    aromatic: false,
    radical: 0,
    mapNumber: null,
    inputNumber: i + 1,
    coords: null,
  }));
  const bonds: Bond[] = [];
  ico.forEach((ns, u) =>
    ns.forEach((v) => {
      const a = index.get(`${u}>${v}`)!;
      if (u < v) bonds.push({ a, b: index.get(`${v}>${u}`)!, order: 2, aromatic: false, wedge: null });
      for (const w of ns) {
        if (w > v && ico[v].includes(w)) {
          bonds.push({ a, b: index.get(`${u}>${w}`)!, order: 1, aromatic: false, wedge: null });
        }
      }
    }),
  );
  return {
    atoms,
    bonds,
    stereo: [],
    groups: [],
    chiralFlag: null,
    title: 'C60',
    properties: {},
    dimension: 0,
  };
}
