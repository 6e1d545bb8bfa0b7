/**
 * Hierarchical comparison of two branches of a digraph (P-92.1.4, "exploration" of the digraph; Hanson et al.
 * 2018, "sphere by sphere"): compare the branch atoms; then, sphere after sphere, the sets of substituents of
 * each pair of corresponding nodes, the sets taken in the order of rank of the nodes they hang from. Stops at
 * the first difference, so only the spheres needed are ever grown.
 *
 * Ranking the substituents of a node (which fixes the exploration order) uses the rules up to the one being
 * applied, Rule 4b excepted (it ranks only the ligands of the unit; see sortAt); the sorted lists are cached per
 * node, per direction of travel and per rule level.
 */
import type { CipLabel } from '../facts.js';
import { CipNode, Digraph, type SortedBranches } from './digraph.js';
import * as rules from './rules.js';

// rule indices (as in rules.ts), local so the hot comparison loop reads plain constants
const RULE_1A = 0;
const RULE_1B = 1;
const RULE_2 = 2;
const RULE_3 = 3;
const RULE_4A = 4;
const RULE_4B = 5;
const RULE_4C = 6;
const RULE_5 = 7;
const RULE_6 = 8;
// the rules themselves, bound once (module namespace reads are not free in the hot loop)
const rule1a = rules.rule1a;
const rule1b = rules.rule1b;
const rule2 = rules.rule2;
const rule3 = rules.rule3;
const rule4a = rules.rule4a;
const rule4c = rules.rule4c;
const rule5 = rules.rule5;
const rule6 = rules.rule6;
import { compareRule4b } from './rule4b.js';

export type AuxFn = (node: CipNode) => CipLabel | null;

interface PairQueue {
  x: CipNode[];
  fx: (CipNode | null)[];
  y: CipNode[];
  fy: (CipNode | null)[];
}

/**
 * Breadth-first queues of node pairs for compareRule, one per nesting depth (ordering branches while comparing
 * compares again), shared by all rankers so their room is reserved once. Written by index with their own
 * count and never truncated (setting an array's length to 0 frees its room); cleared after use so they hold no
 * digraph alive.
 */
const pool: PairQueue[] = [];
let poolDepth = 0;

/** The queue of the next nesting depth, holding the starting pair (x, y); give it back with releaseQueue. */
function takeQueue(x: CipNode, fx: CipNode | null, y: CipNode, fy: CipNode | null): PairQueue {
  const d = poolDepth++;
  let q = pool[d];
  if (q === undefined) q = pool[d] = { x: [], fx: [], y: [], fy: [] };
  q.x[0] = x;
  q.fx[0] = fx;
  q.y[0] = y;
  q.fy[0] = fy;
  return q;
}

/**
 * Appends the first `m` pairs of branches (sx[j], sy[j]) of the pair (nx, ny) to the queue at `len`, except pairs
 * with nothing beyond them (hydrogens, phantoms, duplicates on both sides); returns the new length.
 */
function pushPairs(
  q: PairQueue,
  len: number,
  sx: readonly CipNode[],
  nx: CipNode,
  sy: readonly CipNode[],
  ny: CipNode,
  m: number,
): number {
  for (let j = 0; j < m; j++) {
    const a = sx[j];
    const b = sy[j];
    if ((a.dup || a.atom < 0) && (b.dup || b.atom < 0)) continue;
    q.x[len] = a;
    q.fx[len] = nx;
    q.y[len] = b;
    q.fy[len] = ny;
    len++;
  }
  return len;
}

function releaseQueue(q: PairQueue, len: number): void {
  poolDepth--;
  clearQueue(q, len);
}

function clearQueue(q: PairQueue, len: number): void {
  for (let i = 0; i < len; i++) {
    q.x[i] = NO_NODE;
    q.fx[i] = null;
    q.y[i] = NO_NODE;
    q.fy[i] = null;
  }
}

export class Ranker {
  /** Rules that cannot separate anything in this structure are skipped (saves exploring tied branches). */
  private readonly active: boolean[];

