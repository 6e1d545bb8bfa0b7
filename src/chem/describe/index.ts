/**
 * describe(): a structure in, every stereo fact the engine knows out. Also the per-structure analysis and the
 * configuration carrying that relate() builds on. The one public entry of describe/.
 */
export { describe, type DescribeOptions } from './describe.js';
export { analyse, parentComponent, unitName, type Analysis } from './analyse.js';
export { carryOnto, sameStereoisomer, type Carried } from './carry.js';
export { parentCopies, withoutCopies } from './copies.js';
