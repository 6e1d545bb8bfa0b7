/**
 * Everything the refinement-based functions (classes, key, search) need about one structure, computed once:
 * adjacency, bridges, the bond codes' aromatic set, atom invariants and the compressed adjacency.
 */
import type { Structure } from '../types.js';
import { buildGraph, type Graph } from './adjacency.js';
import { conjugatedRingBonds } from './aromaticity.js';
import { invariantsWith } from './invariants.js';
import { csrOf } from './csr.js';
import type { CsrGraph } from './refine.js';
import { bridges } from './rings.js';

export interface Prepared {
  s: Structure;
  g: Graph;
  aromatic: readonly boolean[];
  inv: number[];
  csr: CsrGraph;
}

export function prepare(s: Structure, aromatic?: readonly boolean[]): Prepared {
  const g = buildGraph(s);
  const bridge = bridges(g, s.bonds.length);
  const arom = aromatic ?? conjugatedRingBonds(s, g, bridge);
  const inv = invariantsWith(s, arom, g, bridge);
  return { s, g, aromatic: arom, inv, csr: csrOf([{ s, aromatic: arom }]) };
}
