/**
 * Kekulization: choose which aromatic bonds become double so that every aromatic atom that needs a double bond
 * gets exactly one. That is a perfect matching on the graph of those atoms joined by aromatic bonds; fused and
 * odd-membered systems (azulene, indolizine) make the graph non-bipartite, so this uses Edmonds' blossom
 * algorithm (J. Edmonds, "Paths, trees, and flowers", Can. J. Math. 1965, 17, 449-467) after a greedy start.
 */

export interface KekuleInput {
  atomCount: number;
  /** Both atoms of every bond, by bond index. */
  bondA: ArrayLike<number>;
  bondB: ArrayLike<number>;
  /** Indices of aromatic bonds that may become double. */
  aromaticBonds: readonly number[];
  /** Atoms that must receive exactly one double bond (true or 1). */
  needsDouble: ArrayLike<boolean | number>;
}

/** The bonds to make double, or an atom that cannot get its double bond. */
export type KekuleResult = { ok: true; doubleBonds: number[] } | { ok: false; atom: number };

/*
 * Working arrays reused between calls (kekulize is synchronous and not re-entrant; nothing here outlives a
 * call): small typed arrays are each a separate off-heap allocation.
 */
let capA = 0;
let capV = 0;
let capE = 0;
let LOCAL = new Int32Array(0);
let DEG = new Int32Array(0);
let START = new Int32Array(0);
let FILL = new Int32Array(0);
let MATCH = new Int32Array(0);
let BUCKET = new Int32Array(0);
let BY_DEGREE = new Int32Array(0);
let COMP = new Int32Array(0);
let POS = new Int32Array(0);
let NB = new Int32Array(0);
let NB_BOND = new Int32Array(0);

function reserveAtoms(atoms: number): void {
  if (atoms > capA || capA > 1 << 16) {
    capA = Math.max(atoms, 64);
    LOCAL = new Int32Array(capA);
  }
}

function reserveGraph(vertices: number, entries: number): void {
  if (vertices + 2 > capV || capV > 1 << 16) {
    capV = Math.max(vertices + 2, 64);
    DEG = new Int32Array(capV);
    START = new Int32Array(capV);
    FILL = new Int32Array(capV);
    MATCH = new Int32Array(capV);
    BUCKET = new Int32Array(capV);
    BY_DEGREE = new Int32Array(capV);
    COMP = new Int32Array(capV);
    POS = new Int32Array(capV);
  }
  if (entries > capE || capE > 1 << 17) {
    capE = Math.max(entries, 128);
    NB = new Int32Array(capE);
    NB_BOND = new Int32Array(capE);
  }
}

