/**
 * Exact graph isomorphism and automorphism search by individualisation and refinement (the scheme of
 * McKay's canonical-labelling work, Congr. Numer. 30 (1981) 45, without canonical labelling): A and B are
 * refined together as one disjoint union, so a colour with different numbers of A and B atoms proves a dead
 * end at once; a branch individualises an A atom and one B atom of its cell and refines again. A leaf (every
 * cell one A atom and one B atom) is checked bond by bond before it is reported.
 *
 * With `key`, the search branches over every image of key ∪ N(key) and then stops at the first completion, so
 * it reports exactly one isomorphism per distinct restriction to key ∪ N(key) (what Burnside counting needs).
 */
import type { Structure } from '../types.js';
import { conjugatedRingBonds } from './aromaticity.js';
import { invariantsWith } from './classes.js';
import { csrOf } from './csr.js';
import { clonePartition, partitionOf, rankKeys, Refiner, type CsrGraph, type Partition } from './refine.js';

export interface IsomorphismOptions {
  /** Atoms of A whose images (and the images of their neighbours) distinguish mappings. */
  key?: number[];
  /** Extra constraints: only atoms of equal colour are mapped onto each other. */
  colourA?: ArrayLike<number>;
  colourB?: ArrayLike<number>;
  /** Aromatic flags per bond; default conjugatedRingBonds() (independent of the Kekulé structure). */
  aromaticA?: boolean[];
  aromaticB?: boolean[];
  /** Stop after this many mappings (default Infinity); the result is then marked incomplete. */
  maxResults?: number;
  /** Search budget in refinement nodes (default 20000); when hit, the result is marked incomplete. */
  maxNodes?: number;
  /** Receives each mapping (a fresh array, A atom -> B atom); return false to stop. */
  onMapping: (map: Int32Array) => boolean;
}

export interface SearchResult {
  /** false when the node budget or maxResults cut the search short (stopping via onMapping keeps it true). */
  complete: boolean;
}

const NONE = 0;
const FOUND = 1;
const STOP = 2;

export function findIsomorphisms(a: Structure, b: Structure, opts: IsomorphismOptions): SearchResult {
  const n = a.atoms.length;
  if (n !== b.atoms.length || validBonds(a) !== validBonds(b)) return { complete: true };
  if (n === 0) {
    opts.onMapping(new Int32Array(0));
    return { complete: true };
  }
  const aromA = opts.aromaticA ?? conjugatedRingBonds(a);
  const same = a === b && opts.colourA === opts.colourB && opts.aromaticA === opts.aromaticB;
  const aromB = same ? aromA : (opts.aromaticB ?? conjugatedRingBonds(b));
  const invA = invariantsWith(a, aromA);
  const invB = same ? invA : invariantsWith(b, aromB);
  const inv = new Float64Array(2 * n);
  inv.set(invA, 0);
  inv.set(invB, n);
  const keys: ArrayLike<number>[] = [inv];
  if (opts.colourA || opts.colourB) {
    const col = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      col[i] = opts.colourA ? opts.colourA[i] : 0;
      col[n + i] = opts.colourB ? opts.colourB[i] : 0;
    }
    keys.push(col);
  }
  const g = csrOf([
    { s: a, aromatic: aromA },
    { s: b, aromatic: aromB },
  ]);
  const refiner = new Refiner(g, n);
  const p = partitionOf(rankKeys(keys, 2 * n));
  if (!refiner.balanced(p) || !refiner.refine(p)) return { complete: true };

  const inKey = new Uint8Array(n);
  if (opts.key) {
    for (const x of opts.key) {
      if (x < 0 || x >= n) continue;
      inKey[x] = 1;
      for (let e = g.offs[x]; e < g.offs[x + 1]; e++) inKey[g.adj[e]] = 1;
    }
  } else inKey.fill(1);

  const search = new Search(g, n, refiner, inKey, opts);
  search.run(p, opts.key ? opts.key.length > 0 : true);
  return { complete: !search.budgetHit && !search.maxHit };
}

/** One isomorphism from A to B, or null (also null when the search budget runs out). */
export function isomorphic(a: Structure, b: Structure): Int32Array | null {
  let found: Int32Array | null = null;
  findIsomorphisms(a, b, {
    maxResults: 1,
    onMapping: (m) => {
      found = m;
      return false;
    },
  });
  return found;
}

