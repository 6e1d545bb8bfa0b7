/**
 * Bridgehead coupling (and cis-only small ring fusion, see fusedPairs): in a small bridged ring system (norbornane, bicyclo[2.2.2]octane, camphor, Tröger's base,
 * adamantane) the two bridgeheads cannot be inverted independently — only one relative configuration closes the
 * rings. Two tetrahedral units a and b are coupled when three internally disjoint ring paths of 1 to 3 inner
 * atoms join them (larger bridges allow in/out isomers, so they are left free; common practice, no source).
 *
 * Geometry: with a and b on the axis and the bridges around it, the bridges appear in one rotational sense
 * looking from a's exterior ligand towards b, and in the opposite sense looking from b's exterior ligand towards
 * a. So the winding of [X_a, a1, a2, a3] is the opposite of that of [X_b, b1, b2, b3], bridge k entering at a_k
 * and leaving at b_k. Stated on the reference tokens that is a linear constraint x_a ⊕ x_b = c.
 */
import type { Graph, RingInfo } from '../graph/index.js';
import type { Structure } from '../types.js';
import { permutationParity, type PerceivedUnit } from './units.js';
import { objectList } from '../read/make.js';

export interface Coupling {
  a: number;
  b: number;
  /** x_a ⊕ x_b must equal c. */
  c: 0 | 1;
}

const MAX_INNER = 3;

export function bridgeCouplings(s: Structure, g: Graph, rings: RingInfo, units: PerceivedUnit[]): Coupling[] {
  const out = objectList<Coupling>();
  for (const c of bridgedPairs(s, g, rings, units)) out.push(c);
  for (const c of fusedPairs(g, rings, units)) out.push(c);
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

function bridgedPairs(s: Structure, g: Graph, rings: RingInfo, units: PerceivedUnit[]): Coupling[] {
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
  const out: Coupling[] = [];
  for (let i = 0; i < cand.length; i++) {
    for (let j = i + 1; j < cand.length; j++) {
      const a = cand[i].u.atoms[0];
      const b = cand[j].u.atoms[0];
      if (system[a] < 0 || system[a] !== system[b]) continue;
      const bridges = threeBridges(a, b, ringNbrs);
      if (!bridges) continue;
      const ua = cand[i].u;
      const ub = cand[j].u;
      const xa = ua.tokens.find((t) => !bridges.some((p) => p[0] === t));
      const xb = ub.tokens.find((t) => !bridges.some((p) => p[p.length - 1] === t));
      if (xa === undefined || xb === undefined) continue;
      const la = [xa, ...bridges.map((p) => p[0])];
      const lb = [xb, ...bridges.map((p) => p[p.length - 1])];
      const pa = permutationParity(la, ua.tokens);
      const pb = permutationParity(lb, ub.tokens);
      if (pa < 0 || pb < 0) continue;
      out.push({ a: cand[i].k, b: cand[j].k, c: (1 ^ pa ^ pb) as 0 | 1 });
    }
  }
  return out;
}

/** Three internally disjoint paths a -> b (inner atoms only, 1..MAX_INNER each), or null. */
function threeBridges(a: number, b: number, ringNbrs: (x: number) => number[]): number[][] | null {
  const paths: number[][] = [];
  const path: number[] = [];
  const onPath = new Set<number>([a]);
  const walk = (x: number): void => {
    if (paths.length > 200) return;
    for (const y of ringNbrs(x)) {
      if (y === b) {
        if (path.length >= 1) paths.push(path.slice());
        continue;
      }
      if (onPath.has(y) || path.length >= MAX_INNER) continue;
      onPath.add(y);
      path.push(y);
      walk(y);
      path.pop();
      onPath.delete(y);
    }
  };
  walk(a);
  paths.sort((p, q) => p.length - q.length);
  for (let i = 0; i < paths.length; i++) {
    for (let j = i + 1; j < paths.length; j++) {
      if (!disjoint(paths[i], paths[j])) continue;
      for (let k = j + 1; k < paths.length; k++) {
        if (disjoint(paths[i], paths[k]) && disjoint(paths[j], paths[k]))
          return [paths[i], paths[j], paths[k]];
      }
    }
  }
  return null;
}

function disjoint(p: number[], q: number[]): boolean {
  for (const x of p) if (q.includes(x)) return false;
  return true;
}
