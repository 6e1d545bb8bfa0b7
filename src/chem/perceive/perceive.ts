/**
 * Perception: every potential stereogenic unit of a (normalized) structure and whether the input defines it.
 *
 * A candidate (perceive/centres.ts, perceive/bonds.ts) is kept when its ligands are constitutionally distinct,
 * or when a pair of them is constitutionally equivalent but the branch behind that pair holds another unit
 * (pseudoasymmetric centres such as C3 of 2,3,4-trihydroxyglutaric acid, "para" units such as C1/C4 of
 * 1,4-dimethylcyclohexane). That second rule refers to the set being built, so it is applied to a fixed point
 * from the optimistic side: start with every candidate, drop the unsupported ones, repeat until nothing changes.
 * Whether such a unit is stereogenic in a given configuration is decided later by the symmetry group
 * (symmetry/), not here.
 */
import {
  aromaticBonds,
  buildGraph,
  connectedComponents,
  equivalenceClasses,
  ringInfo,
} from '../graph/index.js';
import type { Graph, RingInfo } from '../graph/index.js';
import { IMPLICIT_H, type Structure } from '../types.js';
import { bondCandidates } from './bonds.js';
import { tetrahedralCandidate } from './centres.js';
import { hToken, lpToken, type PerceivedUnit } from './units.js';
import { applyInputStereo } from './input.js';
import { survivesSymmetry, swapsPendantTrees, swapsTerminalPair } from './rescue.js';
import { bridgeCouplings, type Coupling } from './bridges.js';
import { objectList } from '../read/make.js';
import { axisCandidates, DEFAULT_AXIS_ORTHO_MIN } from './axes.js';
import { helixRims, helixSense } from '../cip/index.js';
import { addPlanarUnits, type PlanarLinks } from './planar.js';

export interface PerceiveOptions {
  /**
   * Minimum number of ortho substituents (both rings together) for a biaryl bond to count as a potential
   * stereogenic axis when the input does not draw one (perceive/axes.ts; a rule of thumb, default 3).
   */
  axisOrthoMin?: number;
}

export interface Perception {
  structure: Structure;
  graph: Graph;
  rings: RingInfo;
  aromaticBond: boolean[];
  /** Constitutional equivalence class per atom (computed on first use). */
  classes: Int32Array;
  units: PerceivedUnit[];
  /** atom -> index of the unit it is a centre / end of, or -1 */
  unitOfAtom: Int32Array;
  /** Ordinary amine nitrogens the input drew with a configuration (atom indices). */
  invertibleNitrogens: number[];
  /** Bridgehead pairs whose configurations are tied (x_a ⊕ x_b = c). */
  couplings: Coupling[];
  /** Planar units of medium-ring trans double bonds and their hosts (perceive/planar.ts). */
  planar: PlanarLinks;
  components: number[][];
  componentOfAtom: Int32Array;
  remarks: string[];
}

interface Draft extends PerceivedUnit {
  /** Pairs of token positions holding equivalent ligands, each with the atom the pair hangs on. */
  pairs: { anchor: number; token: number }[];
}

