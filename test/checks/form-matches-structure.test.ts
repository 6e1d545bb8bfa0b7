import { describe, expect, it } from 'vitest';
import { formMatchesStructure as check } from '../../src/checks/form-matches-structure.js';
import type { StereoForm } from '../../src/registry/types.js';
import { centre, chiralFacts, ctx, facts, ids, read, record, runCheck, unit } from './facts.js';
import { realCtx } from './real.js';
import { render } from '../../src/checks/words.js';

// Definitions relied on (IUPAC Gold Book): chirality, enantiomer, racemate (equimolar mixture of a pair of
// enantiomers), meso (achiral member of a set of diastereoisomers that includes chiral members),
// diastereoisomerism (stereoisomers not related as mirror images; cis-trans isomers included).
const run = (form: StereoForm, f = facts(), extra: Parameters<typeof record>[0] = {}) =>
  runCheck(check, ctx({ record: record({ form, ...extra }), main: read(f) }));

/** meso-tartaric acid as the engine describes it: two defined centres, achiral, mirror plane. */
const mesoFacts = facts({
  units: [centre(4, 'R', 2), centre(6, 'S', 3)],
  chiral: false,
  meso: true,
  stereoisomers: { total: 3, chiral: 2, achiral: 1, pairs: 1, meso: 1, units: 2 },
  mirror: {
    chiral: false,
    fixedAtoms: [],
    fixedBonds: [[4, 6]],
    explanation: 'mirror plane through the C2–C3 bond',
  },
});
const rTartaric = chiralFacts([centre(4, 'R', 2), centre(6, 'R', 3)], {
  stereoisomers: { total: 3, chiral: 2, achiral: 1, pairs: 1, meso: 1, units: 2 },
});
const flatButanol = facts({
  units: [unit({ atoms: [2], defined: false })],
  chiral: null,
  meso: null,
  stereoisomers: { total: 2, chiral: 2, achiral: 0, pairs: 1, meso: 0, units: 1 },
});

describe('form-matches-structure', () => {
  it('achiral: passes an achiral structure, fails a chiral one', () => {
    expect(run('achiral').findings).toEqual([]);
    const o = run('achiral', chiralFacts([centre(2, 'R')]));
    expect(ids(o)).toEqual(['achiral-but-chiral']);
    expect(o.findings[0].data.units).toBe('1 stereocentre');
  });
  it('achiral: a meso structure gets a note suggesting meso', () => {
    const o = run('achiral', mesoFacts);
    expect(o.findings).toMatchObject([{ messageId: 'achiral-is-meso', severity: 'note' }]);
  });
  it('achiral: undefined units leave it open', () => {
    expect(ids(run('achiral', flatButanol))).toEqual(['achiral-but-open']);
  });
  it('meso: passes meso-tartaric acid, fails (2R,3R)-tartaric acid, with the mirror evidence', () => {
    const ok = run('meso', mesoFacts);
    expect(ok.findings).toEqual([]);
    expect(ok.passed).toMatch(/mirror plane/);
    expect(ids(run('meso', rTartaric))).toEqual(['meso-but-chiral']);
  });
  it('meso: an achiral compound whose constitution has no chiral isomer is not meso', () => {
    const o = run(
      'meso',
      facts({ stereoisomers: { total: 2, chiral: 0, achiral: 2, pairs: 0, meso: 0, units: 2 } }),
    );
    expect(ids(o)).toEqual(['meso-but-no-chiral-isomers']);
  });
  it('single-enantiomer: passes a chiral fully defined structure', () => {
    expect(run('single-enantiomer', rTartaric).findings).toEqual([]);
  });
  it('single-enantiomer: fails meso (identical to its mirror image) with the symmetry in the data', () => {
    const o = run('single-enantiomer', mesoFacts);
    expect(ids(o)).toEqual(['enantiomer-but-achiral']);
    expect(o.findings[0].data.mirror).toBe('mirror plane through the C2–C3 bond');
  });
  it('single-enantiomer: fails undefined units and lists them', () => {
    const o = run('single-enantiomer', flatButanol);
    expect(ids(o)).toEqual(['enantiomer-undefined-units']);
    expect(o.findings[0].data).toMatchObject({ undefinedCount: 1, undefinedUnits: 'C (atom 2)' });
  });
  it('enantioenriched with undefined units is a warning, not an error', () => {
    expect(run('enantioenriched', flatButanol).findings[0].severity).toBe('warning');
  });
  it('racemate: passes a chiral structure (drawn or flat with one pair), fails an achiral one', () => {
    expect(run('racemate', chiralFacts([centre(2, 'R')])).findings).toEqual([]);
    expect(run('racemate', flatButanol).findings).toEqual([]);
    const o = run('racemate', mesoFacts);
    expect(ids(o)).toEqual(['racemate-but-achiral']);
    expect(o.findings[0].data.mirror).toMatch(/mirror plane/);
  });
  it('racemate: no chiral stereoisomer at all', () => {
    const f = facts({
      units: [unit({ atoms: [2], defined: false })],
      chiral: null,
      stereoisomers: { total: 2, chiral: 0, achiral: 2, pairs: 0, meso: 0, units: 1 },
    });
    expect(ids(run('racemate', f))).toEqual(['racemate-no-chiral-isomers']);
  });
  it('racemate: a flat drawing of a constitution with several diastereomers is ambiguous', () => {
    const f = facts({
      units: [unit({ atoms: [2], defined: false }), unit({ atoms: [3], defined: false })],
      chiral: null,
      stereoisomers: { total: 4, chiral: 4, achiral: 0, pairs: 2, meso: 0, units: 2 },
    });
    expect(ids(run('racemate', f))).toEqual(['racemate-which-diastereomer']);
  });
  it('single-diastereomer: two defined units, or one stereogenic double bond (cis/trans isomers are diastereomers)', () => {
    expect(run('single-diastereomer', rTartaric).findings).toEqual([]);
    const stilbene = facts({ units: [unit({ atoms: [2, 3], kind: 'double-bond', label: 'E' })] });
    expect(run('single-diastereomer', stilbene).findings).toEqual([]);
    expect(ids(run('single-diastereomer', chiralFacts([centre(2, 'R')])))).toEqual([
      'diastereomer-too-few-units',
    ]);
  });
  it('unknown passes and lists undefined units', () => {
    const o = run('unknown', flatButanol);
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/undefined stereo units: C \(atom 2\)/);
  });
});

