/** relate(a, b): the relation of two drawings (relate/index.ts). Kept as the module the engine imports. */
export { relate } from './relate/index.js';
