export { buildGraph, type Graph } from './adjacency.js';
export { connectedComponents, componentIds } from './components.js';
export { ringInfo, type RingInfo } from './rings.js';
export { aromaticBonds, conjugatedRingBonds } from './aromaticity.js';
export { atomInvariants, equivalenceClasses, type ClassOptions } from './classes.js';
export {
  automorphisms,
  findIsomorphisms,
  isomorphic,
  type AutomorphismOptions,
  type IsomorphismOptions,
  type SearchResult,
} from './isomorphism.js';
export { constitutionKey, molecularFormula } from './key.js';
