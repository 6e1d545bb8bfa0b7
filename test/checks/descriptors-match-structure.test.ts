import { describe, expect, it } from 'vitest';
import { descriptorsMatchStructure as check } from '../../src/checks/descriptors-match-structure.js';
import type { StructureFacts } from '../../src/chem/facts.js';
import { centre, chiralFacts, ctx, facts, ids, read, record, runCheck, unit } from './facts.js';
import { readSmiles, realCtx } from './real.js';
import { render } from '../../src/checks/words.js';
import { toFinding } from '../../src/audit/findings.js';

// Descriptor notation: IUPAC 2013 recommendations P-93.1.3 (R/S, RS/SR, rac-, rel-, R*), signs of rotation
// (+)/(−)/(±) and meso as used in P-93; Fischer D/L are not CIP descriptors (P-93).
const mapped = chiralFacts([centre(4, 'R', 2), centre(6, 'R', 3)]);
const unmapped = chiralFacts([centre(4, 'R'), centre(6, 'R')]);
const run = (f: StructureFacts, stereo: Parameters<typeof record>[0], name?: string) =>
  runCheck(check, ctx({ record: record(stereo, name ? { name } : {}), main: read(f) }));

describe('descriptors-match-structure: labels', () => {
  it('passes matching descriptors per locant and says so', () => {
    const o = run(mapped, { form: 'single-enantiomer', descriptors: '(2R,3R)' });
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/per locant/);
  });
  it('fails a per-locant mismatch and names the locant', () => {
    const o = run(mapped, { form: 'single-enantiomer', descriptors: '(2R,3S)' });
    expect(ids(o)).toEqual(['descriptor-label-mismatch']);
    expect(o.findings[0].data).toMatchObject({ count: 1, method: 'per-locant' });
    expect(String(o.findings[0].data.mismatches)).toMatch(/locant 3: declared S, computed R/);
  });
  it('compares as counts without atom maps, and says why', () => {
    const ok = run(unmapped, { form: 'single-enantiomer', descriptors: '(2R,3R)' });
    expect(ok.passed).toMatch(/as counts/);
    const bad = run(unmapped, { form: 'single-enantiomer', descriptors: '(2R,3S)' });
    expect(ids(bad)).toEqual(['descriptor-counts-mismatch']);
    expect(bad.findings[0].data).toMatchObject({
      declaredCounts: '1 R, 1 S',
      computedCounts: '2 R',
      method: 'counts',
    });
  });
  it('warns when descriptors leave units out', () => {
    expect(ids(run(mapped, { form: 'single-enantiomer', descriptors: '(2R)' }))).toEqual([
      'descriptors-incomplete',
    ]);
    expect(ids(run(unmapped, { form: 'single-enantiomer', descriptors: '(R)' }))).toEqual([
      'descriptors-incomplete',
    ]);
  });
  it('fails a locant that is not a stereo unit', () => {
    expect(ids(run(mapped, { form: 'single-enantiomer', descriptors: '(2R,3R,5S)' }))).toEqual([
      'descriptor-not-stereo-unit',
    ]);
  });
  it('reports unreadable descriptors with their offset', () => {
    const o = run(mapped, { form: 'single-enantiomer', descriptors: '(2R,3X)' });
    expect(o.findings).toMatchObject([{ messageId: 'descriptor-unreadable', data: { offset: 4 } }]);
  });
  it('reads descriptors from the front of the name when there is no descriptor field', () => {
    expect(
      run(mapped, { form: 'single-enantiomer' }, '(2R,3R)-2,3-dihydroxybutanedioic acid').findings,
    ).toEqual([]);
    expect(ids(run(mapped, { form: 'single-enantiomer' }, '(2S,3S)-2,3-dihydroxybutanedioic acid'))).toEqual([
      'descriptor-label-mismatch',
    ]);
  });
  it('flags a name that disagrees with the descriptor field', () => {
    const o = run(mapped, { form: 'single-enantiomer', descriptors: '(2R,3R)' }, '(2S,3S)-tartaric acid');
    expect(ids(o)).toEqual(['name-and-descriptors-disagree']);
  });
  it('a name without locants agrees with a descriptor field with locants', () => {
    const one = chiralFacts([centre(2, 'R', 2)]);
    expect(
      run(one, { form: 'single-enantiomer', descriptors: '(2R)' }, '(R)-(−)-butan-2-ol').findings,
    ).toEqual([]);
    expect(ids(run(one, { form: 'single-enantiomer', descriptors: '(2R)' }, '(S)-butan-2-ol'))).toEqual([
      'name-and-descriptors-disagree',
    ]);
  });
  it('descriptors on a flat drawing cannot be checked: fine for a racemate, a note for racemic notation otherwise, an error for absolute ones', () => {
    const flat = facts({
      units: [unit({ atoms: [2], defined: false })],
      chiral: true,
      stereoisomers: { total: 2, chiral: 2, achiral: 0, pairs: 1, meso: 0, units: 1 },
    });
    const rac = run(flat, { form: 'racemate', descriptors: '(RS)' });
    expect(rac.findings).toEqual([]);
    expect(rac.passed).toMatch(/as usual for a racemate/);
    expect(run(flat, { form: 'unknown', descriptors: '(RS)' }).findings).toMatchObject([
      { messageId: 'descriptors-cite-undefined-units', severity: 'note' },
    ]);
    const o = run(flat, { form: 'single-enantiomer', descriptors: '(R)' });
    expect(ids(o)).toEqual(['descriptors-cite-undefined-units']);
    expect(o.findings[0].severity).toBeUndefined();
  });
  it('relative descriptors agree up to inversion (P-93.1.3)', () => {
    const drawn = chiralFacts([centre(4, 'S', 1), centre(6, 'R', 2)]);
    expect(
      run(drawn, { form: 'single-enantiomer', descriptors: '(1R*,2S*)' }, undefined).findings.map(
        (f) => f.messageId,
      ),
    ).not.toContain('descriptor-label-mismatch');
  });
  it('compares component descriptors with component structures', () => {
    const r = record({ form: 'diastereomer-mixture', components: [{ smiles: 'C', descriptors: '(2R,3S)' }] });
    const o = runCheck(check, ctx({ record: r, main: read(facts()), components: [read(mapped)] }));
    expect(o.findings).toMatchObject([
      { messageId: 'descriptor-label-mismatch', field: 'stereo.components.0.descriptors' },
    ]);
  });
  it("prints the component's own labels when a component passes, not the parent's", () => {
    // The parent leaves C1 undefined (a menthol / neomenthol mixture); the component defines it.
    const parent = chiralFacts([centre(4, 'S', 2), centre(10, null, 1)]);
    const comp = chiralFacts([centre(4, 'S', 2), centre(10, 'R', 1)]);
    const r = record({ form: 'diastereomer-mixture', components: [{ smiles: 'C', descriptors: '(1R,2S)' }] });
    const o = runCheck(check, ctx({ record: r, main: read(parent), components: [read(comp)] }));
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/component 1 \(1R,2S\) agrees with computed C2 \(atom 4\) S, C1 \(atom 10\) R,/);
  });
  it('notes Fischer D/L as not comparable (DL- names a racemate: nothing left to compare)', () => {
    const o = run(chiralFacts([centre(2, 'S')]), { form: 'single-enantiomer' }, 'L-alanine');
    expect(o.findings).toMatchObject([{ messageId: 'fischer-not-compared', severity: 'note' }]);
  });
});

