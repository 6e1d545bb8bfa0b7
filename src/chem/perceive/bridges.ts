/**
 * Coupled configurations of fused and bridged polycycles: in a small bridged ring system (norbornane, camphor,
 * Tröger's base, adamantane, longifolene) bridgeheads cannot be inverted independently — only one relative
 * configuration closes the rings — and a small ring fused cis-only ties its fusion atoms (fusedPairs). Every
 * small bicycle inside a polycycle gives one constraint: two tetrahedral units a and b are coupled when three
 * internally disjoint ring paths join them whose lengths force the out,out configuration (MAX_SHORT and MAX_LONG
 * below); longer bridges allow in,out isomers, so those pairs stay free. Each constraint is linear,
 * x_a ⊕ x_b = c, so the solutions are counted exactly (symmetry/ counts 2^classes per group element), never
 * by enumeration.
 *
 * Geometry: with a and b on the axis and the bridges around it, the bridges appear in one rotational sense
 * looking from a's exterior ligand towards b, and in the opposite sense looking from b's exterior ligand towards
 * a. So the winding of [X_a, a1, a2, a3] is the opposite of that of [X_b, b1, b2, b3], bridge k entering at a_k
 * and leaving at b_k. Stated on the reference tokens that is a linear constraint x_a ⊕ x_b = c.
 *
 * Atom-order independence: a pair takes its constraint from its tightest bicycles only, and is left free when
 * those disagree; constraints are added tier by tier (tightest first) and a tier that contradicts the tighter
 * ones is dropped with all looser tiers. Tiers, path counts and limits are all properties of the constitution.
 */
import { ParityUnion, type Graph, type RingInfo } from '../graph/index.js';
import type { Structure } from '../types.js';
import { permutationParity, type PerceivedUnit } from './units.js';
import { objectList } from '../read/make.js';

export interface Coupling {
  a: number;
  b: number;
  /** x_a ⊕ x_b must equal c. */
  c: 0 | 1;
}

export function bridgeCouplings(s: Structure, g: Graph, rings: RingInfo, units: PerceivedUnit[]): Coupling[] {
  const ranked: Ranked[] = fusedPairs(g, rings, units).map((c) => ({ a: c.a, b: c.b, c: c.c, rank: 0 }));
  for (const c of bridgedPairs(s, g, rings, units)) ranked.push(c);
  if (ranked.length === 0) return [];
  // Tightest bicycles first; a looser tier that contradicts the tighter ones is dropped with every looser tier
  // (the tiers are properties of the constitution, so what is kept does not depend on the atom order).
  ranked.sort((x, y) => x.rank - y.rank);
  const u = new ParityUnion(units.length);
  const out = objectList<Coupling>();
  for (let i = 0; i < ranked.length;) {
    let j = i;
    while (j < ranked.length && ranked[j].rank === ranked[i].rank) j++;
    for (let k = i; k < j; k++) u.add(ranked[k].a, ranked[k].b, ranked[k].c);
    if (!u.consistent) break;
    for (let k = i; k < j; k++) out.push({ a: ranked[k].a, b: ranked[k].b, c: ranked[k].c });
    i = j;
  }
  return out;
}

/**
 * Ring fusion to a three-membered ring (in a bicycle whose other ring has at most 6 atoms) or of two
 * four-membered rings is cis only (trans-fused bicyclo[n.1.0] with n <= 4 and bicyclo[2.2.0] are too strained to
 * exist; common practice, no source). With a, b the fusion atoms, a1/b1 their neighbours in the first ring and
 * a2/b2 in the second, cis fusion makes the winding of [X_a, b, a1, a2] the opposite of that of [X_b, a, b1, b2]
 * (worked out on model coordinates).
 */
