/**
 * The molecular graph as the CIP labeler sees it: neighbours with bond orders, atomic numbers, the mass each atom
 * carries for Rule 2, and which stereo element sits on which atom or bond. Built once per structure.
 */
import type { StereoElement, Structure } from '../types.js';
import { averageMass } from './masses.js';
import { perceiveMancude, type Mancude } from './mancude.js';

export interface CipGraph {
  s: Structure;
  n: number;
  /** Atomic number per atom (Rule 1a, P-92.1.4.1). */
  z: number[];
  /** Rule 2 mass per atom: the mass number when the input gives an isotope, else the mean atomic mass. */
  mass: number[];
  hCount: number[];
  /** Neighbour atom indices and the order of the bond to each, aligned. */
  nbr: number[][];
  ord: number[][];
  /**
   * The order each bond counts with when duplicate atoms are made: as `ord`, except that a double bond from an
   * atom in an expanded valence state (P=O, S=O, S=N, …) counts as single (the ylidic form P⁺–O⁻, as the
   * 2013 recommendations treat these bonds; the suite's VS038/VS122/VS130 rank them so).
   */
  dupOrd: number[][];
  /** Index into s.stereo of the tetrahedral element centred on each atom, or -1. */
  tetraAt: number[];
  /** Index into s.stereo of the double-bond element with this atom as an end, or -1 (first wins). */
  bondAt: number[];
  /** Index into s.stereo of the axial element with this atom as an end, or -1. */
  axialAt: number[];
  /** Mancude ring bonds and mean duplicate atomic numbers (P-92.1.4.4); found on first use, see `mancudeOf`. */
  mancude: Mancude | null;
  /**
   * Per stereo element: may it carry an auxiliary descriptor? All units but ring-fixed ones at first; while
   * Rule 6 is tried, only those that Rules 1-5 found stereogenic (see label.ts).
   */
  auxAllowed: boolean[];
  /** Per stereo element: its auxiliary descriptor may need Rule 6 (it got its own descriptor by Rule 6). */
  auxRule6: boolean[];
  /** Per stereo element: its geometry is fixed by a small ring, so it is no stereogenic unit. */
  ringFixed: boolean[];
  hasBondStereo: boolean;
  /** Some atom has a mass number: Rule 2 can separate something. */
  isotopes: boolean;
  /** Number of stereo elements: when it is 1, Rules 3-5 cannot separate anything. */
  stereoCount: number;
  /**
   * 1 for atoms of the graph's 2-core (what is left after stripping atoms of degree 1 again and again). An atom
   * outside it lies on no ring, so no ring closure can start there: the digraph skips its ancestor search
   * (a chain of n centres costs O(n) per sphere instead of O(n^2)).
   */
  core: Uint8Array;
  /**
   * Work still allowed for this structure, over all its units (CIP_WORK_BUDGET at the start). When it runs out, the units not yet labelled get no descriptor (left open) instead of running for minutes: a
   * generation-10 dendrimer of drawn centres, a chain of thousands of centres.
   */
  workLeft: number;
}

/**
 * Work allowed per structure, over all its units: digraph nodes made plus node pairs compared. The hardest
 * record of the CIP validation suite (VS280, 3D) takes about 680,000, MoleculeNet structures far less (measured
 * here), so only pathological inputs meet it.
 */
export const CIP_WORK_BUDGET = 3_000_000;