describe('descriptors-match-structure: prefixes against the form', () => {
  const one = chiralFacts([centre(2, 'R', 2)]);
  it('racemic notation needs a racemate', () => {
    for (const d of ['(2RS)', 'rac-(2R)', '(±)']) {
      expect([d, ids(run(one, { form: 'single-enantiomer', descriptors: d }))]).toEqual([
        d,
        ['racemic-notation-needs-racemate'],
      ]);
      expect([d, run(one, { form: 'racemate', descriptors: d }).findings]).toEqual([d, []]);
    }
  });
  it('absolute descriptors with a racemate fail', () => {
    expect(ids(run(one, { form: 'racemate', descriptors: '(2R)' }))).toEqual([
      'absolute-descriptors-with-racemate',
    ]);
  });
  it('relative notation with a racemate is a warning', () => {
    const o = run(chiralFacts([centre(4, 'R', 1), centre(6, 'S', 2)]), {
      form: 'racemate',
      descriptors: 'rel-(1R,2S)',
    });
    expect(o.findings).toMatchObject([{ messageId: 'relative-notation-with-racemate', severity: 'warning' }]);
  });
  it('a sign of rotation with an optically inactive form fails', () => {
    expect(ids(run(one, { form: 'racemate' }, '(+)-2-butanol'))).toEqual(['optical-sign-with-inactive-form']);
    expect(run(one, { form: 'single-enantiomer' }, '(R)-(−)-2-butanol').findings).toEqual([]);
  });
  it('meso in the name with a chiral form fails', () => {
    const mesoLike = facts({ units: [centre(2, 'R', 2), centre(3, 'S', 3)] });
    expect(ids(run(mesoLike, { form: 'racemate' }, 'meso-2,3-dibromobutane'))).toContain(
      'meso-prefix-with-chiral-form',
    );
    expect(run(mesoLike, { form: 'meso' }, 'meso-2,3-dibromobutane').findings).toEqual([]);
  });
  it('does not apply when nothing is declared', () => {
    expect(run(one, { form: 'single-enantiomer' }).notApplicable).toMatch(/^no descriptors declared/);
  });
});

