import { describe, expect, it } from 'vitest';
import { loadRDKit } from '../chem/read/smiles-rdkit-helper.js';
import { CHECKS } from '../../src/checks/index.js';
import type { CheckModule } from '../../src/checks/types.js';
import type { CompoundRecord } from '../../src/registry/types.js';
import { auditRecords } from '../../src/audit/run.js';
import { defaultEngine } from '../../src/audit/engine.js';
import { record, ids, assertRenderable, loaded } from './facts.js';
import { readSmiles, realCtx } from './real.js';

const check = (id: string): CheckModule => CHECKS.find((c) => c.id === id)!;
const run = (id: string, r: CompoundRecord) => {
  const o = check(id).run(realCtx(r));
  assertRenderable(check(id), o);
  return o;
};
const rec = (smiles: string, stereo: Partial<CompoundRecord['stereo']>, p: Partial<CompoundRecord> = {}) =>
  record({ form: 'unknown', ...stereo }, { structure: { smiles }, ...p });

// SMILES of the demo registry; labels cross-checked below with RDKit (@rdkit/rdkit) on the SMILES without
// atom maps, and by hand with the CIP rules (IUPAC 2013, P-92.1).
const RR_TARTARIC = 'OC(=O)[C@H:2](O)[C@@H:3](O)C(=O)O';
const SS_TARTARIC = 'OC(=O)[C@@H:2](O)[C@H:3](O)C(=O)O';
const MESO_TARTARIC = 'OC(=O)[C@H:2](O)[C@H:3](O)C(=O)O';

