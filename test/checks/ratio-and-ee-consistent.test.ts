import { describe, expect, it } from 'vitest';
import { ratioAndEeConsistent as check } from '../../src/checks/ratio-and-ee-consistent.js';
import { eeFromRatio, parseRatio } from '../../src/checks/ratio.js';
import { ctx, ids, record, runCheck } from './facts.js';
import { realCtx } from './real.js';

// ee = |F(+) − F(−)| (IUPAC Gold Book, enantiomer excess); racemate = equimolar mixture of enantiomers
// (Gold Book, racemate). Tolerances are the registry defaults (common practice, no source): ratio sum ±1,
// racemate ±2 points from 50:50, ee ±1, single enantiomer from 98 % ee.
const run = (stereo: Parameters<typeof record>[0], config = {}) =>
  runCheck(check, ctx({ record: record(stereo), config }));

describe('parseRatio', () => {
  it('reads colon ratios, percentages and a single percentage', () => {
    expect(parseRatio('70:30').parts).toEqual([70, 30]);
    expect(parseRatio(' 97.5 : 2.5 ').parts).toEqual([97.5, 2.5]);
    expect(parseRatio('60%:30%:10%')).toMatchObject({ parts: [60, 30, 10], percent: true });
    expect(parseRatio('95%').parts).toEqual([95, 5]);
    expect(parseRatio('3:1')).toMatchObject({ parts: [3, 1], looksLikePercent: false });
  });
  it('reports problems with offsets', () => {
    expect(parseRatio('70:x').problems).toEqual([{ offset: 3, message: "'x' is not a number" }]);
    expect(parseRatio('97,5:2,5').problems[0].message).toMatch(/decimal mark/);
    expect(parseRatio('70').problems[0].message).toMatch(/two or more parts/);
    expect(parseRatio('70%:30').problems[0].message).toMatch(/some parts/);
  });
  it('"0:0" states no proportion: a ratio problem, not a ratio (issue 10)', () => {
    for (const r of ['0:0', '0:0:0', '0%:0%']) {
      expect(parseRatio(r).problems.map((p) => p.message)).toEqual([
        'every part is zero, so it states no proportion',
      ]);
    }
    expect(parseRatio('0:100').problems).toEqual([]);
  });

  it('computes ee from an enantiomer ratio (Gold Book definition)', () => {
    expect(eeFromRatio(97.5, 2.5)).toBeCloseTo(95);
    expect(eeFromRatio(3, 1)).toBeCloseTo(50);
    expect(eeFromRatio(0, 0)).toBeNull();
  });
});

