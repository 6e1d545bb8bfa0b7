/**
 * Rule 4b (P-92.5.2, IUPAC 2013; implementation after Hanson et al. 2018): when two ligands have different
 * descriptor pairs, the one with the first chosen like pair ('RR', 'SS', 'MM', 'PP', 'RM', 'SP') precedes the one
 * with an unlike pair. In each branch the reference descriptor is that of the highest-ranked chiral unit (by
 * Rules 1-4a); when several units tie for that place, each is tried and the best sequence counts. The other
 * descriptors are then paired with the reference in hierarchical order (sphere by sphere, by rank), like pairs
 * first among units that tie in rank.
 */
import type { CipLabel } from '../facts.js';
import type { CipNode } from './digraph.js';
import type { Ranker } from './compare.js';
import { RULE_4A, isChiralLabel, likeClass } from './rules.js';

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
  const qk: number[][] = [[]];
  for (let i = 0; i < q.length; i++) {
    const n = q[i];
    if (!n.dup && n.atom >= 0 && rk.value(RULE_4A, n) === 2) {
      const l = rk.aux(n);
      if (l !== null && isChiralLabel(l)) out.push({ label: l, key: [qk[i].length, ...qk[i]], group: 0 });
    }
    const s = rk.sorted(n, qf[i], RULE_4A);
    let pos = 0;
    for (let j = 0; j < s.nodes.length; j++) {
      if (!s.tie[j]) pos = j;
      q.push(s.nodes[j]);
      qf.push(n);
      qk.push([...qk[i], pos]);
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

/** Like (1) / unlike (0) sequence of the branch against one reference class, like pairs first within ties. */
function pairs(entries: Entry[], refClass: number): number[] {
  const seq: number[] = [];
  let i = 0;
  while (i < entries.length) {
    let j = i;
    let likes = 0;
    while (j < entries.length && entries[j].group === entries[i].group) {
      if (likeClass(entries[j].label) === refClass) likes++;
      j++;
    }
    for (let k = i; k < j; k++) seq.push(k - i < likes ? 1 : 0);
    i = j;
  }
  return seq;
}

function lexCompare(a: number[], b: number[]): number {
  const m = Math.min(a.length, b.length);
  for (let i = 0; i < m; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

function bestPairs(entries: Entry[]): number[] {
  if (entries.length === 0) return [];
  const first = entries[0].group;
  let best: number[] | null = null;
  for (const e of entries) {
    if (e.group !== first) break;
    const seq = pairs(entries, likeClass(e.label));
    if (best === null || lexCompare(seq, best) > 0) best = seq;
  }
  return best ?? [];
}

export function compareRule4b(rk: Ranker, x: CipNode, fx: CipNode | null, y: CipNode, fy: CipNode | null): number {
  const a = bestPairs(descriptors(rk, x, fx));
  const b = bestPairs(descriptors(rk, y, fy));
  const c = lexCompare(a, b);
  return c > 0 ? 1 : c < 0 ? -1 : 0;
}
