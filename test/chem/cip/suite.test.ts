/**
 * The CIP validation suite of Hanson et al., "Algorithmic Analysis of Cahn-Ingold-Prelog Rules of
 * Stereochemistry", J. Chem. Inf. Model. 2018, 58, 1755-1765 (public repository CIPValidationSuite/ValidationSuite,
 * commit 6b9f9db; ../shared/data/cip-validation-suite). A record counts as right when every expected descriptor is
 * computed and no other one is. The floors can only rise: raise them when the score rises.
 */
import { describe, expect, it } from 'vitest';
import { haveSharedData } from '../../support/shared-data.js';
import { loadSdf, loadSmiles, report, score, type SuiteRecord } from './suite.js';

const FLOOR_2D = 299;
const FLOOR_SMILES = 290;
const FLOOR_3D = 299;

function check(name: string, records: () => SuiteRecord[], floor: number): void {
  it(`${name}: at least ${floor} of 300 records fully right`, () => {
    const recs = records();
    expect(recs.length).toBe(300);
    const sc = score(recs);
    const right = sc.filter((s) => s.ok).length;
    const failures = report(sc);
    if (failures) console.log(`${name}: ${right}/300 right; failing records:\n${failures}`);
    expect(right).toBeGreaterThanOrEqual(floor);
  });
}

describe.skipIf(!haveSharedData('cip-validation-suite'))('CIP validation suite (Hanson et al. 2018)', () => {
  check('compounds_2d.sdf', () => loadSdf('compounds_2d.sdf'), FLOOR_2D);
  check('compounds.smi', loadSmiles, FLOOR_SMILES);
  check('compounds_3d.sdf', () => loadSdf('compounds_3d.sdf'), FLOOR_3D);
});
