/**
 * Ring perception: a smallest set of smallest rings (a minimum cycle basis, chosen from Horton's candidate
 * cycles — Horton, SIAM J. Comput. 16 (1987) 358), ring membership of atoms and bonds, the size of the smallest
 * ring through each bond and atom (exact, not read off the SSSR), and ring systems (fused, spiro, bridged).
 */
import type { Structure } from '../types.js';
import { buildGraph, isGraphOf, memoOf, type Graph } from './adjacency.js';
import { minimumCycleBasis, ringRoots, ringSystemsOf } from './sssr.js';

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
  // A copy: the sizes may be shared with later callers of smallestRings (see there), and this one is handed out.
  const smallestRingOfBond = smallestRings(s, g).slice();
  const bondInRing = new Array<boolean>(m);
  const smallestRingOfAtom = new Array<number>(n).fill(0);
  let anyRing = false;
  for (let k = 0; k < m; k++) {
    const r = smallestRingOfBond[k];
    bondInRing[k] = r > 0;
    if (r === 0) continue;
    anyRing = true;
    const { a, b } = s.bonds[k];
    if (smallestRingOfAtom[a] === 0 || r < smallestRingOfAtom[a]) smallestRingOfAtom[a] = r;
    if (smallestRingOfAtom[b] === 0 || r < smallestRingOfAtom[b]) smallestRingOfAtom[b] = r;
  }
  const atomInRing = new Array<boolean>(n);
  for (let i = 0; i < n; i++) atomInRing[i] = smallestRingOfAtom[i] > 0;
  if (!anyRing) {
    return { rings: [], atomInRing, bondInRing, smallestRingOfBond, smallestRingOfAtom, ringSystems: [] };
  }
  const systems = ringSystemsOf(s, n, bondInRing);
  return {
    rings: minimumCycleBasis(s, g, bondInRing, smallestRingOfBond, systems),
    atomInRing,
    bondInRing,
    smallestRingOfBond,
    smallestRingOfAtom,
    ringSystems: systems.systems,
  };
}

/**
 * For each bond u–v: 1 + the shortest u..v path that avoids the bond itself (0 when there is none). When g is
 * the structure's current buildGraph() and the bridges are its own, the answer is kept with the graph and the
 * same array is returned to every caller: do not modify it.
 */
export function smallestRings(s: Structure, g: Graph, bridgeOf?: Uint8Array): number[] {
  const m = s.bonds.length;
  if (isGraphOf(g, s)) {
    const bridge = bridges(g, m);
    const memo = memoOf(g);
    if (memo && (bridgeOf === undefined || bridgeOf === bridge)) {
      if (memo.sizes && memo.bridge === bridge) return memo.sizes;
      const sizes = ringSizes(s, g, bridge);
      if (memo.bridge === bridge) memo.sizes = sizes;
      return sizes;
    }
  }
  return ringSizes(s, g, bridgeOf ?? bridges(g, m));
}

/**
 * smallestRings() proper. Ring bonds (valid non-bridges) fall into ring systems (connected through ring
 * bonds); a system with as many bonds as atoms is one simple cycle, and each of its bonds lies in that cycle
 * only. Other ring bonds get a breadth-first search over the non-bridge bonds.
 */
function ringSizes(s: Structure, g: Graph, bridge: Uint8Array): number[] {
  const n = g.n;
  const m = s.bonds.length;
  const out = new Array<number>(m).fill(0);
  // ring bonds: valid (both ends in range, no self-loop) and not bridges
  const ring = new Uint8Array(m);
  let anyRing = false;
  for (let k = 0; k < m; k++) {
    const { a, b } = s.bonds[k];
    if (bridge[k] || !(a >= 0 && b >= 0 && a < n && b < n && a !== b)) continue;
    ring[k] = 1;
    anyRing = true;
  }
  if (!anyRing) return out;
  const { root, inRing } = ringRoots(s, n, ring);
  // Per system root: atoms minus bonds (0 for a simple cycle).
  const excess = new Int32Array(n);
  for (let i = 0; i < n; i++) if (inRing[i]) excess[root[i]]++;
  const atoms = excess.slice();
  for (let k = 0; k < m; k++) if (ring[k]) excess[root[s.bonds[k].a]]--;
  let dist: Int32Array | null = null;
  let queue: Int32Array | null = null;
  for (let k = 0; k < m; k++) {
    if (!ring[k]) continue;
    const { a, b } = s.bonds[k];
    const system = root[a];
    if (excess[system] === 0) {
      out[k] = atoms[system];
      continue;
    }
    if (dist === null || queue === null) {
      dist = new Int32Array(n).fill(-1);
      queue = new Int32Array(n);
    }
    let head = 0;
    let tail = 0;
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
        queue[tail++] = v; // also b: the queue doubles as the list of atoms to reset
        if (v === b) {
          found = dist[v] + 1;
          break;
        }
      }
    }
    out[k] = found;
    for (let t = 0; t < tail; t++) dist[queue[t]] = -1;
  }
  return out;
}

/** Bridges (bonds in no cycle) by the low-link method, iteratively. Without `keep`, do not modify the result. */
export function bridges(g: Graph, m: number, keep?: ArrayLike<boolean>): Uint8Array {
  if (keep) return bridgesOf(g, m, keep);
  const memo = memoOf(g);
  if (memo === null) return bridgesOf(g, m);
  if (memo.bridge && memo.bridgeM === m) return memo.bridge;
  const bridge = bridgesOf(g, m);
  memo.bridge = bridge;
  memo.bridgeM = m;
  memo.sizes = undefined;
  return bridge;
}

function bridgesOf(g: Graph, m: number, keep?: ArrayLike<boolean>): Uint8Array {
  const n = g.n;
  const isBridge = new Uint8Array(m);
  const disc = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const parentBond = new Int32Array(n).fill(-1);
  const iter = new Int32Array(n);
  const stack = new Int32Array(n);
  let sp = 0;
  let time = 0;
  for (let root = 0; root < n; root++) {
    if (disc[root] >= 0) continue;
    disc[root] = low[root] = time++;
    stack[sp++] = root;
    while (sp > 0) {
      const u = stack[sp - 1];
      if (iter[u] < g.nbrs[u].length) {
        const i = iter[u]++;
        const v = g.nbrs[u][i];
        const k = g.nbrBonds[u][i];
        if (k === parentBond[u] || (keep && !keep[k])) continue;
        if (disc[v] < 0) {
          disc[v] = low[v] = time++;
          parentBond[v] = k;
          stack[sp++] = v;
        } else if (disc[v] < low[u]) low[u] = disc[v];
      } else {
        sp--;
        if (sp > 0) {
          const p = stack[sp - 1];
          if (low[u] < low[p]) low[p] = low[u];
          if (low[u] > disc[p]) isBridge[parentBond[u]] = 1;
        }
      }
    }
  }
  return isBridge;
}