  /**
   * The node whose descriptor is being found (the root at top level). Following Hanson et al. 2018, descriptors
   * are assigned from the outermost nodes inward: while ranking at `scope`, only the descriptors of nodes
   * farther out on the same branch (its descendants in the root's digraph) are known; any other node counts as
   * non-stereogenic. This makes every auxiliary descriptor independent of the order of computation.
   */
  scope: CipNode;
  /**
   * Mirror mode: compare as in the mirror image, where every chiral descriptor is inverted (R/S, M/P) and the
   * pseudoasymmetric ones and E/Z stay. Only Rule 5 (and Rule 6 exploration after it) can tell the difference.
   */
  mirror = false;

  constructor(
    readonly dg: Digraph,
    private readonly auxOf: AuxFn,
  ) {
    this.scope = dg.root;
    const g = dg.g;
    const several = g.stereoCount > 1;
    this.active = [
      true,
      true,
      g.isotopes,
      g.hasBondStereo && several,
      several,
      several,
      several,
      several,
      false,
    ];
  }

  /** Is `n` the scope node or farther out on its branch? */
  inScope(n: CipNode): boolean {
    const sc = this.scope;
    if (sc === this.dg.root) return true;
    let x: CipNode | null = n;
    while (x !== null && x.depth > sc.depth) x = x.parent;
    return x === sc;
  }

  /** The auxiliary descriptor of `n` as seen from the current scope. */
  aux(n: CipNode): CipLabel | null {
    return this.inScope(n) ? this.auxOf(n) : null;
  }

  /** Run `f` with `node` as the scope (while finding the auxiliary descriptor of `node`). */
  within<T>(node: CipNode, f: () => T): T {
    const saved = this.scope;
    const savedMirror = this.mirror;
    this.scope = node;
    this.mirror = false;
    try {
      return f();
    } finally {
      this.scope = saved;
      this.mirror = savedMirror;
    }
  }

  setRule6(ref: number): void {
    this.dg.rule6Ref = ref;
    this.active[RULE_6] = ref >= 0;
  }

  value(rule: number, n: CipNode): number {
    switch (rule) {
      case RULE_1A:
        return rule1a(n);
      case RULE_1B:
        return rule1b(n);
      case RULE_2:
        return rule2(this.dg.massOf(n));
      case RULE_3:
        return n.dup || n.atom < 0 || this.dg.g.bondAt[n.atom] < 0 ? 0 : rule3(this.aux(n));
      case RULE_4A:
        return this.stereoValue(n, rule4a);
      case RULE_4C:
        return this.stereoValue(n, rule4c);
      case RULE_5:
        return this.stereoValue(n, this.mirror ? (l) => rule5(invertChiral(l)) : rule5);
      case RULE_6:
        return rule6(n, this.dg.rule6Ref);
      default:
        return 0;
    }
  }

  private stereoValue(n: CipNode, f: (l: CipLabel | null) => number): number {
    if (n.dup || n.atom < 0) return 0;
    const g = this.dg.g;
    if (g.tetraAt[n.atom] < 0 && g.bondAt[n.atom] < 0 && g.axialAt[n.atom] < 0) return 0;
    return f(this.aux(n));
  }

