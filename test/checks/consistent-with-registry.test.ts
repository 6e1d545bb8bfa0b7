import { describe, expect, it } from 'vitest';
import {
  consistentWithRegistry as check,
  registeredLater,
} from '../../src/checks/consistent-with-registry.js';
import type { Relation } from '../../src/chem/facts.js';
import type { CompoundRecord, Rotation } from '../../src/registry/types.js';
import { centre, chiralFacts, ctx, entry, ids, read, record, runCheck } from './facts.js';

// Enantiomers have equal and opposite specific rotations under the same conditions (IUPAC Gold Book,
// enantiomer / optical activity). Carvone enantiomers: (R)-(−) and (S)-(+), about ±61° neat (handbook, from memory).
const rot = (value: number, p: Partial<Rotation> = {}): Rotation => ({
  value,
  wavelength_nm: 589,
  temperature_c: 20,
  solvent: 'neat',
  ...p,
});
const mine = (stereo: Partial<CompoundRecord['stereo']> = {}) =>
  record({ form: 'single-enantiomer', ...stereo }, { id: 'LX-00020', name: '(S)-(+)-carvone' });
const theirs = (stereo: Partial<CompoundRecord['stereo']> = {}) =>
  record({ form: 'single-enantiomer', ...stereo }, { id: 'LX-00019', name: '(R)-(−)-carvone' });

function setup(
  rel: Relation,
  me: CompoundRecord,
  other: CompoundRecord,
  underReview = true,
  otherUnderReview = false,
) {
  const f = chiralFacts([centre(7, 'S')]);
  const selfRead = read(f, 'me');
  const otherRead = read(chiralFacts([centre(7, 'R')]), 'other');
  const entries = [
    entry(me, selfRead, 'compounds/LX-00020.yml', underReview),
    entry(other, otherRead, `compounds/${other.id}.yml`, otherUnderReview),
  ];
  return ctx({
    record: me,
    main: selfRead,
    entries,
    relations: { 'me|other': rel },
    file: 'compounds/LX-00020.yml',
  });
}

describe('consistent-with-registry', () => {
  it('passes a record with no relative in the registry', () => {
    const o = runCheck(check, setup('diastereomers', mine(), theirs()));
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/compared with 1/);
  });
  it('flags a structure identical to a registered one; a different form is an error', () => {
    expect(runCheck(check, setup('identical', mine(), theirs())).findings).toMatchObject([
      { messageId: 'already-registered', severity: 'warning', data: { otherId: 'LX-00019' } },
    ]);
    expect(ids(runCheck(check, setup('identical', mine(), theirs({ form: 'racemate' }))))).toEqual([
      'same-structure-different-form',
    ]);
  });
  it('names a registered enantiomer and accepts opposite rotations', () => {
    const o = runCheck(
      check,
      setup('enantiomers', mine({ rotation: rot(61) }), theirs({ rotation: rot(-61) })),
    );
    expect(o.findings).toMatchObject([
      { messageId: 'enantiomer-registered', severity: 'note', data: { otherId: 'LX-00019' } },
    ]);
  });
  it('fails enantiomers measured alike with the same sign', () => {
    const o = runCheck(
      check,
      setup('enantiomers', mine({ rotation: rot(61) }), theirs({ rotation: rot(58) })),
    );
    expect(ids(o)).toEqual(['enantiomer-registered', 'enantiomer-rotation-same-sign']);
  });
  it('does not compare rotations measured differently, and says so in a note (see solvents.test.ts)', () => {
    const o = runCheck(
      check,
      setup(
        'enantiomers',
        mine({ rotation: rot(61) }),
        theirs({ rotation: rot(58, { solvent: 'ethanol' }) }),
      ),
    );
    expect(ids(o)).toEqual(['enantiomer-registered', 'enantiomer-rotations-not-compared']);
  });
  it('notes enantiomers of unequal rotation size', () => {
    const o = runCheck(
      check,
      setup('enantiomers', mine({ rotation: rot(61) }), theirs({ rotation: rot(-30) })),
    );
    expect(ids(o)).toEqual(['enantiomer-registered', 'enantiomer-rotation-magnitude']);
  });
  it('warns when a registered enantiomer has a conflicting form', () => {
    expect(ids(runCheck(check, setup('enantiomers', mine(), theirs({ form: 'racemate' }))))).toEqual([
      'enantiomer-form-conflict',
      'enantiomer-registered',
    ]);
  });
  it('only checks records under review, never against themselves', () => {
    expect(runCheck(check, setup('identical', mine(), theirs(), false)).notApplicable).toBe(true);
    const me = mine();
    const selfRead = read(chiralFacts([centre(7, 'S')]), 'me');
    const c = ctx({
      record: me,
      main: selfRead,
      entries: [entry(me, selfRead, 'compounds/LX-00001.yml', true)],
      relations: { 'me|me': 'identical' },
    });
    expect(runCheck(check, c).findings).toEqual([]);
  });
});