export function buildGraph(s: Structure): CipGraph {
  const n = s.atoms.length;
  // neighbour lists of their exact size, cut from shared flat lists (an empty array grown by push reserves room
  // for 16 entries); the order of each list is the order of the bonds, as before
  const bonds = s.bonds;
  const deg = flatDeg.length > n ? flatDeg : (flatDeg = new Array<number>(2 * n + 2).fill(0));
  for (let i = 0; i <= n; i++) deg[i] = 0;
  for (let k = 0; k < bonds.length; k++) {
    const b = bonds[k];
    if (b.a === b.b || b.a < 0 || b.b < 0 || b.a >= n || b.b >= n) continue;
    deg[b.a + 1]++;
    deg[b.b + 1]++;
  }
  for (let i = 0; i < n; i++) deg[i + 1] += deg[i];
  const total = deg[n];
  const fn = flatNbr.length >= total ? flatNbr : (flatNbr = new Array<number>(2 * total).fill(0));
  const fo = flatOrd.length >= total ? flatOrd : (flatOrd = new Array<number>(2 * total).fill(0));
  for (let k = 0; k < bonds.length; k++) {
    const b = bonds[k];
    if (b.a === b.b || b.a < 0 || b.b < 0 || b.a >= n || b.b >= n) continue;
    const i = deg[b.a]++;
    fn[i] = b.b;
    fo[i] = b.order;
    const j = deg[b.b]++;
    fn[j] = b.a;
    fo[j] = b.order;
  }
  // deg[a] is now where the list of a ends (the start of the next one)
  const nbr: number[][] = [];
  const ord: number[][] = [];
  for (let a = 0; a < n; a++) {
    const from = a === 0 ? 0 : deg[a - 1];
    nbr.push(fn.slice(from, deg[a]));
    ord.push(fo.slice(from, deg[a]));
  }
  // the same arrays as `ord` except at atoms in an expanded valence state and their partners (copied on change)
  const dupOrd: number[][] = ord.slice();
  for (let a = 0; a < n; a++) {
    if (!expandedValence(s, a, ord[a])) continue;
    for (let i = 0; i < nbr[a].length; i++) {
      const b = nbr[a][i];
      if (ord[a][i] !== 2 || !CHALCOGEN_OR_N.has(s.atoms[b].atomicNumber)) continue;
      if (dupOrd[a] === ord[a]) dupOrd[a] = ord[a].slice();
      dupOrd[a][i] = 1;
      const j = nbr[b].indexOf(a);
      if (j >= 0) {
        if (dupOrd[b] === ord[b]) dupOrd[b] = ord[b].slice();
        dupOrd[b][j] = 1;
      }
    }
  }
  const tetraAt = new Array<number>(n).fill(-1);
  const bondAt = new Array<number>(n).fill(-1);
  const axialAt = new Array<number>(n).fill(-1);
  let hasBondStereo = false;
  s.stereo.forEach((e, i) => {
    if (e.kind === 'tetrahedral') {
      if (tetraAt[e.centre] < 0) tetraAt[e.centre] = i;
    } else if (e.kind === 'double-bond') {
      hasBondStereo = true;
      for (const end of e.ends) if (bondAt[end] < 0) bondAt[end] = i;
    } else {
      for (const end of e.ends) if (axialAt[end] < 0) axialAt[end] = i;
    }
  });
  const mass = s.atoms.map((a) =>
    a.isotope !== null && a.isotope > 0 ? a.isotope : averageMass(a.atomicNumber),
  );
  const g: CipGraph = {
    s,
    n,
    z: s.atoms.map((a) => a.atomicNumber),
    mass,
    hCount: s.atoms.map((a) => a.hCount),
    nbr,
    ord,
    dupOrd,
    tetraAt,
    bondAt,
    axialAt,
    mancude: null,
    hasBondStereo,
    stereoCount: s.stereo.length,
    ringFixed: [],
    auxAllowed: [],
    auxRule6: [],
    isotopes: s.atoms.some((a) => a.isotope !== null),
    core: twoCore(nbr),
    workLeft: CIP_WORK_BUDGET,
  };
  g.ringFixed = s.stereo.map((e) => fixedByRing(g, e));
  g.auxAllowed = g.ringFixed.map((f) => !f);
  g.auxRule6 = g.ringFixed.map(() => false);
  g.hasBondStereo = s.stereo.some((e, i) => e.kind === 'double-bond' && !g.ringFixed[i]);
  bondAt.fill(-1);
  s.stereo.forEach((e, i) => {
    if (e.kind === 'double-bond' && !g.ringFixed[i])
      for (const end of e.ends) if (bondAt[end] < 0) bondAt[end] = i;
  });
  return g;
}

/** The 2-core of the graph (see CipGraph.core): O(atoms + bonds). */
function twoCore(nbr: number[][]): Uint8Array {
  const n = nbr.length;
  const core = new Uint8Array(n).fill(1);
  const deg = Int32Array.from(nbr, (l) => l.length);
  const stack: number[] = [];
  for (let a = 0; a < n; a++) if (deg[a] <= 1) stack.push(a);
  while (stack.length > 0) {
    const a = stack.pop() as number;
    if (!core[a]) continue;
    core[a] = 0;
    for (const b of nbr[a]) if (core[b] && --deg[b] <= 1) stack.push(b);
  }
  return core;
}

/**
 * Geometry that a small ring fixes is not a stereogenic unit: a double bond in a ring of fewer than 8 atoms
 * (only the cis form exists), an axis bond inside a ring of up to 6 atoms (fluorene, phenanthrene: planar;
 * a bridged biaryl with a 7-membered ring stays axially chiral, as the suite's VS023). Common practice, no source.
 */