  /**
   * Compare branch x (entered from fx) with branch y (entered from fy) under one rule:
   * > 0 when x ranks higher, < 0 when y does, 0 when the rule cannot tell them apart.
   */
  compareRule(rule: number, x: CipNode, fx: CipNode | null, y: CipNode | null, fy: CipNode | null): number {
    if (y === null) return 1;
    if (rule === RULE_4B) return compareRule4b(this, x, fx, y, fy);
    let c = this.value(rule, x) - this.value(rule, y);
    if (c !== 0) return c > 0 ? 1 : -1;
    // hydrogens, phantoms and duplicates have nothing beyond them
    if ((x.dup || x.atom < 0) && (y.dup || y.atom < 0)) return 0;
    if (rule === RULE_1A) return this.compare1a(x, fx, y, fy);
    // breadth-first queues of node pairs, reused per nesting depth (sorting below may compare again); written
    // by index with their own count, never truncated (setting an array's length to 0 frees its room)
    const q = takeQueue(x, fx, y, fy);
    const qx = q.x;
    const qfx = q.fx;
    const qy = q.y;
    const qfy = q.fy;
    let len = 1;
    try {
      const dg = this.dg;
      for (let i = 0; i < len; i++) {
        // the structure's work budget (graph.ts CIP_WORK_BUDGET) counts compared pairs too; spent, it stops here
        if (--dg.g.workLeft <= 0) {
          dg.truncated = true;
          return 0;
        }
        const nx = qx[i];
        const ny = qy[i];
        const sx = this.sorted(nx, qfx[i], rule).nodes;
        const sy = this.sorted(ny, qfy[i], rule).nodes;
        const m = sx.length < sy.length ? sx.length : sy.length;
        for (let j = 0; j < m; j++) {
          c = this.value(rule, sx[j]) - this.value(rule, sy[j]);
          if (c !== 0) return c > 0 ? 1 : -1;
        }
        // (phantom atoms only count under Rule 1a, which compare1a handles)
        len = pushPairs(q, len, sx, nx, sy, ny, m);
      }
    } finally {
      releaseQueue(q, len);
    }
    return 0;
  }

  /**
   * compareRule under Rule 1a, one sphere at a time: first the atomic numbers of every set of the sphere, read
   * from lists ordered by atomic number alone (the full order only permutes runs of equal atomic number, so the
   * numbers read are the same); only when the whole sphere ties are the lists fully ordered, since that order
   * pairs the nodes of the next sphere. The same sets are compared in the same order as node by node, and the
   * deep ordering of runs of equal atomic number is skipped at the sphere that decides.
   */
  private compare1a(x: CipNode, fx: CipNode | null, y: CipNode, fy: CipNode | null): number {
    const q = takeQueue(x, fx, y, fy);
    const qx = q.x;
    const qfx = q.fx;
    const qy = q.y;
    const qfy = q.fy;
    let len = 1;
    let lo = 0;
    try {
      const dg = this.dg;
      while (lo < len) {
        const hi = len;
        dg.g.workLeft -= hi - lo;
        if (dg.g.workLeft <= 0) {
          dg.truncated = true;
          return 0;
        }
        for (let i = lo; i < hi; i++) {
          const sx = this.sorted0(qx[i], qfx[i]).nodes;
          const sy = this.sorted0(qy[i], qfy[i]).nodes;
          const m = sx.length < sy.length ? sx.length : sy.length;
          for (let j = 0; j < m; j++) {
            const c = sx[j].z - sy[j].z;
            if (c !== 0) return c > 0 ? 1 : -1;
          }
          // a missing substituent is a phantom atom (atomic number 0, nothing else)
          if (sx.length !== sy.length) {
            const longer = sx.length > sy.length ? sx : sy;
            for (let j = m; j < longer.length; j++) if (longer[j].z > 0) return longer === sx ? 1 : -1;
          }
        }
        for (let i = lo; i < hi; i++) {
          const nx = qx[i];
          const ny = qy[i];
          const sx = this.sorted(nx, qfx[i], RULE_1A).nodes;
          const sy = this.sorted(ny, qfy[i], RULE_1A).nodes;
          const m = sx.length < sy.length ? sx.length : sy.length;
          len = pushPairs(q, len, sx, nx, sy, ny, m);
        }
        lo = hi;
      }
    } finally {
      releaseQueue(q, len);
    }
    return 0;
  }

  /** Compare under every active rule up to `level`: ±(rule index + 1) for the deciding rule, 0 for a tie. */
  compareUpTo(level: number, x: CipNode, fx: CipNode | null, y: CipNode, fy: CipNode | null): number {
    for (let r = 0; r <= level; r++) {
      if (!this.active[r]) continue;
      const c = this.compareRule(r, x, fx, y, fy);
      if (c !== 0) return c > 0 ? r + 1 : -(r + 1);
    }
    return 0;
  }

