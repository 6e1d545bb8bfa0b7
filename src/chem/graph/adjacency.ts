/**
 * Adjacency lists of a Structure: for each atom its neighbours and, in parallel, the index of the bond that
 * joins them. Hydrogens counted in `hCount` are not atoms and do not appear here; explicit H atoms do.
 */
import type { Structure } from '../types.js';

export interface Graph {
  n: number;
  nbrs: Int32Array[];
  /** Bond index parallel to `nbrs`. */
  nbrBonds: Int32Array[];
}

/**
 * The graphs last built, with the structure, atom count and bond ends each was built from: the engine asks for
 * the adjacency of one structure several times in a row (perception, classes, key, search), so a few recent
 * entries answer nearly every repeat, and a structure changed in place since (other ends, atoms or bonds
 * added) is built afresh. Graphs are never modified after they are built, so one object can be handed to every
 * caller. (A short list, not a WeakMap: weak tables cost the garbage collector more than rebuilding saves.)
 */
interface Built {
  s: Structure;
  ends: Int32Array;
  g: Graph;
  /** Results derived from g alone, for rings.ts. */
  memo: GraphMemo;
}

export interface GraphMemo {
  bridge?: Uint8Array;
  bridgeM?: number;
  sizes?: number[];
}

const RECENT = 4;
const recent: Built[] = [];

/** Builds the neighbour lists. Bonds with an out-of-range end or joining an atom to itself are ignored. */
export function buildGraph(s: Structure): Graph {
  for (let i = recent.length - 1; i >= 0; i--) {
    const e = recent[i];
    if (e.s !== s) continue;
    if (sameEnds(e.ends, s)) return e.g;
    recent.splice(i, 1);
    break;
  }
  const g = buildFresh(s);
  if (recent.length >= RECENT) recent.shift();
  recent.push({ s, ends: endsOf(s), g, memo: {} });
  return g;
}

/** The memo of a graph buildGraph() returned recently, or null. */
export function memoOf(g: Graph): GraphMemo | null {
  for (let i = recent.length - 1; i >= 0; i--) if (recent[i].g === g) return recent[i].memo;
  return null;
}

/** true when g is the graph buildGraph(s) returns now (s not changed since): results derived from g hold for s. */
export function isGraphOf(g: Graph, s: Structure): boolean {
  for (let i = recent.length - 1; i >= 0; i--) {
    const e = recent[i];
    if (e.g === g) return e.s === s && sameEnds(e.ends, s);
  }
  return false;
}

/** The structure's atom count and bond ends: [n, a0, b0, a1, b1, ...]. */
function endsOf(s: Structure): Int32Array {
  const m = s.bonds.length;
  const ends = new Int32Array(2 * m + 1);
  ends[0] = s.atoms.length;
  for (let k = 0; k < m; k++) {
    const b = s.bonds[k];
    ends[2 * k + 1] = b.a;
    ends[2 * k + 2] = b.b;
  }
  return ends;
}

function sameEnds(ends: Int32Array, s: Structure): boolean {
  const m = s.bonds.length;
  if (ends.length !== 2 * m + 1 || ends[0] !== s.atoms.length) return false;
  for (let k = 0; k < m; k++) {
    const b = s.bonds[k];
    if (ends[2 * k + 1] !== b.a || ends[2 * k + 2] !== b.b) return false;
  }
  return true;
}

function buildFresh(s: Structure): Graph {
  const n = s.atoms.length;
  const m = s.bonds.length;
  const deg = new Int32Array(n);
  for (let k = 0; k < m; k++) {
    const { a, b } = s.bonds[k];
    if (!(a >= 0 && b >= 0 && a < n && b < n && a !== b)) continue;
    deg[a]++;
    deg[b]++;
  }
  // One buffer for all lists; each atom's list is a view into it.
  let total = 0;
  for (let i = 0; i < n; i++) total += deg[i];
  const flatNbrs = new Int32Array(total);
  const flatBonds = new Int32Array(total);
  const nbrs: Int32Array[] = new Array(n);
  const nbrBonds: Int32Array[] = new Array(n);
  // fill[i]: next free slot of atom i in the flat buffers.
  const fill = new Int32Array(n);
  let at = 0;
  for (let i = 0; i < n; i++) {
    nbrs[i] = flatNbrs.subarray(at, at + deg[i]);
    nbrBonds[i] = flatBonds.subarray(at, at + deg[i]);
    fill[i] = at;
    at += deg[i];
  }
  for (let k = 0; k < m; k++) {
    const { a, b } = s.bonds[k];
    if (!(a >= 0 && b >= 0 && a < n && b < n && a !== b)) continue;
    flatNbrs[fill[a]] = b;
    flatBonds[fill[a]++] = k;
    flatNbrs[fill[b]] = a;
    flatBonds[fill[b]++] = k;
  }
  return { n, nbrs, nbrBonds };
}
