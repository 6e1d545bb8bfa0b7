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
import { prepare, refinedPartition, type Prepared } from './prepared.js';
import {
  clonePartition,
  copyPartition,
  partitionOf,
  rankKeys,
  Refiner,
  refineOnce,
  type CsrGraph,
  type Partition,
} from './refine.js';
import { checkBudget } from '../budget.js';

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
  /** Search nodes visited (refinements after individualising a pair), for diagnostics. */
  nodes?: number;
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
  const pa = prepare(a, opts.aromaticA);
  const same = a === b && sameColours(opts.colourA, opts.colourB, n) && opts.aromaticA === opts.aromaticB;
  const pb = same ? pa : prepare(b, opts.aromaticB);

  const inKey = new Uint8Array(n);
  const g1 = pa.csr;
  if (opts.key) {
    for (const x of opts.key) {
      if (x < 0 || x >= n) continue;
      inKey[x] = 1;
      for (let e = g1.offs[x]; e < g1.offs[x + 1]; e++) inKey[g1.adj[e]] = 1;
    }
  } else inKey.fill(1);

  let p: Partition;
  let g: CsrGraph;
  let refiner: Refiner;
  if (same) {
    // Automorphisms: refine one copy; when every key atom is alone in its cell, the identity is the only
    // restriction to key ∪ N(key), so there is nothing to search.
    const single = singlePartition(pa, opts.colourA, n);
    let fixed = true;
    for (let i = 0; i < n && fixed; i++) if (inKey[i] && single.len[single.start[i]] > 1) fixed = false;
    if (fixed) {
      const id = new Int32Array(n);
      for (let i = 0; i < n; i++) id[i] = i;
      opts.onMapping(id);
      return { complete: true };
    }
    p = doubled(single, n);
    g = unionCsr(pa.csr, pb.csr);
    refiner = new Refiner(g, n);
  } else {
    g = unionCsr(pa.csr, pb.csr);
    refiner = new Refiner(g, n);
    const keys: ArrayLike<number>[] = [concat(pa.inv, pb.inv)];
    if (opts.colourA || opts.colourB) {
      const col = new Float64Array(2 * n);
      for (let i = 0; i < n; i++) {
        col[i] = opts.colourA ? opts.colourA[i] : 0;
        col[n + i] = opts.colourB ? opts.colourB[i] : 0;
      }
      keys.push(col);
    }
    p = partitionOf(rankKeys(keys, 2 * n));
    if (!refiner.balanced(p) || !refiner.refine(p)) return { complete: true };
  }
  const search = new Search(g, n, refiner, inKey, opts);
  search.root = p;
  search.run(p, opts.key ? opts.key.length > 0 : true);
  return { complete: !search.budgetHit && !search.maxHit, nodes: search.nodes };
}

/** Refined partition of one structure with optional colours (the cached one when colours add nothing). */
function singlePartition(pa: Prepared, colour: ArrayLike<number> | undefined, n: number): Partition {
  const base = refinedPartition(pa);
  if (colour) {
    let constant = true;
    for (let s = 0; s < n && constant; s += base.len[s]) {
      const c = colour[base.lab[s]];
      for (let t = s + 1; t < s + base.len[s]; t++) {
        if (colour[base.lab[t]] !== c) {
          constant = false;
          break;
        }
      }
    }
    if (!constant) {
      const p = partitionOf(rankKeys([pa.inv, colour], n));
      refineOnce(pa.csr, p);
      return p;
    }
  }
  return base;
}

function sameColours(x: ArrayLike<number> | undefined, y: ArrayLike<number> | undefined, n: number): boolean {
  if (x === y) return true;
  if (!x || !y) return false;
  for (let i = 0; i < n; i++) if (x[i] !== y[i]) return false;
  return true;
}

function concat(x: number[], y: number[]): Float64Array {
  const out = new Float64Array(x.length + y.length);
  out.set(x, 0);
  out.set(y, x.length);
  return out;
}

