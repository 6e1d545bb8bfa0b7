/**
 * What the engine computes about a structure: the stable facts that `stereogate describe` prints as JSON and
 * that every check reads. Atom numbers here are the 1-based input numbers (see types.ts), never internal indices.
 */

/** 'e'/'z': a double bond whose ranking at one end rests on Rule 5 (Hanson et al. 2018, as the CIP suite labels). */
export type CipLabel = 'R' | 'S' | 'r' | 's' | 'E' | 'Z' | 'M' | 'P' | 'm' | 'p' | 'e' | 'z';

/** 'planar': the planar chirality of a trans double bond in a ring of 8–11 atoms (atoms: the bond's ends). */
export type UnitKind = 'tetrahedral' | 'double-bond' | 'allene' | 'cumulene' | 'biaryl' | 'helix' | 'planar';

export interface StereoUnitFact {
  kind: UnitKind;
  /** Centre: [n]. Double bond / axis / cumulene: its two end atoms (those the CIP validation suite labels). */
  atoms: number[];
  /** Element of the centre (first end atom for bonds/axes). */
  element: string;
  /** The input fixes this unit's configuration. */
  defined: boolean;
  /** CIP descriptor for a defined unit; null when undefined or when the CIP rules cannot rank the ligands. */
  label: CipLabel | null;
  /** Pseudoasymmetric (r/s) unit: invariant under reflection. */
  pseudoasymmetric: boolean;
  /** Atom-map numbers of the unit's atoms as locants (`[C@@H:2]` gives 2), null where unmapped. */
  locants: (number | null)[];
  /** Enhanced-stereo group the unit belongs to, if any. */
  group: { type: 'abs' | 'and' | 'or'; id: number } | null;
  /** Index (0-based) of the constitutional-equivalence class of this unit; equal numbers = equivalent units. */
  equivalenceClass: number;
  /**
   * The unit's constitutional class written the same way whatever the atom order (the canonical class ranks of
   * its atoms, and its kind): with the CIP label, a registry index key part (src/registry/keys.ts).
   */
  classKey: string;
  /** Index of the connected component (0-based, in input order of first atom) the unit lies in. */
  component: number;
  /**
   * Present (true) on an undefined unit whose configuration the input format cannot state (a biaryl axis or a
   * helix in SMILES): its configuration is open, not missing from the drawing.
   */
  formatCannotState?: true;
  /**
   * With `formatCannotState`: why, in a few words ("a SMILES cannot state its configuration", "a wedge without 2D
   * coordinates fixes no configuration", "2D coordinates cannot state its configuration").
   */
  openBecause?: string;
}

/** An ordinary amine nitrogen drawn with a configuration: not a stereocentre (rapid pyramidal inversion). */
export interface InvertibleNitrogenFact {
  atom: number;
  /** The input drew a configuration on it (wedge or @/@@). */
  drawnWithStereo: boolean;
}

/**
 * An exact count: a number up to 2^53 (every integer up to it is exact in JSON and JavaScript), above it the
 * exact decimal digits as a string (a chain of 300 centres has 2^300 stereoisomers). `countValue` (isomers/)
 * reads either as a bigint.
 */
export type Count = number | string;

export interface StereoisomerCount {
  /** All stereoisomers of the constitution (enantiomers counted separately). */
  total: Count;
  chiral: Count;
  achiral: Count;
  /** Enantiomer pairs = chiral / 2. */
  pairs: Count;
  /** Achiral members that are meso in the Gold Book sense (only possible when chiral > 0). */
  meso: Count;
  /** Number of potential stereo units the count is built on. */
  units: number;
  /**
   * Present (true) only when the symmetry search stopped at its limit: the numbers are then those of the
   * symmetry found, not exact — open, not a count to act on.
   */
  open?: true;
}

export interface StereoisomerEntry {
  smiles: string;
  labels: { atoms: number[]; label: CipLabel | null }[];
  chiral: boolean;
  /** The entry that matches the input structure (only when the input is fully defined). */
  isInput: boolean;
}

/** How the mirror image relates to the structure, with evidence a chemist can check. */
export interface MirrorFacts {
  /** true: the mirror image is a different molecule (chiral); false: superimposable (achiral); null: open. */
  chiral: boolean | null;
  /**
   * When achiral: the atoms and bonds that an improper symmetry (mirror plane, inversion centre, S2n axis)
   * maps onto themselves, as 1-based atom numbers. Empty atoms and bonds suggest an inversion centre.
   */
  fixedAtoms: number[];
  fixedBonds: [number, number][];
  /** Plain words, e.g. "mirror plane through C3 (atom 5)". */
  explanation: string;
}