describe('consistent-with-registry: purity', () => {
  it('the same enantiomer at another purity is a note, not a conflict', () => {
    const o = runCheck(check, setup('identical', mine({ form: 'enantioenriched', ee: 80 }), theirs()));
    expect(o.findings).toMatchObject([{ messageId: 'same-structure-other-purity', severity: 'note' }]);
  });
});

describe('consistent-with-registry: what the drawings stand for', () => {
  it('does not compare a racemic (AND group) drawing with an absolute one', () => {
    const me = mine({ form: 'racemate' });
    const selfRead = read(
      chiralFacts([centre(7, 'S')], {
        enhanced: { groups: [{ type: 'and', id: 1, atoms: [7] }], meaning: 'racemic' },
      }),
      'me',
    );
    const other = theirs();
    const entries = [
      entry(me, selfRead, 'compounds/LX-00020.yml', true),
      entry(other, read(chiralFacts([centre(7, 'S')]), 'other'), 'compounds/LX-00019.yml'),
    ];
    const c = ctx({
      record: me,
      main: selfRead,
      entries,
      relations: { 'me|other': 'identical' },
      file: 'compounds/LX-00020.yml',
    });
    expect(runCheck(check, c).findings).toEqual([]);
  });
});

// Which record carries a conflict: the project's own rule (common practice, no source) — in a pull request the
// record under review, in a full audit the one registered later (higher registry id).
describe('consistent-with-registry: one record carries a conflict', () => {
  const earlier = (stereo: Partial<CompoundRecord['stereo']> = {}) =>
    record({ form: 'single-enantiomer', ...stereo }, { id: 'LX-00030', name: '(R)-(−)-carvone' });
  it('in a full audit the later record carries it, the earlier one gets a note naming it', () => {
    const later = runCheck(check, setup('identical', mine(), theirs({ form: 'racemate' }), true, true));
    expect(later.findings).toMatchObject([
      { messageId: 'same-structure-different-form', data: { otherId: 'LX-00019' } },
    ]);
    const first = runCheck(check, setup('identical', mine(), earlier({ form: 'racemate' }), true, true));
    expect(first.findings).toMatchObject([
      {
        messageId: 'conflict-reported-on-later-record',
        severity: 'note',
        data: { otherId: 'LX-00030', otherMessageId: 'same-structure-different-form' },
      },
    ]);
    expect(first.passed).toMatch(/conflict with LX-00030 is reported on the later record/);
  });
  it('applies to rotations of the same sign and conflicting forms of enantiomers', () => {
    const o = runCheck(
      check,
      setup(
        'enantiomers',
        mine({ rotation: rot(61) }),
        earlier({ form: 'racemate', rotation: rot(58) }),
        true,
        true,
      ),
    );
    expect(o.findings.map((f) => [f.messageId, f.severity ?? null, f.data.otherMessageId ?? null])).toEqual([
      ['enantiomer-registered', 'note', null],
      ['conflict-reported-on-later-record', 'note', 'enantiomer-form-conflict'],
      ['conflict-reported-on-later-record', 'note', 'enantiomer-rotation-same-sign'],
    ]);
  });
  it('in a pull request the record under review carries it even when its id is lower', () => {
    const o = runCheck(check, setup('identical', mine(), earlier({ form: 'racemate' }), true, false));
    expect(ids(o)).toEqual(['same-structure-different-form']);
  });
  it('orders ids by their numbers, and a record without an id last', () => {
    const e = (id: string | null, file = 'compounds/x.yml') => ({ ...entry(mine(), read(null), file), id });
    expect(registeredLater(e('LX-00024'), e('LX-00008'))).toBe(true);
    expect(registeredLater(e('LX-00008'), e('LX-00024'))).toBe(false);
    expect(registeredLater(e('LX-100000'), e('LX-99999'))).toBe(true);
    expect(registeredLater(e(null), e('LX-99999'))).toBe(true);
    expect(registeredLater(e('LX-99999'), e(null))).toBe(false);
  });
});
