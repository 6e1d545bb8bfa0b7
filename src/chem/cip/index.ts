/**
 * The CIP labeler: IUPAC 2013 recommendations P-92 (sequence rules) and P-93 (descriptors), with the revisions
 * and the machine-implementation guide of Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755-1765.
 *
 * `assignCip` gives one result per element of `s.stereo`, in the same order. The label is null when the unit is
 * not stereogenic by the rules (two ligands tie completely), which is how units that a reader records from
 * geometry alone (every sp3 atom of a 3D file) drop out; so do double bonds in rings of up to 7 atoms, biaryl
 * bonds in rings of up to 6, and amine nitrogens that are not bridgeheads of a bridged system.
 *
 * Helicenes are not among the reader's stereo elements: `findHelices` finds them from 3D coordinates or 2D
 * wedges and labels the two terminal atoms of the inner rim (P/M); callers add its results to assignCip's.
 *
 * Files: graph.ts (molecular graph), mancude.ts (P-92.1.4.4), digraph.ts (lazy hierarchical digraph),
 * rules.ts and rule4b.ts (the sequence rules), compare.ts (sphere-by-sphere comparison), aux.ts (auxiliary
 * descriptors), rank.ts (ranking, pseudoasymmetry, R/S), label.ts (each kind of unit, Rule 6), helix.ts.
 */
import type { CipLabel } from '../facts.js';
import type { Structure } from '../types.js';
import { buildGraph } from './graph.js';
import { labelPlain, labelRule6 } from './label.js';
import { checkBudget } from '../budget.js';

export { findHelices, helixRims, helixSense, type HelixResult, type HelixRim } from './helix.js';

export interface CipResult {
  /** Index into s.stereo. */
  element: number;
  label: CipLabel | null;
  /** Atom indices that carry the label: the centre, or the two end atoms of a double bond or axis. */
  atoms: number[];
  /** Present (true) when the label is null because the structure's work budget ran out: open, not "no label". */
  stopped?: true;
}

export function assignCip(s: Structure): CipResult[] {
  if (s.stereo.length === 0) return [];
  const g = buildGraph(s);
  const labels = s.stereo.map((_, i) => {
    checkBudget();
    return labelPlain(g, i);
  });
  if (labels.some((l, i) => l === null && !g.ringFixed[i])) {
    // Rule 6 (Hanson et al. 2018) only for what Rules 1-5 leave tied, lending descriptors only from units
    // found stereogenic; a unit labelled by Rule 6 may in turn settle another one, so repeat once more.
    g.auxAllowed = labels.map((l) => l !== null);
    const by6: number[] = [];
    for (let i = 0; i < labels.length; i++) {
      if (labels[i] !== null) continue;
      labels[i] = labelRule6(g, i);
      if (labels[i] !== null) by6.push(i);
    }
    const open = labels.some((l, i) => l === null && !g.ringFixed[i]);
    if (by6.length > 0 && open) {
      g.auxAllowed = labels.map((l) => l !== null);
      for (const i of by6) g.auxRule6[i] = true;
      for (let i = 0; i < labels.length; i++) {
        if (labels[i] === null && !g.ringFixed[i]) labels[i] = labelPlain(g, i) ?? labelRule6(g, i);
      }
    }
  }
  const stopped = g.workLeft <= 0;
  return s.stereo.map((e, element) => {
    const r: CipResult = {
      element,
      label: labels[element],
      atoms: e.kind === 'tetrahedral' ? [e.centre] : [e.ends[0], e.ends[1]],
    };
    if (stopped && r.label === null && !g.ringFixed[element]) r.stopped = true;
    return r;
  });
}