function fixedByRing(g: CipGraph, e: StereoElement): boolean {
  if (e.kind === 'tetrahedral' && invertibleNitrogen(g, e.centre, e.ligands)) return true;
  if (e.kind === 'double-bond') {
    const [u, v] = e.ends;
    return g.nbr[u].includes(v) && ringSizeThrough(g, u, v, 7) > 0;
  }
  if (e.kind === 'axial' && e.subtype === 'biaryl') return ringSizeThrough(g, e.ends[0], e.ends[1], 6) > 0;
  return false;
}

export function bondOrder(g: CipGraph, a: number, b: number): number {
  const i = g.nbr[a].indexOf(b);
  return i < 0 ? 0 : g.ord[a][i];
}

const CHALCOGEN_OR_N = new Set([7, 8, 16, 34, 52]);

/** P, As with valence 5; S, Se, Te with valence 4 or 6; Cl, Br, I above 1. */
function expandedValence(s: Structure, a: number, orders: number[]): boolean {
  const at = s.atoms[a];
  const z = at.atomicNumber;
  if (z !== 15 && z !== 16 && z !== 17 && z !== 33 && z !== 34 && z !== 35 && z !== 52 && z !== 53)
    return false;
  const v = orders.reduce((x, y) => x + y, 0) + at.hCount;
  switch (z) {
    case 15:
    case 33:
      return v >= 5;
    case 16:
    case 34:
    case 52:
      return v >= 4;
    case 17:
    case 35:
    case 53:
      return v >= 3;
    default:
      return false;
  }
}

/**
 * A neutral three-coordinate nitrogen inverts fast, so it is no stereocentre unless a ring system locks it: a
 * bridgehead of a bridged system (the suite's VS128, Tröger's base VS132) or a three-membered ring (aziridine). Common practice, no source; readers of 3D files give every such nitrogen a configuration.
 */
function invertibleNitrogen(g: CipGraph, centre: number, ligands: number[]): boolean {
  const at = g.s.atoms[centre];
  if (at.atomicNumber !== 7 || at.charge !== 0 || !ligands.includes(-2)) return false;
  const nb = g.nbr[centre];
  if (nb.some((b) => ringSizeThrough(g, centre, b, 3) === 3)) return false;
  if (nb.length !== 3) return true;
  // a bridgehead of a bridged ring system: with the nitrogen and any one neighbour taken away, the other two
  // neighbours still meet (quinuclidine, Tröger's base); a ring-fusion nitrogen (indolizidine) can still invert
  for (const x of nb) {
    const [p, q] = nb.filter((b) => b !== x);
    if (!connectedWithout(g, p, q, centre, x)) return true;
  }
  return false;
}

function connectedWithout(g: CipGraph, p: number, q: number, skip1: number, skip2: number): boolean {
  const seen = new Set<number>([p, skip1, skip2]);
  const stack = [p];
  while (stack.length > 0) {
    const v = stack.pop() as number;
    for (const w of g.nbr[v]) {
      if (w === q) return true;
      if (seen.has(w)) continue;
      seen.add(w);
      stack.push(w);
    }
  }
  return false;
}

/** Size of the smallest ring through the bond a-b, or 0 when there is none of at most `max` atoms. */
export function ringSizeThrough(g: CipGraph, a: number, b: number, max: number): number {
  if (seenBuf.length < g.n) {
    seenBuf = new Int32Array(g.n * 2);
    queueBuf = new Int32Array(g.n * 2);
    stamp = 0;
  }
  const mark = ++stamp;
  const seen = seenBuf;
  const queue = queueBuf;
  seen[a] = mark;
  // breadth-first by layers: queue[lo, hi) is the layer at distance d from a
  queue[0] = a;
  let lo = 0;
  let hi = 1;
  for (let d = 0; lo < hi && d < max - 1; d++) {
    let end = hi;
    for (let q = lo; q < hi; q++) {
      const x = queue[q];
      const nx = g.nbr[x];
      for (let i = 0; i < nx.length; i++) {
        const y = nx[i];
        if (x === a && y === b) continue;
        if (y === b) return d + 2;
        if (seen[y] === mark) continue;
        seen[y] = mark;
        queue[end++] = y;
      }
    }
    lo = hi;
    hi = end;
  }
  return 0;
}

let flatDeg: number[] = new Array<number>(256).fill(0);
let flatNbr: number[] = new Array<number>(512).fill(0);
let flatOrd: number[] = new Array<number>(512).fill(0);
let seenBuf = new Int32Array(256);
let queueBuf = new Int32Array(256);
let stamp = 0;

export function mancudeOf(g: CipGraph): Mancude {
  if (g.mancude === null) g.mancude = perceiveMancude(g.s, g.nbr, g.ord, g.mass);
  return g.mancude;
}
