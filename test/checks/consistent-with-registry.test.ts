import { describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { defaultEngine } from '../../src/audit/engine.js';
import { indexRow } from '../../src/audit/index-row.js';
import { RegistryPhase } from '../../src/audit/registry-phase.js';
import { confirmWith } from '../../src/audit/run.js';
import {
  compareWithRegistry,
  registeredLater,
  type RegistryMode,
} from '../../src/checks/consistent-with-registry.js';
import { RegistryIndex } from '../../src/registry/key-index.js';
import type { IndexRow } from '../../src/registry/keys.js';
import type { CompoundRecord, Rotation } from '../../src/registry/types.js';
import { loaded, record } from './facts.js';
import { readSmiles } from './real.js';

const engine = await defaultEngine();

// Enantiomers have equal and opposite specific rotations under the same conditions (IUPAC Gold Book,
// enantiomer / optical activity). Carvone enantiomers: (R)-(−) and (S)-(+), about ±61° neat (handbook, from memory).
const rot = (value: number, p: Partial<Rotation> = {}): Rotation => ({
  value,
  wavelength_nm: 589,
  temperature_c: 20,
  solvent: 'neat',
  ...p,
});
const S_CARVONE = 'CC1=CC[C@@H](CC1=O)C(=C)C';
const R_CARVONE = 'CC1=CC[C@H](CC1=O)C(=C)C';
// the same (S)-carvone written in another atom order
const S_CARVONE_2 = 'C=C(C)[C@H]1CC=C(C)C(=O)C1';

let seq = 0;
function row(smiles: string, stereo: Partial<CompoundRecord['stereo']>, id: string): IndexRow {
  const r = record(
    { form: 'single-enantiomer', ...stereo },
    { id, structure: { smiles }, name: `compound ${id}` },
  );
  const l = loaded(r, `compounds/${id}.yml`);
  return indexRow(l, readSmiles(smiles), ++seq);
}

/** The registry-wide phase over rows in order (full), or the last row reviewed against the others. */
function phase(rows: IndexRow[], mode: RegistryMode) {
  const p = new RegistryPhase({ mode, config: DEFAULT_CONFIG, confirm: confirmWith(engine) });
  if (mode === 'full') {
    const results = rows.map((r) => p.next(r));
    return { results, summary: p.summary() };
  }
  for (const r of rows.slice(0, -1)) p.file(r);
  p.fileUnderReview(rows[rows.length - 1]!);
  return { results: [p.next(rows[rows.length - 1]!)], summary: p.summary() };
}
const ids = (r: { findings: { messageId: string }[] }) => r.findings.map((f) => f.messageId).sort();

describe('registry keys (IUPAC 2013 P-92: CIP descriptors do not depend on the atom order)', () => {
  it('the same stereoisomer in another atom order has the same key; its enantiomer the mirror key', () => {
    const a = row(S_CARVONE, {}, 'LX-1').keys!;
    const b = row(S_CARVONE_2, {}, 'LX-2').keys!;
    const c = row(R_CARVONE, {}, 'LX-3').keys!;
    expect(a.exact).toBe(true);
    expect(b.stereo).toBe(a.stereo);
    expect(c.stereo).toBe(a.mirror);
    expect(c.stereo).not.toBe(a.stereo);
  });
  it('threonine: (2S,3R) and (2R,3S) are enantiomers, allo-threonine (2S,3S) is neither', () => {
    // L-threonine (2S,3R) and L-allo-threonine (2S,3S): handbook (from memory), descriptors as RDKit gives them
    const thr = row('C[C@@H](O)[C@H](N)C(=O)O', {}, 'LX-4');
    const entThr = row('C[C@H](O)[C@@H](N)C(=O)O', {}, 'LX-5');
    const allo = row('C[C@H](O)[C@H](N)C(=O)O', {}, 'LX-6');
    const index = new RegistryIndex(null);
    index.add(thr);
    index.add(allo);
    expect(index.matches(entThr).map((m) => [m.other.id, m.relation])).toEqual([['LX-4', 'enantiomers']]);
  });
  it('an undefined stereocentre leaves the stereoisomer open: no key to compare', () => {
    expect(row('CC(O)CC', {}, 'LX-7').keys!.stereo).toBeNull();
  });
  it('tartaric acids: equivalent centres make the key inexact; relate() confirms the pairs', () => {
    // (R,R), (S,S) and meso tartaric acid (IUPAC Gold Book, meso): RR/SS enantiomers, meso identical only to itself
    const rr = row('OC(=O)[C@H](O)[C@@H](O)C(=O)O', {}, 'LX-8');
    const ss = row('OC(=O)[C@@H](O)[C@H](O)C(=O)O', {}, 'LX-9');
    const meso = row('OC(=O)[C@H](O)[C@H](O)C(=O)O', { form: 'meso' }, 'LX-10');
    const meso2 = row('OC(=O)[C@@H](O)[C@@H](O)C(=O)O', { form: 'meso' }, 'LX-11');
    expect(rr.keys!.exact).toBe(false);
    const index = new RegistryIndex(confirmWith(engine));
    for (const r of [rr, ss, meso]) index.add(r);
    expect(index.matches(ss).map((m) => [m.other.id, m.relation])).toEqual([['LX-8', 'enantiomers']]);
    expect(index.matches(meso2).map((m) => [m.other.id, m.relation])).toEqual([['LX-10', 'identical']]);
  });
  it('a racemic (AND group) drawing is not compared with an absolute one', () => {
    const index = new RegistryIndex(null);
    index.add(row(S_CARVONE, {}, 'LX-12'));
    expect(index.matches(row('CC1=CC[C@@H](CC1=O)C(=C)C |&1:4|', { form: 'racemate' }, 'LX-13'))).toEqual([]);
  });
});

describe('consistent-with-registry', () => {
  it('passes a record with no relative in the registry', () => {
    const { results } = phase(
      [row(S_CARVONE, {}, 'LX-20'), row(S_CARVONE, {}, 'LX-21')].slice(0, 1),
      'review',
    );
    expect(results[0]!.findings).toEqual([]);
    expect(results[0]!.passed?.evidence).toMatch(/no other registered record/);
  });
  it('flags a structure identical to a registered one; a different form is an error', () => {
    const dup = phase([row(S_CARVONE, {}, 'LX-19'), row(S_CARVONE_2, {}, 'LX-20')], 'review');
    expect(dup.results[0]!.findings).toMatchObject([
      { messageId: 'already-registered', severity: 'warning', data: { otherId: 'LX-19' } },
    ]);
    const other = phase(
      [row(S_CARVONE, { form: 'racemate' }, 'LX-19'), row(S_CARVONE, {}, 'LX-20')],
      'review',
    );
    expect(other.results[0]!.findings).toMatchObject([
      { messageId: 'same-structure-different-form', severity: 'error' },
    ]);
  });
  it('the same enantiomer at another purity is a note, not a conflict', () => {
    const o = phase(
      [row(S_CARVONE, {}, 'LX-19'), row(S_CARVONE, { form: 'enantioenriched', ee: 80 }, 'LX-20')],
      'review',
    );
    expect(o.results[0]!.findings).toMatchObject([
      { messageId: 'same-structure-other-purity', severity: 'note' },
    ]);
  });
  it('names a registered enantiomer once, on the record under review, and accepts opposite rotations', () => {
    const o = phase(
      [row(R_CARVONE, { rotation: rot(-61) }, 'LX-19'), row(S_CARVONE, { rotation: rot(61) }, 'LX-20')],
      'review',
    );
    expect(o.results[0]!.findings).toMatchObject([
      { messageId: 'enantiomer-registered', severity: 'note', data: { otherId: 'LX-19' } },
    ]);
  });
  it('fails enantiomers measured alike with the same sign; ignores rotations measured differently', () => {
    const same = phase(
      [row(R_CARVONE, { rotation: rot(58) }, 'LX-19'), row(S_CARVONE, { rotation: rot(61) }, 'LX-20')],
      'review',
    );
    expect(ids(same.results[0]!)).toEqual(['enantiomer-registered', 'enantiomer-rotation-same-sign']);
    expect(same.results[0]!.passed).toBeNull();
    const unlike = phase(
      [
        row(R_CARVONE, { rotation: rot(58, { solvent: 'ethanol' }) }, 'LX-19'),
        row(S_CARVONE, { rotation: rot(61) }, 'LX-20'),
      ],
      'review',
    );
    expect(ids(unlike.results[0]!)).toEqual(['enantiomer-registered', 'enantiomer-rotations-not-compared']);
    // a check that could not compare the rotations never says they agree (house rule: unverified is not passed)
    expect(unlike.results[0]!.passed?.evidence).toBe(
      'the enantiomer of 1 registered record; forms agree, rotations not compared (see the note)',
    );
    const alike = phase(
      [row(R_CARVONE, { rotation: rot(-61) }, 'LX-19'), row(S_CARVONE, { rotation: rot(61) }, 'LX-20')],
      'review',
    );
    expect(alike.results[0]!.passed?.evidence).toBe(
      'the enantiomer of 1 registered record; forms and rotations agree',
    );
  });
  it('notes enantiomers of unequal rotation size; warns on enantiomers of different kinds of form', () => {
    const size = phase(
      [row(R_CARVONE, { rotation: rot(-30) }, 'LX-19'), row(S_CARVONE, { rotation: rot(61) }, 'LX-20')],
      'review',
    );
    expect(ids(size.results[0]!)).toEqual(['enantiomer-registered', 'enantiomer-rotation-magnitude']);
    const form = phase(
      [row(R_CARVONE, { form: 'racemate' }, 'LX-19'), row(S_CARVONE, {}, 'LX-20')],
      'review',
    );
    expect(ids(form.results[0]!)).toEqual(['enantiomer-form-conflict', 'enantiomer-registered']);
  });
});

// Issue 12 "Noise" (the project's own rule, common practice, no source): registering both enantiomers is normal.
describe('consistent-with-registry: each pair said once', () => {
  it('a full audit lists the enantiomer pair in the summary and gives neither record a note', () => {
    const { results, summary } = phase(
      [row(R_CARVONE, { rotation: rot(-61) }, 'LX-10'), row(S_CARVONE, { rotation: rot(61) }, 'LX-11')],
      'full',
    );
    expect(results.map((r) => r.findings)).toEqual([[], []]);
    expect(summary.pairs).toMatchObject([
      { relation: 'enantiomers', first: { id: 'LX-10' }, second: { id: 'LX-11' } },
    ]);
  });
  it('a full audit reports a conflict on the later record only, with no note on the earlier one', () => {
    const { results, summary } = phase(
      [row(R_CARVONE, { rotation: rot(-58) }, 'LX-12'), row(S_CARVONE, { rotation: rot(-61) }, 'LX-23')],
      'full',
    );
    expect(results.map(ids)).toEqual([[], ['enantiomer-rotation-same-sign']]);
    expect(summary.status).toBe('run');
  });
  it('a review of two records of one pair says it on the one registered later', () => {
    const p = new RegistryPhase({ mode: 'review', config: DEFAULT_CONFIG, confirm: null });
    const a = row(R_CARVONE, {}, 'LX-00030');
    const b = row(S_CARVONE, {}, 'LX-00031');
    p.fileUnderReview(a);
    p.fileUnderReview(b);
    expect([ids(p.next(a)), ids(p.next(b))]).toEqual([[], ['enantiomer-registered']]);
  });
  it('a configured severity applies to the registry-wide findings, and a waiver accepts them', () => {
    const config = { ...DEFAULT_CONFIG, severities: { 'consistent-with-registry': 'warning' as const } };
    const p = new RegistryPhase({ mode: 'full', config, confirm: null });
    p.next(row(S_CARVONE, { form: 'racemate' }, 'LX-40'));
    const later = row(S_CARVONE, {}, 'LX-41');
    later.waivers = [
      {
        index: 0,
        check: 'consistent-with-registry',
        reason: 'two drawings of one batch, corrected in LIMS',
        approved_by: 'M. Lindqvist',
      },
    ];
    expect(p.next(later).findings).toMatchObject([
      {
        messageId: 'same-structure-different-form',
        severity: 'warning',
        waived: { approvedBy: 'M. Lindqvist' },
      },
    ]);
  });
  it('orders ids by their numbers, and a record without an id last', () => {
    const e = (id: string | null) => ({ id, file: 'compounds/x.yml' });
    expect(registeredLater(e('LX-00024'), e('LX-00008'))).toBe(true);
    expect(registeredLater(e('LX-00008'), e('LX-00024'))).toBe(false);
    expect(registeredLater(e('LX-100000'), e('LX-99999'))).toBe(true);
    expect(registeredLater(e(null), e('LX-99999'))).toBe(true);
    expect(registeredLater(e('LX-99999'), e(null))).toBe(false);
  });
  it('compareWithRegistry with no matches passes with its evidence', () => {
    const c = compareWithRegistry(row(S_CARVONE, {}, 'LX-50'), [], 'review', DEFAULT_CONFIG);
    expect(c).toMatchObject({ findings: [], pairs: [] });
  });
});
