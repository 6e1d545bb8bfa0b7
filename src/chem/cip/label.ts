/**
 * The descriptor of one stereo element of the structure, from a digraph grown from the unit itself:
 * tetrahedral centres (R/S, r/s), double bonds and odd cumulenes (E/Z), allenes, even cumulenes and biaryl axes
 * (M/P, m/p). When the rules of 2013 leave ligands tied, the proposed Rule 6 of Hanson et al. 2018 is tried with
 * each tied ligand as the reference; it decides only when every choice gives the same descriptor.
 */
import type { CipLabel } from '../facts.js';
import type { AxialStereo, DoubleBondStereo, StereoElement, TetrahedralStereo } from '../types.js';
import { Digraph } from './digraph.js';
import type { CipGraph } from './graph.js';
import {
  axialLabel,
  endBranches,
  ezLabel,
  ligandBranch,
  newRanker,
  endRank,
  tetrahedralLabel,
} from './aux.js';
import { rankLigands } from './rank.js';
import { RULE_5, RULE_6 } from './rules.js';
import type { Ranker } from './compare.js';

/** Rankers by root atom, shared while one unit is tried with several Rule 6 references. */
type Rankers = Map<number, Ranker>;

function ranker(g: CipGraph, root: number, element: number, ref: number, cache?: Rankers): Ranker {
  let rk = cache?.get(root);
  if (rk === undefined) {
    rk = newRanker(new Digraph(g, root, element));
    cache?.set(root, rk);
  }
  rk.setRule6(ref);
  return rk;
}

/** The neighbour of `end` along the unit: the other end itself, or the first atom of a cumulated chain. */
function towardOther(g: CipGraph, end: number, other: number): number {
  const nb = g.nbr[end];
  if (nb.includes(other)) return other;
  for (let i = 0; i < nb.length; i++) if (g.ord[end][i] >= 2) return nb[i];
  return -1;
}

function tetrahedral(
  g: CipGraph,
  index: number,
  e: TetrahedralStereo,
  ref: number,
  c?: Rankers,
): CipLabel | null {
  const rk = ranker(g, e.centre, index, ref, c);
  const l = tetrahedralLabel(rk, rk.dg.root, e, ref >= 0 ? RULE_6 : RULE_5);
  return rk.dg.truncated ? null : l;
}

/** Ligands of a tetrahedral centre that tie under Rules 1-5 (candidates for the Rule 6 reference). */
function tiedTetrahedral(g: CipGraph, index: number, e: TetrahedralStereo, c?: Rankers): number[] {
  const rk = ranker(g, e.centre, index, -1, c);
  // the branches taken so far are the ones used
  const ligs: ReturnType<typeof rk.dg.phantom>[] = [];
  for (const l of e.ligands) {
    const b = ligandBranch(rk.dg, rk.dg.root, l, ligs);
    if (b === null) return [];
    ligs.push(b);
  }
  const r = rankLigands(rk, rk.dg.root, ligs, RULE_5);
  const out: number[] = [];
  for (let i = 1; i < r.order.length; i++) {
    if (!r.tieWithPrev[i]) continue;
    for (const k of [r.order[i - 1], r.order[i]])
      if (e.ligands[k] >= 0 && !out.includes(e.ligands[k])) out.push(e.ligands[k]);
  }
  return out;
}

function doubleBond(
  g: CipGraph,
  index: number,
  e: DoubleBondStereo,
  ref: number,
  c?: Rankers,
): CipLabel | null {
  const level = ref >= 0 ? RULE_6 : RULE_5;
  const high: { refHigh: boolean; rule5: boolean }[] = [];
  for (let i = 0; i < 2; i++) {
    const end = e.ends[i];
    const excl = towardOther(g, end, e.ends[1 - i]);
    const rk = ranker(g, end, index, ref, c);
    const h = endRank(rk, rk.dg.root, endBranches(rk.dg, rk.dg.root, null, excl), e.refs[i], level);
    if (h === null || rk.dg.truncated) return null;
    high.push(h);
  }
  return ezLabel(e, high[0], high[1]);
}

function axial(g: CipGraph, index: number, e: AxialStereo, ref: number, c?: Rankers): CipLabel | null {
  const level = ref >= 0 ? RULE_6 : RULE_5;
  const r0 = ranker(g, e.ends[0], index, ref, c);
  const r1 = ranker(g, e.ends[1], index, ref, c);
  const l = axialLabel([r0, r1], [r0.dg.root, r1.dg.root], e, level);
  return r0.dg.truncated || r1.dg.truncated ? null : l;
}

function labelWith(g: CipGraph, index: number, e: StereoElement, ref: number, c?: Rankers): CipLabel | null {
  if (e.kind === 'tetrahedral') return tetrahedral(g, index, e, ref, c);
  if (e.kind === 'double-bond') return doubleBond(g, index, e, ref, c);
  return axial(g, index, e, ref, c);
}

/** Candidate Rule 6 references: the ligand atoms of the unit that Rules 1-5 leave tied. */
function rule6Candidates(g: CipGraph, index: number, e: StereoElement, c: Rankers): number[] {
  if (e.kind === 'tetrahedral') return tiedTetrahedral(g, index, e, c);
  if (e.kind === 'double-bond') {
    const out: number[] = [];
    for (let i = 0; i < 2; i++) {
      const excl = towardOther(g, e.ends[i], e.ends[1 - i]);
      for (const b of g.nbr[e.ends[i]]) if (b !== excl) out.push(b);
    }
    return out;
  }
  return e.ligands.filter((l) => l >= 0);
}

/** Descriptors by Rules 1-5 alone (null where ligands tie). */
export function labelPlain(g: CipGraph, index: number): CipLabel | null {
  if (g.ringFixed[index]) return null;
  return labelWith(g, index, g.s.stereo[index], -1);
}

/**
 * Proposed Rule 6 for a unit that Rules 1-5 leave tied: each tied ligand is tried as the reference, and the
 * descriptor stands when every choice gives the same one. Call with `g.auxAllowed` limited to the units Rules 1-5
 * found stereogenic, so that a unit that is no stereocentre (an adamantane bridgehead) lends no descriptor.
 */
export function labelRule6(g: CipGraph, index: number): CipLabel | null {
  if (g.ringFixed[index]) return null;
  const e = g.s.stereo[index];
  const found = new Set<CipLabel>();
  const cache: Rankers = new Map();
  for (const ref of rule6Candidates(g, index, e, cache)) {
    const l = labelWith(g, index, e, ref, cache);
    if (l !== null) found.add(l);
  }
  return found.size === 1 ? [...found][0] : null;
}
