/**
 * A racemate drawn out as its two enantiomers (dot-joined, 1:1) through the engine and the form check: the
 * molecules are chiral, the drawing is a racemate (IUPAC Gold Book, "racemate": an equimolar mixture of a pair
 * of enantiomers), and "meso" does not apply to a mixture (Gold Book "meso-compound": an achiral member of a set
 * of diastereoisomers, i.e. one molecular entity).
 */
import { describe as suite, expect, it } from 'vitest';
import { CHECKS } from '../../src/checks/index.js';
import type { CompoundRecord } from '../../src/registry/types.js';
import { assertRenderable, ids, record } from './facts.js';
import { readSmiles, realCtx } from './real.js';

const check = CHECKS.find((c) => c.id === 'form-matches-structure')!;
const run = (smiles: string, form: CompoundRecord['stereo']['form']) => {
  const o = check.run(realCtx(record({ form }, { structure: { smiles } })));
  assertRenderable(check, o);
  return o;
};
const RAC_LACTIC = 'C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O';

suite('a racemate drawn out', () => {
  it('describe: chiral molecules, not meso, 2 stereoisomers of one molecule, mixture = racemate', () => {
    const f = readSmiles(RAC_LACTIC).facts!;
    expect(f.chiral).toBe(true);
    expect(f.meso).toBe(false);
    expect(f.stereoisomers).toMatchObject({ total: 2, chiral: 2, pairs: 1, meso: 0 });
    expect(f.mixture).toMatchObject({ kind: 'racemate', stereoisomers: 2, ratio: [1, 1] });
    expect(f.enhanced.meaning).toBe('racemic');
    expect(f.components.map((c) => c.role)).toEqual(['parent', 'parent']);
  });
  it('declared racemate: passes (was "cannot form a racemate. Declare meso")', () => {
    const o = run(RAC_LACTIC, 'racemate');
    expect(ids(o)).toEqual([]);
    expect(o.passed).toMatch(/racemate; structure is chiral/);
  });
  it('declared single-enantiomer or meso: fails', () => {
    expect(ids(run(RAC_LACTIC, 'single-enantiomer'))).toEqual(['enantiomer-but-drawn-mixture']);
    expect(ids(run(RAC_LACTIC, 'meso'))).toEqual(['meso-but-chiral']);
  });
  it('two enantiomers 1:2 are enantioenriched, not a racemate', () => {
    const s = 'C[C@H](O)C(=O)O.C[C@@H](O)C(=O)O.C[C@@H](O)C(=O)O';
    expect(readSmiles(s).facts!.mixture).toMatchObject({ kind: 'enantiomers', ratio: [1, 2] });
    expect(ids(run(s, 'enantioenriched'))).toEqual([]);
    expect(ids(run(s, 'racemate'))).toEqual(['racemate-drawn-not-racemic']);
  });
  it('meso- and (R,R)-tartaric acid drawn together: a mixture of diastereomers, no meso fact for the drawing', () => {
    const f = readSmiles('OC(=O)[C@@H](O)[C@@H](O)C(O)=O.OC(=O)[C@@H](O)[C@H](O)C(O)=O').facts!;
    expect(f.mixture).toMatchObject({ kind: 'diastereomers', stereoisomers: 2 });
    expect(f.meso).toBe(false);
    expect(f.chiral).toBe(true);
  });
  it('a 2:1 salt of one enantiomer stays a single stereoisomer (no mixture fact, JSON as before)', () => {
    const f = readSmiles('C[C@H](N)Cc1ccccc1.C[C@H](N)Cc1ccccc1.OS(=O)(=O)O').facts!;
    expect('mixture' in f).toBe(false);
  });
});
