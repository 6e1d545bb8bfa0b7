/**
 * The internal form of a stereogenic unit and the arithmetic of its configuration.
 *
 * Every unit has four reference "ligand tokens" and one configuration bit relative to them:
 *   - token t < n          the atom t
 *   - n <= t < 2n          the implicit hydrogen on atom t - n
 *   - 2n <= t < 3n         the lone pair on atom t - 2n
 * An atom permutation σ (an automorphism, or an isomorphism between two structures) acts on tokens by acting on
 * the atom they name, so "the H on x" goes to "the H on σ(x)".
 *
 * Two modes:
 *   - 'parity' (tetrahedral centres, allenes / even cumulenes, biaryl axes): the bit is the orientation of the
 *     ordered 4-tuple of ligand positions in space (0 = '@', 1 = '@@' in SMILES terms). Swapping any two tokens
 *     flips it; reflection flips it. For axial units the four substituents of the two ends form a tetrahedron, so
 *     the same rule holds (the OpenSMILES allene convention collapses the axis onto a centre for this reason).
 *   - 'cistrans' (double bonds, odd cumulenes): tokens are [u1, u2, v1, v2], u* on atoms[0], v* on atoms[1]; the
 *     bit says whether u1 and v1 are cis (0) or trans (1). Swapping u1/u2 or v1/v2 flips it; reflection keeps it.
 */
import type { UnitKind } from '../facts.js';
import { IMPLICIT_H, LONE_PAIR, type StereoElement } from '../types.js';

export type ConfigMode = 'parity' | 'cistrans';

export interface PerceivedUnit {
  kind: UnitKind;
  mode: ConfigMode;
  /** Centre [c], or the two end atoms [a, b] (terminal atoms of a cumulated chain; the axis atoms of a biaryl). */
  atoms: number[];
  /** Reference tokens (see file comment). */
  tokens: [number, number, number, number];
  /** The input fixes the configuration. */
  defined: boolean;
  /** Configuration bit relative to `tokens` (meaningful when `defined`). */
  bit: 0 | 1;
  /** Has a pair of constitutionally equivalent ligands (pseudoasymmetric / "para" type unit). */
  equivalentPair: boolean;
}

export const hToken = (n: number, atom: number): number => n + atom;
export const lpToken = (n: number, atom: number): number => 2 * n + atom;

/** Image of a token under an atom map. */
export function mapToken(t: number, n: number, map: ArrayLike<number>, nOut = n): number {
  if (t < n) return map[t];
  if (t < 2 * n) return nOut + map[t - n];
  return 2 * nOut + map[t - 2 * n];
}

/** The atom a token belongs to (itself, or the atom carrying the H / lone pair). */
export function tokenAtom(t: number, n: number): number {
  return t < n ? t : t < 2 * n ? t - n : t - 2 * n;
}

/** Parity (0 even, 1 odd) of the permutation taking list `from` to list `to` (same 4 tokens); -1 if not the same set. */
export function permutationParity(from: ArrayLike<number>, to: ArrayLike<number>): number {
  const pos = [0, 0, 0, 0];
  for (let i = 0; i < 4; i++) {
    let j = 0;
    while (j < 4 && to[j] !== from[i]) j++;
    if (j === 4) return -1;
    pos[i] = j;
  }
  let inv = 0;
  for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) if (pos[i] > pos[j]) inv++;
  return inv & 1;
}

/**
 * Given a configuration `bit` stated relative to token list `list` (the same four tokens as `unit.tokens`, in any
 * order), return the bit relative to `unit.tokens`; -1 when `list` does not hold the unit's tokens.
 */
export function rebase(unit: PerceivedUnit, list: ArrayLike<number>, bit: number): number {
  const R = unit.tokens;
  if (unit.mode === 'parity') {
    const p = permutationParity(list, R);
    return p < 0 ? -1 : bit ^ p;
  }
  const p = R.indexOf(list[0]);
  const q = R.indexOf(list[2]);
  if (p < 0 || q < 0 || p < 2 === q < 2) return -1;
  return bit ^ ((p & 1) ^ (q & 1));
}

/** A stereo state: one bit per unit, units indexed as in the perception result. */
export type State = Uint8Array;

/**
 * The StereoElement that states configuration `bit` of `unit` (n = number of atoms); null for a helix, which
 * SMILES and the stereo list cannot state (it is read from coordinates).
 */
export function unitStereo(unit: PerceivedUnit, bit: number, n: number): StereoElement | null {
  if (unit.kind === 'helix' || unit.kind === 'planar') return null;
  const lig = (t: number): number => (t < n ? t : t < 2 * n ? IMPLICIT_H : LONE_PAIR);
  const [a, b, c, d] = unit.tokens.map(lig);
  if (unit.kind === 'tetrahedral') {
    return { kind: 'tetrahedral', centre: unit.atoms[0], ligands: [a, b, c, d], winding: bit ? '@@' : '@' };
  }
  const ends: [number, number] = [unit.atoms[0], unit.atoms[1]];
  if (unit.mode === 'cistrans')
    return { kind: 'double-bond', ends, refs: [a, c], relation: bit ? 'trans' : 'cis' };
  const subtype = unit.kind === 'biaryl' ? 'biaryl' : 'allene';
  return { kind: 'axial', subtype, ends, ligands: [a, b, c, d], winding: bit ? '@@' : '@' };
}
