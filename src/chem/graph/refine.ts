/**
 * Colour refinement to the coarsest equitable partition (the stable colouring of the 1-dimensional
 * Weisfeiler–Leman algorithm, the exact form of Morgan's extended connectivity), computed cell by cell with a
 * queue of splitter cells as in McKay's partition refinement (Congr. Numer. 30 (1981) 45) and Hopcroft's
 * "all but the largest fragment" rule. Atoms are counted per bond code, so a neighbour through a double bond
 * differs from one through a single bond.
 *
 * Cells are kept in an order that depends only on the graph (initial cells sorted by key, fragments sorted by
 * their counts, splitters taken in order of creation), so the final cell index of an atom is independent of
 * atom order. With `split` > 0 the graph is a disjoint union A ∪ B (A = atoms [0, split)) and refinement fails
 * as soon as a cell has different numbers of A and B atoms.
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
/** Count weight per bond code (up to 63 neighbours per code and cell are counted exactly). */
const WEIGHT = [0, 1, 1 << 6, 1 << 12, 1 << 18, 1 << 24, 1 << 27];

/** An ordered partition: cells are contiguous runs of `lab`; `start[v]` is the first position of v's cell. */
export interface Partition {
  lab: Int32Array;
  /** Position of each atom in `lab`. */
  pos: Int32Array;
  /** First position of the cell of each atom. */
  start: Int32Array;
  /** Cell length, stored at the cell's first position. */
  len: Int32Array;
  cells: number;
}

export function clonePartition(p: Partition): Partition {
  return {
    lab: p.lab.slice(),
    pos: p.pos.slice(),
    start: p.start.slice(),
    len: p.len.slice(),
    cells: p.cells,
  };
}

export function copyPartition(from: Partition, to: Partition): void {
  to.lab.set(from.lab);
  to.pos.set(from.pos);
  to.start.set(from.start);
  to.len.set(from.len);
  to.cells = from.cells;
}

/** Dense ranks (0 = lowest) of per-atom keys compared lexicographically. */
export function rankKeys(keys: ArrayLike<number>[], n: number): Int32Array {
  let rank = rankOne(keys[0], n);
  for (let k = 1; k < keys.length; k++) {
    const next = rankOne(keys[k], n);
    let m = 0;
    for (let i = 0; i < n; i++) if (next[i] >= m) m = next[i] + 1;
    const combined = new Float64Array(n);
    for (let i = 0; i < n; i++) combined[i] = rank[i] * m + next[i];
    rank = rankOne(combined, n);
  }
  return rank;
}

function rankOne(values: ArrayLike<number>, n: number): Int32Array {
  const sorted = new Float64Array(n);
  let nan = false;
  for (let i = 0; i < n; i++) {
    sorted[i] = values[i];
    if (values[i] !== values[i]) nan = true;
  }
  // Only the distinct values and their order matter below, which any ascending sort gives; the built-in
  // sort boxes every element of a Float64Array, so it is kept for input with NaN only.
  if (nan) sorted.sort();
  else heapSort(sorted, n);
  let u = 0;
  for (let i = 0; i < n; i++) if (i === 0 || sorted[i] !== sorted[u - 1]) sorted[u++] = sorted[i];
  const out = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const v = values[i];
    let lo = 0;
    let hi = u - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (sorted[mid] < v) lo = mid + 1;
      else hi = mid;
    }
    out[i] = lo;
  }
  return out;
}

/** Ascending in-place heap sort of a[0..n) (no NaN). */
function heapSort(a: Float64Array, n: number): void {
  for (let i = (n >> 1) - 1; i >= 0; i--) siftDown(a, i, n);
  for (let end = n - 1; end > 0; end--) {
    const x = a[0];
    a[0] = a[end];
    a[end] = x;
    siftDown(a, 0, end);
  }
}

function siftDown(a: Float64Array, i: number, n: number): void {
  const x = a[i];
  for (;;) {
    let c = 2 * i + 1;
    if (c >= n) break;
    if (c + 1 < n && a[c + 1] > a[c]) c++;
    if (!(a[c] > x)) break;
    a[i] = a[c];
    i = c;
  }
  a[i] = x;
}

/** Partition whose cells are the atoms of equal rank, in rank order. */
export function partitionOf(rank: Int32Array): Partition {
  const n = rank.length;
  const lab = new Int32Array(n);
  const pos = new Int32Array(n);
  const start = new Int32Array(n);
  const len = new Int32Array(n);
  let cells = 0;
  for (let i = 0; i < n; i++) if (rank[i] + 1 > cells) cells = rank[i] + 1;
  const first = new Int32Array(cells + 1);
  for (let i = 0; i < n; i++) first[rank[i] + 1]++;
  for (let c = 0; c < cells; c++) first[c + 1] += first[c];
  const fill = first.slice(0, cells);
  for (let i = 0; i < n; i++) {
    const c = rank[i];
    pos[i] = fill[c];
    lab[fill[c]++] = i;
    start[i] = first[c];
  }
  for (let c = 0; c < cells; c++) len[first[c]] = first[c + 1] - first[c];
  return { lab, pos, start, len, cells };
}

