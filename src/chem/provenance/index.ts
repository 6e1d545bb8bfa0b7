/**
 * Provenance: the inputs a compound was made from, mapped onto it, and each of its stereo units traced back —
 * carried (from a unit of an input, no bond at it made or broken), formed (new, or a bond at it changed) or
 * unmapped — with a carried unit's spatial configuration compared through the mapped neighbours. The one public
 * entry of provenance/.
 *
 * Each input is placed on the product by the largest common connected substructure (mcs.ts), product atoms given
 * to one input each (assign.ts); the units are then judged (classify.ts). The whole trace of one product is
 * bounded by a step budget: when a search reaches it, every unit is reported 'unmapped' (reason 'bound') rather
 * than judged on a mapping not proven largest.
 */
import { analyse, type Analysis } from '../describe/index.js';
import type { Structure } from '../types.js';
import { assignInputs } from './assign.js';
import { classify } from './classify.js';
import { DEFAULT_MCS_BUDGET, mcsGraph, type McsGraph } from './mcs.js';
import type { Provenance, ProvenanceOptions } from './types.js';

export type * from './types.js';
export { commonSubstructure, mcsGraph, DEFAULT_MCS_BUDGET, type McsGraph, type McsResult } from './mcs.js';

const DEFAULT_MAX_INPUT_ATOMS = 250;

/** Traces the stereo units of `product` back to `inputs` (each a structure as drawn). Pure; never throws on data. */
export function traceProvenance(
  product: Structure,
  inputs: readonly Structure[],
  options: ProvenanceOptions = {},
): Provenance {
  return traceAnalysed(
    analyse(product),
    inputs.map((s) => analyse(s)),
    options,
  );
}

/** traceProvenance on structures already analysed (callers that hold the analyses save the work). */
export function traceAnalysed(
  product: Analysis,
  inputs: readonly Analysis[],
  options: ProvenanceOptions = {},
): Provenance {
  const budget = options.stepBudget ?? DEFAULT_MCS_BUDGET;
  const maxAtoms = options.maxInputAtoms ?? DEFAULT_MAX_INPUT_ATOMS;
  const pg = mcsGraph(product.p);
  const sides = inputs.map((a) => {
    const g = mcsGraph(a.p);
    return g.n > maxAtoms ? null : { a, g };
  });
  const tooLarge = pg.n > maxAtoms;
  const graphs: (McsGraph | null)[] = sides.map((s) => (tooLarge ? null : (s?.g ?? null)));
  const asg = assignInputs(pg, graphs, budget);
  const full = inputs.map((a, k) => sides[k] ?? { a, g: mcsGraph(a.p) });
  const { units, inputs: traces } = classify({ a: product, g: pg }, full, asg);
  return { units, inputs: traces, bounded: asg.bounded, steps: asg.steps };
}
