/**
 * Every property test and fuzz suite runs from a fixed seed, so that a run is repeatable and CI is never red by
 * chance. Set STEREOGATE_FC_SEED to explore other seeds locally (a failure prints the seed and path to replay).
 * A per-assert `seed` in a test file still wins over this default.
 */
import fc from 'fast-check';

const seed = Number(process.env.STEREOGATE_FC_SEED ?? 20_261_203);
fc.configureGlobal({ ...fc.readConfigureGlobal(), seed });