describe('checks on real structures (through the engine)', () => {
  it('RDKit agrees with the engine on the tartaric acid labels', async () => {
    const rdkit = await loadRDKit();
    for (const s of [
      RR_TARTARIC,
      SS_TARTARIC,
      MESO_TARTARIC,
      'C[C@@H:2](O)CC',
      'CC(C)[C@@H:2]1CC[C@@H:5](C)C[C@H:1]1O',
    ]) {
      const unmapped = s.replace(/:\d+\]/g, ']');
      const mol = rdkit.get_mol(unmapped)!;
      const json = JSON.parse(mol.get_json());
      const cip: [number, string][] = json.molecules[0].extensions.find(
        (e: { name: string }) => e.name === 'rdkitRepresentation',
      ).cipCodes;
      mol.delete();
      const ours = readSmiles(unmapped).facts!.units.map((u) => [u.atoms[0] - 1, u.label]);
      expect([s, ours]).toEqual([s, cip]);
    }
  });
  it('(2R,3R)-tartaric acid: the descriptors agree per locant; (2R,3S) does not', () => {
    expect(
      run(
        'descriptors-match-structure',
        rec(RR_TARTARIC, { form: 'single-enantiomer', descriptors: '(2R,3R)' }),
      ).findings,
    ).toEqual([]);
    const bad = run(
      'descriptors-match-structure',
      rec(RR_TARTARIC, { form: 'single-enantiomer', descriptors: '(2R,3S)' }),
    );
    expect(bad.findings).toMatchObject([
      { messageId: 'descriptor-label-mismatch', data: { method: 'per-locant', count: 1 } },
    ]);
  });
  // IUPAC Gold Book, meso compound / racemate.
  it('meso-tartaric acid is meso, and cannot be a racemate', () => {
    expect(run('form-matches-structure', rec(MESO_TARTARIC, { form: 'meso' })).findings).toEqual([]);
    const o = run('form-matches-structure', rec(MESO_TARTARIC, { form: 'racemate' }));
    expect(ids(o)).toEqual(['racemate-but-achiral']);
    expect(String(o.findings[0].data.mirror)).toMatch(/mirror|inversion/);
  });
  it('flat butan-2-ol is a fine racemate; flat 2-methylcyclohexanol is ambiguous', () => {
    expect(run('form-matches-structure', rec('CCC(C)O', { form: 'racemate' })).findings).toEqual([]);
    expect(ids(run('form-matches-structure', rec('CC1CCCCC1O', { form: 'racemate' })))).toEqual([
      'racemate-which-diastereomer',
    ]);
  });
  it('cis-stilbene is a single diastereomer; (S)-2-chlorobutane is not achiral', () => {
    expect(
      run('form-matches-structure', rec('C(=C\\c1ccccc1)\\c1ccccc1', { form: 'single-diastereomer' }))
        .findings,
    ).toEqual([]);
    expect(ids(run('form-matches-structure', rec('C[C@H](Cl)CC', { form: 'achiral' })))).toEqual([
      'achiral-but-chiral',
    ]);
  });
  it('menthol and neomenthol are diastereomers; (R,R)/(S,S)-tartaric acid are enantiomers', () => {
    const mix = (a: string, b: string, parent: string) =>
      rec(parent, {
        form: 'diastereomer-mixture',
        ratio: '70:30',
        components: [{ smiles: a }, { smiles: b }],
      });
    const menthol = 'CC(C)[C@@H]1CC[C@@H](C)C[C@H]1O';
    const neomenthol = 'CC(C)[C@@H]1CC[C@@H](C)C[C@@H]1O';
    expect(
      run('form-matches-structure', mix(menthol, neomenthol, 'CC(C)[C@@H]1CC[C@@H](C)CC1O')).findings,
    ).toEqual([]);
    expect(ids(run('form-matches-structure', mix(RR_TARTARIC, SS_TARTARIC, 'OC(=O)C(O)C(O)C(=O)O')))).toEqual(
      ['mixture-components-enantiomers'],
    );
  });
  it('an amine nitrogen drawn with @ is no basis for a single-enantiomer claim', () => {
    expect(ids(run('nitrogen-inversion', rec('CC[N@](C)CCC', { form: 'single-enantiomer' })))).toEqual([
      'claim-rests-on-invertible-nitrogen',
    ]);
  });
  it('an AND group (CXSMILES &1) contradicts a single-enantiomer claim', () => {
    expect(
      ids(run('enhanced-stereo-matches-form', rec('C[C@@H](O)CC |&1:1|', { form: 'single-enantiomer' }))),
    ).toEqual(['and-group-with-single-enantiomer']);
    expect(
      run('enhanced-stereo-matches-form', rec('C[C@@H](O)CC |&1:1|', { form: 'racemate' })).findings,
    ).toEqual([]);
  });
  // Enantiomers rotate equally and oppositely (IUPAC Gold Book, optical activity); carvone ±61 neat (from memory).
  it('finds the registered enantiomer of (S)-carvone and compares rotation signs', async () => {
    const rot = (value: number) => ({ value, wavelength_nm: 589, temperature_c: 20, solvent: 'neat' });
    const s = rec(
      'CC1=CC[C@@H](CC1=O)C(=C)C',
      { form: 'single-enantiomer', rotation: rot(61) },
      { id: 'LX-00011' },
    );
    const r = rec(
      'CC1=CC[C@H](CC1=O)C(=C)C',
      { form: 'single-enantiomer', rotation: rot(-61) },
      { id: 'LX-00010' },
    );
    const review = async (registered: CompoundRecord) => {
      const mine = loaded(s, 'compounds/LX-00011.yml');
      const res = auditRecords([mine], {
        checks: CHECKS,
        engine: await defaultEngine(),
        registry: [loaded(registered, 'compounds/LX-00010.yml'), mine],
      });
      return res.records[0]!.findings
        .filter((f) => f.check === 'consistent-with-registry')
        .map((f) => f.messageId)
        .sort();
    };
    expect(await review(r)).toEqual(['enantiomer-registered']);
    const wrong = { ...r, stereo: { ...r.stereo, rotation: rot(58) } };
    expect(await review(wrong)).toEqual(['enantiomer-registered', 'enantiomer-rotation-same-sign']);
  });
});
