/**
 * SARIF 2.1.0 (OASIS standard) log of an audit: one run, tool.driver with one rule per check (and the audit's
 * own record-schema / internal-error rules), one result per finding with a physical location in the record file.
 * Waived findings are results with an in-source suppression carrying the reason and the approver.
 *
 * Checks that could not run on a record (its structure unreadable, the registry not all there) are not results:
 * they found nothing and passed nothing. They are tool execution notifications of the run's invocation
 * (SARIF 2.1.0, 3.20.21 toolExecutionNotifications: "runtime conditions detected by the tool during the course
 * of the analysis"), one per check and reason, with the records' locations and the check as associatedRule
 * (3.58.7). Not configuration notifications (3.20.22): nothing in the configuration kept them from running.
 */
import { BUILTIN_RULES, type RuleInfo } from '../audit/builtin-rules.js';
import type { AuditResult, Finding, RecordResult, Severity } from '../audit/types.js';
import type { CheckModule } from '../checks/types.js';
import { notRunGroups, notRunRecordsText, type NotRunGroup } from './not-run.js';

export const SARIF_SCHEMA =
  'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';

export interface SarifOptions {
  /** Prefix for artifact URIs when the registry root is a subfolder of the repository, e.g. 'registry/'. */
  uriPrefix?: string;
}

type Level = 'error' | 'warning' | 'note';

function level(s: Severity): Level {
  return s;
}

/**
 * A rule of the log. Code-scanning viewers show a result with its rule's help and never the run's properties,
 * so the help ends with the caution (the one place a reader of a single alert sees it).
 */
function rule(info: RuleInfo, caution: string): Record<string, unknown> {
  const r: Record<string, unknown> = {
    id: info.id,
    name: info.id.replace(/(^|-)([a-z])/g, (_m, _d, c: string) => c.toUpperCase()),
    shortDescription: { text: info.summary },
    fullDescription: { text: info.explanation },
    help: { text: `${info.summary}\n\n${info.explanation}${caution ? `\n\nCaution: ${caution}` : ''}` },
    defaultConfiguration: { level: level(info.defaultSeverity) },
  };
  return r;
}

function encodeUri(path: string): string {
  return path.split('/').map(encodeURIComponent).join('/');
}

export function renderSarif(
  result: AuditResult,
  checks: readonly CheckModule[],
  options: SarifOptions = {},
): string {
  return `${JSON.stringify(sarifLog(result, checks, options), null, 2)}\n`;
}

/** The SARIF results of one record's findings; `index` gives each check's rule index in the log. */
export function sarifResults(
  r: RecordResult,
  index: ReadonlyMap<string, number>,
  options: SarifOptions = {},
): Record<string, unknown>[] {
  const prefix = options.uriPrefix ? options.uriPrefix.replace(/\/?$/, '/') : '';
  return r.findings.map((f: Finding) => {
    const physical: Record<string, unknown> = {
      artifactLocation: { uri: encodeUri(`${prefix}${r.file}`) },
    };
    if (f.line !== null && f.line >= 1) physical.region = { startLine: f.line };
    const res: Record<string, unknown> = {
      ruleId: f.check,
      ruleIndex: index.get(f.check),
      level: level(f.severity),
      message: { text: f.message },
      locations: [{ physicalLocation: physical }],
      properties: { recordId: r.id, messageId: f.messageId, field: f.field, data: f.data },
    };
    if (f.waived) {
      res.suppressions = [
        {
          kind: 'inSource',
          status: 'accepted',
          justification:
            `${f.waived.reason} (approved by ${f.waived.approvedBy}` +
            `${f.waived.covers ? `; the waiver covers ${f.waived.covers}` : ''})`,
        },
      ];
    }
    return res;
  });
}

export function sarifLog(
  result: AuditResult,
  checks: readonly CheckModule[],
  options: SarifOptions = {},
): Record<string, unknown> {
  const infos: { info: RuleInfo }[] = [
    ...checks.map((c) => ({ info: c as RuleInfo })),
    ...BUILTIN_RULES.filter((b) => !checks.some((c) => c.id === b.id)).map((info) => ({ info })),
  ];
  // A finding of a check not in `checks` (e.g. a caller passed a shorter list) still gets a rule.
  for (const r of result.records) {
    for (const f of r.findings) {
      if (!infos.some((x) => x.info.id === f.check)) {
        infos.push({
          info: { id: f.check, defaultSeverity: f.severity, summary: f.check, explanation: f.check },
        });
      }
    }
  }
  const rules = infos.map((x) => rule(x.info, result.caution));
  const index = new Map(infos.map((x, i) => [x.info.id, i]));
  const prefix = options.uriPrefix ? options.uriPrefix.replace(/\/?$/, '/') : '';
  const results = result.records.flatMap((r) => sarifResults(r, index, options));
  const invocations = sarifInvocations(notRunGroups(result.records), index, prefix);
  return {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: result.tool.name,
            version: result.tool.version,
            semanticVersion: result.tool.version,
            rules,
          },
        },
        ...(invocations ? { invocations } : {}),
        results,
        properties: { caution: result.caution, summary: result.summary },
      },
    ],
  };
}

/**
 * The run's invocation with one tool execution notification per check and reason that kept it from running,
 * or null when every check ran. `prefix` as for the results' artifact URIs.
 */
export function sarifInvocations(
  groups: readonly NotRunGroup[],
  ruleIndex: ReadonlyMap<string, number>,
  prefix = '',
): Record<string, unknown>[] | null {
  if (groups.length === 0) return null;
  const notifications = groups.map((g) => {
    const rule: Record<string, unknown> = { id: g.check };
    const i = ruleIndex.get(g.check);
    if (i !== undefined) rule.index = i;
    return {
      level: 'note',
      message: { text: `${g.check} did not run on ${notRunRecordsText(g)}: ${g.reason}.` },
      associatedRule: rule,
      locations: g.examples.map((e) => {
        const physical: Record<string, unknown> = {
          artifactLocation: { uri: encodeUri(`${prefix}${e.file}`) },
        };
        if (e.line !== null && e.line >= 1) physical.region = { startLine: e.line };
        return { physicalLocation: physical };
      }),
      properties: {
        notRun: true,
        reason: g.reason,
        records: g.records,
        recordIds: g.examples.map((e) => e.id),
      },
    };
  });
  return [{ executionSuccessful: true, toolExecutionNotifications: notifications }];
}
