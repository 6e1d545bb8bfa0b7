/**
 * Perception: the stereogenic units of a structure (tetrahedral centres, double bonds, cumulenes, axes), which of
 * them the input defines, and the coupled configurations of bridged rings. The one public entry of perceive/.
 */
export { perceive, type Perception, type PerceiveOptions } from './perceive.js';
export { DEFAULT_AXIS_ORTHO_MIN } from './axes.js';
export { atomName } from './input.js';
export { mapToken, rebase, unitStereo, type State } from './units.js';
export type { Coupling } from './bridges.js';
export { unitImage, type PlanarLinks } from './planar.js';