describe('ratio-and-ee-consistent', () => {
  it('does not apply without ratio or ee', () => {
    expect(run({ form: 'racemate' }).notApplicable).toBe('no ratio or ee declared (stereo.ratio, stereo.ee)');
  });
  it('ratio parts must sum to 100 when they read as percentages', () => {
    expect(ids(run({ form: 'diastereomer-mixture', ratio: '70:20', components: [{}, {}] }))).toEqual([
      'ratio-parts-not-100',
    ]);
    expect(run({ form: 'diastereomer-mixture', ratio: '70:30', components: [{}, {}] }).findings).toEqual([]);
    expect(run({ form: 'diastereomer-mixture', ratio: '3:1', components: [{}, {}] }).findings).toEqual([]);
  });
  it('parts must match the components', () => {
    expect(ids(run({ form: 'diastereomer-mixture', ratio: '60:30:10', components: [{}, {}] }))).toEqual([
      'ratio-components-count',
    ]);
  });
  it('a racemate is 50:50 within tolerance', () => {
    expect(run({ form: 'racemate', ratio: '51:49' }).findings).toEqual([]);
    const o = run({ form: 'racemate', ratio: '60:40' });
    expect(ids(o)).toEqual(['racemate-ratio-not-even']);
    expect(o.findings[0].data).toMatchObject({ deviation: '10', ee: '20' });
    expect(run({ form: 'racemate', ratio: '60:40' }, { racemateRatioTolerance: 10 }).findings).toEqual([]);
  });
  it('a racemate has ee 0', () => {
    expect(ids(run({ form: 'racemate', ee: 12 }))).toEqual(['racemate-ee-not-zero']);
  });
  it('a stated ee agrees with the ratio', () => {
    expect(run({ form: 'enantioenriched', ratio: '90:10', ee: 80 }).findings).toEqual([]);
    const o = run({ form: 'enantioenriched', ratio: '90:10', ee: 90 });
    expect(ids(o)).toEqual(['ee-disagrees-with-ratio']);
    expect(o.findings[0].data).toMatchObject({ computedEe: '80', ee: 90 });
  });
  it('a single enantiomer meets the ee threshold, stated or from the ratio', () => {
    expect(run({ form: 'single-enantiomer', ee: 99.5 }).findings).toEqual([]);
    expect(ids(run({ form: 'single-enantiomer', ee: 92 }))).toEqual(['single-enantiomer-ee-low']);
    expect(ids(run({ form: 'single-enantiomer', ratio: '95:5' }))).toEqual(['single-enantiomer-ee-low']);
    expect(run({ form: 'single-enantiomer', ee: 92 }, { singleEnantiomerMinEe: 90 }).findings).toEqual([]);
  });
  it('enantiomer forms need a two-part ratio', () => {
    expect(ids(run({ form: 'enantioenriched', ratio: '80:15:5' }))).toEqual(['enantiomer-ratio-parts']);
  });
  it('enantioenriched at ee 0 is a racemate', () => {
    expect(ids(run({ form: 'enantioenriched', ee: 0 }))).toEqual(['enantioenriched-ee-zero']);
  });
  it('an achiral or meso form has no ee', () => {
    expect(ids(run({ form: 'meso', ee: 0 }))).toEqual(['ee-for-achiral-form']);
  });
  it('an exactly 1:1 diastereomer mixture gets a note; 55:45 does not', () => {
    const o = run({ form: 'diastereomer-mixture', ratio: '50:50', components: [{}, {}] });
    expect(o.findings).toMatchObject([{ messageId: 'diastereomer-ratio-exactly-even', severity: 'note' }]);
    expect(run({ form: 'diastereomer-mixture', ratio: '55:45', components: [{}, {}] }).findings).toEqual([]);
  });
  it('no 1:1 question when the listed components are enantiomers, not diastereomers', () => {
    // (2R,3R)- and (2S,3S)-tartaric acid are enantiomers (Gold Book, enantiomer); 1:1 of them is the racemate
    // (Gold Book, racemate), which form-matches-structure reports. Real structures through the engine.
    const components = [
      { smiles: 'OC(=O)[C@H](O)[C@@H](O)C(=O)O' },
      { smiles: 'OC(=O)[C@@H](O)[C@H](O)C(=O)O' },
    ];
    const r = record(
      { form: 'diastereomer-mixture', ratio: '50:50', components },
      { id: 'LX-00090', structure: { smiles: 'OC(=O)C(O)C(O)C(=O)O' } },
    );
    expect(runCheck(check, realCtx(r)).findings).toEqual([]);
    // (2R,3R) and meso-(2R,3S) are diastereomers: the question stays.
    const dia = record(
      {
        form: 'diastereomer-mixture',
        ratio: '50:50',
        components: [components[0], { smiles: 'OC(=O)[C@H](O)[C@H](O)C(=O)O' }],
      },
      { id: 'LX-00091', structure: { smiles: 'OC(=O)C(O)C(O)C(=O)O' } },
    );
    expect(ids(runCheck(check, realCtx(dia)))).toEqual(['diastereomer-ratio-exactly-even']);
  });
  it('an unreadable ratio is reported with its position', () => {
    const o = run({ form: 'racemate', ratio: '50:fifty' });
    expect(o.findings).toMatchObject([{ messageId: 'ratio-unreadable', data: { offset: 4 } }]);
  });
});
