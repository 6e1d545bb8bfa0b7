/**
 * analyse(): everything describe() and relate() compute once per structure — the normalised structure, its
 * perception, the symmetry group acting on the stereo units, the drawn state and which units are reported.
 */
import { normalize, type Normalized } from '../normalize.js';
import { atomName, perceive, type PerceiveOptions, type Perception, type State } from '../perceive/index.js';
import {
  chiralityOf,
  feasible,
  stereogenicIn,
  unitGroup,
  type Chirality,
  type UnitGroup,
} from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { checkBudget } from '../budget.js';

/** Everything describe() and relate() compute once per structure. */
export interface Analysis {
  norm: Normalized;
  p: Perception;
  group: UnitGroup;
  state: State;
  defined: Uint8Array;
  /** Units reported as stereo units (stereogenic in at least one completion of the drawing). */
  reported: boolean[];
  chirality: Chirality;
}

export function analyse(input: Structure, opts: PerceiveOptions = {}): Analysis {
  const norm = normalize(input);
  const p = perceive(norm.structure, opts);
  const group = unitGroup(p);
  const m = p.units.length;
  const state = Uint8Array.from(p.units, (u) => u.bit);
  const defined = Uint8Array.from(p.units, (u) => (u.defined ? 1 : 0));
  const reported = p.units.map((_u, k) => stereogenicSomewhere(group, state, defined, k));
  for (let k = 0; k < m; k++) {
    // 3D input states a configuration for every sp3 atom from its coordinates: nothing to remark on there.
    if (!reported[k] && p.units[k].defined && p.units[k].kind !== 'planar' && p.structure.dimension !== 3) {
      p.remarks.push(
        `${unitName(p, k)} is drawn with a configuration but is not stereogenic in this stereoisomer (its two equivalent branches are alike); not listed`,
      );
    }
  }
  if (!group.complete)
    p.remarks.push(
      'symmetry search stopped at its limit: stereoisomer counts are open (stereoisomers.open), and so are chirality and relations that a symmetry not found could change',
    );
  const chirality = chiralityOf(group, state, defined);
  return { norm, p, group, state, defined, reported, chirality };
}

/** Is unit k stereogenic in some completion of the drawing? (Exact up to 2^10 completions, else assumed.) */
function stereogenicSomewhere(g: UnitGroup, x: State, defined: Uint8Array, k: number): boolean {
  const planar = k < g.planarHost.length && g.planarHost[k] >= 0;
  if (g.perms.length === 1 && !planar) return true;
  const open: number[] = [];
  for (let i = 0; i < x.length; i++) if (!defined[i] && i !== k) open.push(i);
  if (open.length > 10) return true;
  const y = Uint8Array.from(x);
  let seenFeasible = false;
  for (let mask = 0; mask < 1 << open.length; mask++) {
    checkBudget(g.perms.length);
    for (let b = 0; b < open.length; b++) y[open[b]] = (mask >> b) & 1;
    if (!feasible(g, y)) continue;
    seenFeasible = true;
    if (stereogenicIn(g, y, k)) return true;
  }
  return !seenFeasible;
}

export function unitName(p: Perception, k: number): string {
  const u = p.units[k];
  const s = p.structure;
  return u.atoms.length === 1
    ? atomName(s, u.atoms[0])
    : `the ${atomName(s, u.atoms[0])}–${atomName(s, u.atoms[1])} unit`;
}

/** Index of the parent component: the largest component holding carbon (else the largest). */
export function parentComponent(s: Structure, comps: number[][]): number {
  const organic = (c: number[]): boolean => c.some((x) => s.atoms[x].atomicNumber === 6);
  let parent = -1;
  comps.forEach((c, k) => {
    const better =
      parent < 0 ||
      (organic(c) && !organic(comps[parent])) ||
      (organic(c) === organic(comps[parent]) && c.length > comps[parent].length);
    if (better) parent = k;
  });
  return parent;
}
