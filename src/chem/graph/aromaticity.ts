/**
 * Aromatic bonds, so that a Kekulé drawing and an aromatic SMILES of the same molecule compare equal.
 *
 * A bond is aromatic when the input says so, or when it lies in a ring (or in the envelope of two rings fused
 * at one bond) whose atoms can all join a cyclic pi system and contribute 4n+2 pi electrons (Hückel's rule,
 * IUPAC Gold Book "Hückel (4n + 2) rule"). Electron counts per atom, in the usual simple model:
 * an atom with a ring double bond gives 1; an sp2 atom with an exocyclic double bond to a heteroatom (C=O in
 * 2-pyridone) gives 0; a lone-pair donor with only single bonds (pyrrole-type N, furan O, thiophene S, C-) gives
 * 2; a carbocation or three-connected boron gives 0; anything else (sp3, triple bonds) stops the ring.
 */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { bridges, ringInfo, type RingInfo } from './rings.js';

const NOT_PI = -1;

export function aromaticBonds(s: Structure, rings?: RingInfo, g?: Graph): boolean[] {
  const out = s.bonds.map((b) => b.aromatic);
  if (!s.bonds.some((b) => b.order === 2 || b.aromatic)) return out; // no double bond: nothing to find
  const graph = g ?? buildGraph(s);
  const info = rings ?? ringInfo(s, graph);
  if (info.rings.length === 0) return out;
  const donation = new Int8Array(s.atoms.length).fill(NOT_PI);
  for (let i = 0; i < s.atoms.length; i++)
    if (info.atomInRing[i]) donation[i] = piElectrons(s, graph, info, i);

  const R = info.rings.length;
  const ringBonds = info.rings.map((r) => ringBondList(r, graph));
  const aromaticRing = info.rings.map((r) => huckel(r, donation));
  // Pairs of rings fused at exactly one bond, judged on their envelope (azulene, some heteroaromatics). The
  // verdict of a pair does not depend on the others', so pairs are found through the bonds they share.
  // (A two-membered ring lists one bond twice: such structures take the pair-by-pair comparison.)
  if (R > 1 && info.rings.some((r) => r.length < 3)) {
    for (let i = 0; i < R; i++) {
      for (let j = i + 1; j < R; j++) {
        if (aromaticRing[i] && aromaticRing[j]) continue;
        const shared = ringBonds[i].filter((k) => ringBonds[j].includes(k));
        if (shared.length !== 1) continue;
        const atoms = [...new Set([...info.rings[i], ...info.rings[j]])];
        if (atoms.length !== info.rings[i].length + info.rings[j].length - 2) continue;
        if (huckel(atoms, donation)) aromaticRing[i] = aromaticRing[j] = true;
      }
    }
  } else if (R > 1) {
    const ringsOfBond = new Map<number, number[]>();
    for (let i = 0; i < R; i++) {
      for (const k of ringBonds[i]) {
        const list = ringsOfBond.get(k);
        if (list) list.push(i);
        else ringsOfBond.set(k, [i]);
      }
    }
    // shared[i * R + j] (i < j): bonds rings i and j have in common.
    let shared: Int32Array | null = null;
    for (const list of ringsOfBond.values()) {
      if (list.length < 2) continue;
      shared ??= new Int32Array(R * R);
      for (let x = 0; x < list.length; x++)
        for (let y = x + 1; y < list.length; y++) {
          const i = list[x] < list[y] ? list[x] : list[y];
          const j = list[x] < list[y] ? list[y] : list[x];
          if (i !== j) shared[i * R + j]++;
        }
    }
    if (shared) {
      const mark = new Uint8Array(s.atoms.length);
      for (let i = 0; i < R; i++) {
        for (let j = i + 1; j < R; j++) {
          if (shared[i * R + j] !== 1 || (aromaticRing[i] && aromaticRing[j])) continue;
          if (envelopeHuckel(info.rings[i], info.rings[j], donation, mark))
            aromaticRing[i] = aromaticRing[j] = true;
        }
      }
    }
  }
  aromaticRing.forEach((yes, r) => {
    if (yes) for (const k of ringBonds[r]) out[k] = true;
  });
  return out;
}

/**
 * huckel() of the atoms of two rings together, when they share exactly two atoms (false otherwise). `mark` is
 * all zero on entry and on return.
 */
function envelopeHuckel(
  p: readonly number[],
  q: readonly number[],
  donation: Int8Array,
  mark: Uint8Array,
): boolean {
  let common = 0;
  let pi = true;
  let sum = 0;
  for (const a of p) {
    mark[a] = 1;
    if (donation[a] === NOT_PI) pi = false;
    sum += donation[a];
  }
  for (const a of q) {
    if (mark[a] === 1) {
      common++;
      continue;
    }
    if (donation[a] === NOT_PI) pi = false;
    sum += donation[a];
  }
  for (const a of p) mark[a] = 0;
  return common === 2 && pi && sum % 4 === 2;
}

