import { describe, expect, it } from 'vitest';
import { enhancedStereoMatchesForm as check } from '../../src/checks/enhanced-stereo-matches-form.js';
import type { EnhancedStereoFacts } from '../../src/chem/facts.js';
import { centre, chiralFacts, ctx, ids, read, record, runCheck } from './facts.js';

// Meaning of enhanced-stereo groups: CTfile format specification (V3000 collections STEABS / STERAC / STEREL):
// AND (racemic) = drawn + mirror image as a mixture; OR (relative) = drawn or mirror image, unknown which.
const drawn = (enhanced: EnhancedStereoFacts, chiralFlag: boolean | null = null) =>
  read(chiralFacts([centre(2, 'R', 2), centre(3, 'S', 3)], { enhanced }), 'main', chiralFlag);
const and1: EnhancedStereoFacts = { groups: [{ type: 'and', id: 1, atoms: [2, 3] }], meaning: 'racemic' };
const or1: EnhancedStereoFacts = { groups: [{ type: 'or', id: 1, atoms: [2, 3] }], meaning: 'relative' };
const abs: EnhancedStereoFacts = { groups: [], meaning: 'absolute' };

describe('enhanced-stereo-matches-form', () => {
  it('an AND group with a single-enantiomer claim fails; with a racemate it passes', () => {
    expect(
      ids(runCheck(check, ctx({ record: record({ form: 'single-enantiomer' }), main: drawn(and1) }))),
    ).toEqual(['and-group-with-single-enantiomer']);
    const ok = runCheck(check, ctx({ record: record({ form: 'racemate' }), main: drawn(and1) }));
    expect(ok.findings).toEqual([]);
    expect(ok.passed).toMatch(/racemic/);
  });
  it('a racemate drawn as absolute is a warning; with rac- descriptors only a note', () => {
    const o = runCheck(check, ctx({ record: record({ form: 'racemate' }), main: drawn(abs) }));
    expect(o.findings).toMatchObject([{ messageId: 'racemate-drawn-absolute', severity: 'warning' }]);
    const named = runCheck(
      check,
      ctx({ record: record({ form: 'racemate', descriptors: 'rac-(2R,3S)' }), main: drawn(abs) }),
    );
    expect(named.findings).toMatchObject([{ messageId: 'racemate-drawn-absolute', severity: 'note' }]);
    // a bare rac- in the name (rac-ibuprofen) names the racemate but cites no configuration: the absolute
    // drawing still reads as one enantiomer (issue 12: the name is read, not taken as an explanation)
    const bare = runCheck(
      check,
      ctx({ record: record({ form: 'racemate' }, { name: 'rac-ibuprofen' }), main: drawn(abs) }),
    );
    expect(bare.findings).toMatchObject([{ messageId: 'racemate-drawn-absolute', severity: 'warning' }]);
  });
  it('an OR group with a racemate fails', () => {
    expect(ids(runCheck(check, ctx({ record: record({ form: 'racemate' }), main: drawn(or1) })))).toEqual([
      'or-group-with-racemate',
    ]);
  });
  it('several AND groups with a racemate', () => {
    const two: EnhancedStereoFacts = {
      groups: [
        { type: 'and', id: 1, atoms: [2] },
        { type: 'and', id: 2, atoms: [3] },
      ],
      meaning: 'mixture',
    };
    expect(ids(runCheck(check, ctx({ record: record({ form: 'racemate' }), main: drawn(two) })))).toEqual([
      'several-and-groups-with-racemate',
    ]);
  });
  it('an OR group with absolute descriptors; relative descriptors pass', () => {
    const bad = runCheck(
      check,
      ctx({ record: record({ form: 'single-enantiomer', descriptors: '(2R,3S)' }), main: drawn(or1) }),
    );
    expect(ids(bad)).toEqual(['or-group-with-absolute-descriptors']);
    expect(bad.findings[0].field).toBe('stereo.descriptors');
    const ok = runCheck(
      check,
      ctx({ record: record({ form: 'single-enantiomer', descriptors: 'rel-(2R,3S)' }), main: drawn(or1) }),
    );
    expect(ok.findings).toEqual([]);
  });
  it('an AND group with absolute descriptors in the name', () => {
    const o = runCheck(
      check,
      ctx({
        record: record({ form: 'racemate' }, { name: '(2R,3S)-2,3-dibromopentane' }),
        main: drawn(and1),
      }),
    );
    expect(o.findings).toMatchObject([{ messageId: 'and-group-with-absolute-descriptors', field: 'name' }]);
  });
  it('a molfile without chiral flag and absolute descriptors for a single enantiomer gets a note', () => {
    const o = runCheck(
      check,
      ctx({ record: record({ form: 'single-enantiomer', descriptors: '(2R,3S)' }), main: drawn(abs, false) }),
    );
    expect(o.findings).toMatchObject([
      { messageId: 'relative-flag-with-single-enantiomer', severity: 'note' },
    ]);
  });
  it('does not apply to a structure without stereo', () => {
    expect(runCheck(check, ctx({ record: record({ form: 'achiral' }) })).notApplicable).toBe(
      'the structure has no enhanced-stereo group and no defined stereo unit',
    );
  });
});
