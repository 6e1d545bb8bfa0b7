/**
 * Candidate stereogenic double bonds and cumulated chains, from the constitution alone.
 *
 *   - C=C, C=N, N=N (N may be N+ in iminium ions), not aromatic, not in a ring of fewer than 8 atoms (trans
 *     double bonds are strained out of smaller rings: IUPAC 2013 P-93.5.1.4.1 / common practice).
 *   - Each end has one or two substituents besides its partner; a nitrogen end with a single substituent carries
 *     a lone pair as the second. An =NH end (no heavy substituent) is not stereogenic (fast tautomerism /
 *     inversion; common practice, no source).
 *   - A cumulated chain X=C=…=Y (interior atoms with exactly two double bonds and nothing else): an odd number
 *     of double bonds gives a cis/trans-like unit ('double-bond' for one, 'cumulene' for three or more), an even
 *     number an axial unit ('allene' for two, 'cumulene' for four or more). IUPAC 2013 P-93.5.7 / P-93.4.2.
 */
import type { Graph, RingInfo } from '../graph/index.js';
import type { UnitKind } from '../facts.js';
import type { Structure } from '../types.js';
import { hToken, lpToken, type ConfigMode } from './units.js';

export interface BondCandidate {
  kind: UnitKind;
  mode: ConfigMode;
  ends: [number, number];
  /** The chain's bonds (one for a plain double bond). */
  bonds: number[];
  tokens: [number, number, number, number];
}

function doubleCount(s: Structure, g: Graph, i: number): number {
  let d = 0;
  for (const b of g.nbrBonds[i]) if (s.bonds[b].order === 2) d++;
  return d;
}

function isCumuleneInterior(s: Structure, g: Graph, i: number): boolean {
  return g.nbrs[i].length === 2 && s.atoms[i].hCount === 0 && doubleCount(s, g, i) === 2;
}

/** The two substituent tokens of end `e` (partner excluded), or null when the end cannot carry stereo. */
function endTokens(s: Structure, g: Graph, e: number, partner: number): [number, number] | null {
  const a = s.atoms[e];
  if (a.radical !== 0) return null;
  const n = s.atoms.length;
  const subs: number[] = [];
  for (const x of g.nbrs[e]) if (x !== partner) subs.push(x);
  for (const b of g.nbrBonds[e]) {
    const bond = s.bonds[b];
    const other = bond.a === e ? bond.b : bond.a;
    if (other !== partner && bond.order !== 1) return null;
  }
  if (a.atomicNumber === 6 && a.charge === 0) {
    if (subs.length + a.hCount !== 2 || a.hCount > 1) return null;
    if (a.hCount === 1) subs.push(hToken(n, e));
    return [subs[0], subs[1]];
  }
  if (a.atomicNumber === 7) {
    if (a.charge === 0 && subs.length === 1 && a.hCount === 0) return [subs[0], lpToken(n, e)];
    if (a.charge === 1 && subs.length + a.hCount === 2 && a.hCount <= 1 && subs.length >= 1) {
      if (a.hCount === 1) subs.push(hToken(n, e));
      return [subs[0], subs[1]];
    }
  }
  return null;
}

function ringOk(rings: RingInfo, bond: number): boolean {
  const r = rings.smallestRingOfBond[bond];
  return r === 0 || r >= 8;
}

export function bondCandidates(
  s: Structure,
  g: Graph,
  rings: RingInfo,
  aromaticBond: boolean[],
): BondCandidate[] {
  const out: BondCandidate[] = [];
  const seen = new Uint8Array(s.bonds.length);
  for (let bi = 0; bi < s.bonds.length; bi++) {
    const b = s.bonds[bi];
    if (seen[bi] || b.order !== 2 || aromaticBond[bi] || b.aromatic) continue;
    // Walk the cumulated chain this bond belongs to, in both directions.
    const chainBonds = [bi];
    seen[bi] = 1;
    const ends: number[] = [];
    for (const start of [b.a, b.b]) {
      let prev = start === b.a ? b.b : b.a;
      let cur = start;
      while (isCumuleneInterior(s, g, cur)) {
        const k = g.nbrs[cur][0] === prev ? 1 : 0;
        const next = g.nbrs[cur][k];
        const nb = g.nbrBonds[cur][k];
        if (seen[nb]) break; // a ring of cumulated bonds
        seen[nb] = 1;
        chainBonds.push(nb);
        prev = cur;
        cur = next;
      }
      ends.push(cur);
      // remember the neighbour of the end inside the chain
      ends.push(prev);
    }
    const [e0, in0, e1, in1] = ends;
    if (e0 === e1) continue;
    if (chainBonds.some((x) => aromaticBond[x] || s.bonds[x].aromatic || !ringOk(rings, x))) continue;
    const k = chainBonds.length;
    const el0 = s.atoms[e0].atomicNumber;
    const el1 = s.atoms[e1].atomicNumber;
    if (k === 1 && !((el0 === 6 || el0 === 7) && (el1 === 6 || el1 === 7))) continue;
    if (k > 1 && (el0 !== 6 || el1 !== 6)) continue;
    const t0 = endTokens(s, g, e0, in0);
    const t1 = endTokens(s, g, e1, in1);
    if (!t0 || !t1) continue;
    const odd = k % 2 === 1;
    out.push({
      kind: k === 1 ? 'double-bond' : k === 2 ? 'allene' : 'cumulene',
      mode: odd ? 'cistrans' : 'parity',
      ends: [e0, e1],
      bonds: chainBonds,
      tokens: [t0[0], t0[1], t1[0], t1[1]],
    });
  }
  return out;
}