describe('form-matches-structure: mixtures', () => {
  const comp = (tag: string, key = 'K1') =>
    read(chiralFacts([centre(2, 'R')], { constitutionKey: key }), tag);
  const mixture = (n: number) =>
    record({ form: 'diastereomer-mixture', components: Array.from({ length: n }, () => ({ smiles: 'C' })) });
  it('needs two or more components', () => {
    expect(
      ids(runCheck(check, ctx({ record: mixture(1), main: read(flatButanol), components: [comp('a')] }))),
    ).toEqual(['mixture-needs-components']);
  });
  it('passes pairwise diastereomers of the parent constitution', () => {
    const o = runCheck(
      check,
      ctx({
        record: mixture(2),
        main: read(flatButanol),
        components: [comp('a'), comp('b')],
        relations: { 'a|b': 'diastereomers' },
      }),
    );
    expect(o.findings).toEqual([]);
  });
  it('fails identical, enantiomeric and unrelated components', () => {
    const base = {
      record: mixture(3),
      main: read(flatButanol),
      components: [comp('a'), comp('b'), comp('c')],
    };
    const o = runCheck(
      check,
      ctx({
        ...base,
        relations: { 'a|b': 'identical', 'a|c': 'enantiomers', 'b|c': 'constitutional-isomers' },
      }),
    );
    expect(ids(o)).toEqual([
      'mixture-components-enantiomers',
      'mixture-components-identical',
      'mixture-components-unrelated',
    ]);
    expect(o.findings.find((f) => f.messageId === 'mixture-components-enantiomers')!.data).toMatchObject({
      a: 1,
      b: 3,
    });
  });
  it('fails a component of another constitution', () => {
    const o = runCheck(
      check,
      ctx({
        record: mixture(2),
        main: read(flatButanol),
        components: [comp('a'), comp('b', 'K2')],
        relations: { 'a|b': 'diastereomers' },
      }),
    );
    expect(ids(o)).toEqual(['mixture-component-constitution']);
  });
  it('a racemate that lists components needs two enantiomers', () => {
    const r = record({ form: 'racemate', components: [{ smiles: 'C' }, { smiles: 'C' }] });
    const base = { record: r, main: read(flatButanol), components: [comp('a'), comp('b')] };
    expect(runCheck(check, ctx({ ...base, relations: { 'a|b': 'enantiomers' } })).findings).toEqual([]);
    expect(ids(runCheck(check, ctx({ ...base, relations: { 'a|b': 'identical' } })))).toEqual([
      'racemate-components-not-enantiomers',
    ]);
  });
});

