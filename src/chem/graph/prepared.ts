/**
 * Everything the refinement-based functions (classes, key, search) need about one structure, computed once:
 * adjacency, bridges, the bond codes' aromatic set, atom invariants and the compressed adjacency.
 */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { conjugatedRingBonds } from './aromaticity.js';
import { invariantsWith } from './invariants.js';
import { bondCode } from './csr.js';
import { partitionOf, rankKeys, refineOnce, type CsrGraph, type Partition } from './refine.js';
import { bridges } from './rings.js';

export interface Prepared {
  s: Structure;
  g: Graph;
  aromatic: readonly boolean[];
  inv: number[];
  csr: CsrGraph;
  /** The equitable partition refined from the invariants alone (computed on first use; do not modify). */
  refined?: Partition;
}

/** The refined partition of the invariants (no extra colours), cached on the prepared structure. */
export function refinedPartition(p: Prepared): Partition {
  if (!p.refined) {
    const part = partitionOf(rankKeys([p.inv], p.inv.length));
    refineOnce(p.csr, part);
    p.refined = part;
  }
  return p.refined;
}

/**
 * Cache of recent preparations: the engine asks for key, classes and automorphisms of one structure in a row.
 * An entry is used only while a checksum over everything the preparation reads still matches, so a structure
 * changed in place is prepared afresh. (A short list, not a WeakMap: weak tables cost the garbage collector
 * more than the lookups save.)
 */
const RECENT = 8;
const cache: { s: Structure; sum: number; aromatic: readonly boolean[] | undefined; prepared: Prepared }[] =
  [];

export function prepare(s: Structure, aromatic?: readonly boolean[]): Prepared {
  const sum = checksum(s, aromatic);
  for (let i = cache.length - 1; i >= 0; i--) {
    const e = cache[i];
    if (e.s === s && e.aromatic === aromatic && e.sum === sum) return e.prepared;
  }
  const prepared = prepareFresh(s, aromatic);
  if (cache.length >= RECENT) cache.shift();
  cache.push({ s, sum, aromatic, prepared });
  return prepared;
}

function checksum(s: Structure, aromatic: readonly boolean[] | undefined): number {
  // Written with a plain function (a closure assigning h would box it on every step).
  let h = 0x9e3779b9 ^ s.atoms.length;
  for (const a of s.atoms) {
    h = mix(h, a.atomicNumber);
    h = mix(h, a.charge);
    h = mix(h, a.hCount);
    h = mix(h, a.isotope ?? -1);
    h = mix(h, a.radical);
  }
  h = mix(h, s.bonds.length);
  for (const b of s.bonds) {
    h = mix(h, b.a);
    h = mix(h, b.b);
    h = mix(h, b.order);
  }
  if (aromatic) for (let k = 0; k < aromatic.length; k++) h = mix(h, aromatic[k] ? 1 : 2);
  return h;
}

function mix(h: number, x: number): number {
  return Math.imul(h ^ x, 0x01000193);
}

function prepareFresh(s: Structure, aromatic?: readonly boolean[]): Prepared {
  const g = buildGraph(s);
  const bridge = bridges(g, s.bonds.length);
  const arom = aromatic ?? conjugatedRingBonds(s, g, bridge);
  const inv = invariantsWith(s, arom, g, bridge);
  return { s, g, aromatic: arom, inv, csr: csrOfGraph(s, g, arom) };
}

/**
 * csrOf([{ s, aromatic }]) read off the adjacency lists, which hold the same neighbours in the same order
 * (bonds in index order, each added to both ends; invalid bonds left out).
 */
function csrOfGraph(s: Structure, g: Graph, aromatic: readonly boolean[]): CsrGraph {
  const n = g.n;
  const offs = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) offs[i + 1] = offs[i] + g.nbrs[i].length;
  const adj = new Int32Array(offs[n]);
  const code = new Int32Array(offs[n]);
  for (let i = 0; i < n; i++) {
    const nb = g.nbrs[i];
    const bb = g.nbrBonds[i];
    const at = offs[i];
    adj.set(nb, at);
    for (let t = 0; t < bb.length; t++) code[at + t] = bondCode(s, bb[t], aromatic);
  }
  return { n, offs, adj, code };
}
