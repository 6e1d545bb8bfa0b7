/**
 * origin-supports-claim on textbook reactions, through the real engine. The reactions, their stereochemical
 * course and the outcomes are textbook facts written from memory (no single source); every CIP label in a comment
 * was checked with RDKit's new CIP labeller (Debian python3-rdkit 2022.09), and cis/trans of the cyclopropanes by
 * an RDKit 3D embedding (dihedral across the ring). The principle under test: enantiomeric transition states are
 * equal in energy (racemate from achiral or racemic inputs without chiral control), diastereomeric ones are not
 * (unequal diastereomers) — IUPAC Gold Book, "stereoselectivity"; Cram 1952 for additions to α-chiral aldehydes.
 */
import fc from 'fast-check';
import { describe as suite, expect, it } from 'vitest';
import { originSupportsClaim as check } from '../../src/checks/origin-supports-claim.js';
import type { CompoundRecord } from '../../src/registry/types.js';
import { render } from '../../src/checks/words.js';
import type { RawFinding } from '../../src/checks/types.js';
import { runCheck } from './facts.js';
import { realCtx } from './real.js';

type Stereo = CompoundRecord['stereo'];

function rec(id: string, smiles: string, stereo: Stereo, origin?: CompoundRecord['origin']): CompoundRecord {
  const r: CompoundRecord = { id, structure: { smiles }, stereo };
  if (origin) r.origin = origin;
  return r;
}

function run(record: CompoundRecord, others: CompoundRecord[] = []) {
  return runCheck(check, realCtx(record, { others }));
}

const ids = (o: ReturnType<typeof run>) => o.findings.map((f) => f.messageId);
/** The message as the chemist reads it (the audit renders the same template with the same data). */
const msg = (f: RawFinding) => render(check.messages[f.messageId], f.data);

const ACETOPHENONE = 'CC(=O)c1ccccc1';
const R_PHENYLETHANOL = 'C[C@@H](O)c1ccccc1'; // (R), RDKit

suite('origin-supports-claim: where an enantiomeric excess can come from', () => {
  it('NaBH4 reduction of acetophenone claimed single-enantiomer: error, racemate expected (from memory)', () => {
    const o = run(
      rec(
        'LX-00101',
        R_PHENYLETHANOL,
        { form: 'single-enantiomer' },
        { from: [ACETOPHENONE], control: 'none' },
      ),
    );
    expect(o.findings).toMatchObject([
      { messageId: 'no-source-of-bias', field: 'stereo.form', data: { expected: 'racemate' } },
    ]);
    expect(msg(o.findings[0])).toMatch(/enantiomeric, equal in energy/);
    expect(o.passed).toBeUndefined();
  });

  it('the same reduction declared racemate passes, and the checklist line gives the expected outcome with its reason', () => {
    const o = run(
      rec('LX-00101', 'CC(O)c1ccccc1', { form: 'racemate' }, { from: [ACETOPHENONE], control: 'none' }),
    );
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(
      /^expected racemate — no source of enantiomeric bias.*equal in energy; declared racemate$/,
    );
  });

  it('an ee or a rotation on a product of achiral inputs is a claim of excess too', () => {
    const o = run(
      rec(
        'LX-00101',
        R_PHENYLETHANOL,
        { form: 'unknown', ee: 40 },
        { from: [ACETOPHENONE], control: 'none' },
      ),
    );
    expect(ids(o)).toEqual(['no-source-of-bias']);
    const r = run(
      rec(
        'LX-00101',
        R_PHENYLETHANOL,
        { form: 'unknown', rotation: { value: 45 } },
        { from: [ACETOPHENONE], control: 'none' },
      ),
    );
    expect(r.findings[0]).toMatchObject({ messageId: 'no-source-of-bias', field: 'stereo.rotation' });
  });

  it('the oxazaborolidine-catalysed (CBS) reduction: chiral catalyst, enantioenriched product passes (from memory)', () => {
    const o = run(
      rec(
        'LX-00102',
        R_PHENYLETHANOL,
        { form: 'enantioenriched', ee: 96 },
        { from: [ACETOPHENONE], control: 'chiral-catalyst' },
      ),
    );
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(
      /expected enantioenriched — the chiral-catalyst is the source of enantiomeric bias/,
    );
  });

  it('control not stated: the claim is left unchecked with a note naming what is missing, never passed', () => {
    const o = run(rec('LX-00102', R_PHENYLETHANOL, { form: 'single-enantiomer' }, { from: [ACETOPHENONE] }));
    expect(o.findings).toMatchObject([{ messageId: 'control-not-stated', severity: 'note' }]);
    expect(o.passed).toBeUndefined();
  });

  it('an input drawn without its configuration leaves the question open (note), never passed', () => {
    const o = run(
      rec(
        'LX-00103',
        'CC(=O)N[C@@H](C)C(=O)O',
        { form: 'single-enantiomer' },
        { from: ['CC(N)C(=O)O', 'CC(=O)OC(C)=O'], control: 'none' },
      ),
    );
    expect(o.findings).toMatchObject([
      { messageId: 'input-stereo-unknown', severity: 'note' },
      { messageId: 'carried-unit-open', severity: 'note' },
    ]);
    expect(msg(o.findings[0])).toMatch(/input 1 \(CC\(N\)C\(=O\)O\) is drawn without the configuration/);
  });
});