function fusedPairs(g: Graph, rings: RingInfo, units: PerceivedUnit[]): Coupling[] {
  const out: Coupling[] = [];
  let anyCentre = false;
  for (const u of units) if (u.kind === 'tetrahedral') anyCentre = true;
  if (!anyCentre) return out;
  const unitAt = new Int32Array(g.n).fill(-1); // atom -> its tetrahedral unit
  for (let k = 0; k < units.length; k++) if (units[k].kind === 'tetrahedral') unitAt[units[k].atoms[0]] = k;
  for (let ka = 0; ka < units.length; ka++) {
    if (units[ka].kind !== 'tetrahedral') continue;
    const a = units[ka].atoms[0];
    for (let i = 0; i < g.nbrs[a].length; i++) {
      const b = g.nbrs[a][i];
      const kb = unitAt[b];
      if (kb < 0 || b < a) continue;
      const r = rings.smallestRingOfBond[g.nbrBonds[a][i]];
      if (r !== 3 && r !== 4) continue;
      const through = rings.rings.filter((ring) => adjacentIn(ring, a, b));
      if (through.length !== 2) continue;
      through.sort((x, y) => x.length - y.length);
      const [r1, r2] = [through[0].length, through[1].length];
      if (!((r1 === 3 && r2 <= 6) || (r1 === 4 && r2 === 4))) continue;
      const a1 = ringNeighbour(through[0], a, b);
      const a2 = ringNeighbour(through[1], a, b);
      const b1 = ringNeighbour(through[0], b, a);
      const b2 = ringNeighbour(through[1], b, a);
      const ua = units[ka];
      const ub = units[kb];
      const xa = ua.tokens.find((t) => t !== b && t !== a1 && t !== a2);
      const xb = ub.tokens.find((t) => t !== a && t !== b1 && t !== b2);
      if (xa === undefined || xb === undefined) continue;
      const pa = permutationParity([xa, b, a1, a2], ua.tokens);
      const pb = permutationParity([xb, a, b1, b2], ub.tokens);
      if (pa < 0 || pb < 0) continue;
      out.push({ a: ka, b: kb, c: (1 ^ pa ^ pb) as 0 | 1 });
    }
  }
  return out;
}

function adjacentIn(ring: number[], a: number, b: number): boolean {
  const i = ring.indexOf(a);
  if (i < 0) return false;
  const L = ring.length;
  return ring[(i + 1) % L] === b || ring[(i + L - 1) % L] === b;
}

/** The neighbour of a in the ring other than b. */
function ringNeighbour(ring: number[], a: number, b: number): number {
  const i = ring.indexOf(a);
  const L = ring.length;
  const next = ring[(i + 1) % L];
  return next === b ? ring[(i + L - 1) % L] : next;
}

/**
 * A bicycle forces the out,out relative configuration of its bridgeheads when its two shorter bridges have at most
 * MAX_SHORT inner atoms and its longest at most MAX_LONG; beyond that an in,out isomer (one bridgehead's exterior
 * ligand turned into the cage) may exist. Basis: the MMFF94 strain of in,out- over out,out-1,(bridgehead)-
 * dimethylbicyclo[L.m.n]alkanes, computed with RDKit 2022.09 (ETKDGv3 embedding, MMFF94 minimisation): with
 * m, n <= 3 and L = 5 every in,out form either does not embed or lies at least 50 kcal/mol up; at L = 6 to 9 some
 * fall to 30 or less (bicyclo[7.2.1] 30, [6.3.1] 30, [9.3.2] 27), and inside real polycycles such long paths do
 * run in,out (strychnine and artemisinin as drawn in MoleculeNet), so they are left free. With m = 4 the in,out
 * form is known (in,out-bicyclo[4.4.1]undecane, Winkler et al. 1991 — from memory) and [5.4.1] lies 24 up.
 */
const MAX_LONG = 5;
const MAX_SHORT = 3;
/** Ring paths from one bridgehead beyond which its ring system is searched to MAX_SHORT only. */
const MAX_PATHS = 4000;

interface Ranked extends Coupling {
  /** Tightness of the bicycle that forces it (smaller = shorter bridges). */
  rank: number;
}

function bridgedPairs(s: Structure, g: Graph, rings: RingInfo, units: PerceivedUnit[]): Ranked[] {
  let possible = 0;
  for (const u of units) {
    if (u.kind !== 'tetrahedral') continue;
    let ringBonds = 0;
    for (const b of g.nbrBonds[u.atoms[0]]) if (rings.bondInRing[b]) ringBonds++;
    if (ringBonds >= 3) possible++;
  }
  if (possible < 2) return [];
  const memo = new Map<number, number[]>(); // the bridge search asks for the same atoms many times
  const ringNbrs = (x: number): number[] => {
    let out = memo.get(x);
    if (out !== undefined) return out;
    out = [];
    for (let k = 0; k < g.nbrs[x].length; k++) if (rings.bondInRing[g.nbrBonds[x][k]]) out.push(g.nbrs[x][k]);
    memo.set(x, out);
    return out;
  };
  const cand = units
    .map((u, k) => ({ u, k }))
    .filter(({ u }) => u.kind === 'tetrahedral' && ringNbrs(u.atoms[0]).length >= 3);
  if (cand.length < 2) return [];
  const system = new Int32Array(s.atoms.length).fill(-1);
  rings.ringSystems.forEach((atoms, k) => atoms.forEach((x) => (system[x] = k)));
  const candAt = new Int32Array(s.atoms.length).fill(-1);
  cand.forEach((c, i) => (candAt[c.u.atoms[0]] = i));
  const bySystem = new Map<number, number[]>();
  cand.forEach((c, i) => {
    const k = system[c.u.atoms[0]];
    if (k < 0) return;
    const members = bySystem.get(k);
    if (members === undefined) bySystem.set(k, [i]);
    else members.push(i);
  });
  // One search depth per ring system (the shorter one when any of its atoms has too many paths), so that no pair
  // depends on which of its two ends comes first.
  const searchSystem = (members: number[], maxInner: number): Ranked[] | null => {
    const found: Ranked[] = [];
    for (const i of members) {
      const a = cand[i].u.atoms[0];
      const isEnd = (y: number): boolean => candAt[y] > i && system[y] === system[a];
      const byEnd = pathsFrom(a, ringNbrs, isEnd, maxInner);
      if (byEnd === null) return null;
      for (const [b, paths] of byEnd) {
        const j = candAt[b];
        const r = pairCoupling(cand[i].u, cand[j].u, paths);
        if (r !== null) found.push({ a: cand[i].k, b: cand[j].k, c: r.c, rank: r.rank });
      }
    }
    return found;
  };
  const out: Ranked[] = [];
  for (const members of bySystem.values()) {
    if (members.length < 2) continue;
    const found = searchSystem(members, MAX_LONG) ?? searchSystem(members, MAX_SHORT);
    if (found !== null) for (const r of found) out.push(r);
  }
  return out;
}

