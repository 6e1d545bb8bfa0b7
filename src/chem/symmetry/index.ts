/**
 * Symmetry: the group of constitutional automorphisms acting on the stereo units (with the mirror), and what
 * follows from it — chirality, stereogenicity, canonical states. The one public entry of symmetry/.
 */
export {
  act,
  canonicalState,
  chiralityOf,
  elementMapping,
  feasible,
  fixedCount,
  mirror,
  mirrorState,
  sameState,
  stereogenicIn,
  unitGroup,
  type Chirality,
  type UnitGroup,
} from './group.js';
