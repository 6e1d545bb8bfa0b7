/**
 * Locates ../shared/data (the CIP validation suite and the MoleculeNet structures). Suites that need it call
 * `sharedDataOrSkip()`: on a clone without it they skip with a one-line notice; under .ci/run
 * (STEREOGATE_REQUIRE_SHARED_DATA=1) its absence fails the run.
 */
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
export const SHARED_DATA_DIR = resolve(here, '..', '..', '..', 'shared', 'data');

export function sharedDataPath(...parts: string[]): string {
  return join(SHARED_DATA_DIR, ...parts);
}

/** true when the data is present; false (with a notice) when absent and not required; throws when required. */
export function haveSharedData(...parts: string[]): boolean {
  const p = sharedDataPath(...parts);
  if (existsSync(p)) return true;
  if (process.env.STEREOGATE_REQUIRE_SHARED_DATA === '1') {
    throw new Error(`shared reference data missing: ${p} (required under .ci/run)`);
  }
  console.warn(`[stereogate tests] skipping: shared reference data not found at ${p}`);
  return false;
}
