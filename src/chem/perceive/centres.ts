/**
 * Which atoms can be tetrahedral stereocentres, judged from the constitution alone (ligand equivalence is
 * decided later, in perceive.ts). The rules, element by element:
 *
 *   C, Si, Ge, Sn   four single-bonded σ-neighbours (hydrogens included), at most one H, neutral, no radical.
 *   N+  / P+ / As+  four single-bonded heavy neighbours, no H (quaternary ammonium, N-oxides drawn N+–O−,
 *                   phosphonium). Protonated amines ([NH+]) are not centres: proton exchange inverts them.
 *   N (neutral)     three single-bonded heavy neighbours, no H, not aromatic, and either in a three-membered ring
 *                   (aziridines invert slowly) or a bridgehead of a small bridged ring system (three ring bonds,
 *                   two rings of at most 8 atoms through N sharing at least three atoms, as in Tröger's base or
 *                   quinuclidines; not the N bridge of tropanes, whose substituent flips).
 *                   Any other such N is an ordinary, rapidly inverting amine (reported apart).
 *   P, As (neutral) three single-bonded σ-neighbours (at most one H) with a lone pair (phosphines), or four
 *                   σ-neighbours with exactly one double bond (phosphine oxides/sulfides, phosphates, P(V) esters).
 *   S, Se           three σ-neighbours with exactly one double bond and no charge (sulfoxides, sulfinates,
 *                   sulfinamides), three single bonds and charge +1 (sulfonium; sulfoxides drawn S+–O−),
 *                   each with a lone pair; or four σ-neighbours with two double bonds (sulfoximines).
 *
 * Excluded everywhere: an atom carrying a terminal chalcogen double bond together with a terminal single-bonded
 * chalcogen of the same element that bears H or a negative charge (R–S(=O)–O−, R2P(=O)OH): the two are one
 * resonance / tautomer pair, so the "two ligands" are the same — unless isotopes tell them apart. Sources: the element rules are common practice
 * (no single source); nitrogen inversion barriers: Eliel & Wilen, Stereochemistry of Organic Compounds (1994),
 * ch. 8 (from memory).
 */
import type { Graph, RingInfo } from '../graph/index.js';
import type { Structure } from '../types.js';
import { hToken, lpToken } from './units.js';

export type CentreVerdict =
  { kind: 'centre'; tokens: [number, number, number, number] } | { kind: 'invertible-nitrogen' } | null;

export function tetrahedralCandidate(
  s: Structure,
  g: Graph,
  rings: RingInfo,
  aromaticBond: boolean[],
  i: number,
): CentreVerdict {
  const atom = s.atoms[i];
  const z = atom.atomicNumber;
  if (z !== 6 && z !== 7 && z !== 14 && z !== 15 && z !== 16 && z !== 32 && z !== 33 && z !== 34 && z !== 50)
    return null;
  if (atom.radical !== 0 || atom.hCount > 1) return null;
  const nb = g.nbrs[i];
  const nbB = g.nbrBonds[i];
  const heavy = nb.length;
  if (heavy < 2 || heavy > 4) return null;
  const h = atom.hCount;
  const sigma = heavy + h;
  if (sigma < 3 || sigma > 4) return null;
  let doubles = 0;
  for (let k = 0; k < nbB.length; k++) {
    const b = s.bonds[nbB[k]];
    if (aromaticBond[nbB[k]] || b.aromatic) return null;
    if (b.order === 2) doubles++;
    else if (b.order !== 1) return null;
  }
  const n = s.atoms.length;
  if (h > 1) return null;
  const c = atom.charge;
  switch (z) {
    case 6:
    case 14:
    case 32:
    case 50:
      return c === 0 && sigma === 4 && doubles === 0 ? centreOf(nb, h, false, n, i) : null;
    case 7:
      if (doubles > 0 || h > 0) return null;
      if (c === 1 && heavy === 4) return centreOf(nb, h, false, n, i);
      if (c === 0 && heavy === 3) {
        if (atom.aromatic) return null;
        if (rings.smallestRingOfAtom[i] === 3 || isSmallBridgehead(g, rings, i))
          return centreOf(nb, h, true, n, i);
        return { kind: 'invertible-nitrogen' };
      }
      return null;
    case 15:
    case 33:
      if (resonancePair(s, g, i)) return null;
      if (c === 0 && doubles === 0 && sigma === 3) return centreOf(nb, h, true, n, i);
      if (c === 0 && doubles === 1 && sigma === 4 && h === 0) return centreOf(nb, h, false, n, i);
      if (c === 1 && doubles === 0 && sigma === 4 && h === 0) return centreOf(nb, h, false, n, i);
      return null;
    case 16:
    case 34:
      if (h > 0 || resonancePair(s, g, i)) return null;
      if (c === 0 && doubles === 1 && heavy === 3) return centreOf(nb, h, true, n, i);
      if (c === 1 && doubles === 0 && heavy === 3) return centreOf(nb, h, true, n, i);
      if (c === 0 && doubles === 2 && heavy === 4) return centreOf(nb, h, false, n, i);
      return null;
    default:
      return null;
  }
}