// Descriptors without atom maps (issue 12). Ephedrine is (1R,2S)-2-(methylamino)-1-phenylpropan-1-ol (handbook,
// from memory); the SMILES below is labelled C1 (atom 5, the carbinol carbon) R and C2 (atom 2) S by RDKit's new
// CIP labeller (rdCIPLabeler, python3-rdkit 2022.09) and by our engine.
describe('descriptors-match-structure: counts are not a per-atom check', () => {
  const EPHEDRINE = 'C[C@H](NC)[C@H](O)c1ccccc1';
  const real = (smiles: string, descriptors: string) =>
    runCheck(
      check,
      realCtx(
        record(
          { form: 'single-enantiomer', descriptors },
          { id: 'LX-00091', name: 'ephedrine', structure: { smiles } },
        ),
      ),
    );
  it("the enantiomer's descriptors (1S,2R) on ephedrine drawn (1R,2S): a note with the fix, never a pass (before: passed as counts)", () => {
    const o = real(EPHEDRINE, '(1S,2R)');
    expect(o.findings).toMatchObject([
      {
        messageId: 'descriptors-not-verified-per-atom',
        severity: 'note',
        data: {
          mappedSmiles: 'C[C@H:2](NC)[C@H:5](O)c1ccccc1',
          atoms: '2, 5',
          fitsIf: '; they fit the drawing only if locant 1 is atom 2 and locant 2 is atom 5',
        },
      },
    ]);
    const text = render(check.messages['descriptors-not-verified-per-atom'], o.findings[0].data);
    expect(text).toMatch(/consistent in count .*not verified per atom/);
    expect(text).toContain(
      'C[C@H:2](NC)[C@H:5](O)c1ccccc1 (each map number is the atom number in your SMILES',
    );
    // the right descriptors are not verified either: the same note, without a pass
    expect(ids(real(EPHEDRINE, '(1R,2S)'))).toEqual(['descriptors-not-verified-per-atom']);
  });
  it('pasted back with the locants as atom maps, the comparison is per atom: wrong descriptors fail, right ones pass', () => {
    const pasted = 'C[C@H:2](NC)[C@H:1](O)c1ccccc1';
    const bad = real(pasted, '(1S,2R)');
    expect(ids(bad)).toEqual(['descriptor-label-mismatch']);
    expect(bad.findings[0].data).toMatchObject({ count: 2, method: 'per-locant' });
    const good = real(pasted, '(1R,2S)');
    expect(good.findings).toEqual([]);
    expect(good.passed).toMatch(/per locant/);
  });
  it('the note can be raised to a warning by the registry (severities, check-id/message-id)', () => {
    const o = real(EPHEDRINE, '(1S,2R)');
    const c = realCtx(record({ form: 'single-enantiomer' }, { id: 'LX-00091' }));
    const config = {
      ...c.config,
      severities: { 'descriptors-match-structure/descriptors-not-verified-per-atom': 'warning' as const },
    };
    expect(toFinding(check, o.findings[0], c.loaded, config).severity).toBe('warning');
    expect(toFinding(check, o.findings[0], c.loaded, c.config).severity).toBe('note');
  });
  it('a single stereocentre is matched without atom maps: (S) on (R)-butan-2-ol fails, (R) passes per unit', () => {
    const bad = real('C[C@@H](O)CC', '(S)');
    expect(ids(bad)).toEqual(['descriptor-label-mismatch']);
    expect(bad.findings[0].data).toMatchObject({
      method: 'per-unit',
      mismatches: 'atom 2: declared S, computed R',
    });
    const good = real('C[C@@H](O)CC', '(2R)');
    expect(good.findings).toEqual([]);
    expect(good.passed).toMatch(/per unit/);
  });
  it('one centre and one double bond are told apart by E/Z versus R/S', () => {
    // (3S,4E)-hex-4-en-3-ol: RDKit's rdCIPLabeler (python3-rdkit 2022.09) gives C atom 4 S and the double bond E
    const smiles = 'C/C=C/[C@@H](O)CC';
    const labels = readSmiles(smiles)
      .facts!.units.map((u) => u.label)
      .sort();
    expect(labels).toEqual(['E', 'S']);
    expect(real(smiles, '(3S,4E)').passed).toMatch(/per unit/);
    const bad = real(smiles, '(3S,4Z)');
    expect(ids(bad)).toEqual(['descriptor-label-mismatch']);
    expect(bad.findings[0].data).toMatchObject({ method: 'per-unit', count: 1 });
  });
  it('counts settle the claim when every matching gives the same labels: all centres alike, or two centres up to inversion', () => {
    const rr = chiralFacts([centre(4, 'R'), centre(6, 'R')]);
    expect(run(rr, { form: 'single-enantiomer', descriptors: '(2R,3R)' }).passed).toMatch(/every matching/);
    const rs = chiralFacts([centre(4, 'R'), centre(6, 'S')]);
    expect(run(rs, { form: 'racemate', descriptors: '(2RS,3SR)' }).passed).toMatch(/every matching/);
    // three centres, racemic: (1RS,2SR,3SR) fits some matchings only
    const rss = chiralFacts([centre(2, 'R'), centre(4, 'S'), centre(6, 'S')]);
    expect(ids(run(rss, { form: 'racemate', descriptors: '(1RS,2SR,3SR)' }))).toEqual([
      'descriptors-not-verified-per-atom',
    ]);
  });
});

