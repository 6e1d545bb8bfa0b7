/** Hand-built audit results for the action's tests (the shapes of src/audit/types.ts). */
import type { AuditResult, Finding, RecordResult, Severity } from '../../../src/audit/types.js';

export function finding(severity: Severity, line: number | null, extra: Partial<Finding> = {}): Finding {
  return {
    check: 'form-matches-structure',
    messageId: 'racemate-needs-chiral',
    severity,
    message: 'declared racemate, but the structure is identical to its mirror image',
    data: { declared: 'racemate' },
    line,
    field: 'stereo.form',
    waived: null,
    ...extra,
  };
}

export function record(file: string, findings: Finding[], id: string | null = 'LX-00001'): RecordResult {
  return {
    id,
    file,
    computed: null,
    findings,
    passed: [],
    declared: { form: 'racemate', descriptors: null },
  };
}

export function result(records: RecordResult[]): AuditResult {
  const live = records.flatMap((r) => r.findings).filter((f) => f.waived === null);
  const count = (s: Severity): number => live.filter((f) => f.severity === s).length;
  return {
    tool: { name: 'stereogate', version: '0.1.0' },
    records,
    summary: {
      records: records.length,
      errors: count('error'),
      warnings: count('warning'),
      notes: count('note'),
      waived: records.flatMap((r) => r.findings).length - live.length,
    },
    caution: 'Computed result: the responsible chemist confirms.',
  };
}

/** Pull request 7 of larkspur/registry, as the API tests and the action tests see it. */
export const pr = {
  owner: 'larkspur',
  repo: 'registry',
  number: 7,
  baseSha: 'a'.repeat(40),
  headSha: 'b'.repeat(40),
  changedFiles: null,
};