/** The union partition of A ∪ A' from an equitable partition of A: each cell followed by its copies. */
function doubled(p: Partition, n: number): Partition {
  const lab = new Int32Array(2 * n);
  const pos = new Int32Array(2 * n);
  const start = new Int32Array(2 * n);
  const len = new Int32Array(2 * n);
  for (let s = 0; s < n; s += p.len[s]) {
    const L = p.len[s];
    for (let t = 0; t < L; t++) {
      const v = p.lab[s + t];
      lab[2 * s + t] = v;
      lab[2 * s + L + t] = v + n;
      pos[v] = 2 * s + t;
      pos[v + n] = 2 * s + L + t;
      start[v] = start[v + n] = 2 * s;
    }
    len[2 * s] = 2 * L;
  }
  return { lab, pos, start, len, cells: p.cells };
}

/** Disjoint union of two compressed graphs (atoms of y follow those of x). */
function unionCsr(x: CsrGraph, y: CsrGraph): CsrGraph {
  const n = x.n + y.n;
  const offs = new Int32Array(n + 1);
  const ex = x.adj.length;
  offs.set(x.offs, 0);
  for (let i = 1; i <= y.n; i++) offs[x.n + i] = ex + y.offs[i];
  const adj = new Int32Array(ex + y.adj.length);
  adj.set(x.adj, 0);
  for (let e = 0; e < y.adj.length; e++) adj[ex + e] = y.adj[e] + x.n;
  const code = new Int32Array(adj.length);
  code.set(x.code, 0);
  code.set(y.code, ex);
  return { n, offs, adj, code };
}

/** One isomorphism from A to B, or null (also null when the search budget runs out; see isomorphism()). */
export function isomorphic(a: Structure, b: Structure): Int32Array | null {
  return isomorphism(a, b).map;
}

/**
 * One isomorphism or null, and whether the answer is certain: `decided` is false only when the search budget
 * ran out before a mapping was found (then "not isomorphic" is not proven).
 */
export function isomorphism(
  a: Structure,
  b: Structure,
  maxNodes?: number,
): { map: Int32Array | null; decided: boolean } {
  let found: Int32Array | null = null;
  const r = findIsomorphisms(a, b, {
    maxNodes,
    onMapping: (m) => {
      found = m;
      return false;
    },
  });
  return { map: found, decided: found !== null || r.complete };
}

export type AutomorphismOptions = Omit<IsomorphismOptions, 'colourB' | 'aromaticB'> & {
  colour?: ArrayLike<number>;
};

/** Automorphisms of s (same semantics as findIsomorphisms with B = A). */
export function automorphisms(s: Structure, opts: AutomorphismOptions): SearchResult {
  const colour = opts.colour ?? opts.colourA;
  // Left undefined when not given: prepare() then computes conjugatedRingBonds() itself and its cached
  // preparation of s (from equivalenceClasses or constitutionKey) is reused instead of a fresh one.
  const aromatic = opts.aromaticA;
  return findIsomorphisms(s, s, {
    ...opts,
    colourA: colour,
    colourB: colour,
    aromaticA: aromatic,
    aromaticB: aromatic,
  });
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
  root: Partition | null = null;
  private readonly maxNodes: number;
  private readonly maxResults: number;
  private readonly pool: Partition[] = [];

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
  run(p: Partition, exhaustive: boolean, depth = 0): number {
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
    // x: the lowest A atom of the cell (a key atom while exhaustive, so that its images are distinct
    // restrictions); ys: the B atoms it may map to.
    let x = -1;
    const ys: number[] = [];
    for (let t = target; t < target + best; t++) {
      const v = lab[t];
      if (v >= n) ys.push(v);
      else if ((!exhaustive || this.inKey[v]) && (x < 0 || v < x)) x = v;
    }
    ys.sort((u, v) => u - v);
    let any = NONE;
    for (const y of ys) {
      checkBudget();
      if (++this.nodes > this.maxNodes) {
        this.budgetHit = true;
        return STOP;
      }
      const child = this.scratch(depth);
      copyPartition(p, child);
      if (!this.refiner.individualise(child, x, y)) continue;
      const r = this.run(child, exhaustive, depth + 1);
      if (r === STOP) return STOP;
      if (r === FOUND) {
        any = FOUND;
        if (!exhaustive) return FOUND;
      }
    }
    return any;
  }

  /** One partition per search depth, reused. */
  private scratch(depth: number): Partition {
    while (this.pool.length <= depth) this.pool.push(clonePartition(this.pool[0] ?? this.root!));
    return this.pool[depth];
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