// Names as chemists write them (issue 12): the stereo prefix is read and compared with the declared form; the
// rest is the name. IUPAC 2013 P-93.1.3 (rac-, RS/SR, (±), rel-, *); D-/L- Fischer–Rosanoff (P-102/P-103, from
// memory). Failing and passing cases side by side.
describe('descriptors-match-structure: stereo prefixes in names', () => {
  const flat = facts({
    units: [unit({ atoms: [11], defined: false })],
    chiral: true,
    stereoisomers: { total: 2, chiral: 2, achiral: 0, pairs: 1, meso: 0, units: 1 },
  });
  const and = chiralFacts([centre(11, 'S')], {
    enhanced: { groups: [{ type: 'and', id: 1, atoms: [11] }], meaning: 'racemic' },
  });
  it('rac-ibuprofen names a racemate (before: an error); with a single-enantiomer form it contradicts it', () => {
    for (const f of [flat, and]) {
      expect(run(f, { form: 'racemate' }, 'rac-ibuprofen').findings).toEqual([]);
      expect(ids(run(f, { form: 'single-enantiomer' }, 'rac-ibuprofen'))).toEqual([
        'racemic-notation-needs-racemate',
      ]);
    }
  });
  it('(R,S)-ibuprofen is read as (RS) (before: two errors); (±)- and (RS)- too', () => {
    for (const n of ['(R,S)-ibuprofen', '(RS)-ibuprofen', '(±)-ibuprofen', '(S,R)-ibuprofen']) {
      for (const f of [flat, and]) {
        expect([n, run(f, { form: 'racemate' }, n).findings]).toEqual([n, []]);
      }
      expect([n, ids(run(and, { form: 'single-enantiomer' }, n))]).toEqual([
        n,
        ['racemic-notation-needs-racemate'],
      ]);
    }
    expect(run(and, { form: 'racemate' }, '(R,S)-ibuprofen').passed).toMatch(
      /legacy way of naming a racemate/,
    );
  });
  it('(R,S) on a structure with two centres and a single-enantiomer form: racemate or two centres without locants — a warning, not an error', () => {
    const two = chiralFacts([centre(2, 'R'), centre(3, 'S')]);
    const o = run(two, { form: 'single-enantiomer' }, '(R,S)-x');
    expect(o.findings).toMatchObject([{ messageId: 'legacy-racemate-or-two-centres', severity: 'warning' }]);
    // with one centre there is no second reading: the racemate contradicts the form
    expect(ids(run(and, { form: 'single-enantiomer' }, '(R,S)-x'))).toEqual([
      'racemic-notation-needs-racemate',
    ]);
  });
  it('D-/L- name one enantiomer: fine for a single enantiomer, an error with a racemate or an achiral form', () => {
    const one = chiralFacts([centre(2, 'S')]);
    expect(ids(run(one, { form: 'single-enantiomer' }, 'L-alanine'))).toEqual(['fischer-not-compared']);
    expect(ids(run(one, { form: 'racemate' }, 'L-alanine'))).toEqual([
      'fischer-not-compared',
      'fischer-prefix-with-form',
    ]);
    expect(run(flat, { form: 'racemate' }, 'DL-alanine').findings).toEqual([]);
    expect(ids(run(one, { form: 'single-enantiomer' }, 'DL-alanine'))).toEqual([
      'racemic-notation-needs-racemate',
    ]);
  });
  it('(−) written with a look-alike dash is a sign (issue 10): fails a racemate, passes a single enantiomer', () => {
    const one = chiralFacts([centre(2, 'R', 2)]);
    for (const minus of ['\u2012', '\u2014', '\uFE63', '\uFF0D', '\u02D7']) {
      expect(ids(run(one, { form: 'racemate' }, `(${minus})-butan-2-ol`))).toEqual([
        'optical-sign-with-inactive-form',
      ]);
      expect(run(one, { form: 'single-enantiomer' }, `(R)-(${minus})-butan-2-ol`).findings).toEqual([]);
    }
  });
  it('erythro/threo and cis/trans on a ring are read, not errors', () => {
    const two = chiralFacts([centre(2, 'R'), centre(3, 'R')]);
    expect(run(two, { form: 'racemate' }, '(±)-threo-methylphenidate').findings).toEqual([]);
    expect(run(two, { form: 'racemate' }, 'erythro-x').findings).toEqual([]);
  });
  it('a name that says nothing stereo says nothing', () => {
    for (const n of ['ibuprofen', 'S-methyl ethanethioate', '(2-chloroethyl)amine']) {
      expect([n, run(and, { form: 'racemate' }, n).notApplicable]).toEqual([
        n,
        expect.stringMatching(/^no descriptors declared/),
      ]);
    }
  });
});

