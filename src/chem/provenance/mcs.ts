/**
 * The largest common connected substructure of an input and a product, element and bond order kept: an injective
 * map of input atoms onto product atoms such that the bonds both share (same ends, same order; aromatic bonds as
 * one class, so Kekulé and aromatic drawings agree) join the mapped atoms into one connected piece. The size is
 * the number of shared bonds, then of atoms, then of hydrogens kept (edge-based, as reaction mapping by minimum chemical distance asks:
 * a bond broken between two atoms that both survive leaves both atoms mapped).
 *
 * Branch and bound, written for this job: the piece grows from a seed pair along shared bonds; each step takes
 * the frontier atom with the fewest product candidates and tries each candidate, then leaving the atom out. A bond
 * is "lost" once both its ends are decided and it is not shared (or one end is left out); shared + possible ≤
 * total − lost bounds every completion. A seed, once tried with every candidate, is left out of later seeds, so
 * the search is complete. Every step counts against a budget; a search that reaches it says so (`complete` false)
 * and its best piece so far is not proven largest.
 */
import type { Perception } from '../perceive/index.js';

/** An atom graph prepared for the search: element, neighbours and bond classes. */
export interface McsGraph {
  n: number;
  element: Int32Array;
  nbrs: Int32Array[];
  /** Bond class parallel to `nbrs`: the order (1-4), or 5 for an aromatic bond. */
  cls: Int32Array[];
  bonds: number;
  /** Hydrogens counted on each atom (not atoms of the graph). */
  h: Int32Array;
}

export interface McsResult {
  /** Input atom -> product atom, or -1. */
  map: Int32Array;
  atoms: number;
  bonds: number;
  /** false when the step budget ran out before the best piece was proven largest. */
  complete: boolean;
  steps: number;
}

export interface McsOptions {
  /** Product atoms the piece may use (others belong to another input already); default all. */
  available?: Uint8Array;
  /** Search steps (candidate tries) before the search stops; default 100,000. */
  budget?: number;
}

export const AROMATIC_CLASS = 5;
export const DEFAULT_MCS_BUDGET = 100_000;

export function mcsGraph(p: Perception): McsGraph {
  const s = p.structure;
  const n = s.atoms.length;
  const element = Int32Array.from(s.atoms, (a) => (a.element === '*' ? 0 : a.atomicNumber));
  const nbrs = p.graph.nbrs;
  const cls = p.graph.nbrBonds.map((list) =>
    Int32Array.from(list, (b) => (p.aromaticBond[b] ? AROMATIC_CLASS : s.bonds[b].order)),
  );
  let bonds = 0;
  for (let i = 0; i < n; i++) bonds += nbrs[i].length;
  const h = Int32Array.from(s.atoms, (a) => a.hCount);
  return { n, element, nbrs, cls, bonds: bonds / 2, h };
}

/** The class of the bond x–y in g, or 0 when they are not bonded. */
export function bondClass(g: McsGraph, x: number, y: number): number {
  const l = g.nbrs[x];
  for (let k = 0; k < l.length; k++) if (l[k] === y) return g.cls[x][k];
  return 0;
}

class Budget extends Error {}

const RADIUS = 3;

/**
 * Environment codes of each atom at radius 0..RADIUS (element and hydrogens, then the neighbours' codes with bond
 * classes), for ordering only: a pair whose surroundings agree further out is tried first, so that the first
 * piece found is usually the right one and the bound prunes the rest early.
 */
function environments(g: McsGraph): Int32Array[] {
  const out = [Int32Array.from(g.element, (e, i) => e * 8 + Math.min(g.h[i], 7))];
  for (let r = 1; r <= RADIUS; r++) {
    const prev = out[r - 1];
    const next = new Int32Array(g.n);
    for (let i = 0; i < g.n; i++) {
      const parts: number[] = [];
      for (let k = 0; k < g.nbrs[i].length; k++) parts.push(prev[g.nbrs[i][k]] * 8 + g.cls[i][k]);
      parts.sort((x, y) => x - y);
      let h = prev[i] | 0;
      for (const x of parts) h = (Math.imul(h, 31) + x) | 0;
      next[i] = h;
    }
    out.push(next);
  }
  return out;
}