// Meso needs stereo units and chiral stereoisomers (Gold Book, meso compounds): advise only what is possible.
describe('form-matches-structure: advice for an achiral structure declared chiral', () => {
  const plain = facts({
    units: [],
    stereoisomers: { total: 1, chiral: 0, achiral: 1, pairs: 0, meso: 0, units: 0 },
  });
  it('a meso structure may be declared meso', () => {
    expect(String(run('single-enantiomer', mesoFacts).findings[0].data.remedy)).toMatch(
      /^Declare meso, or correct the configurations \(R,S\)/,
    );
  });
  it('a structure with no stereo unit is not offered meso', () => {
    for (const form of ['single-enantiomer', 'racemate'] as const) {
      const o = run(form, plain);
      expect(o.findings[0].severity).toBeUndefined();
      expect(String(o.findings[0].data.remedy)).toMatch(/no stereo unit.*declare achiral/);
      expect(String(o.findings[0].data.remedy)).not.toMatch(/meso/);
    }
  });
  it('an amine whose only configuration is on an ordinary nitrogen: a note, nitrogen-inversion carries the error', () => {
    const amine = facts({ ...plain, invertibleNitrogens: [{ atom: 3, drawnWithStereo: true }] });
    const o = run('single-enantiomer', amine);
    expect(o.findings).toMatchObject([
      { messageId: 'enantiomer-but-achiral', severity: 'note', data: { explainedBy: 'nitrogen-inversion' } },
    ]);
    expect(String(o.findings[0].data.remedy)).toMatch(/nitrogen \(atom 3\)/);
    // With nitrogen-inversion switched off (or down to a note) the form error stands on its own.
    const off = runCheck(
      check,
      ctx({
        record: record({ form: 'single-enantiomer' }),
        main: read(amine),
        config: { severities: { 'nitrogen-inversion': 'off' } },
      }),
    );
    expect(off.findings[0].severity).toBeUndefined();
    expect(String(off.findings[0].data.remedy)).not.toMatch(/meso/);
  });
});

// One atom, one name (issue 12): meso-2,3-dibromobutane drawn with atom maps; the symmetry evidence from the
// engine names atoms by input number (C2–C4), the units by locant (C2, C3). Messages now name each atom as
// "locant (atom n)". meso-2,3-dibromobutane is achiral with a mirror plane through the C2–C3 bond (IUPAC Gold
// Book, meso-compound).
describe('form-matches-structure: one naming scheme per message', () => {
  const meso = (form: StereoForm) =>
    runCheck(
      check,
      realCtx(
        record(
          { form },
          { id: 'LX-00092', name: '2,3-dibromobutane', structure: { smiles: 'C[C@H:2](Br)[C@H:3](Br)C' } },
        ),
      ),
    );
  it('the error for a racemate names the bond C2 (atom 2)–C3 (atom 4), not C2–C4', () => {
    const o = meso('racemate');
    expect(ids(o)).toEqual(['racemate-but-achiral']);
    const text = render(check.messages['racemate-but-achiral'], o.findings[0].data);
    expect(text).toContain('the middle of the C2 (atom 2)–C3 (atom 4) bond');
    expect(text).not.toMatch(/C2–C4/);
  });
  it('the evidence of a passing meso claim uses the same names', () => {
    const o = meso('meso');
    expect(o.findings).toEqual([]);
    expect(o.passed).toContain('C2 (atom 2)–C3 (atom 4) bond');
  });
  it('without atom maps, atoms are named by element and number', () => {
    const o = runCheck(
      check,
      realCtx(record({ form: 'meso' }, { id: 'LX-00093', structure: { smiles: 'C[C@H](Br)[C@H](Br)C' } })),
    );
    expect(o.passed).toContain('C (atom 2)–C (atom 4) bond');
  });
});
