/**
 * Ring perception: a smallest set of smallest rings (a minimum cycle basis, chosen from Horton's candidate
 * cycles — Horton, SIAM J. Comput. 16 (1987) 358), ring membership of atoms and bonds, the size of the smallest
 * ring through each bond and atom (exact, not read off the SSSR), and ring systems (fused, spiro, bridged).
 */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { componentIds } from './components.js';

export interface RingInfo {
  /** A smallest set of smallest rings; atoms in ring order. Sorted by size. */
  rings: number[][];
  atomInRing: boolean[];
  bondInRing: boolean[];
  /** Size of the smallest ring containing the bond; 0 = not in a ring. */
  smallestRingOfBond: number[];
  /** Size of the smallest ring containing the atom; 0 = not in a ring. */
  smallestRingOfAtom: number[];
  /** Ring systems (rings sharing at least one atom, transitively), as ascending atom sets. */
  ringSystems: number[][];
}

export function ringInfo(s: Structure, g: Graph = buildGraph(s)): RingInfo {
  const n = g.n;
  const m = s.bonds.length;
  const smallestRingOfBond = smallestRings(s, g);
  const bondInRing = smallestRingOfBond.map((x) => x > 0);
  const smallestRingOfAtom = new Array<number>(n).fill(0);
  for (let k = 0; k < m; k++) {
    const r = smallestRingOfBond[k];
    if (r === 0) continue;
    const { a, b } = s.bonds[k];
    for (const x of [a, b]) {
      if (smallestRingOfAtom[x] === 0 || r < smallestRingOfAtom[x]) smallestRingOfAtom[x] = r;
    }
  }
  const atomInRing = smallestRingOfAtom.map((x) => x > 0);
  const rings = bondInRing.some((x) => x) ? sssr(s, g, bondInRing) : [];
  return { rings, atomInRing, bondInRing, smallestRingOfBond, smallestRingOfAtom, ringSystems: systems(rings, n) };
}

/** For each bond u–v: 1 + the shortest u..v path that avoids the bond itself (0 when there is none). */
function smallestRings(s: Structure, g: Graph): number[] {
  const n = g.n;
  const out = new Array<number>(s.bonds.length).fill(0);
  const dist = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  const bridge = bridges(g, s.bonds.length);
  for (let k = 0; k < s.bonds.length; k++) {
    const { a, b } = s.bonds[k];
    if (bridge[k] || a === b || a < 0 || b < 0 || a >= n || b >= n) continue;
    let head = 0;
    let tail = 0;
    const seen: number[] = [a];
    dist[a] = 0;
    queue[tail++] = a;
    let found = 0;
    while (head < tail && found === 0) {
      const u = queue[head++];
      const nb = g.nbrs[u];
      const bb = g.nbrBonds[u];
      for (let i = 0; i < nb.length; i++) {
        if (bb[i] === k || bridge[bb[i]]) continue;
        const v = nb[i];
        if (dist[v] >= 0) continue;
        dist[v] = dist[u] + 1;
        seen.push(v);
        if (v === b) {
          found = dist[v] + 1;
          break;
        }
        queue[tail++] = v;
      }
    }
    out[k] = found;
    for (const v of seen) dist[v] = -1;
  }
  return out;
}

/** Bridges (bonds in no cycle) by the low-link method, iteratively. */
export function bridges(g: Graph, m: number, keep?: ArrayLike<boolean>): Uint8Array {
  const n = g.n;
  const isBridge = new Uint8Array(m);
  const disc = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const parentBond = new Int32Array(n).fill(-1);
  const iter = new Int32Array(n);
  const stack: number[] = [];
  let time = 0;
  for (let root = 0; root < n; root++) {
    if (disc[root] >= 0) continue;
    disc[root] = low[root] = time++;
    stack.push(root);
    while (stack.length) {
      const u = stack[stack.length - 1];
      if (iter[u] < g.nbrs[u].length) {
        const i = iter[u]++;
        const v = g.nbrs[u][i];
        const k = g.nbrBonds[u][i];
        if (k === parentBond[u] || (keep && !keep[k])) continue;
        if (disc[v] < 0) {
          disc[v] = low[v] = time++;
          parentBond[v] = k;
          stack.push(v);
        } else if (disc[v] < low[u]) low[u] = disc[v];
      } else {
        stack.pop();
        if (stack.length) {
          const p = stack[stack.length - 1];
          if (low[u] < low[p]) low[p] = low[u];
          if (low[u] > disc[p]) isBridge[parentBond[u]] = 1;
        }
      }
    }
  }
  return isBridge;
}

interface Candidate {
  size: number;
  atoms: number[];
  bits: Uint32Array;
}