  /** The branches of `node` entered from `from`, sorted highest first under rules up to `level`. */
  sorted(node: CipNode, from: CipNode | null, level: number): SortedBranches {
    if (level === RULE_1A) {
      const s0 = this.sorted0(node, from);
      if (s0.pending) this.finish0(s0, node);
      return s0;
    }
    if (node.dup || node.atom < 0) return EMPTY;
    // the usual case, downwards inside the scope in plain mode: an array by level
    const plain =
      from === node.parent && !this.mirror && this.dg.rule6Ref < 0 && (level < RULE_3 || this.inScope(node));
    if (plain) {
      if (node.down === null) node.down = new Array<SortedBranches>(LEVELS);
      const hit = node.down[level];
      if (hit !== undefined) return hit;
      const out = this.sortAt(node, from, level);
      node.down[level] = out;
      return out;
    }
    // outside the scope every descriptor is hidden, so such traversals are cached apart
    const hidden = level >= RULE_3 && (from !== node.parent || !this.inScope(node)) ? 1 : 0;
    const mirrored = this.mirror && level >= RULE_5 ? 2 : 0;
    const num = ((from === null ? 0 : from.id + 1) * 16 + level) * 4 + hidden + mirrored;
    const key = level >= RULE_6 ? `${num}:${this.dg.rule6Ref}` : num;
    if (node.sorted === null) node.sorted = new Map();
    const hit = node.sorted.get(key);
    if (hit) return hit;
    const out = this.sortAt(node, from, level);
    node.sorted.set(key, out);
    return out;
  }

  /**
   * The Rule 1a list of the branches of `node` entered from `from`, cached as sorted() caches it, but possibly
   * still pending (ordered by atomic number alone).
   */
  private sorted0(node: CipNode, from: CipNode | null): SortedBranches {
    if (node.dup || node.atom < 0) return EMPTY;
    if (from === node.parent && !this.mirror && this.dg.rule6Ref < 0) {
      const hit = node.down0;
      if (hit !== null) return hit;
      const out = this.byAtomicNumber(node, from);
      node.down0 = out;
      return out;
    }
    const key = (from === null ? 0 : from.id + 1) * 64;
    if (node.sorted === null) node.sorted = new Map();
    const hit = node.sorted.get(key);
    if (hit) return hit;
    const out = this.byAtomicNumber(node, from);
    node.sorted.set(key, out);
    return out;
  }

  /** The branches by atomic number, highest first (stable): a pending Rule 1a list. */
  private byAtomicNumber(node: CipNode, from: CipNode | null): SortedBranches {
    const br = this.dg.branches(node, from);
    // branches() hands out the node's own child list when entered from its parent: sort a copy of that one
    const nodes = br === node.kids ? br.slice() : br;
    for (let i = 1; i < nodes.length; i++) {
      const v = nodes[i];
      let j = i - 1;
      while (j >= 0 && nodes[j].z < v.z) {
        nodes[j + 1] = nodes[j];
        j--;
      }
      nodes[j + 1] = v;
    }
    // `tie` is made when the list is completed (finish0)
    return { nodes, tie: NO_TIES, pending: true };
  }

  /** Order the runs of equal atomic number of a pending Rule 1a list by their whole branches, in place. */
  private finish0(out: SortedBranches, node: CipNode): void {
    const nodes = out.nodes;
    out.tie = new Array<boolean>(nodes.length).fill(false);
    for (let i = 0; i < nodes.length;) {
      let j = i + 1;
      while (j < nodes.length && nodes[j].z === nodes[i].z) j++;
      if (j - i > 1) {
        // hydrogens, phantoms and duplicates of one atomic number tie under Rule 1a (compareRule gives 0 for
        // each pair): the run keeps its order, all tied
        if (allLeaves(nodes, i, j)) for (let x = i + 1; x < j; x++) out.tie[x] = true;
        else this.sortRun(nodes, i, j, node, RULE_1A, out);
      }
      i = j;
    }
    out.pending = false;
  }

