/**
 * Auxiliary descriptors (P-92.1.4 / P-92.5, IUPAC 2013; procedure of Hanson et al. 2018): each stereogenic unit
 * met inside a branch gets a descriptor computed in the root's digraph re-rooted at the unit's node, so ring
 * paths are seen as the root sees them. They are what Rules 3, 4a, 4b, 4c and 5 compare. Computed on demand and
 * memoised on the node; a unit whose ranking would need its own descriptor (a cycle) counts as having none.
 */
import type { CipLabel } from '../facts.js';
import {
  IMPLICIT_H,
  LONE_PAIR,
  type AxialStereo,
  type DoubleBondStereo,
  type TetrahedralStereo,
} from '../types.js';
import { CipNode, Digraph, H_ATOM } from './digraph.js';
import { Ranker } from './compare.js';
import { handedness, rankLigands } from './rank.js';
import { RULE_5, RULE_6 } from './rules.js';

/** The branch of `centre` (re-rooted there) that leads to ligand `lig` of a stereo element. */
export function ligandBranch(
  dg: Digraph,
  centre: CipNode,
  lig: number,
  used: readonly CipNode[],
): CipNode | null {
  const br = dg.branches(centre, null);
  if (lig === LONE_PAIR) return dg.phantom(centre);
  if (lig === IMPLICIT_H) {
    for (const b of br) if (b.atom === H_ATOM && !used.includes(b)) return b;
    return null;
  }
  for (const b of br) if (b.atom === lig && !b.dup && !used.includes(b)) return b;
  for (const b of br) if (b.atom === lig && !used.includes(b)) return b;
  return null;
}

const NONE: readonly CipNode[] = [];

/** The digraph branches of a centre's four ligands, in ligand order; null when one cannot be found. */
function ligandBranches(rk: Ranker, centre: CipNode, e: TetrahedralStereo): CipNode[] | null {
  // the branches taken so far are the ones used
  const ligs: CipNode[] = [];
  for (const l of e.ligands) {
    const b = ligandBranch(rk.dg, centre, l, ligs);
    if (b === null) return null;
    ligs.push(b);
  }
  return ligs;
}

/** R/S (or r/s) of a tetrahedral element at `centre`, or null when two ligands tie. */
export function tetrahedralLabel(
  rk: Ranker,
  centre: CipNode,
  e: TetrahedralStereo,
  level = RULE_5,
): CipLabel | null {
  const ligs = ligandBranches(rk, centre, e);
  if (ligs === null) return null;
  const r = rankLigands(rk, centre, ligs, level);
  if (r.tied) return null;
  const rankOf = [0, 0, 0, 0];
  r.order.forEach((li, pos) => (rankOf[li] = pos));
  const h = handedness(e.winding, rankOf);
  return r.pseudo ? (h === 'R' ? 'r' : 's') : h;
}

/** Rule 6 inside a branch: each tied ligand as the reference; the descriptor stands when all choices agree. */
function tetrahedralRule6(rk: Ranker, centre: CipNode, e: TetrahedralStereo): CipLabel | null {
  const ligs = ligandBranches(rk, centre, e);
  if (ligs === null) return null;
  const r = rankLigands(rk, centre, ligs, RULE_5);
  const found = new Set<CipLabel>();
  const savedRef = rk.dg.rule6Ref;
  try {
    for (let i = 1; i < r.order.length; i++) {
      if (!r.tieWithPrev[i]) continue;
      for (const k of [r.order[i - 1], r.order[i]]) {
        if (ligs[k].atom < 0) continue;
        rk.setRule6(ligs[k].atom);
        const l = tetrahedralLabel(rk, centre, e, RULE_6);
        if (l !== null) found.add(l);
      }
    }
  } finally {
    rk.setRule6(savedRef);
  }
  return found.size === 1 ? [...found][0] : null;
}

/** The branches at one end of a double bond, leaving out the other end and its duplicates. */
export function endBranches(dg: Digraph, end: CipNode, from: CipNode | null, other: number): CipNode[] {
  return dg.branches(end, from).filter((b) => b.atom !== other);
}

/**
 * At one end: is `ref` (an atom index or IMPLICIT_H) the higher-ranked of `cands`, and did Rule 5 decide it?
 * null when they tie. With one candidate it is the higher by default (the other place is a phantom or lone pair).
 */
export function endRank(
  rk: Ranker,
  end: CipNode,
  cands: CipNode[],
  ref: number,
  level = RULE_5,
): { refHigh: boolean; rule5: boolean } | null {
  if (cands.length === 0) return null;
  let top = cands[0];
  let rule5 = false;
  if (cands.length >= 2) {
    const c = rk.compareUpTo(level, cands[0], end, cands[1], end);
    if (c === 0) return null;
    top = c > 0 ? cands[0] : cands[1];
    rule5 = Math.abs(c) - 1 === RULE_5;
  }
  const refHigh = ref === IMPLICIT_H ? top.atom === H_ATOM : top.atom === ref && !top.dup;
  return { refHigh, rule5 };
}

/**
 * E/Z from which ends' higher ligands are the reference ligands and the input's cis/trans relation; 'e'/'z'
 * when Rule 5 ranked exactly one end (the descriptor then rests on enantiomorphic ligands).
 */