// Salts: bis(amphetamine) sulfate, (C9H13N)2·H2SO4 (2:1 salt; handbook, from memory), drawn as two
// (S)-amphetamines and one sulfuric acid; real structures through the engine (perception, CIP, relation).
describe('descriptors-match-structure: repeated components of a salt', () => {
  const salt = (smiles: string, descriptors: string) =>
    runCheck(
      check,
      realCtx(
        record(
          { form: 'single-enantiomer', descriptors },
          { id: 'LX-00090', name: '(S)-amphetamine sulfate', structure: { smiles } },
        ),
      ),
    );
  it('counts identical parent components once', () => {
    const o = salt('C[C@H](N)Cc1ccccc1.C[C@H](N)Cc1ccccc1.OS(=O)(=O)O', '(S)');
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/component 2 repeats component 1/);
  });
  it('also when the second amphetamine is written in another atom order', () => {
    expect(salt('C[C@H](N)Cc1ccccc1.c1ccc(cc1)C[C@@H](N)C.OS(=O)(=O)O', '(S)').findings).toEqual([]);
  });
  it('does not merge the two enantiomers of a mixed salt', () => {
    // (S)- and (R)-amphetamine: same constitution, other configuration; (S) leaves the R centre uncited.
    expect(ids(salt('C[C@H](N)Cc1ccccc1.C[C@@H](N)Cc1ccccc1.OS(=O)(=O)O', '(S)'))).toEqual([
      'descriptors-incomplete',
    ]);
  });
});

// Pyramidal inversion of amines (IUPAC Gold Book): an ordinary amine nitrogen is not a stereocentre.
describe('descriptors-match-structure: descriptors on an invertible nitrogen', () => {
  const amine = facts({ invertibleNitrogens: [{ atom: 3, drawnWithStereo: true }] });
  it('a note beside the nitrogen-inversion error for a stereo claim', () => {
    const o = run(amine, { form: 'single-enantiomer' }, '(S)-N-ethyl-N-methylpropan-1-amine');
    expect(o.findings).toMatchObject([
      {
        messageId: 'descriptor-on-invertible-nitrogen',
        severity: 'note',
        field: 'name',
        data: { atoms: 'nitrogen (atom 3)', explainedBy: 'nitrogen-inversion' },
      },
    ]);
  });
  it('the error itself when the form claims nothing (nitrogen-inversion then reports only a note)', () => {
    const o = run(amine, { form: 'achiral', descriptors: '(S)' });
    expect(o.findings).toMatchObject([{ messageId: 'descriptor-on-invertible-nitrogen' }]);
    expect(o.findings[0].severity).toBeUndefined();
  });
});
