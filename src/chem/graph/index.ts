/**
 * Graph algorithms for the stereo engine: adjacency, components, rings (SSSR), aromaticity, constitutional
 * equivalence classes, isomorphism / automorphism search and the constitution key. Implicit hydrogens are
 * counts; explicit H atoms are ordinary atoms. Bond equality in classes, keys and searches uses
 * conjugatedRingBonds() by default, so Kekulé structures and aromatic SMILES of one molecule compare equal.
 */
export { buildGraph, type Graph } from './adjacency.js';
export { connectedComponents, componentIds } from './components.js';
export { ringInfo, type RingInfo } from './rings.js';
export { aromaticBonds, conjugatedRingBonds } from './aromaticity.js';
export { atomInvariants, equivalenceClasses, type ClassOptions } from './classes.js';
export {
  automorphisms,
  findIsomorphisms,
  isomorphic,
  isomorphism,
  type AutomorphismOptions,
  type IsomorphismOptions,
  type SearchResult,
} from './isomorphism.js';
export { constitutionKey, molecularFormula } from './key.js';
export { ParityUnion } from './parity-union.js';
