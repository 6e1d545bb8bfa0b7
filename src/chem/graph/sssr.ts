/**
 * A smallest set of smallest rings: a minimum cycle basis chosen from Horton's candidate cycles (Horton, SIAM J.
 * Comput. 16 (1987) 358) — for every root atom r and every non-tree bond x–y of a breadth-first tree from r, the
 * cycle P(r,x) + xy + P(y,r) — sorted by size and kept when independent of the rings already kept (Gaussian
 * elimination over GF(2) on bond bit sets). Each ring system is handled on its own; a system with one
 * independent cycle is that cycle.
 */
import type { Structure } from '../types.js';
import type { Graph } from './adjacency.js';

interface Candidate {
  size: number;
  atoms: number[];
  bits: Uint32Array;
}

export function minimumCycleBasis(
  s: Structure,
  g: Graph,
  bondInRing: readonly boolean[],
  smallestRingOfBond: readonly number[],
  ringSystems?: { systems: number[][]; systemOf: Int32Array },
): number[][] {
  const n = g.n;
  const m = s.bonds.length;
  const { systems, systemOf } = ringSystems ?? ringSystemsOf(s, n, bondInRing);
  const bondCount = new Int32Array(systems.length);
  const smallest = new Int32Array(systems.length).fill(0x7fffffff);
  for (let k = 0; k < m; k++) {
    if (!bondInRing[k]) continue;
    const r = systemOf[s.bonds[k].a];
    bondCount[r]++;
    smallest[r] = Math.min(smallest[r], smallestRingOfBond[k]);
  }
  const rings: number[][] = [];
  systems.forEach((atoms, r) => {
    const nullity = bondCount[r] - atoms.length + 1;
    if (nullity === 1) rings.push(walkCycle(atoms[0], g, bondInRing));
    else if (nullity > 1) rings.push(...hortonBasis(atoms, nullity, g, bondInRing, m, smallest[r]));
  });
  return rings.sort((p, q) => p.length - q.length);
}

/**
 * Atoms joined by the bonds `isRing` marks, transitively (union-find): `root[i]` is the smallest atom of i's ring
 * system (i itself for an atom in no ring), `inRing[i]` is 1 for an atom on a marked bond.
 */
export function ringRoots(
  s: Structure,
  n: number,
  isRing: ArrayLike<boolean | number>,
): { root: Int32Array; inRing: Uint8Array } {
  const root = new Int32Array(n);
  for (let i = 0; i < n; i++) root[i] = i;
  const find = (x: number): number => {
    while (root[x] !== x) x = root[x] = root[root[x]];
    return x;
  };
  const inRing = new Uint8Array(n);
  for (let k = 0; k < s.bonds.length; k++) {
    if (!isRing[k]) continue;
    const b = s.bonds[k];
    inRing[b.a] = inRing[b.b] = 1;
    const ra = find(b.a);
    const rb = find(b.b);
    if (ra !== rb) root[Math.max(ra, rb)] = Math.min(ra, rb);
  }
  for (let i = 0; i < n; i++) root[i] = find(i);
  return { root, inRing };
}

/**
 * Ring systems (fused, spiro, bridged): atoms joined by ring bonds, transitively. Systems are ordered by their
 * smallest atom, atoms ascending; systemOf is -1 for atoms in no ring.
 */
export function ringSystemsOf(
  s: Structure,
  n: number,
  bondInRing: readonly boolean[],
): { systems: number[][]; systemOf: Int32Array } {
  const { root: rootOf, inRing } = ringRoots(s, n, bondInRing);
  const systems: number[][] = [];
  const systemOf = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    if (!inRing[i]) continue;
    const root = rootOf[i];
    if (systemOf[root] < 0) {
      systemOf[root] = systems.length;
      systems.push([]);
    }
    systemOf[i] = systemOf[root];
    systems[systemOf[i]].push(i);
  }
  return { systems, systemOf };
}

/** The single cycle of a ring system with one independent cycle, from `start`. */
function walkCycle(start: number, g: Graph, bondInRing: readonly boolean[]): number[] {
  const out = [start];
  let prevBond = -1;
  let u = start;
  for (;;) {
    let next = -1;
    for (let i = 0; i < g.nbrs[u].length; i++) {
      const k = g.nbrBonds[u][i];
      if (bondInRing[k] && k !== prevBond) {
        next = g.nbrs[u][i];
        prevBond = k;
        break;
      }
    }
    if (next < 0 || next === start) return out;
    out.push(next);
    u = next;
  }
}

/**
 * Horton candidates are generated in rounds of growing size limit, from the system's smallest ring (exact, per
 * bond) up, with the breadth-first search cut at half the limit, so large
 * fused systems (fullerenes, big polycycles) do not pay for every long candidate; each round's candidates are
 * longer than all earlier ones, so elimination stays in size order.
 */
