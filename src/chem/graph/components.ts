/** Connected components (molecules of a salt or mixture). */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';

/** Atom indices ascending within each component; components ordered by their smallest atom. */
export function connectedComponents(s: Structure, g: Graph = buildGraph(s)): number[][] {
  const comp = componentIds(s, g);
  const out: number[][] = [];
  for (let i = 0; i < g.n; i++) {
    const c = comp[i];
    if (c === out.length) out.push([]);
    out[c].push(i);
  }
  return out;
}

/** Component number of each atom, numbered in order of the components' smallest atoms. */
export function componentIds(s: Structure, g: Graph = buildGraph(s)): Int32Array {
  const comp = new Int32Array(g.n).fill(-1);
  const stack: number[] = [];
  let next = 0;
  for (let start = 0; start < g.n; start++) {
    if (comp[start] >= 0) continue;
    comp[start] = next;
    stack.push(start);
    while (stack.length) {
      const u = stack.pop()!;
      for (const v of g.nbrs[u]) {
        if (comp[v] < 0) {
          comp[v] = next;
          stack.push(v);
        }
      }
    }
    next++;
  }
  return comp;
}