/** Cell index (0-based, in partition order) of every atom. */
export function cellIndex(p: Partition): Int32Array {
  const n = p.lab.length;
  const out = new Int32Array(n);
  let c = -1;
  for (let i = 0; i < n; i = i + p.len[i]) {
    c++;
    for (let t = i; t < i + p.len[i]; t++) out[p.lab[t]] = c;
  }
  return out;
}

const ascending = (x: number, y: number): number => x - y;

/** Reusable workspace for refining partitions of one graph. */
export class Refiner {
  private readonly count: Int32Array;
  private readonly touched: Int32Array;
  private readonly queue: Int32Array;
  private readonly inQueue: Uint8Array;
  private readonly cellHits: Int32Array;
  private readonly cellBase: Int32Array;
  private readonly members: Int32Array;
  private readonly cellsToSplit: number[] = [];
  private readonly sortBuf: Float64Array;
  private readonly starts: number[] = [];
  private head = 0;
  private tail = 0;
  private queued = 0;
  /** Work done so far (neighbour visits), for search budgets. */
  work = 0;

  constructor(
    public g: CsrGraph,
    readonly split = 0,
    /** Atoms the workspace holds (at least g.n); a larger one serves smaller graphs too. */
    readonly capacity = g.n,
  ) {
    const n = capacity;
    this.count = new Int32Array(n);
    this.touched = new Int32Array(n);
    this.queue = new Int32Array(n + 1);
    this.inQueue = new Uint8Array(n);
    this.cellHits = new Int32Array(n);
    this.cellBase = new Int32Array(n);
    this.members = new Int32Array(n);
    this.sortBuf = new Float64Array(n);
  }

  /** Moves atoms x (of A) and y (of B) of one cell into a cell of their own at the cell's start; refines. */
  individualise(p: Partition, x: number, y: number): boolean {
    const { start, len } = p;
    const s = start[x];
    const L = len[s];
    swapTo(p, x, s);
    swapTo(p, y, s + 1);
    len[s] = 2;
    len[s + 2] = L - 2;
    for (let t = s + 2; t < s + L; t++) start[p.lab[t]] = s + 2;
    p.cells++;
    return this.refine(p, [s]);
  }

  /** Balanced A/B counts in every cell (always true without a split). */
  balanced(p: Partition): boolean {
    if (this.split === 0) return true;
    for (let s = 0; s < p.lab.length; s += p.len[s]) if (!this.cellBalanced(p, s, p.len[s])) return false;
    return true;
  }

  /**
   * Refines p in place until equitable. `splitters` are the first positions of the cells to start from (all
   * cells when omitted). Returns false when A and B were found to differ.
   */
  refine(p: Partition, splitters?: number[]): boolean {
    const { offs, adj, code } = this.g;
    const { lab, start, len } = p;
    const { count, touched, queue, inQueue, cellHits, cellBase, members } = this;
    const qsize = queue.length;
    this.head = 0;
    this.tail = 0;
    this.queued = 0;
    if (splitters) for (const s of splitters) this.push(s);
    else for (let s = 0; s < lab.length; s += len[s]) this.push(s);
    const n = lab.length;
    let ok = true;
    while (this.queued > 0 && ok) {
      if (p.cells === n) break; // discrete: nothing left to split
      const w = queue[this.head];
      this.head = this.head + 1 === qsize ? 0 : this.head + 1;
      this.queued--;
      inQueue[w] = 0;
      // Count, for every atom, its neighbours in cell w per bond code.
      let nt = 0;
      const wEnd = w + len[w];
      for (let t = w; t < wEnd; t++) {
        const v = lab[t];
        this.work += offs[v + 1] - offs[v] + 1;
        for (let e = offs[v]; e < offs[v + 1]; e++) {
          const u = adj[e];
          if (count[u] === 0) touched[nt++] = u;
          count[u] += WEIGHT[code[e]];
        }
      }
      // Group the touched atoms by cell (cells in position order, so the result does not depend on atom order).
      const cells = this.cellsToSplit;
      cells.length = 0;
      for (let t = 0; t < nt; t++) {
        const s = start[touched[t]];
        if (len[s] === 1) continue;
        if (cellHits[s] === 0) cells.push(s);
        cellHits[s]++;
      }
      if (cells.length > 1) sortPositions(cells);
      let off = 0;
      for (const s of cells) {
        cellBase[s] = off;
        off += cellHits[s];
        cellHits[s] = 0;
      }
      for (let t = 0; t < nt; t++) {
        const u = touched[t];
        const s = start[u];
        if (len[s] === 1) continue;
        members[cellBase[s] + cellHits[s]++] = u;
      }
      for (const s of cells) {
        if (ok && this.splitCell(p, s, cellBase[s], cellHits[s]) < 0) ok = false;
        cellHits[s] = 0;
      }
      for (let t = 0; t < nt; t++) count[touched[t]] = 0;
    }
    this.drain();
    return ok;
  }

