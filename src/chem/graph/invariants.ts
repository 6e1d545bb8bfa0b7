/** Atom invariants for refinement: what an atom is, before its neighbours are looked at. */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { conjugatedRingBonds } from './aromaticity.js';
import { bridges, smallestRings } from './rings.js';

/** Element, charge, isotope, hydrogens, degree, radical, aromatic flag and smallest ring size, packed in one number. */
export function atomInvariants(s: Structure, aromatic?: boolean[]): number[] {
  return invariantsWith(s, aromatic);
}

/** As atomInvariants, reusing adjacency and bridges the caller already has. */
export function invariantsWith(
  s: Structure,
  aromatic?: readonly boolean[],
  graph?: Graph,
  bridgeOf?: Uint8Array,
): number[] {
  const n = s.atoms.length;
  const g = graph ?? buildGraph(s);
  const bridge = bridgeOf ?? bridges(g, s.bonds.length);
  const arom = aromatic ?? conjugatedRingBonds(s, g, bridge);
  // Smallest ring through each atom (0 = none): tells decalin from bicyclopentyl, which colour refinement
  // alone cannot.
  const bondRing = smallestRings(s, g, bridge);
  const ring = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    for (const k of g.nbrBonds[i])
      if (bondRing[k] > 0 && (ring[i] === 0 || bondRing[k] < ring[i])) ring[i] = bondRing[k];
  }
  const aromaticAtom = new Array<boolean>(n).fill(false);
  for (let i = 0; i < n; i++) for (const k of g.nbrBonds[i]) if (arom[k]) aromaticAtom[i] = true;
  return s.atoms.map((a, i) => {
    let v = clamp(a.atomicNumber, 0, 127);
    v = v * 32 + clamp(a.charge + 16, 0, 31);
    v = v * 512 + clamp(a.isotope ?? 0, 0, 511);
    v = v * 32 + clamp(a.hCount, 0, 31);
    v = v * 32 + clamp(g.nbrs[i].length, 0, 31);
    v = v * 4 + clamp(a.radical, 0, 3);
    v = v * 2 + (aromaticAtom[i] ? 1 : 0);
    v = v * 32 + clamp(ring[i], 0, 31);
    return v;
  });
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}