function huckel(atoms: readonly number[], donation: Int8Array): boolean {
  let sum = 0;
  for (const a of atoms) {
    if (donation[a] === NOT_PI) return false;
    sum += donation[a];
  }
  return sum % 4 === 2;
}

/** Bonds of a ring given in ring order. */
function ringBondList(ring: readonly number[], g: Graph): number[] {
  const out: number[] = [];
  for (let i = 0; i < ring.length; i++) {
    const u = ring[i];
    const v = ring[(i + 1) % ring.length];
    const idx = g.nbrs[u].indexOf(v);
    if (idx >= 0) out.push(g.nbrBonds[u][idx]);
  }
  return out;
}

/** Pi electrons a ring atom can give to a cyclic system, or NOT_PI. */
function piElectrons(s: Structure, g: Graph, info: RingInfo, i: number): number {
  const atom = s.atoms[i];
  let ringDouble = 0;
  let exoDoubleHetero = 0;
  let exoDoubleCarbon = 0;
  for (let t = 0; t < g.nbrs[i].length; t++) {
    const k = g.nbrBonds[i][t];
    const b = s.bonds[k];
    if (b.order >= 3) return NOT_PI;
    if (b.order !== 2) continue;
    if (info.bondInRing[k]) ringDouble++;
    else if (s.atoms[g.nbrs[i][t]].atomicNumber === 6) exoDoubleCarbon++;
    else exoDoubleHetero++;
  }
  const conn = g.nbrs[i].length + atom.hCount;
  if (ringDouble === 1) return exoDoubleCarbon + exoDoubleHetero === 0 ? 1 : NOT_PI;
  if (ringDouble > 1) return NOT_PI;
  if (exoDoubleCarbon > 0) return NOT_PI;
  if (exoDoubleHetero === 1) return atom.atomicNumber === 6 || atom.atomicNumber === 7 ? 0 : NOT_PI;
  if (exoDoubleHetero > 1) return NOT_PI;
  if (atom.radical !== 0) return NOT_PI;
  const q = atom.charge;
  switch (atom.atomicNumber) {
    case 6:
      if (conn !== 3) return NOT_PI;
      return q === -1 ? 2 : q === 1 ? 0 : NOT_PI;
    case 7:
    case 15:
    case 33:
      if (q === 0 && conn === 3) return 2;
      if (q === -1 && conn === 2) return 2;
      return NOT_PI;
    case 8:
    case 16:
    case 34:
    case 52:
      return q === 0 && conn === 2 ? 2 : NOT_PI;
    case 5:
      return q === 0 && conn === 3 ? 0 : NOT_PI;
    default:
      return NOT_PI;
  }
}

/**
 * Bonds whose order can differ between Kekulé structures of the same molecule, and their neighbours in
 * conjugated rings: ring bonds joining two atoms that each carry a ring double bond, excluding bridges of that
 * subgraph. Any alternating cycle of a Kekulé structure lies in this subgraph, and the subgraph is the same for
 * every Kekulé structure (an atom's double bond can only move along rings), so comparing these bonds as one
 * kind makes two Kekulé drawings, or drawings from writers with different aromaticity models, compare equal.
 * Input aromatic flags are not used: the readers kekulize, and flags differ between writers.
 */
export function conjugatedRingBonds(
  s: Structure,
  g: Graph = buildGraph(s),
  bridgeOf?: Uint8Array,
): boolean[] {
  const m = s.bonds.length;
  const out = new Array<boolean>(m).fill(false);
  if (!s.bonds.some((b) => b.order === 2)) return out;
  const bridge = bridgeOf ?? bridges(g, m);
  const n = g.n;
  const hasRingDouble = new Uint8Array(n);
  s.bonds.forEach((b, k) => {
    if (b.order === 2 && !bridge[k] && b.a !== b.b && b.a >= 0 && b.b >= 0 && b.a < n && b.b < n) {
      hasRingDouble[b.a] = hasRingDouble[b.b] = 1;
    }
  });
  const keep: boolean[] = s.bonds.map(
    (b, k) => !bridge[k] && b.order <= 2 && hasRingDouble[b.a] === 1 && hasRingDouble[b.b] === 1,
  );
  if (!keep.some((x) => x)) return out;
  const subBridge = bridges(g, m, keep);
  for (let k = 0; k < m; k++) out[k] = keep[k] && !subBridge[k];
  return out;
}
