/**
 * Symmetry of a stereo configuration: the group the constitutional automorphisms induce on the stereo units,
 * the mirror image, and chirality.
 *
 * Each automorphism σ of the constitution maps unit i onto unit π(i) and carries its configuration along; stated
 * against the reference ligands of π(i), the bit changes by the parity of the permutation σ induces on the
 * ligand list (perceive/units.ts `rebase`). So σ acts on a state x ∈ {0,1}^units as a signed permutation:
 * (σ·x)[π(i)] = x[i] ⊕ f(i). Reflection M flips every 'parity' unit and keeps cis/trans units; it commutes with
 * the group. A fully defined configuration x is achiral iff M(x) lies in the orbit of x (some σ with σ·x = M(x));
 * that σ·M⁻¹ is an improper symmetry, and the atoms it fixes are the evidence we print.
 */
import { automorphisms, ParityUnion } from '../graph/index.js';
import { mapToken, rebase, unitImage, type State } from '../perceive/index.js';
import type { Perception } from '../perceive/index.js';
import type { StereoElement, Structure } from '../types.js';
import type { Coupling } from '../perceive/index.js';
import { atomWith, coords3, newBond, restructure, withStereo } from '../read/make.js';

export interface UnitGroup {
  /** Distinct signed permutations of the units; element 0 is the identity. */
  perms: Int32Array[];
  flips: Uint8Array[];
  /** One automorphism (atom map) realizing each element. */
  atomMaps: Int32Array[];
  /** 1 for 'parity' units (reflection flips them), 0 for cis/trans units. */
  reflect: Uint8Array;
  /** Bridgehead couplings: only states with x_a ⊕ x_b = c exist. */
  couplings: Coupling[];
  /**
   * Planar units (perceive/planar.ts): planarHost[i] = the host double bond of planar unit i, else -1; while
   * the host holds planarZ[i] (ring-cis) the planar unit is absent and states keep its bit at 0.
   */
  planarHost: Int32Array;
  planarZ: Uint8Array;
  /** false when the automorphism search stopped at its limit (counts are then lower bounds of the symmetry). */
  complete: boolean;
}

const MAX_GROUP = 20000;
/** Group elements times units kept at most (each element is a signed permutation of all units). */
const MAX_GROUP_WORK = 2_000_000;
const NO_PLANAR = new Int32Array(0);

export function unitGroup(p: Perception): UnitGroup {
  const { units } = p;
  const n = p.structure.atoms.length;
  const m = units.length;
  const reflect = Uint8Array.from(units, (u) => (u.mode === 'parity' ? 1 : 0));
  const id = new Int32Array(n);
  for (let i = 0; i < n; i++) id[i] = i;
  const group: UnitGroup = {
    perms: [Int32Array.from(units, (_u, i) => i)],
    flips: [new Uint8Array(m)],
    atomMaps: [id],
    reflect,
    couplings: p.couplings,
    // empty without planar units, so every loop over them costs nothing
    planarHost: p.planar.any ? p.planar.host : NO_PLANAR,
    planarZ: p.planar.zBit,
    complete: true,
  };
  if (m === 0 || trivialOnUnits(p)) return group;
  const cap = Math.min(MAX_GROUP, Math.max(64, Math.floor(MAX_GROUP_WORK / m)));
  const seen = new Set<string>([signature(group.perms[0], group.flips[0])]);
  const key: number[] = [];
  for (const u of units) key.push(...u.atoms);
  const res = automorphisms(p.structure, {
    key,
    colour: p.classes,
    maxResults: cap * 4,
    onMapping: (map: Int32Array) => {
      const perm = new Int32Array(m);
      const flip = new Uint8Array(m);
      for (let i = 0; i < m; i++) {
        const u = units[i];
        const j = unitImage(p, u, map);
        if (j < 0) return true; // does not preserve the unit set (a biaryl axis drawn on one side only)
        const f = rebase(
          units[j],
          u.tokens.map((t) => mapToken(t, n, map)),
          0,
        );
        if (f < 0) return true;
        perm[i] = j;
        flip[i] = f;
      }
      const sig = signature(perm, flip);
      if (!seen.has(sig)) {
        seen.add(sig);
        group.perms.push(perm);
        group.flips.push(flip);
        group.atomMaps.push(Int32Array.from(map));
      }
      return group.perms.length < cap;
    },
  });
  group.complete = res.complete && group.perms.length < cap;
  return group;
}

