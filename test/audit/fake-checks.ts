/** Small check modules for audit tests: they exercise the plumbing (lines, waivers, severities, throws). */
import type { CheckModule } from '../../src/checks/types.js';

/** Passes when the form is 'achiral', else a finding on stereo.form. */
export const formCheck: CheckModule = {
  id: 'fake-form',
  defaultSeverity: 'error',
  summary: 'Fake: the form must be achiral.',
  explanation: 'Test double, no chemistry.',
  messages: { 'not-achiral': 'Declared {form}, computed achiral.' },
  run(ctx) {
    if (!ctx.record) return { findings: [], notApplicable: 'no record' };
    if (ctx.record.stereo.form === 'achiral') return { findings: [], passed: 'form is achiral' };
    return {
      findings: [{ messageId: 'not-achiral', data: { form: ctx.record.stereo.form }, field: 'stereo.form' }],
    };
  },
};

/** A note on stereo.ratio when a ratio is given (message-level severity), else not applicable. */
export const ratioNote: CheckModule = {
  id: 'fake-ratio',
  defaultSeverity: 'warning',
  summary: 'Fake: ratios get a note.',
  explanation: 'Test double.',
  messages: { 'has-ratio': 'Ratio {ratio} given; measured?', 'bad-ratio': 'Ratio {ratio} is odd.' },
  run(ctx) {
    const ratio = ctx.record?.stereo.ratio;
    if (ratio === undefined) return { findings: [], notApplicable: 'no ratio given' };
    if (ratio === '1:2')
      return { findings: [{ messageId: 'bad-ratio', data: { ratio }, field: 'stereo.ratio' }] };
    return {
      findings: [{ messageId: 'has-ratio', data: { ratio }, field: 'stereo.ratio', severity: 'note' }],
    };
  },
};

/** Throws for records whose name contains "explode". */
export const throwingCheck: CheckModule = {
  id: 'fake-throws',
  defaultSeverity: 'error',
  summary: 'Fake: throws.',
  explanation: 'Test double.',
  messages: {},
  run(ctx) {
    if (ctx.record?.name?.includes('explode')) throw new Error('kaboom');
    return { findings: [], passed: 'did not throw' };
  },
};

/** Records what it saw, to test the context. */
export function spyCheck(seen: { id: string | null; priorChecks: string[]; sameKey: number }[]): CheckModule {
  return {
    id: 'fake-spy',
    defaultSeverity: 'note',
    summary: 'Fake: spy.',
    explanation: 'Test double.',
    messages: {},
    run(ctx) {
      const key = ctx.main.facts?.constitutionKey;
      seen.push({
        id: ctx.loaded.id,
        priorChecks: (ctx.findings ?? []).map((f) => f.check),
        sameKey: key === undefined ? -1 : 1,
      });
      return { findings: [] };
    },
  };
}