/** The centre's tokens: its neighbours, then its H, then its lone pair; null unless that makes four. */
function centreOf(nb: Int32Array, h: number, withLonePair: boolean, n: number, i: number): CentreVerdict {
  const count = nb.length + (h === 1 ? 1 : 0) + (withLonePair ? 1 : 0);
  if (count !== 4) return null;
  const t: [number, number, number, number] = [0, 0, 0, 0];
  let k = 0;
  for (; k < nb.length; k++) t[k] = nb[k];
  if (h === 1) t[k++] = hToken(n, i);
  if (withLonePair) t[k] = lpToken(n, i);
  return { kind: 'centre', tokens: t };
}

/**
 * N that is a true bridgehead of a small bridged system: all three of its bonds are ring bonds, and two SSSR
 * rings of at most 8 atoms through it share at least three atoms (bridged, not merely fused). An N that is itself
 * the one-atom bridge, with its substituent outside the rings (tropane, 8-azabicyclo[3.2.1]octane; granatane,
 * 9-azabicyclo[3.3.1]nonane), inverts like any tertiary amine: the N-substituent flips between the two faces
 * (Eliel & Wilen 1994, ch. 8, from memory). Tröger's base and quinuclidine N are locked.
 */
function isSmallBridgehead(g: Graph, rings: RingInfo, i: number): boolean {
  let ringBonds = 0;
  for (const b of g.nbrBonds[i]) if (rings.bondInRing[b]) ringBonds++;
  if (ringBonds < 3) return false;
  const mine = rings.rings.filter((r) => r.length <= 8 && r.includes(i));
  for (let a = 0; a < mine.length; a++) {
    for (let b = a + 1; b < mine.length; b++) {
      const set = new Set(mine[a]);
      let shared = 0;
      for (const x of mine[b]) if (set.has(x)) shared++;
      if (shared >= 3) return true;
    }
  }
  // In a bridged bicycle any two SSSR rings through a bridgehead share it, the other bridgehead and a bridge.
  return false;
}

/** Terminal X= together with terminal X–H or X− of the same element on atom i (one resonance pair). */
function resonancePair(s: Structure, g: Graph, i: number): boolean {
  const doubleEl = new Set<number>();
  const singleEl = new Set<number>();
  const nb = g.nbrs[i];
  for (let k = 0; k < nb.length; k++) {
    const x = s.atoms[nb[k]];
    if (
      g.nbrs[nb[k]].length !== 1 ||
      (x.atomicNumber !== 8 && x.atomicNumber !== 16 && x.atomicNumber !== 34)
    )
      continue;
    const order = s.bonds[g.nbrBonds[i][k]].order;
    const key = x.atomicNumber * 1000 + (x.isotope ?? 0); // isotopes tell the two apart (P-93.2.4, 17O/18O)
    if (order === 2) doubleEl.add(key);
    else if (order === 1 && (x.hCount > 0 || x.charge < 0)) singleEl.add(key);
  }
  for (const e of doubleEl) if (singleEl.has(e)) return true;
  // Charge-separated form: S+/P+ with a terminal O− and another terminal O− / OH of the same element.
  if (s.atoms[i].charge > 0) {
    const seen = new Set<number>();
    for (let k = 0; k < nb.length; k++) {
      const x = s.atoms[nb[k]];
      if (g.nbrs[nb[k]].length !== 1 || x.atomicNumber !== 8 || (x.charge >= 0 && x.hCount === 0)) continue;
      if (seen.has(x.isotope ?? 0)) return true;
      seen.add(x.isotope ?? 0);
    }
  }
  return false;
}
