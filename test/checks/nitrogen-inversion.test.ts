import { describe, expect, it } from 'vitest';
import { nitrogenInversion as check } from '../../src/checks/nitrogen-inversion.js';
import { render } from '../../src/checks/words.js';
import { centre, chiralFacts, ctx, facts, ids, read, record, runCheck } from './facts.js';

// Pyramidal inversion of amines (IUPAC Gold Book, pyramidal inversion). Barriers from memory: ammonia about
// 24 kJ/mol, simple trialkylamines roughly 30–40 kJ/mol, so their configurations interconvert at room temperature.
const amine = (drawn: boolean) => facts({ invertibleNitrogens: [{ atom: 2, drawnWithStereo: drawn }] });

describe('nitrogen-inversion', () => {
  it('fails a stereo claim resting only on an amine nitrogen', () => {
    const o = runCheck(
      check,
      ctx({ record: record({ form: 'single-enantiomer' }), main: read(amine(true)) }),
    );
    expect(ids(o)).toEqual(['claim-rests-on-invertible-nitrogen']);
    expect(o.findings[0].data).toMatchObject({ atoms: '(atom 2)', drawnWithStereo: true });
  });
  it("states the barrier of trialkylamines, not ammonia's, and marks the values as from memory", () => {
    const o = runCheck(
      check,
      ctx({ record: record({ form: 'single-enantiomer' }), main: read(amine(true)) }),
    );
    const text = render(check.messages[o.findings[0].messageId], o.findings[0].data);
    // failing case of the issue: ammonia's barrier given as that of simple amines
    expect(text).not.toMatch(/about 25 kJ\/mol for simple amines/);
    expect(text).toMatch(/30–40 kJ\/mol for simple trialkylamines/);
    expect(text).toMatch(/from memory/);
  });
  it('also when the nitrogen is not drawn with stereo but is the only candidate', () => {
    expect(
      ids(runCheck(check, ctx({ record: record({ form: 'racemate' }), main: read(amine(false)) }))),
    ).toEqual(['claim-rests-on-invertible-nitrogen']);
  });
  it('passes an achiral claim for the same amine', () => {
    expect(
      runCheck(check, ctx({ record: record({ form: 'achiral' }), main: read(amine(false)) })).findings,
    ).toEqual([]);
  });
  it('a drawn nitrogen next to a real stereocentre gets a note only', () => {
    const f = chiralFacts([centre(5, 'S')], { invertibleNitrogens: [{ atom: 2, drawnWithStereo: true }] });
    const o = runCheck(check, ctx({ record: record({ form: 'single-enantiomer' }), main: read(f) }));
    expect(o.findings).toMatchObject([
      { messageId: 'stereo-drawn-on-invertible-nitrogen', severity: 'note' },
    ]);
  });
  it('does not apply without amine nitrogens', () => {
    expect(
      runCheck(
        check,
        ctx({ record: record({ form: 'single-enantiomer' }), main: read(chiralFacts([centre(2, 'R')])) }),
      ).notApplicable,
    ).toBe('the structure has no amine nitrogen that inverts');
  });
});

describe('nitrogen-inversion: one error for one root cause', () => {
  it('names the descriptors to drop with the claim', () => {
    const f = facts({ invertibleNitrogens: [{ atom: 3, drawnWithStereo: true }] });
    const named = record({ form: 'single-enantiomer' }, { name: '(S)-N-ethyl-N-methylpropan-1-amine' });
    expect(runCheck(check, ctx({ record: named, main: read(f) })).findings[0].data.dropDescriptors).toBe(
      ' and drop (S) from the name',
    );
    const field = record({ form: 'single-enantiomer', descriptors: '(S)' });
    expect(runCheck(check, ctx({ record: field, main: read(f) })).findings[0].data.dropDescriptors).toBe(
      ' and drop (S) from stereo.descriptors',
    );
  });
});