export function ezLabel(
  e: DoubleBondStereo,
  end0: { refHigh: boolean; rule5: boolean },
  end1: { refHigh: boolean; rule5: boolean },
): CipLabel {
  const cis = e.relation === 'cis' ? end0.refHigh === end1.refHigh : end0.refHigh !== end1.refHigh;
  const lower = end0.rule5 !== end1.rule5;
  return cis ? (lower ? 'z' : 'Z') : lower ? 'e' : 'E';
}

function doubleBondLabel(rk: Ranker, node: CipNode, e: DoubleBondStereo): CipLabel | null {
  const dg = rk.dg;
  const i = e.ends[0] === node.atom ? 0 : 1;
  const other = e.ends[1 - i];
  let partner: CipNode | null = null;
  if (node.parent !== null && node.parent.atom === other && !node.parent.dup) partner = node.parent;
  else for (const k of dg.kids(node)) if (k.atom === other && !k.dup) partner = k;
  if (partner === null) return null;
  const here = endRank(rk, node, endBranches(dg, node, null, other), e.refs[i]);
  if (here === null) return null;
  const there = endRank(rk, partner, endBranches(dg, partner, null, node.atom), e.refs[1 - i]);
  if (there === null) return null;
  const label = i === 0 ? ezLabel(e, here, there) : ezLabel(e, there, here);
  if (partner.aux === undefined) partner.aux = label;
  return label;
}

/**
 * M/P (or m/p) of an axis from its two end nodes, each with the ranker of its digraph: near ligands (on ends[0])
 * precede far ones; aR corresponds to M and aS to P (P-93.5.7.1, from memory). null when a pair ties.
 */
export function axialLabel(rks: Ranker[], ends: CipNode[], e: AxialStereo, level = RULE_5): CipLabel | null {
  const rankOf = [0, 0, 0, 0];
  let pseudo = false;
  for (let i = 0; i < 2; i++) {
    const rk = rks[i];
    const end = ends[i];
    const a = ligandBranch(rk.dg, end, e.ligands[2 * i], NONE);
    const b = ligandBranch(rk.dg, end, e.ligands[2 * i + 1], a !== null ? [a] : NONE);
    if (a === null || b === null) return null;
    const r = rankLigands(rk, end, [a, b], level);
    if (r.tied) return null;
    pseudo = pseudo !== r.pseudo;
    rankOf[2 * i + r.order[0]] = 2 * i;
    rankOf[2 * i + r.order[1]] = 2 * i + 1;
  }
  const h = handedness(e.winding, rankOf);
  const label = h === 'R' ? 'M' : 'P';
  return pseudo ? (label === 'M' ? 'm' : 'p') : label;
}

/** The node of the axis's other end, reached from `node` along the cumulated chain (or the axis bond). */
function farEnd(dg: Digraph, node: CipNode, other: number): CipNode | null {
  const g = dg.g;
  let frontier: CipNode[] = [node];
  const seen = new Set<CipNode>([node]);
  for (let step = 0; step < 8 && frontier.length > 0; step++) {
    const next: CipNode[] = [];
    for (const x of frontier) {
      if (x !== node && x.atom !== other && g.nbr[x.atom].length !== 2) continue;
      const around = [...dg.kids(x), ...(x.parent ? [x.parent] : [])];
      for (const y of around) {
        if (y.dup || y.atom < 0 || seen.has(y)) continue;
        if (y.atom === other) return y;
        seen.add(y);
        if (g.nbr[y.atom].length === 2 && g.dupOrd[y.atom].every((o) => o === 2)) next.push(y);
      }
    }
    frontier = next;
  }
  return null;
}

function axialAux(rk: Ranker, node: CipNode, e: AxialStereo): CipLabel | null {
  const i = e.ends[0] === node.atom ? 0 : 1;
  const far = farEnd(rk.dg, node, e.ends[1 - i]);
  if (far === null) return null;
  const ends = i === 0 ? [node, far] : [far, node];
  const label = axialLabel([rk, rk], ends, e);
  if (far.aux === undefined) far.aux = label;
  return label;
}

/** Make the auxiliary-descriptor function for one digraph. */
export function auxFor(dg: Digraph): (rk: Ranker) => (node: CipNode) => CipLabel | null {
  return (rk: Ranker) =>
    (node: CipNode): CipLabel | null => {
      if (node.aux !== undefined) return node.aux;
      if (node.auxBusy || node === dg.root || node.dup || node.atom < 0) return null;
      const g = dg.g;
      node.auxBusy = true;
      let label: CipLabel | null = null;
      const t = g.tetraAt[node.atom];
      const b = g.bondAt[node.atom];
      const x = g.axialAt[node.atom];
      if (t >= 0 && t !== dg.rootElement && g.auxAllowed[t]) {
        const e = g.s.stereo[t] as TetrahedralStereo;
        label = rk.within(node, () => tetrahedralLabel(rk, node, e));
        if (label === null && g.auxRule6[t]) label = rk.within(node, () => tetrahedralRule6(rk, node, e));
      } else if (b >= 0 && b !== dg.rootElement && g.auxAllowed[b]) {
        label = rk.within(node, () => doubleBondLabel(rk, node, g.s.stereo[b] as DoubleBondStereo));
      } else if (x >= 0 && x !== dg.rootElement && g.auxAllowed[x]) {
        label = rk.within(node, () => axialAux(rk, node, g.s.stereo[x] as AxialStereo));
      }
      node.auxBusy = false;
      node.aux = label;
      return label;
    };
}

export function newRanker(dg: Digraph): Ranker {
  const rk: Ranker = new Ranker(dg, (n) => aux(n));
  const aux = auxFor(dg)(rk);
  return rk;
}