/**
 * Every automorphism fixes every unit and its ligands when each unit atom is alone in its equivalence class and
 * no unit has equivalent ligands (refinement never separates equivalent atoms, so a singleton class is fixed):
 * the induced group is trivial and the search can be skipped.
 */
function trivialOnUnits(p: Perception): boolean {
  if (p.units.some((u) => u.equivalentPair)) return false;
  const classes = p.classes;
  const size = new Int32Array(classes.length + 1);
  for (let i = 0; i < classes.length; i++) size[classes[i]]++;
  return p.units.every((u) => u.atoms.every((a) => size[classes[a]] === 1));
}

function signature(perm: Int32Array, flip: Uint8Array): string {
  let s = '';
  for (let i = 0; i < perm.length; i++) s += `${perm[i]}${flip[i] ? '-' : '+'},`;
  return s;
}

/** Does the state satisfy every coupling (can it exist)? */
export function feasible(g: UnitGroup, x: State): boolean {
  for (const c of g.couplings) if ((x[c.a] ^ x[c.b]) !== c.c) return false;
  for (let i = 0; i < g.planarHost.length; i++) if (x[i] === 1 && absentPlanar(g, x, i)) return false;
  return true;
}

/** Is unit i a planar unit whose host is ring-cis in x (so that it does not exist)? */
function absentPlanar(g: UnitGroup, x: State, i: number): boolean {
  if (i >= g.planarHost.length) return false;
  const h = g.planarHost[i];
  return h >= 0 && x[h] === g.planarZ[i];
}

/** Sets absent planar units to 0 (the one state that stands for "no planar unit"). */
function normalise(g: UnitGroup, x: State): State {
  for (let i = 0; i < g.planarHost.length; i++) if (absentPlanar(g, x, i)) x[i] = 0;
  return x;
}

/** σ_k · x (optionally composed with the reflection M). */
export function act(g: UnitGroup, k: number, x: State, withMirror = false): State {
  const perm = g.perms[k];
  const flip = g.flips[k];
  const out = new Uint8Array(x.length);
  for (let i = 0; i < x.length; i++) out[perm[i]] = x[i] ^ flip[i] ^ (withMirror ? g.reflect[i] : 0);
  return normalise(g, out);
}

export function mirrorState(g: UnitGroup, x: State): State {
  return normalise(
    g,
    Uint8Array.from(x, (v, i) => v ^ g.reflect[i]),
  );
}

export function sameState(a: State, b: State): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Index of a group element σ with σ·x = y, or -1. */
export function elementMapping(g: UnitGroup, x: State, y: State): number {
  outer: for (let k = 0; k < g.perms.length; k++) {
    const perm = g.perms[k];
    const flip = g.flips[k];
    for (let i = 0; i < x.length; i++)
      if ((x[i] ^ flip[i]) !== y[perm[i]] && !absentPlanar(g, x, i)) continue outer;
    return k;
  }
  return -1;
}

/** Lexicographically smallest member of the orbit of x: a canonical name for the stereoisomer. */
export function canonicalState(g: UnitGroup, x: State): State {
  let best = x;
  for (let k = 1; k < g.perms.length; k++) {
    const y = act(g, k, x);
    for (let i = 0; i < y.length; i++) {
      if (y[i] !== best[i]) {
        if (y[i] < best[i]) best = y;
        break;
      }
    }
  }
  return best;
}

/**
 * Can some completion y of the partial state (x on the `defined` units) satisfy (σ_k M)·y = y (mirror = true)
 * or σ_k·y = y (mirror = false)? Checked cycle by cycle of π_k.
 */
export function fixedCompletionExists(
  g: UnitGroup,
  k: number,
  x: State,
  defined: Uint8Array,
  mirror: boolean,
): boolean {
  const perm = g.perms[k];
  const flip = g.flips[k];
  const m = x.length;
  // a planar unit binds only where its host is drawn ring-trans; elsewhere a ring-cis completion frees it
  const planar = g.planarHost.length > 0;
  const bound = (i: number): boolean =>
    !planar || g.planarHost[i] < 0 || (defined[g.planarHost[i]] === 1 && !absentPlanar(g, x, i));
  if (g.couplings.length > 0) {
    const u = solver(g, k, mirror, m + 1, bound);
    for (let i = 0; i < m; i++) if (defined[i] && bound(i)) u.add(i, m, x[i]);
    return u.consistent;
  }
  const done = new Uint8Array(m);
  for (let s = 0; s < m; s++) {
    if (done[s]) continue;
    if (!bound(s)) {
      for (let i = s; !done[i] || i !== s; i = perm[i]) done[i] = 1;
      continue;
    }
    // Walk the cycle; rel[i] = y[i] ⊕ y[s].
    let i = s;
    let rel = 0;
    let want = -1; // required value of y[s], from a defined unit
    do {
      done[i] = 1;
      if (defined[i]) {
        const need = x[i] ^ rel;
        if (want >= 0 && want !== need) return false;
        want = need;
      }
      rel ^= flip[i] ^ (mirror ? g.reflect[i] : 0);
      i = perm[i];
    } while (i !== s);
    if (rel !== 0) return false;
  }
  return true;
}

