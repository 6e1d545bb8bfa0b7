/**
 * Colour refinement (Morgan's extended connectivity in its exact form, the 1-dimensional Weisfeiler–Leman
 * algorithm): an atom's new colour is its old colour plus the sorted multiset of (bond code, neighbour colour).
 * Colours are dense ranks of the sorted signatures, so they depend only on the graph, never on atom order.
 */

/** Compressed adjacency: neighbours of atom i are adj[offs[i] .. offs[i+1]), with a bond code each. */
export interface CsrGraph {
  n: number;
  offs: Int32Array;
  adj: Int32Array;
  code: Int32Array;
}

/** Bond code: 1..4 for the Kekulé order, 5 for an aromatic bond. */
export const AROMATIC_CODE = 5;
const CODES = 8;

/** Dense ranks (0 = lowest) of per-atom keys compared lexicographically. */
export function rankKeys(keys: ArrayLike<number>[], n: number): Int32Array {
  const idx = Array.from({ length: n }, (_, i) => i);
  const cmp = (i: number, j: number): number => {
    for (const k of keys) {
      const d = k[i] - k[j];
      if (d !== 0) return d;
    }
    return 0;
  };
  idx.sort(cmp);
  const out = new Int32Array(n);
  let r = 0;
  for (let t = 0; t < n; t++) {
    if (t > 0 && cmp(idx[t - 1], idx[t]) !== 0) r++;
    out[idx[t]] = r;
  }
  return out;
}

export function countColours(colour: Int32Array): number {
  let max = -1;
  for (let i = 0; i < colour.length; i++) if (colour[i] > max) max = colour[i];
  return max + 1;
}

/**
 * Workspace for repeated refinement of one graph (the search refines at every node).
 * `split` > 0 marks a disjoint union A ∪ B with A = atoms [0, split): refinement then fails (returns -1) as
 * soon as some colour has different numbers of A and B atoms.
 */
export class Refiner {
  private readonly sig: Int32Array;
  private readonly order: Int32Array;
  private readonly next: Int32Array;
  private readonly countA: Int32Array;
  private readonly countB: Int32Array;

  constructor(
    readonly g: CsrGraph,
    readonly split = 0,
  ) {
    this.sig = new Int32Array(g.adj.length);
    this.order = new Int32Array(g.n);
    this.next = new Int32Array(g.n);
    this.countA = new Int32Array(g.n + 1);
    this.countB = new Int32Array(g.n + 1);
  }

  /** Refines `colour` (dense ranks) in place to the stable colouring; returns the class count or -1. */
  refine(colour: Int32Array, classes = countColours(colour)): number {
    const { n, offs, adj, code } = this.g;
    const sig = this.sig;
    const order = this.order;
    if (this.split > 0 && !this.balanced(colour, classes)) return -1;
    for (;;) {
      if (classes === n) return classes;
      for (let i = 0; i < n; i++) {
        const lo = offs[i];
        const hi = offs[i + 1];
        for (let e = lo; e < hi; e++) {
          const v = colour[adj[e]] * CODES + code[e];
          let p = e;
          while (p > lo && sig[p - 1] > v) {
            sig[p] = sig[p - 1];
            p--;
          }
          sig[p] = v;
        }
        order[i] = i;
      }
      const cmp = (i: number, j: number): number => {
        let d = colour[i] - colour[j];
        if (d !== 0) return d;
        const li = offs[i];
        const lj = offs[j];
        d = offs[i + 1] - li - (offs[j + 1] - lj);
        if (d !== 0) return d;
        const len = offs[i + 1] - li;
        for (let t = 0; t < len; t++) {
          d = sig[li + t] - sig[lj + t];
          if (d !== 0) return d;
        }
        return 0;
      };
      order.sort(cmp);
      const next = this.next;
      let r = 0;
      next[order[0]] = 0;
      for (let t = 1; t < n; t++) {
        if (cmp(order[t - 1], order[t]) !== 0) r++;
        next[order[t]] = r;
      }
      const fresh = r + 1;
      if (fresh === classes) return classes;
      colour.set(next);
      classes = fresh;
      if (this.split > 0 && !this.balanced(colour, classes)) return -1;
    }
  }

  private balanced(colour: Int32Array, classes: number): boolean {
    const a = this.countA;
    const b = this.countB;
    a.fill(0, 0, classes);
    b.fill(0, 0, classes);
    for (let i = 0; i < this.split; i++) a[colour[i]]++;
    for (let i = this.split; i < this.g.n; i++) b[colour[i]]++;
    for (let c = 0; c < classes; c++) if (a[c] !== b[c]) return false;
    return true;
  }
}