  private sortAt(node: CipNode, from: CipNode | null, level: number): SortedBranches {
    // the order under rules up to `level` refines the order under the rules before it: only runs that tie
    // there need sorting, and only by this rule. Rule 4b is no such rule: it compares the ligands of the unit
    // being ranked by the like/unlike pairs of their whole branches (P-92.5.2; Hanson et al. 2018), and puts
    // no order on the branches of a node farther out. Exploring there under Rules 4c and 5, the branches stay
    // in their Rule 4a order and are ordered by the rule being applied, so a pseudoasymmetric node counts by its
    // own r/s (Rule 4c) and its chiral neighbours by R/S (Rule 5) wherever it sits: the suite's VS268 (16S).
    const base = this.sorted(node, from, level - 1);
    if (!this.active[level] || level === RULE_4B || !anyTrue(base.tie)) return base;
    const out: SortedBranches = { nodes: base.nodes.slice(), tie: base.tie.slice(), pending: false };
    for (let i = 0; i < out.nodes.length;) {
      let j = i + 1;
      while (j < out.nodes.length && base.tie[j]) j++;
      if (j - i > 1) this.sortRun(out.nodes, i, j, node, level, out);
      i = j;
    }
    return out;
  }

  /**
   * Sort nodes[i..j) (all branches of `centre`, tied under the rules before `rule`) by `rule` alone, highest
   * first, writing them and their ties into `out` at the same places.
   */
  private sortRun(
    nodes: CipNode[],
    i: number,
    j: number,
    centre: CipNode,
    rule: number,
    out: SortedBranches,
  ): SortedBranches {
    if (j - i === 2) {
      const a = nodes[i];
      const b = nodes[i + 1];
      const c = this.compareRule(rule, a, centre, b, centre);
      out.nodes[i] = c < 0 ? b : a;
      out.nodes[i + 1] = c < 0 ? a : b;
      out.tie[i] = false;
      out.tie[i + 1] = c === 0;
      return out;
    }
    const run = nodes.slice(i, j);
    const k = run.length;
    const m: number[] = new Array<number>(k * k).fill(0);
    for (let a = 0; a < k; a++) {
      for (let b = a + 1; b < k; b++) {
        const c = this.compareRule(rule, run[a], centre, run[b], centre);
        m[a * k + b] = c;
        m[b * k + a] = -c;
      }
    }
    const order = run.map((_, x) => x);
    for (let x = 1; x < k; x++) {
      const v = order[x];
      let y = x - 1;
      while (y >= 0 && m[order[y] * k + v] < 0) {
        order[y + 1] = order[y];
        y--;
      }
      order[y + 1] = v;
    }
    for (let x = 0; x < k; x++) {
      out.nodes[i + x] = run[order[x]];
      out.tie[i + x] = x > 0 && m[order[x - 1] * k + order[x]] === 0;
    }
    return out;
  }
}

export { CipNode };

/** Placeholder for cleared queue slots. */
const NO_NODE = new CipNode(-1, -2, 0, false, 0, 0, false, null);

/** The `tie` of a pending list (never read before finish0 replaces it). */
const NO_TIES: boolean[] = [];

const EMPTY: SortedBranches = { nodes: [], tie: [], pending: false };

/** Rule levels (1a to 6): the length of a node's `down` cache. */
const LEVELS = 9;

function anyTrue(t: boolean[]): boolean {
  for (let i = 0; i < t.length; i++) if (t[i]) return true;
  return false;
}

/** nodes[i..j) are all hydrogens, phantoms or duplicates. */
function allLeaves(nodes: CipNode[], i: number, j: number): boolean {
  for (let k = i; k < j; k++) if (!nodes[k].dup && nodes[k].atom >= 0) return false;
  return true;
}

function invertChiral(l: CipLabel | null): CipLabel | null {
  if (l === 'e') return 'z';
  if (l === 'z') return 'e';
  return l === 'R' ? 'S' : l === 'S' ? 'R' : l === 'M' ? 'P' : l === 'P' ? 'M' : l;
}