/** Number of states fixed by σ_k (or σ_k M): 2^cycles when every cycle is consistent, else 0. */
export function fixedCount(g: UnitGroup, k: number, mirror: boolean): bigint {
  const perm = g.perms[k];
  const m = perm.length;
  if (g.couplings.length > 0) {
    if (g.planarHost.length === 0) {
      const u = solver(g, k, mirror, m);
      return u.consistent ? 1n << BigInt(u.classes) : 0n;
    }
    const u = solver(g, k, mirror, m, (i) => g.planarHost[i] < 0);
    if (!u.consistent) return 0n;
    let planar = 0;
    for (let i = 0; i < m; i++) if (g.planarHost[i] >= 0) planar++;
    if (planar === 0) return 1n << BigInt(u.classes);
    const pc = planarCycles(g, k, mirror);
    return pc.factor << BigInt(u.classes - planar - pc.cycles);
  }
  const done = new Uint8Array(m);
  let cycles = 0n;
  for (let s = 0; s < m; s++) {
    if (done[s]) continue;
    if (s < g.planarHost.length && g.planarHost[s] >= 0) {
      for (let i = s; !done[i] || i !== s; i = perm[i]) done[i] = 1;
      continue;
    }
    if (cycleFlips(g, k, s, mirror, done) !== 0) return 0n;
    cycles++;
  }
  if (g.planarHost.length === 0) return 1n << cycles;
  const pc = planarCycles(g, k, mirror);
  return pc.factor << (cycles - BigInt(pc.cycles));
}

/**
 * Burnside with planar units (three configurations per medium-ring trans bond: Z and the two twisted E forms).
 * The caller counted every consistent cycle of hosts as 2 (its two values); it stands for 1 + 2 states when the
 * cycle of its planar units is consistent too (Z, and both twists) and for 1 otherwise (Z only). Returns
 * Π (1 or 3) over host cycles and the number of host cycles (the caller's factor 2 to take out for each).
 */
function planarCycles(g: UnitGroup, k: number, mirror: boolean): { factor: bigint; cycles: number } {
  const perm = g.perms[k];
  const m = perm.length;
  const done = new Uint8Array(m);
  let factor = 1n;
  let cycles = 0;
  for (let s = 0; s < m; s++) {
    if (done[s] || g.planarHost[s] < 0) continue;
    cycles++;
    if (cycleFlips(g, k, s, mirror, done) === 0) factor *= 3n;
  }
  return { factor, cycles };
}

/** Constraints of "σ_k (M) fixes y" plus the couplings, on `size` nodes (units, and an optional zero node). */
function solver(
  g: UnitGroup,
  k: number,
  mirror: boolean,
  size: number,
  bound: (i: number) => boolean = () => true,
): ParityUnion {
  const u = new ParityUnion(size);
  const perm = g.perms[k];
  const flip = g.flips[k];
  for (let i = 0; i < perm.length; i++)
    if (bound(i)) u.add(i, perm[i], flip[i] ^ (mirror ? g.reflect[i] : 0));
  for (const c of g.couplings) u.add(c.a, c.b, c.c);
  return u;
}

export interface Chirality {
  chiral: boolean | null;
  /** Group element σ with σ·x = M(x) when x is fully defined and achiral; -1 otherwise. */
  witness: number;
  /** The drawn configurations break a bridgehead coupling: no such stereoisomer exists (chiral is null). */
  impossible?: boolean;
}

const MAX_ENUMERATED_UNDEFINED = 14;