suite('origin-supports-claim: meso desymmetrisation', () => {
  // dimethyl cis-cyclohex-4-ene-1,2-dicarboxylate (1R,2S), meso; pig-liver esterase gives one enantiomer of
  // the half ester (from memory)
  const diester = rec('LX-00110', 'COC(=O)[C@@H]1CC=CC[C@@H]1C(=O)OC', { form: 'meso' });
  const half = 'COC(=O)[C@@H]1CC=CC[C@@H]1C(=O)O';
  it('with an enzyme: single enantiomer passes; both centres carried, either enantiomer fits', () => {
    for (const s of [half, 'OC(=O)[C@@H]1CC=CC[C@@H]1C(=O)OC']) {
      const o = run(
        rec(
          'LX-00111',
          s,
          { form: 'single-enantiomer', ee: 98 },
          { from: ['LX-00110'], control: 'biocatalyst' },
        ),
        [diester],
      );
      expect(o.findings).toEqual([]);
      expect(o.passed).toMatch(/biocatalyst/);
    }
  });
  it('the same hydrolysis without enzyme claimed single-enantiomer: error, enantiotopic groups react at equal rates', () => {
    const o = run(
      rec('LX-00111', half, { form: 'single-enantiomer' }, { from: ['LX-00110'], control: 'none' }),
      [diester],
    );
    expect(o.findings).toMatchObject([
      { messageId: 'desymmetrised-without-control', data: { expected: 'racemate' } },
    ]);
    expect(msg(o.findings[0])).toMatch(/enantiotopic/);
  });
  it('a trans half ester drawn from the cis diester: an epimer at one carried centre', () => {
    const o = run(
      rec(
        'LX-00111',
        'COC(=O)[C@@H]1CC=CC[C@H]1C(=O)O',
        { form: 'racemate' },
        { from: ['LX-00110'], control: 'none' },
      ),
      [diester],
    );
    expect(ids(o)).toEqual(['carried-epimer']);
  });
});