  private push(s: number): void {
    this.queue[this.tail] = s;
    this.tail = this.tail + 1 === this.queue.length ? 0 : this.tail + 1;
    this.inQueue[s] = 1;
    this.queued++;
  }

  private drain(): void {
    const queue = this.queue;
    while (this.head !== this.tail) {
      this.inQueue[queue[this.head]] = 0;
      this.head = this.head + 1 === queue.length ? 0 : this.head + 1;
    }
    this.queued = 0;
  }

  /**
   * Splits the cell at s by count; the cell's touched atoms are members[from .. from+k). Untouched atoms (count
   * 0) stay at the front as the first fragment. Returns the number of fragments, or -1 on an A/B imbalance.
   */
  private splitCell(p: Partition, s: number, from: number, k: number): number {
    const { lab, start, len } = p;
    const count = this.count;
    const L = len[s];
    if (k === L) {
      const first = count[lab[s]];
      let uniform = true;
      for (let t = s + 1; t < s + L; t++) {
        if (count[lab[t]] !== first) {
          uniform = false;
          break;
        }
      }
      if (uniform) return 1;
    }
    // Touched atoms to the end of the cell, then sorted there by (count, atom).
    let end = s + L;
    for (let i = 0; i < k; i++) swapTo(p, this.members[from + i], --end);
    this.work += k;
    const buf = this.sortBuf;
    for (let t = 0; t < k; t++) buf[t] = count[lab[end + t]] * 4194304 + lab[end + t];
    // Keys are distinct (they hold the atom), so any ascending sort gives the same order; short runs are
    // sorted in place rather than through a fresh subarray view.
    if (k > 16) buf.subarray(0, k).sort();
    else {
      for (let t = 1; t < k; t++) {
        const x = buf[t];
        let j = t;
        while (j > 0 && buf[j - 1] > x) {
          buf[j] = buf[j - 1];
          j--;
        }
        buf[j] = x;
      }
    }
    for (let t = 0; t < k; t++) {
      const v = buf[t] % 4194304;
      lab[end + t] = v;
      p.pos[v] = end + t;
    }
    const wasQueued = this.inQueue[s] === 1;
    const starts = this.starts;
    starts.length = 0;
    let largest = s;
    let largestLen = 0;
    if (end > s) {
      len[s] = end - s; // untouched atoms: their start is unchanged, and the cell stays balanced
      starts.push(s);
      largestLen = end - s;
    }
    let fragStart = end;
    for (let t = end; t <= s + L; t++) {
      if (t === s + L || (t > end && count[lab[t]] !== count[lab[t - 1]])) {
        const fl = t - fragStart;
        len[fragStart] = fl;
        for (let q = fragStart; q < t; q++) start[lab[q]] = fragStart;
        if (this.split > 0 && !this.cellBalanced(p, fragStart, fl)) return -1;
        starts.push(fragStart);
        if (fl > largestLen) {
          largestLen = fl;
          largest = fragStart;
        }
        fragStart = t;
      }
    }
    p.cells += starts.length - 1;
    for (const f of starts) {
      if (wasQueued) {
        if (f !== s) this.push(f);
      } else if (f !== largest) this.push(f);
    }
    return starts.length;
  }

  private cellBalanced(p: Partition, s: number, L: number): boolean {
    let a = 0;
    for (let t = s; t < s + L; t++) if (p.lab[t] < this.split) a++;
    return 2 * a === L;
  }
}

/** Ascending sort of distinct cell positions: in place for short lists (Array#sort copies its input). */
function sortPositions(a: number[]): void {
  if (a.length > 32) {
    a.sort(ascending);
    return;
  }
  for (let t = 1; t < a.length; t++) {
    const x = a[t];
    let j = t;
    while (j > 0 && a[j - 1] > x) {
      a[j] = a[j - 1];
      j--;
    }
    a[j] = x;
  }
}

/** Workspace for refineOnce(): refine() leaves count, cellHits and inQueue all zero, as it found them. */
let shared: Refiner | null = null;

/**
 * new Refiner(g).refine(p) on a workspace kept between calls. The workspace is taken out while in use, so a
 * call that throws leaves none behind in a half-used state.
 */
export function refineOnce(g: CsrGraph, p: Partition): boolean {
  let r = shared;
  shared = null;
  if (r === null || r.capacity < g.n) r = new Refiner(g, 0, Math.max(g.n, 64));
  else r.g = g;
  const ok = r.refine(p);
  r.g = EMPTY;
  shared = r;
  return ok;
}

const EMPTY: CsrGraph = { n: 0, offs: new Int32Array(1), adj: new Int32Array(0), code: new Int32Array(0) };

/** Moves atom v to position `at` (swapping with the atom there). */
function swapTo(p: Partition, v: number, at: number): void {
  const from = p.pos[v];
  const w = p.lab[at];
  p.lab[from] = w;
  p.pos[w] = from;
  p.lab[at] = v;
  p.pos[v] = at;
}