export function commonSubstructure(a: McsGraph, b: McsGraph, options: McsOptions = {}): McsResult {
  const budget = options.budget ?? DEFAULT_MCS_BUDGET;
  const avail = options.available ?? new Uint8Array(b.n).fill(1);
  const map = new Int32Array(a.n).fill(-1);
  const inv = new Int32Array(b.n).fill(-1);
  const excluded = new Uint8Array(a.n);
  let steps = 0;
  let shared = 0;
  let lost = 0;
  let mapped = 0;
  let out = 0;
  // third criterion: hydrogens kept (Σ min(h) over mapped pairs), so that a chain is not mapped back to front
  let hKept = 0;
  let hLost = 0;
  let hTotal = 0;
  for (let u = 0; u < a.n; u++) hTotal += a.h[u];
  const best = { bonds: -1, atoms: 0, h: 0, map: new Int32Array(a.n).fill(-1) };
  const countB = new Map<number, number>();
  for (let y = 0; y < b.n; y++) if (avail[y]) countB.set(b.element[y], (countB.get(b.element[y]) ?? 0) + 1);
  const total = a.bonds;

  const better = (): boolean =>
    shared > best.bonds ||
    (shared === best.bonds && (mapped > best.atoms || (mapped === best.atoms && hKept > best.h)));
  const hopeless = (): boolean => {
    const bound = total - lost;
    if (bound !== best.bonds) return bound < best.bonds;
    const atoms = a.n - out;
    return atoms < best.atoms || (atoms === best.atoms && hTotal - hLost <= best.h);
  };
  // every bond and atom of the input placed: nothing larger exists; hydrogens only break ties among smaller pieces
  // (proving the best hydrogen count among whole embeddings would cost a search over all of them)
  const done = (): boolean => best.bonds === total && best.atoms === a.n;

  const mapAtom = (u: number, v: number): void => {
    map[u] = v;
    inv[v] = u;
    mapped++;
    const kept = Math.min(a.h[u], b.h[v]);
    hKept += kept;
    hLost += a.h[u] - kept;
    const l = a.nbrs[u];
    for (let k = 0; k < l.length; k++) {
      const w = l[k];
      if (map[w] < 0) continue;
      if (bondClass(b, v, map[w]) === a.cls[u][k]) shared++;
      else lost++;
    }
  };
  const unmapAtom = (u: number): void => {
    const v = map[u];
    const l = a.nbrs[u];
    for (let k = 0; k < l.length; k++) {
      const w = l[k];
      if (map[w] < 0) continue;
      if (bondClass(b, v, map[w]) === a.cls[u][k]) shared--;
      else lost--;
    }
    const kept = Math.min(a.h[u], b.h[v]);
    hKept -= kept;
    hLost -= a.h[u] - kept;
    map[u] = -1;
    inv[v] = -1;
    mapped--;
  };
  const excludeAtom = (u: number, sign: 1 | -1): void => {
    excluded[u] = sign > 0 ? 1 : 0;
    out += sign;
    hLost += sign * a.h[u];
    for (const w of a.nbrs[u]) if (!excluded[w]) lost += sign;
  };

  /** Product candidates for input atom u: free, same element, joined to the image of a mapped neighbour by a shared bond. */
  const candidates = (u: number, into: number[]): void => {
    into.length = 0;
    const l = a.nbrs[u];
    for (let k = 0; k < l.length; k++) {
      const w = l[k];
      const mw = map[w];
      if (mw < 0) continue;
      const lb = b.nbrs[mw];
      for (let q = 0; q < lb.length; q++) {
        const x = lb[q];
        if (inv[x] >= 0 || !avail[x] || b.element[x] !== a.element[u] || b.cls[mw][q] !== a.cls[u][k])
          continue;
        if (!into.includes(x)) into.push(x);
      }
    }
  };
  const envA = environments(a);
  const envB = environments(b);
  /** How far out (0..RADIUS, -1 for not at all) the surroundings of u and v agree. */
  const likeness = (u: number, v: number): number => {
    let r = -1;
    while (r < RADIUS && envA[r + 1][u] === envB[r + 1][v]) r++;
    return r;
  };
  const gain = (u: number, v: number): number => {
    let g = 0;
    const l = a.nbrs[u];
    for (let k = 0; k < l.length; k++) if (map[l[k]] >= 0 && bondClass(b, v, map[l[k]]) === a.cls[u][k]) g++;
    return 8 * g + likeness(u, v) + 1;
  };
  const decided = (u: number): boolean => map[u] >= 0 || excluded[u] === 1;

  /** Maps u to each candidate in turn and grows from there; true when the search is over (done or hopeless). */
  const tryEach = (u: number, candidates: readonly number[]): boolean => {
    for (const v of candidates) {
      if (++steps > budget) throw new Budget();
      mapAtom(u, v);
      grow();
      unmapAtom(u);
      if (done() || hopeless()) return true;
    }
    return false;
  };
  const grow = (): void => {
    if (hopeless()) return;
    // the frontier: undecided atoms next to the piece
    let pick = -1;
    let pickCands: number[] = [];
    const forced: number[] = [];
    const cand: number[] = [];
    for (let u = 0; u < a.n; u++) {
      if (decided(u)) continue;
      let next = false;
      for (const w of a.nbrs[u]) if (map[w] >= 0) next = true;
      if (!next) continue;
      candidates(u, cand);
      if (cand.length === 0) {
        // no way in now; if every neighbour is decided there never will be
        if (a.nbrs[u].every(decided)) forced.push(u);
        continue;
      }
      if (pick < 0 || cand.length < pickCands.length) {
        pick = u;
        pickCands = cand.slice();
      }
    }
    for (const u of forced) excludeAtom(u, 1);
    try {
      if (pick < 0) {
        if (better()) {
          best.bonds = shared;
          best.atoms = mapped;
          best.h = hKept;
          best.map.set(map);
        }
        return;
      }
      if (hopeless()) return;
      const u = pick;
      pickCands.sort((x, y) => gain(u, y) - gain(u, x) || x - y);
      if (tryEach(u, pickCands)) return;
      excludeAtom(u, 1);
      grow();
      excludeAtom(u, -1);
    } finally {
      for (let k = forced.length - 1; k >= 0; k--) excludeAtom(forced[k], -1);
    }
  };

  // Seeds: atoms whose whole surroundings occur fewest times in the product first (but at least once), then the
  // rarest elements; each tried first on the product atoms that look most alike.
  const far = new Map<number, number>();
  for (let y = 0; y < b.n; y++) if (avail[y]) far.set(envB[RADIUS][y], (far.get(envB[RADIUS][y]) ?? 0) + 1);
  const rarity = (x: number): number => far.get(envA[RADIUS][x]) ?? 1e6;
  const seeds = Array.from({ length: a.n }, (_x, i) => i).sort(
    (x, y) =>
      rarity(x) - rarity(y) ||
      (countB.get(a.element[x]) ?? 0) - (countB.get(a.element[y]) ?? 0) ||
      a.nbrs[y].length - a.nbrs[x].length ||
      x - y,
  );
  let complete = true;
  try {
    for (const u0 of seeds) {
      if (hopeless() || done()) break;
      const starts: number[] = [];
      for (let v0 = 0; v0 < b.n; v0++) if (avail[v0] && b.element[v0] === a.element[u0]) starts.push(v0);
      starts.sort((x, y) => likeness(u0, y) - likeness(u0, x) || x - y);
      tryEach(u0, starts);
      excludeAtom(u0, 1);
    }
  } catch (e) {
    if (!(e instanceof Budget)) throw e;
    complete = false;
  }
  return {
    map: best.map,
    atoms: best.bonds < 0 ? 0 : best.atoms,
    bonds: Math.max(0, best.bonds),
    complete,
    steps: Math.min(steps, budget),
  };
}