export function perceive(s: Structure, opts: PerceiveOptions = {}): Perception {
  const n = s.atoms.length;
  const graph = buildGraph(s);
  const rings = ringInfo(s, graph);
  const aromaticBond = aromaticBonds(s, rings, graph);
  // Default (Kekulé-independent) bond coding, the same the automorphism search uses, so classes are a valid
  // colouring. Computed only when some atom or bond is a candidate (a third of real structures have none).
  let classCache: Int32Array | null = null;
  const classesOf = (): Int32Array => (classCache ??= equivalenceClasses(s));
  const tokenClass = (t: number): number => (t < n ? classesOf()[t] : t < 2 * n ? -1 : -2);

  const drafts = objectList<Draft>();
  const invertibleAll = new Set<number>();
  for (let i = 0; i < n; i++) {
    const v = tetrahedralCandidate(s, graph, rings, aromaticBond, i);
    if (v === null) continue;
    if (v.kind === 'invertible-nitrogen') {
      invertibleAll.add(i);
      continue;
    }
    const pairs = equalPairs(v.tokens, tokenClass, [i, i]);
    if (pairs === null) continue;
    drafts.push({
      kind: 'tetrahedral',
      mode: 'parity',
      atoms: [i],
      tokens: v.tokens,
      defined: false,
      bit: 0,
      equivalentPair: pairs.length > 0,
      pairs,
    });
  }
  for (const c of bondCandidates(s, graph, rings, aromaticBond)) {
    const pairs = equalPairs(c.tokens, tokenClass, c.ends, true);
    if (pairs === null) continue;
    drafts.push({
      kind: c.kind,
      mode: c.mode,
      atoms: [...c.ends],
      tokens: c.tokens,
      defined: false,
      bit: 0,
      equivalentPair: pairs.length > 0,
      pairs,
    });
  }
  // Biaryl axes the input draws (molfile wedges, 3D coordinates).
  for (const e of s.stereo) {
    if (e.kind !== 'axial' || e.subtype !== 'biaryl') continue;
    const t = e.ligands.map((x, k) =>
      x >= 0 ? x : x === IMPLICIT_H ? hToken(n, e.ends[k < 2 ? 0 : 1]) : lpToken(n, e.ends[k < 2 ? 0 : 1]),
    );
    const tokens: [number, number, number, number] = [t[0], t[1], t[2], t[3]];
    const pairs = equalPairs(tokens, tokenClass, e.ends, true) ?? [];
    drafts.push({
      kind: 'biaryl',
      mode: 'parity',
      atoms: [...e.ends],
      tokens,
      defined: false,
      bit: 0,
      equivalentPair: pairs.length > 0,
      pairs,
    });
  }

  // Potential axes from the constitution (ortho substitution, a rule of thumb), where none is drawn.
  let anyAromatic = false;
  for (let k = 0; k < aromaticBond.length && !anyAromatic; k++) anyAromatic = aromaticBond[k];
  if (anyAromatic) {
    const orthoMin = opts.axisOrthoMin ?? DEFAULT_AXIS_ORTHO_MIN;
    for (const c of axisCandidates(s, graph, rings, aromaticBond, orthoMin)) {
      const drawn = drafts.some(
        (d) => d.kind === 'biaryl' && d.atoms.includes(c.ends[0]) && d.atoms.includes(c.ends[1]),
      );
      if (drawn) continue;
      const pairs = equalPairs(c.tokens, tokenClass, c.ends, true) ?? [];
      drafts.push({
        kind: 'biaryl',
        mode: 'parity',
        atoms: [c.ends[0], c.ends[1]],
        tokens: c.tokens,
        defined: false,
        bit: 0,
        equivalentPair: pairs.length > 0,
        pairs,
      });
    }
  }

  // Helicenes ([5]helicene and up): a helical unit on the inner rim of ortho-fused rings (cip/helix.ts).
  if (n >= 18 && fusedSmallRings(rings) >= 5) {
    for (const rim of helixRims(s)) {
      const sense = helixSense(s, rim);
      const [t0, t1] = rim.ends;
      drafts.push({
        kind: 'helix',
        mode: 'parity',
        atoms: [t0, t1],
        // reversed rim -> reversed list, an even permutation: P stays bit 0 under any symmetry
        tokens: [rim.chain[0], t0, t1, rim.chain[rim.chain.length - 1]],
        defined: sense !== null,
        bit: sense === 'M' ? 1 : 0,
        equivalentPair: false,
        pairs: [],
      });
    }
  }

  let kept = fixedPoint(drafts, graph, n);
  // Second look at what the branch rule dropped (rescue.ts); rescued units may support others.
  const tried = new Set<Draft>();
  for (let round = 0; round < 4 && kept.length < drafts.length; round++) {
    const keptSet = new Set(kept);
    const rescued = drafts.filter((d) => {
      if (keptSet.has(d) || tried.has(d)) return false;
      tried.add(d);
      return (
        !swapsTerminalPair(d, graph, classesOf(), n) &&
        !swapsPendantTrees(d, graph, classesOf(), n) &&
        survivesSymmetry(s, d, classesOf())
      );
    });
    if (rescued.length === 0) break;
    for (const d of rescued) d.pairs = [];
    kept = fixedPoint(drafts, graph, n);
  }
  kept.sort((a, b) => Math.min(...a.atoms) - Math.min(...b.atoms));
  // explicit literal, not `({ pairs, ...u }) => u`: a rest copy has a hidden class of its own
  const units = objectList<PerceivedUnit>();
  for (const d of kept) {
    units.push({
      kind: d.kind,
      mode: d.mode,
      atoms: d.atoms,
      tokens: d.tokens,
      defined: d.defined,
      bit: d.bit,
      equivalentPair: d.equivalentPair,
    });
  }
  const unitOfAtom = new Int32Array(n).fill(-1);
  units.forEach((u, k) => {
    for (const a of u.atoms) unitOfAtom[a] = k;
  });

  const components = connectedComponents(s, graph);
  const componentOfAtom = new Int32Array(n);
  components.forEach((c, k) => {
    for (const a of c) componentOfAtom[a] = k;
  });
  const remarks = objectList<string>();
  const invertibleNitrogens = applyInputStereo(s, units, unitOfAtom, invertibleAll, remarks);
  const planar = addPlanarUnits(s, graph, rings, units);
  const couplings = bridgeCouplings(s, graph, rings, units);
  for (const c of couplings) {
    const [ua, ub] = [units[c.a], units[c.b]];
    if (ua.defined && ub.defined && (ua.bit ^ ub.bit) !== c.c) {
      const name = (u: PerceivedUnit): string =>
        `${s.atoms[u.atoms[0]].element}${s.atoms[u.atoms[0]].inputNumber}`;
      remarks.push(
        `the configurations drawn at ${name(ua)} and ${name(ub)} cannot both hold: they are the bridgeheads or fusion atoms of a small ring system, which fixes their relative configuration`,
      );
    }
  }
  const result = {
    structure: s,
    graph,
    rings,
    aromaticBond,
    units,
    unitOfAtom,
    invertibleNitrogens,
    couplings,
    planar,
    components,
    componentOfAtom,
    remarks,
  } as Omit<Perception, 'classes'> as Perception;
  // One getter function for every result (a new closure per result would turn each result into a slow
  // dictionary-mode object); the per-result computation sits in a WeakMap.
  lazyClasses.set(result, classesOf);
  Object.defineProperty(result, 'classes', { get: classesGetter, enumerable: true });
  return result;
}

