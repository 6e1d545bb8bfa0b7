import { describe, expect, it } from 'vitest';
import { reviewWaivers, waiverAccepts, waiverReview as check } from '../../src/checks/waivers.js';
import type { Finding } from '../../src/audit/types.js';
import type { Waiver } from '../../src/registry/types.js';
import { ctx, ids, record, runCheck } from './facts.js';

// Waivers need a reason and an approver (common practice, no source: review decisions are recorded with both).
const f = (check: string): Finding => ({
  check,
  messageId: 'x',
  severity: 'warning',
  message: '',
  data: {},
  line: null,
  field: null,
  waived: null,
});
const withWaivers = (waivers: Waiver[]) => record({ form: 'racemate' }, { waivers });

describe('waiver-review', () => {
  it('does not apply without waivers', () => {
    expect(runCheck(check, ctx({ record: record() })).notApplicable).toBe('the record has no waivers');
  });
  it('passes a complete waiver that matches a finding', () => {
    const r = withWaivers([
      { check: 'rotation-consistent', reason: 'measured at 365 nm only', approved_by: 'A. Chemist' },
    ]);
    const o = runCheck(check, ctx({ record: r, findings: [f('rotation-consistent')] }));
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/1 accept/);
  });
  it('flags a waiver without reason or approver', () => {
    const r = withWaivers([
      { check: 'rotation-consistent' },
      { check: 'ratio-and-ee-consistent', reason: 'ok' },
    ]);
    const o = runCheck(
      check,
      ctx({ record: r, findings: [f('rotation-consistent'), f('ratio-and-ee-consistent')] }),
    );
    expect(ids(o)).toEqual(['waiver-incomplete', 'waiver-incomplete']);
    expect(o.findings.map((x) => x.field)).toEqual(['waivers.0', 'waivers.1']);
    expect(String(o.findings[0].data.missing)).toMatch(/reason.*approver/);
  });
  it('notes a waiver that matches no finding, and an unknown check id', () => {
    const r = withWaivers([{ check: 'rotation-consistent', reason: 'r', approved_by: 'a' }]);
    const o = runCheck(check, ctx({ record: r, findings: [] }));
    expect(o.findings).toMatchObject([{ messageId: 'waiver-matches-nothing', severity: 'note' }]);
    const direct = reviewWaivers(r, [], ['form-matches-structure']);
    expect(direct[0].data).toMatchObject({ knownCheck: false });
  });
  it('notes a repeated waiver', () => {
    const w = { check: 'rotation-consistent', reason: 'r', approved_by: 'a' };
    expect(
      ids(runCheck(check, ctx({ record: withWaivers([w, w]), findings: [f('rotation-consistent')] }))),
    ).toEqual(['waiver-duplicate']);
  });
  it('a narrowed waiver names its message and the other record (registry otherId, origin input)', () => {
    const registry = {
      check: 'consistent-with-registry',
      messageId: 'already-registered',
      data: { otherId: 'LX-00456' },
    };
    const origin = {
      check: 'origin-supports-claim',
      messageId: 'carried-inverted',
      data: { input: 'LX-00123' },
    };
    const w = { check: 'consistent-with-registry', other_record: 'LX-00123' };
    expect(waiverAccepts(w, registry)).toBe(false);
    expect(waiverAccepts({ ...w, other_record: 'LX-00456' }, registry)).toBe(true);
    expect(
      waiverAccepts({ ...w, other_record: 'LX-00456', message_id: 'enantiomer-registered' }, registry),
    ).toBe(false);
    expect(waiverAccepts({ check: 'origin-supports-claim', other_record: 'LX-00123' }, origin)).toBe(true);
    expect(waiverAccepts({ check: 'consistent-with-registry' }, registry)).toBe(true);
  });
  it('two waivers of one check about different records are not repeats; the same one twice is', () => {
    const w = { check: 'consistent-with-registry', reason: 'r', approved_by: 'a' };
    const found = [
      { check: 'consistent-with-registry', messageId: 'already-registered', data: { otherId: 'LX-1' } },
      { check: 'consistent-with-registry', messageId: 'already-registered', data: { otherId: 'LX-2' } },
    ];
    const two = reviewWaivers(
      withWaivers([
        { ...w, other_record: 'LX-1' },
        { ...w, other_record: 'LX-2' },
      ]),
      found,
    );
    expect(two).toEqual([]);
    const same = reviewWaivers(
      withWaivers([
        { ...w, other_record: 'LX-1' },
        { ...w, other_record: 'LX-1' },
      ]),
      found,
    );
    expect(same.map((x) => x.messageId)).toEqual(['waiver-duplicate']);
  });
});
