/**
 * Rule 4b (P-92.5.2, IUPAC 2013; implementation after Hanson et al. 2018): when two ligands have different
 * descriptor pairs, the one with the first chosen like pair ('RR', 'SS', 'MM', 'PP', 'RM', 'SP') precedes the one
 * with an unlike pair. In each branch the reference descriptor is that of the highest-ranked chiral unit (by
 * Rules 1-4a); when several units tie for that place, each is tried and the best sequence counts. The other
 * descriptors are then paired with the reference in hierarchical order (sphere by sphere, by rank), like pairs
 * first among units that tie in rank. The rule ranks the ligands of the unit being labelled (and of each auxiliary
 * unit, at its own turn); it puts no order on the branches of nodes farther out (compare.ts, sortAt).
 */
import type { CipLabel } from '../facts.js';
import type { CipNode } from './digraph.js';
import type { Ranker } from './compare.js';
import * as rules from './rules.js';

const RULE_4A = rules.RULE_4A;
const isChiralLabel = rules.isChiralLabel;
const likeClass = rules.likeClass;

interface Entry {
  label: CipLabel;
  /** Sphere, then the rank position at each sphere on the way down; equal keys are interchangeable units. */
  key: number[];
  group: number;
}

function keyCompare(a: number[], b: number[]): number {
  const m = Math.min(a.length, b.length);
  for (let i = 0; i < m; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/**
 * Chiral descriptors of a branch in hierarchical order. Units whose paths from the branch root tie at every
 * sphere under Rules 1-4a (for instance the two ways round a ring) share a group: their order is not fixed.
 */
function descriptors(rk: Ranker, x: CipNode, fx: CipNode | null): Entry[] {
  const out: Entry[] = [];
  const q: CipNode[] = [x];
  const qf: (CipNode | null)[] = [fx];
  // the key path of each queued node as a link to its parent's entry and its own rank position (the path
  // itself is spelled out only for the nodes that carry a descriptor)
  const qParent: number[] = [-1];
  const qPos: number[] = [0];
  const qDepth: number[] = [0];
  for (let i = 0; i < q.length; i++) {
    if (--rk.dg.g.workLeft <= 0) {
      rk.dg.truncated = true;
      break;
    }
    const n = q[i];
    if (!n.dup && n.atom >= 0 && rk.value(RULE_4A, n) === 2) {
      const l = rk.aux(n);
      if (l !== null && isChiralLabel(l)) {
        const len = qDepth[i];
        const key = new Array<number>(len + 1);
        key[0] = len;
        for (let k = i, at = len; at >= 1; k = qParent[k], at--) key[at] = qPos[k];
        out.push({ label: l, key, group: 0 });
      }
    }
    const s = rk.sorted(n, qf[i], RULE_4A);
    let pos = 0;
    for (let j = 0; j < s.nodes.length; j++) {
      if (!s.tie[j]) pos = j;
      q.push(s.nodes[j]);
      qf.push(n);
      qParent.push(i);
      qPos.push(pos);
      qDepth.push(qDepth[i] + 1);
    }
  }
  out.sort((a, b) => keyCompare(a.key, b.key));
  let g = 0;
  for (let i = 0; i < out.length; i++) {
    if (i > 0 && keyCompare(out[i - 1].key, out[i].key) !== 0) g++;
    out[i].group = g;
  }
  return out;
}

/** Hydrogens, phantoms and duplicates: nothing to order among them. */
function allLeaves(nodes: CipNode[], a: number, b: number): boolean {
  for (let k = a; k < b; k++) if (!nodes[k].dup && nodes[k].atom >= 0) return false;
  return true;
}

/** 2 for a descriptor like the reference, 1 for an unlike one, 0 for none. */
function own(rk: Ranker, n: CipNode, refClass: number): number {
  const l = chiralLabel(rk, n);
  return l === null ? 0 : likeClass(l) === refClass ? 2 : 1;
}

function chiralLabel(rk: Ranker, n: CipNode): CipLabel | null {
  if (n.dup || n.atom < 0 || rk.value(RULE_4A, n) !== 2) return null;
  const l = rk.aux(n);
  return l !== null && isChiralLabel(l) ? l : null;
}

/**
 * Like (1) / unlike (0) sequence of the branch x against one reference class, in hierarchical order. Branches
 * that Rules 1-4a cannot order are put like-first: by their own descriptor, then by their own sequence, so that
 * units deeper down keep following the unit they hang from (the pairing of Hanson et al. 2018).
 */
function orderedPairs(
  rk: Ranker,
  x: CipNode,
  fx: CipNode | null,
  refClass: number,
  memo: Map<CipNode, number[]>,
): number[] {
  const hit = memo.get(x);
  if (hit) return hit;
  const seq: number[] = [];
  const q: CipNode[] = [x];
  const qf: (CipNode | null)[] = [fx];
  for (let i = 0; i < q.length; i++) {
    const n = q[i];
    const l = chiralLabel(rk, n);
    if (l !== null) seq.push(likeClass(l) === refClass ? 1 : 0);
    const s = rk.sorted(n, qf[i], RULE_4A);
    const nodes = s.nodes.slice();
    for (let a = 0; a < nodes.length;) {
      let b = a + 1;
      while (b < nodes.length && s.tie[b]) b++;
      if (b - a > 1 && !allLeaves(nodes, a, b)) {
        const run = nodes.slice(a, b);
        run.sort(
          (u, v) =>
            own(rk, v, refClass) - own(rk, u, refClass) ||
            lexCompare(orderedPairs(rk, v, n, refClass, memo), orderedPairs(rk, u, n, refClass, memo)),
        );
        for (let k = a; k < b; k++) nodes[k] = run[k - a];
      }
      a = b;
    }
    for (const c of nodes) {
      q.push(c);
      qf.push(n);
    }
  }
  memo.set(x, seq);
  return seq;
}

function lexCompare(a: number[], b: number[]): number {
  const m = Math.min(a.length, b.length);
  for (let i = 0; i < m; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/** The best like/unlike sequence of a branch over the candidate reference descriptors of its first units. */
function bestPairs(rk: Ranker, x: CipNode, fx: CipNode | null): number[] {
  const entries = descriptors(rk, x, fx);
  if (entries.length === 0) return [];
  const first = entries[0].group;
  const classes = new Set<number>();
  for (const e of entries) {
    if (e.group !== first) break;
    classes.add(likeClass(e.label));
  }
  let best: number[] | null = null;
  for (const cls of classes) {
    const seq = orderedPairs(rk, x, fx, cls, new Map());
    if (best === null || lexCompare(seq, best) > 0) best = seq;
  }
  return best ?? [];
}

export function compareRule4b(
  rk: Ranker,
  x: CipNode,
  fx: CipNode | null,
  y: CipNode,
  fy: CipNode | null,
): number {
  const c = lexCompare(bestPairs(rk, x, fx), bestPairs(rk, y, fy));
  return c > 0 ? 1 : c < 0 ? -1 : 0;
}
