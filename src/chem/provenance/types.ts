/**
 * What the provenance engine reports: each stereo unit of a product traced back to the inputs it was made from.
 * Atom numbers are the 1-based input numbers of each structure (see ../types.ts), never internal indices.
 */
import type { UnitKind } from '../facts.js';

/**
 * carried: the unit maps onto a unit of one input and no bond at it was made or broken;
 * formed: the unit is new, or a bond at it changed (or may have: see `reason`);
 * unmapped: no input accounts for its atoms, or the mapping stopped at its bound.
 */
export type UnitFate = 'carried' | 'formed' | 'unmapped';

export type FateReason =
  /** carried: same neighbours, same bonds. */
  | 'bonds-kept'
  /** formed: the atom comes from an input where it is no stereo unit (prochiral carbonyl, enantiotopic group). */
  | 'new-unit'
  /** formed: a bond at the unit was made, broken or changed order. */
  | 'bond-changed'
  /** formed: a neighbour could come from another input as well, so whether its bond was made cannot be told. */
  | 'bond-may-be-made'
  /** formed: the atoms of the unit come from two different inputs. */
  | 'atoms-from-two-inputs'
  /** unmapped: an atom of the unit is matched by no input. */
  | 'not-covered'
  /** unmapped: the mapping search stopped at its bound before it was proven. */
  | 'bound';

export interface UnitOrigin {
  kind: UnitKind;
  /** Product atoms of the unit (centre, or the two ends). */
  atoms: number[];
  fate: UnitFate;
  reason: FateReason;
  /** The input the unit's atoms come from (carried, or formed on an atom of an input); null when unmapped. */
  input: number | null;
  /** The matching atoms in that input. */
  inputAtoms: number[] | null;
  /** Carried: whether the input defines the unit's configuration. */
  inputDefined: boolean;
  /** Whether the product drawing defines the unit's configuration. */
  productDefined: boolean;
  /**
   * Carried and defined on both sides: the spatial configuration the product shows compared with the input's,
   * through the mapped neighbours (not the CIP label): 'same' or 'inverted'; otherwise 'open'.
   */
  configuration: 'same' | 'inverted' | 'open';
  /**
   * For a changed bond: the product neighbour whose bond was made or may have been made, and the input it comes
   * from (null when no input matches it).
   */
  neighbour: { atom: number; input: number | null } | null;
}

export interface InputTrace {
  input: number;
  /** How many times the input was found in the product (a diamide from two equivalents of one amine: 2). */
  copies: number;
  heavyAtoms: number;
  /** Atoms and bonds of the largest copy found in the product. */
  atomsMapped: number;
  bondsMapped: number;
  /**
   * The carried units of this input, taken together and defined on both sides: 'same' when some mapping (the
   * input's symmetry allows several) gives every one the same configuration, 'mirror' when one gives all the
   * mirror image (parity units inverted, cis/trans kept) and none all the same, 'mixed' otherwise; 'none' without
   * such units.
   */
  relative: 'same' | 'mirror' | 'mixed' | 'none';
}

export interface Provenance {
  units: UnitOrigin[];
  inputs: InputTrace[];
  /** A mapping search stopped at its bound: every unit is then 'unmapped' with reason 'bound'. */
  bounded: boolean;
  /** Search steps spent in all (for benchmarks). */
  steps: number;
}

export interface ProvenanceOptions {
  /** Search steps allowed per input mapping; default DEFAULT_MCS_BUDGET. */
  stepBudget?: number;
  /** Inputs larger than this many heavy atoms are not mapped (their units are 'unmapped', reason 'bound'); default 250. */
  maxInputAtoms?: number;
}
