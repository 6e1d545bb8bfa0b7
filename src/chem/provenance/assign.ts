/**
 * Places the inputs on the product, each product atom given to at most one input: the input whose largest common
 * substructure with the still unclaimed atoms is largest goes first (shared bonds, then atoms, then input order),
 * and the others are searched again on what is left. Going by size alone would let a small reagent take a piece
 * of the substrate (acetic anhydride's C–C(=O)–O fits the carboxyl of N-acetylalanine better than its own acetyl).
 * When every input is placed, an input found again almost whole (two thirds of its heavy atoms, at least two) in
 * what is left is placed again: a diamide from two equivalents of one amine.
 */
import { commonSubstructure, type McsGraph, type McsResult } from './mcs.js';

export interface Placement {
  input: number;
  /** Input atom -> product atom, or -1. */
  map: Int32Array;
  atoms: number;
  bonds: number;
}

export interface Assignment {
  placements: Placement[];
  /** Product atom -> index into `placements`, or -1. */
  owner: Int32Array;
  /** Some search stopped at its bound (or an input was too large to search). */
  bounded: boolean;
  steps: number;
}

const MAX_EXTRA_COPIES = 8;

function stillFits(r: McsResult, free: Uint8Array): boolean {
  for (let i = 0; i < r.map.length; i++) if (r.map[i] >= 0 && !free[r.map[i]]) return false;
  return true;
}

export function assignInputs(
  product: McsGraph,
  inputs: readonly (McsGraph | null)[],
  stepBudget: number,
): Assignment {
  const free = new Uint8Array(product.n).fill(1);
  const owner = new Int32Array(product.n).fill(-1);
  const placements: Placement[] = [];
  let steps = 0;
  let bounded = inputs.some((g) => g === null);
  const search = (k: number): McsResult | null => {
    const remaining = stepBudget - steps;
    if (remaining <= 0) {
      bounded = true;
      return null;
    }
    const r = commonSubstructure(inputs[k]!, product, { available: free, budget: remaining });
    steps += r.steps;
    if (!r.complete) bounded = true;
    return r;
  };
  const place = (k: number, r: McsResult): void => {
    const index = placements.length;
    placements.push({ input: k, map: r.map, atoms: r.atoms, bonds: r.bonds });
    for (let i = 0; i < r.map.length; i++) {
      const v = r.map[i];
      if (v < 0) continue;
      free[v] = 0;
      owner[v] = index;
    }
  };

  const results = new Map<number, McsResult>();
  const pending = new Set<number>();
  inputs.forEach((g, k) => {
    if (g !== null && g.n > 0) pending.add(k);
  });
  while (pending.size > 0 && !bounded) {
    let bestK = -1;
    let bestR: McsResult | null = null;
    for (const k of pending) {
      let r = results.get(k);
      if (!r || !stillFits(r, free)) {
        const fresh = search(k);
        if (fresh === null || bounded) break;
        r = fresh;
        results.set(k, r);
      }
      if (
        bestR === null ||
        r.bonds > bestR.bonds ||
        (r.bonds === bestR.bonds && r.atoms > bestR.atoms) ||
        (r.bonds === bestR.bonds && r.atoms === bestR.atoms && k < bestK)
      ) {
        bestK = k;
        bestR = r;
      }
    }
    if (bounded || bestR === null || bestR.atoms === 0) break;
    place(bestK, bestR);
    pending.delete(bestK);
  }

  let extra = 0;
  for (let k = 0; k < inputs.length && !bounded; k++) {
    const g = inputs[k];
    if (g === null || !placements.some((p) => p.input === k)) continue;
    const need = Math.max(2, Math.ceil((2 * g.n) / 3));
    while (extra < MAX_EXTRA_COPIES && !bounded) {
      let left = 0;
      for (let v = 0; v < product.n; v++) left += free[v];
      if (left < need) break;
      const r = search(k);
      if (r === null || bounded || r.atoms < need) break;
      place(k, r);
      extra++;
    }
  }
  return { placements, owner, bounded, steps };
}