function hortonBasis(
  atoms: number[],
  nullity: number,
  g: Graph,
  bondInRing: readonly boolean[],
  m: number,
  smallest: number,
): number[][] {
  const n = g.n;
  const words = (m + 31) >>> 5;
  const seen = new Map<number, Uint32Array[]>();
  const dist = new Int32Array(n).fill(-1);
  const parent = new Int32Array(n);
  const parentBond = new Int32Array(n);
  const branch = new Int32Array(n);
  const order = new Int32Array(n);
  const basis: Uint32Array[] = [];
  const owner = new Int32Array(m).fill(-1);
  const rings: number[][] = [];
  const scratch = new Uint32Array(words);
  const work = new Uint32Array(words);
  let below = 0;
  let complete = false;
  for (let limit = smallest; rings.length < nullity; limit = limit < 16 ? limit + 2 : limit * 2) {
    const depth = (limit + 1) >> 1;
    const cands: Candidate[] = [];
    // No candidate of this round is shorter than `first` (the smallest ring is exact), so candidates of that
    // size are eliminated as they are found, in the order a stable sort by size would give them; once the
    // basis is complete the remaining roots need no search. Longer ones wait for the end of the round.
    const first = Math.max(below + 1, smallest);
    for (const r of atoms) {
      dist[r] = 0;
      parent[r] = -1;
      parentBond[r] = -1;
      branch[r] = r;
      let head = 0;
      let tail = 0;
      order[tail++] = r;
      // Breadth-first, level by level. When x (at dist d < depth) is expanded, every atom at dist <= d is
      // already known, so a neighbour met for the first time is its child, and a known neighbour reached
      // through a bond other than a tree bond closes a candidate: the non-tree bonds x–y met this way, taken
      // from the end x nearer r (the smaller atom when level), in the order the atoms are expanded, are the
      // candidates of a scan of every tree atom's bonds after the search. (Bonds between two atoms at dist
      // `depth`, which are not expanded, would close cycles longer than the limit.)
      while (head < tail) {
        const x = order[head++];
        const dx = dist[x];
        if (dx >= depth) continue;
        const nb = g.nbrs[x];
        const nk = g.nbrBonds[x];
        for (let i = 0; i < nb.length; i++) {
          const k = nk[i];
          if (!bondInRing[k]) continue;
          const y = nb[i];
          const dy = dist[y];
          if (dy < 0) {
            dist[y] = dx + 1;
            parent[y] = x;
            parentBond[y] = k;
            branch[y] = x === r ? y : branch[x];
            order[tail++] = y;
            continue;
          }
          if (parentBond[x] === k || parentBond[y] === k) continue;
          if (dy < dx || (dy === dx && y < x)) continue; // each bond once per root
          if (x !== r && y !== r && branch[x] === branch[y]) continue;
          const size = dx + dy + 1;
          if (size <= below || size > limit) continue;
          // The bond set first, in a scratch vector: most candidates repeat one found from an earlier root.
          for (let u = x; u !== r; u = parent[u]) scratch[parentBond[u] >>> 5] ^= 1 << (parentBond[u] & 31);
          for (let u = y; u !== r; u = parent[u]) scratch[parentBond[u] >>> 5] ^= 1 << (parentBond[u] & 31);
          scratch[k >>> 5] ^= 1 << (k & 31);
          let hash = 0;
          for (let w = 0; w < words; w++) hash = (Math.imul(hash, 31) + scratch[w]) | 0;
          const bucket = seen.get(hash);
          let repeat = false;
          if (bucket) {
            for (let j = 0; j < bucket.length && !repeat; j++) repeat = equalBits(bucket[j], scratch);
          }
          if (repeat) {
            scratch.fill(0);
            continue;
          }
          const bits = scratch.slice();
          scratch.fill(0);
          if (bucket) bucket.push(bits);
          else seen.set(hash, [bits]);
          if (size === first) {
            if (!independent(bits, work, basis, owner)) continue;
            const path: number[] = [];
            for (let u = x; u !== r; u = parent[u]) path.push(u);
            path.push(r);
            path.reverse(); // r .. x
            for (let u = y; u !== r; u = parent[u]) path.push(u);
            rings.push(path);
            if (rings.length === nullity) {
              complete = true;
              break;
            }
            continue;
          }
          const path: number[] = [];
          for (let u = x; u !== r; u = parent[u]) path.push(u);
          path.push(r);
          path.reverse(); // r .. x
          for (let u = y; u !== r; u = parent[u]) path.push(u);
          cands.push({ size, atoms: path, bits });
        }
        if (complete) break;
      }
      for (let t = 0; t < tail; t++) dist[order[t]] = -1;
      if (complete) break;
    }
    if (complete) break;
    cands.sort((p, q) => p.size - q.size);
    for (const c of cands) {
      if (!independent(c.bits, work, basis, owner)) continue;
      rings.push(c.atoms);
      if (rings.length === nullity) break;
    }
    below = limit;
    if (limit > 2 * n + 2) break; // every candidate has been generated
  }
  return rings;
}

/**
 * Gaussian elimination over GF(2) in echelon form: each basis vector owns its lowest bit. Adds the reduced
 * `bits` (reduced in `work`) to the basis when it is independent of it; returns whether it was.
 */
function independent(bits: Uint32Array, work: Uint32Array, basis: Uint32Array[], owner: Int32Array): boolean {
  work.set(bits);
  let p = firstBit(work);
  while (p >= 0 && owner[p] >= 0) {
    xorInto(work, basis[owner[p]]);
    p = firstBit(work);
  }
  if (p < 0) return false;
  owner[p] = basis.length;
  basis.push(work.slice());
  return true;
}

function equalBits(x: Uint32Array, y: Uint32Array): boolean {
  for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return false;
  return true;
}

function xorInto(v: Uint32Array, w: Uint32Array): void {
  for (let i = 0; i < v.length; i++) v[i] ^= w[i];
}

function firstBit(v: Uint32Array): number {
  for (let i = 0; i < v.length; i++) if (v[i] !== 0) return i * 32 + (31 - Math.clz32(v[i] & -v[i]));
  return -1;
}
