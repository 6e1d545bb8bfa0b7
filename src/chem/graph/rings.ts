/**
 * Ring perception: a smallest set of smallest rings (a minimum cycle basis, chosen from Horton's candidate
 * cycles — Horton, SIAM J. Comput. 16 (1987) 358), ring membership of atoms and bonds, the size of the smallest
 * ring through each bond and atom (exact, not read off the SSSR), and ring systems (fused, spiro, bridged).
 */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { minimumCycleBasis, ringSystemsOf } from './sssr.js';

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
  const rings = bondInRing.some((x) => x) ? minimumCycleBasis(s, g, bondInRing, smallestRingOfBond) : [];
  return {
    rings,
    atomInRing,
    bondInRing,
    smallestRingOfBond,
    smallestRingOfAtom,
    ringSystems: ringSystemsOf(s, n, bondInRing).systems,
  };
}

/** For each bond u–v: 1 + the shortest u..v path that avoids the bond itself (0 when there is none). */
export function smallestRings(s: Structure, g: Graph, bridgeOf?: Uint8Array): number[] {
  const n = g.n;
  const out = new Array<number>(s.bonds.length).fill(0);
  const dist = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  const bridge = bridgeOf ?? bridges(g, s.bonds.length);
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
