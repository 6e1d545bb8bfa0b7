/**
 * Small graph helpers for the molfile reader and the coordinate-based stereo readers: neighbour lists and
 * ring-bond detection (a bond is in a ring when it is not a bridge of the molecular graph).
 */
import type { Bond } from '../types.js';

export interface Adjacency {
  /** nbr[i] = neighbour atom indices of atom i, in bond input order. */
  nbr: number[][];
  /** bnd[i][k] = index of the bond joining i and nbr[i][k]. */
  bnd: number[][];
}

export function adjacency(atomCount: number, bonds: readonly Bond[]): Adjacency {
  const nbr: number[][] = [];
  const bnd: number[][] = [];
  for (let i = 0; i < atomCount; i++) {
    nbr.push([]);
    bnd.push([]);
  }
  for (let k = 0; k < bonds.length; k++) {
    const { a, b } = bonds[k]!;
    nbr[a]!.push(b);
    bnd[a]!.push(k);
    nbr[b]!.push(a);
    bnd[b]!.push(k);
  }
  return { nbr, bnd };
}

/** ring[k] is true when bond k lies on a cycle (iterative bridge finding, no recursion limit). */
export function ringBonds(atomCount: number, bonds: readonly Bond[], adj: Adjacency): boolean[] {
  const ring = new Array<boolean>(bonds.length).fill(true);
  const disc = new Int32Array(atomCount).fill(-1);
  const low = new Int32Array(atomCount);
  let time = 0;
  for (let root = 0; root < atomCount; root++) {
    if (disc[root] !== -1) continue;
    // stack of [atom, parent bond, next neighbour position]
    const stack: [number, number, number][] = [[root, -1, 0]];
    disc[root] = low[root] = time++;
    while (stack.length > 0) {
      const top = stack[stack.length - 1]!;
      const [v, pb] = top;
      const ns = adj.nbr[v]!;
      if (top[2] < ns.length) {
        const k = top[2]++;
        const w = ns[k]!;
        const bk = adj.bnd[v]![k]!;
        if (bk === pb) continue;
        if (disc[w] === -1) {
          disc[w] = low[w] = time++;
          stack.push([w, bk, 0]);
        } else if (disc[w]! < low[v]!) {
          low[v] = disc[w]!;
        }
      } else {
        stack.pop();
        if (stack.length > 0) {
          const u = stack[stack.length - 1]![0];
          if (low[v]! < low[u]!) low[u] = low[v]!;
          if (low[v]! > disc[u]!) ring[pb] = false;
        }
      }
    }
  }
  return ring;
}
