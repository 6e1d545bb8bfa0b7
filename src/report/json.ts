/**
 * The stable JSON report: {"records":[{"id","file","computed","findings":[{"check","severity","message","line"}]}],
 * "summary":{"records","errors","warnings","notes"}} — keys always present, in this order; extra keys follow.
 */
import type { AuditResult, Finding, RecordResult } from '../audit/types.js';

function finding(f: Finding): Record<string, unknown> {
  return {
    check: f.check,
    severity: f.severity,
    message: f.message,
    line: f.line,
    messageId: f.messageId,
    field: f.field,
    data: f.data,
    waived: f.waived
      ? {
          reason: f.waived.reason,
          approvedBy: f.waived.approvedBy,
          ...(f.waived.covers === undefined ? {} : { covers: f.waived.covers }),
        }
      : null,
  };
}

/** One record of the report (as it stands in `records`). */
export function jsonRecord(r: RecordResult): Record<string, unknown> {
  return {
    id: r.id,
    file: r.file,
    computed: r.computed,
    findings: r.findings.map(finding),
    declared: { form: r.declared.form, descriptors: r.declared.descriptors },
    passed: r.passed.map((p) => ({ check: p.check, evidence: p.evidence })),
    notRun: (r.notRun ?? []).map((n) => ({ check: n.check, reason: n.reason })),
  };
}

/** The report as a plain object (for callers that embed it). */
export function jsonReport(result: AuditResult): Record<string, unknown> {
  const s = result.summary;
  const out: Record<string, unknown> = {
    records: result.records.map(jsonRecord),
    summary: { records: s.records, errors: s.errors, warnings: s.warnings, notes: s.notes, waived: s.waived },
    tool: { name: result.tool.name, version: result.tool.version },
    caution: result.caution,
  };
  if (result.unmatched?.length) out.unmatched = [...result.unmatched];
  if (result.registry) out.registry = result.registry;
  return out;
}

export function renderJson(result: AuditResult): string {
  return `${JSON.stringify(jsonReport(result), null, 2)}\n`;
}