/** Chirality of the drawing: with undefined units, true if every completion is chiral, false if none is. */
export function chiralityOf(g: UnitGroup, x: State, defined: Uint8Array): Chirality {
  const m = x.length;
  const open: number[] = [];
  for (let i = 0; i < m; i++) if (!defined[i]) open.push(i);
  if (open.length === 0) {
    if (!feasible(g, x)) return { chiral: null, witness: -1, impossible: true };
    const k = elementMapping(g, x, mirrorState(g, x));
    // a search stopped at its limit may have missed the improper symmetry: achiral is proven, chiral is open
    return { chiral: k < 0 ? (g.complete ? true : null) : false, witness: k };
  }
  let someAchiral = false;
  for (let k = 0; k < g.perms.length && !someAchiral; k++)
    someAchiral = fixedCompletionExists(g, k, x, defined, true);
  if (!someAchiral) {
    // Without any feasible completion the drawing stands for no stereoisomer at all.
    if (!someFeasibleCompletion(g, x, defined)) return { chiral: null, witness: -1, impossible: true };
    return { chiral: true, witness: -1 };
  }
  if (!g.reflect.some((r) => r === 1)) return { chiral: false, witness: -1 };
  if (open.length > MAX_ENUMERATED_UNDEFINED) return { chiral: null, witness: -1 };
  const y = Uint8Array.from(x);
  for (let mask = 0; mask < 1 << open.length; mask++) {
    for (let b = 0; b < open.length; b++) y[open[b]] = (mask >> b) & 1;
    if (!feasible(g, y)) continue;
    if (elementMapping(g, y, mirrorState(g, y)) < 0) return { chiral: null, witness: -1 };
  }
  return { chiral: false, witness: -1 };
}

/** Does some completion of the defined units satisfy every coupling? */
function someFeasibleCompletion(g: UnitGroup, x: State, defined: Uint8Array): boolean {
  const m = x.length;
  const u = new ParityUnion(m + 1);
  for (const c of g.couplings) u.add(c.a, c.b, c.c);
  for (let i = 0; i < m; i++) if (defined[i]) u.add(i, m, x[i]);
  return u.consistent;
}

/**
 * Is unit k stereogenic in the fully defined state x: does inverting it alone give another stereoisomer? A
 * coupled bridgehead cannot be inverted alone, yet it is stereogenic (inverting the whole system gives another
 * stereoisomer), so an infeasible inversion counts as stereogenic.
 */
export function stereogenicIn(g: UnitGroup, x: State, k: number): boolean {
  if (absentPlanar(g, x, k)) return false;
  const y = Uint8Array.from(x);
  y[k] ^= 1;
  if (!feasible(g, y)) return true;
  return elementMapping(g, x, y) < 0;
}

/**
 * The mirror image: tetrahedral and axial windings inverted, cis/trans kept, coordinates reflected. Groups and
 * flags unchanged.
 */
export function mirror(s: Structure): Structure {
  // literals with the readers' property order, not spreads: one hidden class per kind of object (see read/make.ts)
  const stereo = s.stereo.map((e): StereoElement => {
    const winding = e.kind === 'double-bond' ? null : e.winding === '@' ? '@@' : '@';
    if (e.kind === 'tetrahedral')
      return { kind: 'tetrahedral', centre: e.centre, ligands: e.ligands, winding: winding! };
    if (e.kind === 'axial')
      return { kind: 'axial', subtype: e.subtype, ends: e.ends, ligands: e.ligands, winding: winding! };
    return e;
  });
  if (s.dimension === 0) return withStereo(s, stereo);
  // Units read from the drawing itself (a helix) follow the drawing: reflect it too (z -> -z; wedge <-> hash).
  const atoms = s.atoms.map((a) =>
    a.coords === null || s.dimension !== 3
      ? a
      : atomWith(a, { coords: coords3(a.coords[0], a.coords[1], -a.coords[2]) }),
  );
  const bonds = s.bonds.map((b) =>
    s.dimension === 2 && (b.wedge === 'up' || b.wedge === 'down')
      ? newBond(b.a, b.b, b.order, b.aromatic, b.wedge === 'up' ? 'down' : 'up')
      : b,
  );
  return restructure(s, atoms, bonds, stereo, s.groups);
}

/** The flips (with the mirror's, if asked) along the cycle of element k's permutation through unit s, marked done. */
function cycleFlips(g: UnitGroup, k: number, s: number, mirror: boolean, done: Uint8Array): number {
  const perm = g.perms[k];
  const flip = g.flips[k];
  let i = s;
  let rel = 0;
  do {
    done[i] = 1;
    rel ^= flip[i] ^ (mirror ? g.reflect[i] : 0);
    i = perm[i];
  } while (i !== s);
  return rel;
}
