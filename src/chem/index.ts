/**
 * The stereo engine's public API: read a structure, describe it, relate two, mirror one, write SMILES.
 * Pure functions, no I/O.
 */
export { readStructure, parseMolfile, readSdRecords, type ReadOptions } from './read/index.js';
export { parseSmiles } from './read/smiles.js';
export { writeSmiles, type WriteSmilesOptions } from './write/smiles.js';
export { describe, analyse, type DescribeOptions, type Analysis } from './describe/index.js';
export { relate } from './relate.js';
export { countValue, exactCount } from './isomers/index.js';
export { mirror } from './symmetry/index.js';
export { normalize } from './normalize.js';
export { perceive, type Perception } from './perceive/index.js';
export { labelUnits, type CipResult } from './labels.js';
export type * from './types.js';
export type * from './facts.js';
export { IMPLICIT_H, LONE_PAIR } from './types.js';
