/**
 * The demo registry (fixtures/demo-registry) audited end to end through the real engine: every record marked
 * "WRONG ON PURPOSE" in its YAML comment gets the findings the comment describes, and the correct records get
 * no error or warning of their own. The chemistry of each record is in its comment.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import type { AuditResult } from '../../src/audit/types.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'demo-registry');

/** Errors and warnings each record should get (check/message), by the design of the demo. */
const EXPECTED: Record<string, string[]> = {
  'LX-00021': [
    'form-matches-structure/racemate-but-achiral',
    'consistent-with-registry/same-structure-different-form',
  ],
  'LX-00022': ['descriptors-match-structure/descriptor-label-mismatch'],
  'LX-00023': [
    'rotation-consistent/sign-disagrees-with-rotation',
    'consistent-with-registry/enantiomer-rotation-same-sign',
  ],
  'LX-00024': [
    'enhanced-stereo-matches-form/racemate-drawn-absolute',
    'ratio-and-ee-consistent/racemate-ratio-not-even',
    'consistent-with-registry/same-structure-different-form',
  ],
  'LX-00025': ['enhanced-stereo-matches-form/and-group-with-single-enantiomer'],
  // One root cause, one error; form and descriptors add notes pointing at it (see the test below).
  'LX-00026': ['nitrogen-inversion/claim-rests-on-invertible-nitrogen'],
  'LX-00027': ['form-matches-structure/achiral-but-chiral'],
  'LX-00028': ['form-matches-structure/diastereomer-too-few-units'],
  'LX-00029': ['form-matches-structure/mixture-components-enantiomers'],
  'LX-00030': ['ratio-and-ee-consistent/ee-disagrees-with-ratio'],
  'LX-00031': ['ratio-and-ee-consistent/single-enantiomer-ee-low'],
  'LX-00032': ['rotation-consistent/rotation-should-be-zero'],
  'LX-00033': ['structure-readable/structure-source-refused'],
  'LX-00034': ['form-matches-structure/racemate-which-diastereomer', 'waiver-review/waiver-incomplete'],
  'LX-00036': ['enhanced-stereo-matches-form/or-group-with-absolute-descriptors'],
  'LX-00037': ['descriptors-match-structure/racemic-notation-needs-racemate'],
  // The synthesis sequences LX-00201..LX-00210: only the origin shows that the ester is drawn as the mirror image.
  'LX-00206': ['origin-supports-claim/carried-enantiomer'],
};

let result: AuditResult;
beforeAll(async () => {
  result = await runAudit({ root: ROOT });
}, 300_000);

const byId = (id: string) => result.records.find((r) => r.id === id)!;
const serious = (id: string) =>
  byId(id)
    .findings.filter((f) => !f.waived && f.severity !== 'note')
    .map((f) => `${f.check}/${f.messageId}`)
    .sort();

describe('demo registry (Larkspur Chemistry Lab)', () => {
  it('has 25 or more records, YAML and JSON, with molfiles next to two of them', () => {
    const files = readdirSync(join(ROOT, 'compounds'));
    expect(files.filter((f) => /\.(ya?ml|json)$/.test(f)).length).toBeGreaterThanOrEqual(25);
    expect(files.filter((f) => f.endsWith('.json')).length).toBeGreaterThanOrEqual(2);
    expect(readFileSync(join(ROOT, 'compounds', 'LX-00009.mol'), 'utf8')).toMatch(/MDLV30\/STERAC1/);
  });
  it('every record marked wrong on purpose is in the expectations, and the others are not', () => {
    const wrong = readdirSync(join(ROOT, 'compounds'))
      .filter(
        (f) =>
          f.endsWith('.yml') && /WRONG ON PURPOSE/.test(readFileSync(join(ROOT, 'compounds', f), 'utf8')),
      )
      .map((f) => f.replace('.yml', ''));
    for (const id of wrong) expect([id, id in EXPECTED]).toEqual([id, true]);
  });
  it('gives each record exactly the designed errors and warnings', () => {
    for (const r of result.records) {
      expect([r.id, serious(r.id!)]).toEqual([r.id, [...(EXPECTED[r.id!] ?? [])].sort()]);
    }
  });
  it('shows the complete waiver as accepted and notes the useless one', () => {
    const waived = byId('LX-00035').findings.filter((f) => f.waived);
    expect(waived).toMatchObject([
      { check: 'form-matches-structure', waived: { approvedBy: 'M. Lindqvist' } },
    ]);
    expect(byId('LX-00017').findings.map((f) => f.messageId)).toContain('waiver-matches-nothing');
  });
  it('asks whether an exactly 1:1 diastereomer ratio was measured', () => {
    expect(byId('LX-00038').findings.map((f) => f.messageId)).toEqual(['diastereomer-ratio-exactly-even']);
  });
  it('reports each conflict between two records once, on the later record; the earlier gets nothing', () => {
    const conflicts = (id: string) =>
      byId(id)
        .findings.filter((f) => f.check === 'consistent-with-registry')
        .map((f) => [f.messageId, f.data.otherId]);
    expect(conflicts('LX-00024')).toEqual([['same-structure-different-form', 'LX-00008']]);
    expect(conflicts('LX-00023')).toEqual([['enantiomer-rotation-same-sign', 'LX-00012']]);
    expect(conflicts('LX-00021')).toEqual([['same-structure-different-form', 'LX-00016']]);
    for (const id of ['LX-00008', 'LX-00012', 'LX-00016']) expect(conflicts(id)).toEqual([]);
  });
  // Issue 12 "Noise": registering both enantiomers is normal; 20 notes on this demo before, none now.
  it('gives no record a note for a registered enantiomer; the summary lists every pair once', () => {
    const notes = result.records.flatMap((r) =>
      r.findings.filter((f) => f.check === 'consistent-with-registry' && f.severity === 'note'),
    );
    expect(notes).toEqual([]);
    const pairs = result.registry!.pairs.map((p) => `${p.relation} ${p.first.id} ${p.second.id}`);
    expect(pairs).toContain('enantiomers LX-00001 LX-00002');
    expect(pairs).toContain('enantiomers LX-00010 LX-00011');
    expect(result.registry!.status).toBe('run');
  });
  it('the amine drawn with a configuration at nitrogen: one error, the form and descriptor sides as notes', () => {
    expect(
      byId('LX-00026')
        .findings.map((f) => `${f.severity} ${f.check}/${f.messageId}`)
        .sort(),
    ).toEqual([
      'error nitrogen-inversion/claim-rests-on-invertible-nitrogen',
      'note descriptors-match-structure/descriptor-on-invertible-nitrogen',
      'note form-matches-structure/enantiomer-but-achiral',
    ]);
  });
  it('asks no 1:1 question for a "diastereomer mixture" of two enantiomers', () => {
    expect(byId('LX-00029').findings.map((f) => f.messageId)).toEqual(['mixture-components-enantiomers']);
  });
});
