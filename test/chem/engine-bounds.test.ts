/**
 * Size bounds of the engine on pathological but valid inputs (issue 10): a dendrimer of drawn [C@@H] branch
 * points and a long isotactic chain must finish with an answer — exact where it can be had in polynomial work,
 * "open" where a limit stops it — instead of running for minutes. No timing is asserted (timings live in
 * `npm run bench`); the tests assert what the facts say.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import { smiles } from './stereo-helpers.js';

/** Branch point CH with two identical branches: no branch point is stereogenic (every pair of branches is alike). */
const dendrimer = (g: number): string => {
  const arm = (d: number): string => (d === 0 ? 'C' : `C[C@@H](${arm(d - 1)})${arm(d - 1)}`);
  return 'O' + arm(g);
};

suite('engine bounds', () => {
  it('a generation-10 dendrimer of drawn branch points: no stereocentre, and labelling stops at its work limit (open)', () => {
    const f = describe(smiles(dendrimer(10)));
    expect(f.units).toHaveLength(0);
    expect(f.stereoisomers).toMatchObject({ total: 1, chiral: 0, achiral: 1 });
    expect(f.chiral).toBe(false);
    expect(f.remarks.some((r) => /work limit/.test(r))).toBe(true);
  }, 120_000);
  it('a generation-7 dendrimer is labelled in full (the limit is not met on ordinary sizes)', () => {
    const f = describe(smiles(dendrimer(7)));
    expect(f.units).toHaveLength(0);
    expect(f.remarks.some((r) => /work limit/.test(r))).toBe(false);
  }, 60_000);
});

suite('exact counts at any size', () => {
  it('a chain of 299 centres has 2^299 stereoisomers, exact, as a string in JSON (2^n rule for n distinct centres, Eliel & Wilen 1994, from memory)', () => {
    const f = describe(smiles('C' + 'C[C@H](C)'.repeat(300) + 'C'));
    expect(f.stereoisomers.units).toBe(299);
    expect(f.stereoisomers.total).toBe((2n ** 299n).toString());
    expect(f.stereoisomers.pairs).toBe((2n ** 298n).toString());
    expect(f.stereoisomers.achiral).toBe(0);
    const json = JSON.parse(JSON.stringify(f)) as typeof f;
    expect(BigInt(json.stereoisomers.total)).toBe(2n ** 299n);
  }, 60_000);
  it('counts up to 2^53 stay JSON numbers (the JSON of describe is unchanged there)', () => {
    const f = describe(smiles('C' + 'C[C@H](C)'.repeat(54) + 'C'));
    expect(f.stereoisomers.total).toBe(2 ** 53);
    expect(typeof f.stereoisomers.pairs).toBe('number');
    const g = describe(smiles('C' + 'C[C@H](C)'.repeat(55) + 'C'));
    expect(g.stereoisomers.total).toBe((2n ** 54n).toString());
  });
  it('a chain of 4,000 centres: exact count, the CIP labels stop at the work limit and are left open', () => {
    const f = describe(smiles('C' + 'C[C@H](C)'.repeat(4000) + 'C'));
    expect(f.stereoisomers.total).toBe((2n ** 3999n).toString());
    expect(f.chiral).toBe(true);
    expect(f.remarks.some((r) => /work limit/.test(r))).toBe(true);
    expect(f.units.some((u) => u.label === null)).toBe(true);
  }, 120_000);
});

suite('symmetry stopped at its limit says "open"', () => {
  /** Branch points with two alike branches that end in drawn centres: stereogenic, and a symmetry group of 2^k. */
  const stereoDendrimer = (d: number): string => {
    const arm = (k: number): string => (k === 0 ? '[C@@H](O)C' : `C[C@@H](${arm(k - 1)})${arm(k - 1)}`);
    return 'O' + arm(d);
  };
  it('a generation-5 dendrimer of stereogenic branch points: counts marked open, chirality and the mirror relation open', () => {
    const s = smiles(stereoDendrimer(5));
    const f = describe(s);
    expect(f.stereoisomers.open).toBe(true);
    expect(f.chiral).toBeNull();
    expect(relate(s, mirror(s)).relation).toBe('same-constitution');
  }, 60_000);
  it('a generation-3 one is below the limit: exact (no open mark), chiral, and enantiomeric to its mirror image', () => {
    const s = smiles(stereoDendrimer(3));
    const f = describe(s);
    expect('open' in f.stereoisomers).toBe(false);
    expect(f.chiral).toBe(true);
    expect(relate(s, mirror(s)).relation).toBe('enantiomers');
  });
});