suite('origin-supports-claim: carried stereocentres', () => {
  const ala = rec('LX-00120', 'N[C@@H](C)C(=O)O', { form: 'single-enantiomer', ee: 99.5 }); // (S), RDKit
  const from = { from: ['LX-00120', 'CC(=O)OC(C)=O'], control: 'none' as const };
  it('N-acetylation of (S)-alanine drawn (S): passes, the centre carried unchanged (from memory)', () => {
    const o = run(rec('LX-00121', 'CC(=O)N[C@@H](C)C(=O)O', { form: 'single-enantiomer', ee: 99 }, from), [
      ala,
    ]);
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/expected non-racemic, C \(atom 5\) as in LX-00120, ee at most 99.5%/);
  });
  it('the same product drawn (R): error, the drawing starts from the enantiomer', () => {
    const o = run(rec('LX-00121', 'CC(=O)N[C@H](C)C(=O)O', { form: 'single-enantiomer' }, from), [ala]);
    expect(o.findings).toMatchObject([{ messageId: 'carried-enantiomer', data: { input: 'LX-00120' } }]);
    expect(msg(o.findings[0])).toMatch(/not the CIP labels/);
  });
  it('declared racemate although the carried centre keeps its configuration: error', () => {
    const o = run(rec('LX-00121', 'CC(=O)N[C@@H](C)C(=O)O', { form: 'racemate' }, from), [ala]);
    expect(ids(o)).toEqual(['racemate-from-enriched-input']);
  });
  it('a higher ee than the input: warning, unless the record says the product was enriched', () => {
    const low = rec('LX-00120', 'N[C@@H](C)C(=O)O', { form: 'enantioenriched', ee: 90 });
    const o = run(rec('LX-00121', 'CC(=O)N[C@@H](C)C(=O)O', { form: 'enantioenriched', ee: 99 }, from), [
      low,
    ]);
    expect(o.findings).toMatchObject([
      { messageId: 'ee-above-input', severity: 'warning', data: { inputEe: '90' } },
    ]);
    const ok = run(
      rec(
        'LX-00121',
        'CC(=O)N[C@@H](C)C(=O)O',
        { form: 'enantioenriched', ee: 99 },
        { ...from, control: 'enrichment' },
      ),
      [low],
    );
    expect(ok.findings).toEqual([]);
  });
  it('Mitsunobu inversion with phthalimide: the bond at the centre changes, so no retention claim either way (from memory)', () => {
    const octanol = rec('LX-00130', 'CCCCCC[C@H](C)O', { form: 'single-enantiomer', ee: 99 }); // (S), RDKit
    const origin = { from: ['LX-00130', 'O=C1NC(=O)c2ccccc12'], control: 'none' as const };
    for (const s of ['CCCCCC[C@@H](C)N1C(=O)c2ccccc2C1=O', 'CCCCCC[C@H](C)N1C(=O)c2ccccc2C1=O']) {
      const o = run(rec('LX-00131', s, { form: 'single-enantiomer' }, origin), [octanol]);
      expect(o.findings).toEqual([]);
      expect(o.passed).toMatch(/enantiomeric composition set by the reaction/);
    }
  });
  it('a racemic input keeps its relative configuration: trans acid -> trans ester passes either way round, cis is an error', () => {
    // trans-2-phenylcyclopropane-1-carboxylic acid, racemic (RDKit: (1R,2R), trans by 3D embedding)
    const acid = rec('LX-00140', 'OC(=O)[C@@H]1C[C@H]1c1ccccc1', {
      form: 'racemate',
      descriptors: 'rac-(1R,2R)',
    });
    const origin = { from: ['LX-00140', 'CO'], control: 'none' as const };
    for (const s of ['COC(=O)[C@@H]1C[C@H]1c1ccccc1', 'COC(=O)[C@H]1C[C@@H]1c1ccccc1']) {
      const o = run(rec('LX-00141', s, { form: 'racemate', descriptors: 'rac-(1R,2R)' }, origin), [acid]);
      expect(o.findings).toEqual([]);
      expect(o.passed).toMatch(/relative configuration/);
    }
    const cis = run(rec('LX-00141', 'COC(=O)[C@@H]1C[C@@H]1c1ccccc1', { form: 'racemate' }, origin), [acid]);
    expect(ids(cis)).toEqual(['carried-relative-differs']);
    const single = run(
      rec('LX-00141', 'COC(=O)[C@@H]1C[C@H]1c1ccccc1', { form: 'single-enantiomer' }, origin),
      [acid],
    );
    expect(ids(single)).toEqual(['no-source-of-bias']);
  });
});

suite("origin-supports-claim: diastereomers (Cram's rule)", () => {
  // (S)-2-phenylpropanal (RDKit) + MeMgBr -> 3-phenylbutan-2-ol, (3S) kept, C2 new: about 2:1 (Cram 1952, from memory)
  const aldehyde = rec('LX-00150', 'C[C@H](C=O)c1ccccc1', { form: 'single-enantiomer', ee: 98 });
  const origin = { from: ['LX-00150', 'C[Mg]Br'], control: 'none' as const };
  const major = 'C[C@@H](c1ccccc1)[C@H](C)O'; // (2S,3S), RDKit
  const minor = 'C[C@@H](c1ccccc1)[C@@H](C)O'; // (2R,3S), RDKit
  const mixture = (ratio: string, second = minor): CompoundRecord =>
    rec(
      'LX-00151',
      'C[C@@H](c1ccccc1)C(C)O',
      { form: 'diastereomer-mixture', ratio, components: [{ smiles: major }, { smiles: second }] },
      origin,
    );
  it('an unequal mixture with the carried centre unchanged in both components passes', () => {
    const o = run(mixture('67:33'), [aldehyde]);
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(
      /C \(atom 2\) as in LX-00150.*; diastereomers at C \(atom 9\) in unequal amounts/,
    );
  });
  it('1:1 is queried with the reason: diastereomeric transition states differ in energy', () => {
    const o = run(mixture('50:50'), [aldehyde]);
    expect(o.findings).toMatchObject([{ messageId: 'diastereomers-one-to-one', severity: 'note' }]);
    expect(msg(o.findings[0])).toMatch(/diastereomeric, differ in energy/);
  });
  it('a component with the carried centre inverted is an error', () => {
    const o = run(mixture('67:33', 'C[C@H](c1ccccc1)[C@@H](C)O'), [aldehyde]);
    expect(ids(o)).toEqual(['mixture-component-differs']);
  });
  it('a single diastereomer is fine; without ratio or evidence a note says they are worth stating', () => {
    const bare = run(rec('LX-00152', major, { form: 'single-diastereomer' }, origin), [aldehyde]);
    expect(ids(bare)).toEqual(['diastereomer-ratio-not-stated']);
    const shown = run(
      rec(
        'LX-00152',
        major,
        { form: 'single-diastereomer', evidence: ['1H NMR of the crude, d.r. 95:5'] },
        origin,
      ),
      [aldehyde],
    );
    expect(shown.findings).toEqual([]);
  });
  it('drawn with the carried centre inverted: error', () => {
    const o = run(
      rec(
        'LX-00152',
        'C[C@H](c1ccccc1)[C@H](C)O',
        { form: 'single-diastereomer', evidence: ['NMR'] },
        origin,
      ),
      [aldehyde],
    );
    expect(ids(o)).toEqual(['carried-enantiomer']);
  });
});

