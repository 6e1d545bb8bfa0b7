/**
 * Identical copies of the parent in a salt or solvate ((S)-amphetamine sulfate, 2:1): components with the
 * parent's constitution and the same stereoisomer. Counts and chirality are then given per copy, and relate()
 * compares one copy of each parent.
 */
import { constitutionKey } from '../graph/index.js';
import { extractAtoms } from '../normalize.js';
import { sameStereoisomer } from './carry.js';
import type { Structure } from '../types.js';

/** Indices of the components that are copies of component `parent` (not including `parent` itself). */
export function parentCopies(s: Structure, comps: number[][], parent: number): number[] {
  if (parent < 0 || comps.length < 2) return [];
  const ps = extractAtoms(s, comps[parent]);
  const key = constitutionKey(ps);
  const out: number[] = [];
  comps.forEach((c, k) => {
    if (k === parent || c.length !== comps[parent].length) return;
    const cs = extractAtoms(s, c);
    if (constitutionKey(cs) !== key) return;
    if (ps.stereo.length + cs.stereo.length === 0 || sameStereoisomer(ps, cs)) out.push(k);
  });
  return out;
}

/** The structure with the parent's copies left out (one copy of the parent, every other component). */
export function withoutCopies(s: Structure, comps: number[][], copies: number[]): Structure {
  const drop = new Set(copies);
  const atoms = comps
    .filter((_c, k) => !drop.has(k))
    .flat()
    .sort((x, y) => x - y);
  return extractAtoms(s, atoms);
}
