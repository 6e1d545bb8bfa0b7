/**
 * Debian's python3-rdkit (2022.09) as an independent reference: 3D embedding (a stereoisomer that cannot be
 * embedded is infeasible) and rdCIPLabeler. Suites that need it skip with a one-line notice when it is absent;
 * under .ci/run (STEREOGATE_REQUIRE_SHARED_DATA=1) its absence fails the run, as with ../shared/data.
 */
import { spawnSync } from 'node:child_process';

const PYTHON = process.env.STEREOGATE_PYTHON ?? '/usr/bin/python3';
let cached: boolean | null = null;

/** true when python3 can import RDKit's AllChem; false (with a notice) when not and not required; throws when required. */
export function havePythonRdkit(): boolean {
  if (cached === null) {
    const r = spawnSync(PYTHON, ['-c', 'from rdkit.Chem import AllChem'], {
      encoding: 'utf8',
      timeout: 60_000,
    });
    cached = r.status === 0;
  }
  if (cached) return true;
  if (process.env.STEREOGATE_REQUIRE_SHARED_DATA === '1')
    throw new Error(`python3-rdkit missing (${PYTHON} cannot import rdkit; required under .ci/run)`);
  console.warn(`[stereogate tests] skipping: python3-rdkit not found (${PYTHON} cannot import rdkit)`);
  return false;
}

/** Runs a Python script with JSON on stdin and returns its JSON stdout. Throws with stderr on failure. */
export function runPython<T>(script: string, input: unknown, timeoutMs = 240_000): T {
  const r = spawnSync(PYTHON, ['-c', script], {
    input: JSON.stringify(input),
    encoding: 'utf8',
    timeout: timeoutMs,
    maxBuffer: 64 * 1024 * 1024,
  });
  if (r.status !== 0) throw new Error(`python3 failed (${r.status}): ${r.stderr || r.error?.message}`);
  return JSON.parse(r.stdout) as T;
}
