/** Renumbers the atoms (and reorders the bonds) of a Structure: the same molecule in another atom order. */
import type { Structure } from '../../../src/chem/types.js';

/** perm[i] = new index of old atom i; bondOrder = new position of each old bond (defaults to identity). */
export function permute(
  s: Structure,
  perm: readonly number[],
  bondOrder?: readonly number[],
  flip = false,
): Structure {
  const atoms = new Array(s.atoms.length);
  s.atoms.forEach((a, i) => (atoms[perm[i]] = { ...a }));
  const bonds = new Array(s.bonds.length);
  s.bonds.forEach((b, k) => {
    const a = perm[b.a];
    const c = perm[b.b];
    bonds[bondOrder ? bondOrder[k] : k] = { ...b, a: flip ? c : a, b: flip ? a : c };
  });
  return { ...s, atoms, bonds, stereo: [], groups: [] };
}

/** Image of old atom indices under the permutation, for checking mappings. */
export function inverse(perm: readonly number[]): number[] {
  const inv = new Array<number>(perm.length);
  perm.forEach((p, i) => (inv[p] = i));
  return inv;
}

/** A pseudo-random permutation of 0..n-1 from a seed (Fisher–Yates with a small LCG). */
export function shuffle(n: number, seed: number): number[] {
  const p = Array.from({ length: n }, (_, i) => i);
  let x = seed >>> 0 || 1;
  for (let i = n - 1; i > 0; i--) {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    const j = x % (i + 1);
    [p[i], p[j]] = [p[j], p[i]];
  }
  return p;
}