const lazyClasses = new WeakMap<object, () => Int32Array>();
function classesGetter(this: object): Int32Array {
  return lazyClasses.get(this)!();
}

/**
 * One entry per group of equivalent ligands (two, three or four alike), naming a ligand of the group; null when
 * the unit can never be stereogenic (two or more implicit hydrogens cannot occur here). For bond units the two
 * ends are judged separately (tokens 0,1 on ends[0]; 2,3 on ends[1]).
 */
function equalPairs(
  tokens: number[],
  cls: (t: number) => number,
  anchors: number[],
  perEnd = false,
): { anchor: number; token: number }[] | null {
  const out: { anchor: number; token: number }[] = [];
  if (perEnd) {
    for (const k of [0, 2])
      if (cls(tokens[k]) === cls(tokens[k + 1])) out.push({ anchor: anchors[k >> 1], token: tokens[k] });
    return out;
  }
  const c = [cls(tokens[0]), cls(tokens[1]), cls(tokens[2]), cls(tokens[3])];
  for (let i = 0; i < 4; i++) {
    let same = 0;
    for (let j = 0; j < 4; j++) if (c[j] === c[i]) same++;
    if (same >= 2 && c.indexOf(c[i]) === i) out.push({ anchor: anchors[0], token: tokens[i] });
  }
  return out;
}

/** Number of SSSR rings of 5 or 6 atoms (a cheap bound before looking for helices). */
function fusedSmallRings(rings: RingInfo): number {
  let k = 0;
  for (const r of rings.rings) if (r.length === 5 || r.length === 6) k++;
  return k;
}

function fixedPoint(drafts: Draft[], g: Graph, n: number): Draft[] {
  let alive = drafts.slice();
  for (;;) {
    const unitAtom = new Int32Array(n).fill(-1);
    alive.forEach((d, k) => {
      for (const a of d.atoms) unitAtom[a] = k;
    });
    const next = objectList<Draft>();
    for (let k = 0; k < alive.length; k++) {
      const d = alive[k];
      if (d.pairs.every((p) => p.token < n && branchHoldsUnit(g, p.anchor, p.token, unitAtom, k)))
        next.push(d);
    }
    if (next.length === alive.length) return next;
    alive = next;
  }
}

function branchHoldsUnit(
  g: Graph,
  anchor: number,
  start: number,
  unitAtom: Int32Array,
  self: number,
): boolean {
  const seen = new Uint8Array(g.n);
  seen[anchor] = 1;
  seen[start] = 1;
  const stack = [start];
  while (stack.length) {
    const x = stack.pop()!;
    if (unitAtom[x] >= 0 && unitAtom[x] !== self) return true;
    for (const y of g.nbrs[x]) {
      if (!seen[y]) {
        seen[y] = 1;
        stack.push(y);
      }
    }
  }
  return false;
}