/** What an enhanced-stereo drawing stands for. */
export interface EnhancedStereoFacts {
  groups: { type: 'abs' | 'and' | 'or'; id: number; atoms: number[] }[];
  /**
   * absolute: one stereoisomer, as drawn; racemic: drawn + mirror image (all units in one AND group);
   * relative: drawn or mirror image, unknown which (all in one OR group, or a molfile without the chiral flag);
   * mixture: several AND groups (more than two stereoisomers); mixed: any other combination; none: no stereo.
   */
  meaning: 'absolute' | 'racemic' | 'relative' | 'mixture' | 'mixed' | 'none';
}

export interface ComponentFacts {
  index: number;
  /** Molecular formula in Hill order, e.g. "C4H6O6". */
  formula: string;
  heavyAtoms: number;
  /** The largest organic component is the parent; the rest are counter-ions / solvents. */
  role: 'parent' | 'other';
  /** Parent components only: how many identical copies of the parent the structure holds (2 for a 2:1 salt). */
  copies?: number;
  smiles: string;
}

/** A drawing that holds several stereoisomers of the parent's constitution as separate molecules. */
export interface MixtureFacts {
  /**
   * racemate: two enantiomers in equal numbers; enantiomers: the two in unequal numbers; diastereomers: no two
   * are enantiomers; stereoisomers: several, among them an enantiomer pair.
   */
  kind: 'racemate' | 'enantiomers' | 'diastereomers' | 'stereoisomers';
  /** Number of different stereoisomers drawn, and how many molecules of each (in the order first drawn). */
  stereoisomers: number;
  ratio: number[];
  explanation: string;
}

export interface StructureFacts {
  stereocenters: { atom: number; label: CipLabel | null; element: string; defined: boolean }[];
  stereobonds: { atoms: [number, number]; label: CipLabel | null; kind: UnitKind; defined: boolean }[];
  /** Every stereo unit with all its facts (stereocenters/stereobonds are views of this list). */
  units: StereoUnitFact[];
  /** As drawn: true chiral, false achiral, null when undefined units leave it open (see `mirror`). */
  chiral: boolean | null;
  /** Gold Book meso: achiral, and the constitution has chiral stereoisomers. null when open. */
  meso: boolean | null;
  /** Number of undefined stereo units. */
  undefined: number;
  /** With several identical copies of the parent, counts and chirality are those of one copy. */
  stereoisomers: StereoisomerCount;
  /**
   * Present only when the drawing holds several stereoisomers of the parent as separate molecules (a racemate
   * drawn out): counts are then those of one molecule, `chiral` says whether the molecules drawn are chiral.
   */
  mixture?: MixtureFacts;
  /** Present only when requested (describe --list, or a check that needs it). */
  stereoisomerList?: StereoisomerEntry[];
  mirror: MirrorFacts;
  enhanced: EnhancedStereoFacts;
  invertibleNitrogens: InvertibleNitrogenFact[];
  components: ComponentFacts[];
  /** Canonical-ish constitution key (no stereo) for lookups; equal structures give equal keys. */
  constitutionKey: string;
  formula: string;
  /** Non-fatal remarks from reading and perception (e.g. "wedge on a non-stereogenic atom 7"). */
  remarks: string[];
}

export type Relation =
  | 'identical'
  | 'enantiomers'
  | 'diastereomers'
  | 'constitutional-isomers'
  | 'different-compounds'
  | 'same-constitution';

export interface DifferingUnit {
  kind: UnitKind;
  /** Atom numbers in structure A. */
  atomsA: number[];
  /** The matching atom numbers in structure B. */
  atomsB: number[];
  labelA: CipLabel | null;
  labelB: CipLabel | null;
}

/** How two drawings differ besides their relation (both taken in charge-neutral form). */
export interface FormDifference {
  /**
   * protonation: a molecule is drawn in another charge state (an ion, a zwitterion) in one drawing;
   * salt-form: the other components (counter-ions, solvents) differ; ratio: another number of copies.
   */
  kind: 'protonation' | 'salt-form' | 'ratio';
  explanation: string;
}

export interface RelationFacts {
  relation: Relation;
  /**
   * Units whose configuration differs, compared through the atom mapping (diastereomers), or every unit
   * (enantiomers).
   */
  differingUnits: DifferingUnit[];
  /** Diastereomers: units whose configuration is the same but whose CIP descriptor changes (r/s centres). */
  relabelledUnits: DifferingUnit[];
  /** Diastereomers differing in configuration at exactly one of two or more tetrahedral centres. */
  epimers: boolean;
  /**
   * Components outside the stereo relation (achiral counter-ions, solvents, components only one drawing holds),
   * matched in charge-neutral form; the unmatched ones as drawn.
   */
  otherComponents: { onlyInA: string[]; onlyInB: string[] };
  /** Salt form, protonation state and ratio differences; empty when the drawings differ in none. */
  formDifferences: FormDifference[];
  /** Plain words for a chemist. */
  explanation: string;
}