/**
 * Every simple ring path from a (at most maxInner inner atoms) to each end atom; null when more than MAX_PATHS
 * paths leave a (all of them counted, whatever their end, so the limit does not depend on the atom order).
 */
function pathsFrom(
  a: number,
  ringNbrs: (x: number) => number[],
  isEnd: (y: number) => boolean,
  maxInner: number,
): Map<number, number[][]> | null {
  const byEnd = new Map<number, number[][]>();
  const path: number[] = [];
  const onPath = new Set<number>([a]);
  let found = 0;
  const walk = (x: number): boolean => {
    for (const y of ringNbrs(x)) {
      if (onPath.has(y)) continue;
      if (isEnd(y) && path.length >= 1) {
        let list = byEnd.get(y);
        if (list === undefined) byEnd.set(y, (list = []));
        list.push(path.slice());
      }
      if (path.length >= maxInner) continue;
      if (++found > MAX_PATHS) return false;
      onPath.add(y);
      path.push(y);
      const ok = walk(y);
      path.pop();
      onPath.delete(y);
      if (!ok) return false;
    }
    return true;
  };
  return walk(a) ? byEnd : null;
}

/**
 * The coupling of bridgeheads a and b, from the tightest bicycles (three internally disjoint paths, forced by
 * MAX_SHORT / MAX_LONG) that join them; null when there is none or when the tightest ones disagree (then the
 * pair is left free).
 */
function pairCoupling(
  ua: PerceivedUnit,
  ub: PerceivedUnit,
  paths: number[][],
): { c: 0 | 1; rank: number } | null {
  paths.sort((p, q) => p.length - q.length);
  let best = Infinity;
  let c = -1;
  for (let k = 2; k < paths.length; k++) {
    const L = paths[k].length;
    if (L * 100 > best) break; // every later triple is looser
    for (let i = 0; i < k; i++) {
      if (!disjoint(paths[i], paths[k])) continue;
      for (let j = i + 1; j < k; j++) {
        if (!disjoint(paths[j], paths[k]) || !disjoint(paths[i], paths[j])) continue;
        const [s1, s2] = [paths[i].length, paths[j].length];
        if (s2 > MAX_SHORT) continue;
        const rank = L * 100 + s2 * 10 + s1;
        if (rank > best) continue;
        const x = tripleCoupling(ua, ub, [paths[i], paths[j], paths[k]]);
        if (x < 0) continue;
        if (rank < best) {
          best = rank;
          c = x;
        } else if (x !== c) c = 2; // the tightest bicycles disagree
      }
    }
  }
  return c === 0 || c === 1 ? { c, rank: best } : null;
}

/**
 * x_a ⊕ x_b for the out,out configuration of the bicycle formed by three bridges (see file comment); -1 when the
 * exterior ligand cannot be found.
 */
function tripleCoupling(ua: PerceivedUnit, ub: PerceivedUnit, bridges: number[][]): number {
  const xa = ua.tokens.find((t) => !bridges.some((p) => p[0] === t));
  const xb = ub.tokens.find((t) => !bridges.some((p) => p[p.length - 1] === t));
  if (xa === undefined || xb === undefined) return -1;
  const pa = permutationParity([xa, ...bridges.map((p) => p[0])], ua.tokens);
  const pb = permutationParity([xb, ...bridges.map((p) => p[p.length - 1])], ub.tokens);
  if (pa < 0 || pb < 0) return -1;
  return 1 ^ pa ^ pb;
}

function disjoint(p: number[], q: number[]): boolean {
  for (const x of p) if (q.includes(x)) return false;
  return true;
}
