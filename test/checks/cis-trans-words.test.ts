/**
 * cis/trans in names against the drawn double bond (descriptors-match-structure). Names and geometries are
 * handbook facts: maleic acid is cis-butenedioic acid, (Z); fumaric acid trans-, (E); oleic acid is
 * cis-octadec-9-enoic acid, elaidic acid its trans isomer; trans-stilbene is (E)-1,2-diphenylethene
 * (IUPAC 2013 recommendations, P-93.4.2; CRC Handbook of Chemistry and Physics, physical constants of organic
 * compounds — both from memory). SMILES geometry: OpenSMILES, '/' and '\' bond marks.
 */
import { describe, expect, it } from 'vitest';
import { CHECKS } from '../../src/checks/index.js';
import { judgedDoubleBond } from '../../src/checks/cis-trans-words.js';
import type { CompoundRecord } from '../../src/registry/types.js';
import { assertRenderable, ids, record } from './facts.js';
import { readSmiles, realCtx } from './real.js';

const check = CHECKS.find((c) => c.id === 'descriptors-match-structure')!;
const run = (
  smiles: string,
  name: string,
  form: CompoundRecord['stereo']['form'] = 'single-diastereomer',
) => {
  const o = check.run(realCtx(record({ form }, { structure: { smiles }, name })));
  assertRenderable(check, o);
  return o;
};

const MALEIC = 'OC(=O)/C=C\\C(=O)O';
const FUMARIC = 'OC(=O)/C=C/C(=O)O';
const OLEIC = 'CCCCCCCC/C=C\\CCCCCCCC(=O)O';
const ELAIDIC = 'CCCCCCCC/C=C/CCCCCCCC(=O)O';
const STILBENE_E = 'c1ccc(cc1)/C=C/c1ccccc1';

describe('cis/trans in a name against the drawn double bond', () => {
  it('passes names that agree with the drawing', () => {
    for (const [smi, name] of [
      [MALEIC, 'cis-butenedioic acid'],
      [FUMARIC, 'trans-butenedioic acid'],
      [OLEIC, 'cis-octadec-9-enoic acid'],
      [ELAIDIC, 'trans-octadec-9-enoic acid'],
      [STILBENE_E, 'trans-stilbene'],
    ]) {
      expect(ids(run(smi, name)), `${name}`).not.toContain('cis-trans-word-contradicts-drawing');
    }
  });

  it('flags a name that contradicts the drawing, and says which atoms and which E/Z the drawing is', () => {
    const o = run(FUMARIC, 'cis-butenedioic acid');
    expect(ids(o)).toContain('cis-trans-word-contradicts-drawing');
    const f = o.findings.find((x) => x.messageId === 'cis-trans-word-contradicts-drawing')!;
    expect(f.data.label).toBe('E');
    expect(f.field).toBe('name');
    expect(ids(run(OLEIC, 'trans-octadec-9-enoic acid'))).toContain('cis-trans-word-contradicts-drawing');
  });

  it('reads the geometry whichever way the SMILES writes the marks and the hydrogens', () => {
    // the same cis bond: marks on the other side, explicit [H] as the reference, ring-closure order
    for (const smi of ['OC(=O)\\C=C/C(=O)O', 'OC(=O)/C([H])=C(/[H])C(=O)O', 'C(=O)(O)/C=C\\C(O)=O']) {
      const j = judgedDoubleBond(readSmiles(smi).structure!, readSmiles(smi).facts!);
      expect(j?.drawn, smi).toBe('cis');
    }
  });

  it('agrees with the CIP label for every judged bond (cis = Z, trans = E at a 1,2-disubstituted bond)', () => {
    for (const smi of [
      MALEIC,
      FUMARIC,
      OLEIC,
      ELAIDIC,
      STILBENE_E,
      'Cl/C=C/Br',
      'Cl/C=C\\Br',
      'N#C/C=C\\O',
    ]) {
      const r = readSmiles(smi);
      const j = judgedDoubleBond(r.structure!, r.facts!)!;
      expect(j, smi).not.toBeNull();
      expect(r.facts!.units[0].label, smi).toBe(j.drawn === 'cis' ? 'Z' : 'E');
    }
  });

  it('warns when the name states a geometry the drawing leaves open', () => {
    expect(ids(run('OC(=O)C=CC(=O)O', 'cis-butenedioic acid'))).toContain('cis-trans-word-on-undefined-bond');
  });

  it('leaves cis/trans alone where it is ambiguous or about a ring', () => {
    // trisubstituted double bond: cis/trans would refer to a main chain (not judged)
    expect(
      judgedDoubleBond(readSmiles('C/C(C)=C/CC').structure!, readSmiles('C/C(C)=C/CC').facts!),
    ).toBeNull();
    // cis-1,2-dimethylcyclohexane: the word is about the ring's stereocentres
    const ring = run('C[C@@H]1CCCC[C@H]1C', 'trans-1,2-dimethylcyclohexane', 'meso');
    expect(ids(ring)).not.toContain('cis-trans-word-contradicts-drawing');
    expect(ids(ring)).not.toContain('cis-trans-word-on-undefined-bond');
    // two double bonds
    expect(ids(run('C/C=C/C=C\\C', 'cis-hexa-2,4-diene'))).not.toContain(
      'cis-trans-word-contradicts-drawing',
    );
  });
});