export function kekulize(inp: KekuleInput): KekuleResult {
  reserveAtoms(inp.atomCount);
  // local numbering over atoms that need a double bond
  const local = LOCAL.fill(-1, 0, inp.atomCount);
  const globalOf: number[] = [];
  for (let i = 0; i < inp.atomCount; i++) {
    if (inp.needsDouble[i]) {
      local[i] = globalOf.length;
      globalOf.push(i);
    }
  }
  const m = globalOf.length;
  if (m === 0) return { ok: true, doubleBonds: [] };
  // neighbour lists (in aromatic-bond order) as flat arrays: vertex u's are nb[start[u] .. start[u + 1])
  const bonds = inp.aromaticBonds;
  reserveGraph(m, 2 * bonds.length);
  const deg = DEG.fill(0, 0, m);
  for (let k = 0; k < bonds.length; k++) {
    const u = local[inp.bondA[bonds[k]!]!]!;
    const v = local[inp.bondB[bonds[k]!]!]!;
    if (u < 0 || v < 0) continue;
    deg[u]++;
    deg[v]++;
  }
  const start = START;
  start[0] = 0;
  for (let u = 0; u < m; u++) start[u + 1] = start[u]! + deg[u]!;
  const nb = NB;
  const nbBond = NB_BOND;
  const fill = FILL;
  for (let u = 0; u < m; u++) fill[u] = start[u]!;
  for (let k = 0; k < bonds.length; k++) {
    const bi = bonds[k]!;
    const u = local[inp.bondA[bi]!]!;
    const v = local[inp.bondB[bi]!]!;
    if (u < 0 || v < 0) continue;
    nb[fill[u]!] = v;
    nbBond[fill[u]!++] = bi;
    nb[fill[v]!] = u;
    nbBond[fill[v]!++] = bi;
  }
  const match = MATCH.fill(-1, 0, m);
  // Greedy start, fewest choices first (forced pairs at ring fusions and chain ends go first); ties in input
  // order (a stable counting sort by degree).
  let maxDeg = 0;
  for (let u = 0; u < m; u++) if (deg[u]! > maxDeg) maxDeg = deg[u]!;
  const bucket = BUCKET.fill(0, 0, maxDeg + 2);
  for (let u = 0; u < m; u++) bucket[deg[u]! + 1]++;
  for (let d = 0; d <= maxDeg; d++) bucket[d + 1] += bucket[d]!;
  const byDegree = BY_DEGREE;
  for (let u = 0; u < m; u++) byDegree[bucket[deg[u]!]!++] = u;
  for (let k = 0; k < m; k++) {
    const v = byDegree[k]!;
    if (match[v] !== -1) continue;
    let best = -1;
    for (let e = start[v]!; e < start[v + 1]!; e++) {
      const u = nb[e]!;
      if (match[u] === -1 && (best === -1 || deg[u]! < deg[best]!)) best = u;
    }
    if (best !== -1) {
      match[v] = best;
      match[best] = v;
    }
  }
  // Augment per connected component, so that a large molecule with many separate aromatic systems costs
  // the size of each system, not of the whole molecule, per augmenting search.
  const comp = COMP.fill(-1, 0, m);
  const pos = POS;
  const members: number[] = [];
  for (let s0 = 0; s0 < m; s0++) {
    if (comp[s0] !== -1) continue;
    members.length = 0;
    members.push(s0);
    comp[s0] = s0;
    let exposed = false;
    for (let h = 0; h < members.length; h++) {
      const u = members[h]!;
      if (match[u] === -1) exposed = true;
      for (let e = start[u]!; e < start[u + 1]!; e++) {
        const w = nb[e]!;
        if (comp[w] === -1) {
          comp[w] = s0;
          members.push(w);
        }
      }
    }
    if (!exposed) continue;
    members.forEach((u, k) => (pos[u] = k));
    const subAdj = members.map((u) => {
      const list: number[] = [];
      for (let e = start[u]!; e < start[u + 1]!; e++) list.push(pos[nb[e]!]!);
      return list;
    });
    const subMatch = new Int32Array(members.length);
    members.forEach((u, k) => (subMatch[k] = match[u] === -1 ? -1 : pos[match[u]!]!));
    for (let k = 0; k < members.length; k++) {
      if (subMatch[k] !== -1) continue;
      if (!augment(k, subAdj, subMatch)) return { ok: false, atom: globalOf[members[k]!]! };
    }
    members.forEach((u, k) => (match[u] = members[subMatch[k]!]!));
  }
  const doubleBonds: number[] = [];
  for (let u = 0; u < m; u++) {
    const v = match[u]!;
    if (v <= u) continue;
    let e = start[u]!;
    while (nb[e] !== v) e++;
    doubleBonds.push(nbBond[e]!);
  }
  return { ok: true, doubleBonds };
}

/** Edmonds: grow an alternating tree from `root`, shrinking blossoms; augment if an exposed vertex is found. */
function augment(root: number, adj: number[][], match: Int32Array): boolean {
  const m = match.length;
  const used = new Uint8Array(m);
  const parent = new Int32Array(m).fill(-1);
  const base = new Int32Array(m);
  for (let i = 0; i < m; i++) base[i] = i;
  const queue: number[] = [root];
  used[root] = 1;
  let head = 0;

  const lca = (a0: number, b0: number): number => {
    const seen = new Uint8Array(m);
    let a = a0;
    for (;;) {
      a = base[a]!;
      seen[a] = 1;
      if (match[a] === -1) break;
      a = parent[match[a]!]!;
    }
    let b = b0;
    for (;;) {
      b = base[b]!;
      if (seen[b]) return b;
      b = parent[match[b]!]!;
    }
  };
  const markPath = (v0: number, b: number, child0: number, blossom: Uint8Array): void => {
    let v = v0;
    let child = child0;
    while (base[v] !== b) {
      blossom[base[v]!] = 1;
      blossom[base[match[v]!]!] = 1;
      parent[v] = child;
      child = match[v]!;
      v = parent[match[v]!]!;
    }
  };

  while (head < queue.length) {
    const v = queue[head++]!;
    for (const to of adj[v]!) {
      if (base[v] === base[to] || match[v] === to) continue;
      if (to === root || (match[to] !== -1 && parent[match[to]!] !== -1)) {
        const cur = lca(v, to);
        const blossom = new Uint8Array(m);
        markPath(v, cur, to, blossom);
        markPath(to, cur, v, blossom);
        for (let i = 0; i < m; i++) {
          if (blossom[base[i]!]) {
            base[i] = cur;
            if (!used[i]) {
              used[i] = 1;
              queue.push(i);
            }
          }
        }
      } else if (parent[to] === -1) {
        parent[to] = v;
        if (match[to] === -1) {
          // flip the alternating path root ... to
          let x = to;
          while (x !== -1) {
            const px = parent[x]!;
            const next = match[px]!;
            match[x] = px;
            match[px] = x;
            x = next;
          }
          return true;
        }
        used[match[to]!] = 1;
        queue.push(match[to]!);
      }
    }
  }
  return false;
}