export type AutomorphismOptions = Omit<IsomorphismOptions, 'colourB' | 'aromaticB'> & { colour?: ArrayLike<number> };

/** Automorphisms of s (same semantics as findIsomorphisms with B = A). */
export function automorphisms(s: Structure, opts: AutomorphismOptions): SearchResult {
  const colour = opts.colour ?? opts.colourA;
  const aromatic = opts.aromaticA ?? conjugatedRingBonds(s);
  return findIsomorphisms(s, s, { ...opts, colourA: colour, colourB: colour, aromaticA: aromatic, aromaticB: aromatic });
}

function validBonds(s: Structure): number {
  const n = s.atoms.length;
  let c = 0;
  for (const b of s.bonds) if (b.a >= 0 && b.b >= 0 && b.a < n && b.b < n && b.a !== b.b) c++;
  return c;
}

class Search {
  nodes = 0;
  results = 0;
  budgetHit = false;
  maxHit = false;
  private readonly maxNodes: number;
  private readonly maxResults: number;

  constructor(
    private readonly g: CsrGraph,
    private readonly n: number,
    private readonly refiner: Refiner,
    private readonly inKey: Uint8Array,
    private readonly opts: IsomorphismOptions,
  ) {
    this.maxNodes = opts.maxNodes ?? 20000;
    this.maxResults = opts.maxResults ?? Infinity;
  }

  /** `exhaustive`: still branching over key images. Returns NONE, FOUND or STOP. */
  run(p: Partition, exhaustive: boolean): number {
    const n = this.n;
    if (p.cells === n) return this.leaf(p);
    const { lab, len } = p;
    // Target: the smallest non-singleton cell, among cells holding a key atom while exhaustive.
    let target = -1;
    let best = Infinity;
    if (exhaustive) {
      for (let s = 0; s < 2 * n; s += len[s]) {
        if (len[s] <= 2 || len[s] >= best) continue;
        for (let t = s; t < s + len[s]; t++) {
          if (lab[t] < n && this.inKey[lab[t]]) {
            target = s;
            best = len[s];
            break;
          }
        }
      }
      if (target < 0) exhaustive = false;
    }
    if (target < 0) {
      for (let s = 0; s < 2 * n; s += len[s]) {
        if (len[s] > 2 && len[s] < best) {
          target = s;
          best = len[s];
        }
      }
    }
    let x = -1;
    const ys: number[] = [];
    for (let t = target; t < target + best; t++) {
      const v = lab[t];
      if (v >= n) ys.push(v);
      else if (x < 0 || (exhaustive && this.inKey[v] && !this.inKey[x]) || (v < x && this.inKey[v] === this.inKey[x])) {
        if (!exhaustive || this.inKey[v] || x < 0) x = v;
      }
    }
    ys.sort((u, v) => u - v);
    let any = NONE;
    for (const y of ys) {
      if (++this.nodes > this.maxNodes) {
        this.budgetHit = true;
        return STOP;
      }
      const child = clonePartition(p);
      if (!this.refiner.individualise(child, x, y)) continue;
      const r = this.run(child, exhaustive);
      if (r === STOP) return STOP;
      if (r === FOUND) {
        any = FOUND;
        if (!exhaustive) return FOUND;
      }
    }
    return any;
  }

  private leaf(p: Partition): number {
    const n = this.n;
    const { offs, adj, code } = this.g;
    const map = new Int32Array(n);
    for (let s = 0; s < 2 * n; s += 2) {
      const u = p.lab[s];
      const v = p.lab[s + 1];
      if (u < n) map[u] = v - n;
      else map[v] = u - n;
    }
    // Bond-by-bond check: refinement to a discrete colouring does not by itself prove an isomorphism.
    for (let i = 0; i < n; i++) {
      const bi = map[i] + n;
      for (let e = offs[i]; e < offs[i + 1]; e++) {
        const target = map[adj[e]] + n;
        let ok = false;
        for (let f = offs[bi]; f < offs[bi + 1]; f++) {
          if (adj[f] === target && code[f] === code[e]) {
            ok = true;
            break;
          }
        }
        if (!ok) return NONE;
      }
    }
    this.results++;
    if (this.opts.onMapping(map) === false) return STOP;
    if (this.results >= this.maxResults) {
      this.maxHit = true;
      return STOP;
    }
    return FOUND;
  }
}