suite('origin-supports-claim: the origin itself', () => {
  it('an id that is not registered and not SMILES is an error, with the closest id', () => {
    const o = run(
      rec('LX-00160', R_PHENYLETHANOL, { form: 'racemate' }, { from: ['LX-00016'], control: 'none' }),
      [rec('LX-00015', ACETOPHENONE, { form: 'achiral' })],
    );
    expect(o.findings).toMatchObject([
      {
        messageId: 'input-not-found',
        field: 'origin.from.0',
        data: { suggestion: ' (did you mean LX-00015?)' },
      },
    ]);
  });
  it('an entry that is neither an id nor readable SMILES is an error saying where it fails', () => {
    const o = run(
      rec('LX-00160', R_PHENYLETHANOL, { form: 'racemate' }, { from: ['CC(=O'], control: 'none' }),
    );
    expect(o.findings).toMatchObject([{ messageId: 'input-unreadable', field: 'origin.from.0' }]);
  });
  it('a cycle of origins is an error naming the cycle', () => {
    const a = rec('LX-00170', R_PHENYLETHANOL, { form: 'racemate' }, { from: ['LX-00171'], control: 'none' });
    const b = rec('LX-00171', 'CC(O)c1ccccc1', { form: 'racemate' }, { from: ['LX-00172'], control: 'none' });
    const c = rec('LX-00172', ACETOPHENONE, { form: 'achiral' }, { from: ['LX-00170'], control: 'none' });
    const o = run(a, [b, c]);
    expect(o.findings).toMatchObject([
      { messageId: 'origin-cycle', data: { cycle: 'LX-00170 ← LX-00171 ← LX-00172 ← LX-00170' } },
    ]);
  });
  it('a unit no input accounts for is left unchecked with a note (is an input missing?)', () => {
    const o = run(
      rec('LX-00180', R_PHENYLETHANOL, { form: 'single-enantiomer' }, { from: ['C=O'], control: 'none' }),
    );
    expect(ids(o)).toContain('units-unmapped');
    expect(o.passed).toBeUndefined();
  });
  it('an input too large to map within the bound: unmapped, a note, never passed and never a stall', () => {
    const big = `${'C'.repeat(300)}`;
    const o = run(rec('LX-00181', R_PHENYLETHANOL, { form: 'racemate' }, { from: [big], control: 'none' }));
    expect(o.findings[0]).toMatchObject({ messageId: 'units-unmapped', severity: 'note' });
    expect(msg(o.findings[0])).toMatch(/stopped at its bound/);
    expect(o.passed).toBeUndefined();
  });
  it('its findings are errors unless marked otherwise (notes are "unverified")', () => {
    expect(check.defaultSeverity).toBe('error');
  });
  it('a record without origin is not judged', () => {
    const o = run(rec('LX-00190', R_PHENYLETHANOL, { form: 'single-enantiomer' }));
    expect(o.notApplicable).toBe('no origin given (origin)');
  });
});

suite('origin-supports-claim: hostile origins (fast-check, seeded)', () => {
  it('any from entries never throw, each bad entry is a finding on its own line, never a pass', () => {
    const entry = fc.oneof(
      fc.string({ maxLength: 30 }),
      fc.constantFrom('LX-00015', 'LX-00015', 'C1CC1', 'CC(=O', '[Xx]', '|&1:1|', 'C'.repeat(400)),
    );
    fc.assert(
      fc.property(fc.array(entry, { minLength: 1, maxLength: 4 }), (from) => {
        const r = rec('LX-00199', R_PHENYLETHANOL, { form: 'single-enantiomer' }, { from, control: 'none' });
        const o = run(r, [rec('LX-00015', ACETOPHENONE, { form: 'achiral' })]);
        for (const f of o.findings) expect(msg(f)).not.toMatch(/\{\w+\}/);
        const bad = o.findings.filter((f) => /^input-(not-found|unreadable)$/.test(f.messageId));
        for (const f of bad) expect(f.field).toMatch(/^origin\.from\.\d+$/);
        if (o.findings.length > 0) expect(o.passed).toBeUndefined();
      }),
      { seed: 4242, numRuns: 60 },
    );
  });
});
