/**
 * The engine's one internal structure. Every reader (SMILES, CXSMILES, molfile V2000/V3000, SD) produces it;
 * every algorithm (perception, CIP, symmetry, isomers, relation) consumes it. Pure data, no methods, so it can
 * cross worker-thread boundaries by structured clone.
 *
 * Atom indices are 0-based positions in `atoms`. Hydrogens written inside brackets (`[C@H]`) or implied by
 * valence are NOT atoms: they are counted in `Atom.hCount`. Hydrogens written as atoms (`[H]`, an H line in a
 * molfile) ARE atoms. `Atom.inputNumber` is the 1-based number the CIP validation suite uses: input order,
 * explicit hydrogen atoms counted, bracket hydrogens not counted.
 */

/** Sentinel used in a ligand list for the implicit hydrogen of a centre (e.g. the H of `[C@H]`). */
export const IMPLICIT_H = -1;
/** Sentinel used in a ligand list for a lone pair (sulfoxide S, phosphine P, bridgehead N, …). */
export const LONE_PAIR = -2;

export type BondOrder = 1 | 2 | 3 | 4; // 4 = quadruple (rare)

export interface Atom {
  /** Element symbol as chemists write it ('C', 'Cl', 'H'); '*' for a wildcard / R group / query atom. */
  element: string;
  /** 0 for a wildcard. */
  atomicNumber: number;
  charge: number;
  /** Mass number when an isotope is given, else null. */
  isotope: number | null;
  /** Hydrogens attached but not present as atoms (bracket H plus valence-implied H). */
  hCount: number;
  /** Written aromatic in the input (SMILES lowercase, molfile bond type 4 on some bond). */
  aromatic: boolean;
  /** Unpaired electrons: 0 none, 1 one (doublet), 2 two (triplet/singlet carbene). */
  radical: number;
  /** SMILES atom-map number (`[C@@H:2]`) or molfile atom-map field; null when absent. */
  mapNumber: number | null;
  /** 1-based input number (see file comment). */
  inputNumber: number;
  /** Coordinates when the input had them (molfile); null for SMILES. */
  coords: [number, number, number] | null;
}

export interface Bond {
  /** Atom indices, a < b not guaranteed: the order is the input order (matters for wedges). */
  a: number;
  b: number;
  /** Kekulé order. Aromatic input is kekulized by the reader where possible; see `aromatic`. */
  order: BondOrder;
  /** The input called this bond aromatic (SMILES ':' or implicit between aromatic atoms, molfile type 4). */
  aromatic: boolean;
  /**
   * Molfile wedge as drawn, from the `a` atom (the narrow end): 'up' (wedge), 'down' (hash), 'either' (wavy);
   * null when plain. For double bonds 'either' means "crossed"/unknown geometry.
   */
  wedge: 'up' | 'down' | 'either' | null;
}

/**
 * Tetrahedral configuration in SMILES terms: looking from `ligands[0]` towards the centre, `ligands[1..3]`
 * run anticlockwise for `'@'` and clockwise for `'@@'`. Ligands are atom indices or IMPLICIT_H / LONE_PAIR.
 * Three-ligand centres (sulfoxides, phosphines) carry LONE_PAIR as one ligand.
 */
export interface TetrahedralStereo {
  kind: 'tetrahedral';
  centre: number;
  ligands: [number, number, number, number];
  winding: '@' | '@@';
}

/**
 * Double-bond (or odd cumulene) configuration: `refs[0]` is a neighbour of `ends[0]`, `refs[1]` of `ends[1]`
 * (atom index, or IMPLICIT_H for an implicit hydrogen), and they lie `cis` or `trans` across the bond.
 * For cumulenes with an odd number of double bonds, `ends` are the terminal atoms of the cumulated chain.
 */
export interface DoubleBondStereo {
  kind: 'double-bond';
  ends: [number, number];
  refs: [number, number];
  relation: 'cis' | 'trans';
}

/**
 * Axial configuration: allenes and even cumulenes (ends = the terminal sp2 atoms of the cumulated chain) and
 * biaryl axes (ends = the two atoms of the axis bond). It is written like a tetrahedral centre collapsed onto the
 * axis (the OpenSMILES allene convention `CC=[C@]=CC`): ligands = [near a, near b, far a, far b] where "near"
 * substituents sit on ends[0] and "far" ones on ends[1] (IMPLICIT_H for an implicit hydrogen); looking from
 * ligands[0], ligands[1..3] run anticlockwise for '@' and clockwise for '@@'.
 */
export interface AxialStereo {
  kind: 'axial';
  subtype: 'allene' | 'biaryl';
  ends: [number, number];
  ligands: [number, number, number, number];
  winding: '@' | '@@';
}

export type StereoElement = TetrahedralStereo | DoubleBondStereo | AxialStereo;

/** Enhanced stereo (molfile V3000 collections, CXSMILES `|a:…|`, `|&1:…|`, `|o1:…|`). */
export interface StereoGroup {
  type: 'abs' | 'and' | 'or';
  /** Group number as written (1 for `&1`); 0 for abs. */
  id: number;
  /** Atom indices (tetrahedral centres) in the group. */
  atoms: number[];
}

export interface Structure {
  atoms: Atom[];
  bonds: Bond[];
  /** Defined stereo as the input states it. Units the input leaves undefined have no entry here. */
  stereo: StereoElement[];
  /** Enhanced stereo groups as written; empty when the input has none. */
  groups: StereoGroup[];
  /**
   * Molfile chiral flag: true = the drawing is the absolute configuration; false = relative (racemic when no
   * groups say otherwise); null when the input format has no such flag (SMILES).
   */
  chiralFlag: boolean | null;
  /** Title / name line from a molfile, or the SMILES name field; null when absent. */
  title: string | null;
  /** Data fields of an SD record (`> <FIELD>`), in input order. Empty for other inputs. */
  properties: Record<string, string>;
  /** Dimensionality of the input coordinates: 0 for SMILES, 2 or 3 for molfiles. */
  dimension: 0 | 2 | 3;
}

/** Where something was found in the input text. */
export interface SourcePosition {
  /** 1-based line (molfile, SD, YAML); for SMILES the line of the SMILES within its file if known. */
  line?: number;
  /** 1-based column within the line, or 0-based character offset within a SMILES string (see `offset`). */
  column?: number;
  /** 0-based character offset into a SMILES string. */
  offset?: number;
  /** SD record number, 1-based. */
  record?: number;
}

export interface ReadError {
  /** Short stable code, e.g. 'smiles-unclosed-ring', 'molfile-bad-counts-line'. */
  code: string;
  /** Plain words: what is wrong. */
  message: string;
  at: SourcePosition;
}

export type ReadResult =
  { ok: true; structure: Structure; warnings: ReadError[] } | { ok: false; error: ReadError };