/** Minimum cycle basis: Horton candidates sorted by size, kept when independent over GF(2). */
function sssr(s: Structure, g: Graph, bondInRing: boolean[]): number[][] {
  const n = g.n;
  const m = s.bonds.length;
  let ringAtoms = 0;
  let ringBonds = 0;
  for (let k = 0; k < m; k++) if (bondInRing[k]) ringBonds++;
  const inRing = new Uint8Array(n);
  for (let k = 0; k < m; k++) {
    if (!bondInRing[k]) continue;
    inRing[s.bonds[k].a] = 1;
    inRing[s.bonds[k].b] = 1;
  }
  for (let i = 0; i < n; i++) ringAtoms += inRing[i];
  // Components of the ring-bond subgraph: count atoms in ring by their component among ring bonds.
  const comp = componentIds(s, ringSubgraph(g, bondInRing));
  const compSet = new Set<number>();
  for (let i = 0; i < n; i++) if (inRing[i]) compSet.add(comp[i]);
  const nullity = ringBonds - ringAtoms + compSet.size;
  if (nullity <= 0) return [];

  const words = (m + 31) >>> 5;
  const cands: Candidate[] = [];
  const seenKeys = new Set<string>();
  const dist = new Int32Array(n);
  const parent = new Int32Array(n);
  const parentBond = new Int32Array(n);
  const branch = new Int32Array(n);
  const order = new Int32Array(n);
  for (let r = 0; r < n; r++) {
    if (!inRing[r]) continue;
    dist.fill(-1);
    dist[r] = 0;
    parent[r] = -1;
    parentBond[r] = -1;
    branch[r] = r;
    let head = 0;
    let tail = 0;
    order[tail++] = r;
    while (head < tail) {
      const u = order[head++];
      const nb = g.nbrs[u];
      for (let i = 0; i < nb.length; i++) {
        const k = g.nbrBonds[u][i];
        if (!bondInRing[k]) continue;
        const v = nb[i];
        if (dist[v] >= 0) continue;
        dist[v] = dist[u] + 1;
        parent[v] = u;
        parentBond[v] = k;
        branch[v] = u === r ? v : branch[u];
        order[tail++] = v;
      }
    }
    // Every non-tree ring bond x–y closes a candidate P(r,x) + xy + P(y,r) when the paths meet only at r.
    for (let t = 0; t < tail; t++) {
      const x = order[t];
      const nb = g.nbrs[x];
      for (let i = 0; i < nb.length; i++) {
        const k = g.nbrBonds[x][i];
        const y = nb[i];
        if (!bondInRing[k] || parentBond[x] === k || parentBond[y] === k || dist[y] < 0) continue;
        if (dist[y] < dist[x] || (dist[y] === dist[x] && y < x)) continue; // each bond once per root
        if (x !== r && y !== r && branch[x] === branch[y]) continue;
        const bits = new Uint32Array(words);
        const path: number[] = [];
        for (let u = x; u !== r; u = parent[u]) {
          path.push(u);
          bits[parentBond[u] >>> 5] ^= 1 << (parentBond[u] & 31);
        }
        path.push(r);
        path.reverse(); // r .. x
        const back: number[] = [];
        for (let u = y; u !== r; u = parent[u]) {
          back.push(u);
          bits[parentBond[u] >>> 5] ^= 1 << (parentBond[u] & 31);
        }
        bits[k >>> 5] ^= 1 << (k & 31);
        const atoms = path.concat(back); // r .. x, y .. (child of r)
        const key = Array.from(bits).join(',');
        if (seenKeys.has(key)) continue;
        seenKeys.add(key);
        cands.push({ size: atoms.length, atoms, bits });
      }
    }
  }
  cands.sort((p, q) => p.size - q.size);

  // Gaussian elimination over GF(2), basis kept with distinct leading bits.
  const basis: Uint32Array[] = [];
  const pivots: number[] = [];
  const rings: number[][] = [];
  for (const c of cands) {
    const v = c.bits.slice();
    for (let j = 0; j < basis.length; j++) {
      const p = pivots[j];
      if (v[p >>> 5] & (1 << (p & 31))) xorInto(v, basis[j]);
    }
    const p = firstBit(v);
    if (p < 0) continue;
    // keep the basis reduced on pivot columns so later reductions need one pass
    for (let j = 0; j < basis.length; j++) {
      if (basis[j][p >>> 5] & (1 << (p & 31))) xorInto(basis[j], v);
    }
    basis.push(v);
    pivots.push(p);
    rings.push(c.atoms);
    if (rings.length === nullity) break;
  }
  return rings;
}

function xorInto(v: Uint32Array, w: Uint32Array): void {
  for (let i = 0; i < v.length; i++) v[i] ^= w[i];
}

function firstBit(v: Uint32Array): number {
  for (let i = 0; i < v.length; i++) if (v[i] !== 0) return i * 32 + (31 - Math.clz32(v[i] & -v[i]));
  return -1;
}

export function ringSubgraph(g: Graph, bondInRing: boolean[]): Graph {
  const nbrs: Int32Array[] = [];
  const nbrBonds: Int32Array[] = [];
  for (let u = 0; u < g.n; u++) {
    const keep: number[] = [];
    for (let i = 0; i < g.nbrs[u].length; i++) if (bondInRing[g.nbrBonds[u][i]]) keep.push(i);
    nbrs.push(Int32Array.from(keep, (i) => g.nbrs[u][i]));
    nbrBonds.push(Int32Array.from(keep, (i) => g.nbrBonds[u][i]));
  }
  return { n: g.n, nbrs, nbrBonds };
}

/** Rings sharing an atom belong to one system. */
function systems(rings: number[][], n: number): number[][] {
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]];
    return x;
  };
  const inRing = new Uint8Array(n);
  for (const r of rings) {
    for (const a of r) {
      inRing[a] = 1;
      const ra = find(a);
      const r0 = find(r[0]);
      if (ra !== r0) parent[Math.max(ra, r0)] = Math.min(ra, r0);
    }
  }
  const byRoot = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    if (!inRing[i]) continue;
    const root = find(i);
    const list = byRoot.get(root);
    if (list) list.push(i);
    else byRoot.set(root, [i]);
  }
  return [...byRoot.values()].sort((p, q) => p[0] - q[0]);
}
