/**
 * RawFinding -> Finding: message from the check's template, severity after config overrides, line from the
 * record's field positions, and the waiver (if the record carries a complete one for this check).
 */
import type { AuditConfig, CheckModule, RawFinding } from '../checks/types.js';
import { acceptingWaiver } from '../checks/waivers.js';
import { render } from '../checks/words.js';
import { lineOf } from '../registry/positions.js';
import type { LoadedRecord } from '../registry/types.js';
import type { Finding, Severity } from './types.js';

/** Id of the findings the audit itself makes from a record's schema / syntax problems. */
export const SCHEMA_CHECK_ID = 'record-schema';
/** Id of the finding made when a check throws. */
export const INTERNAL_ERROR_ID = 'internal-error';

/** A finding that says stereogate itself failed on the record (a check, or reading the file). */
export function isInternalError(f: Pick<Finding, 'check' | 'messageId'>): boolean {
  return f.check === INTERNAL_ERROR_ID || f.messageId === INTERNAL_ERROR_ID;
}

/**
 * The severity of a finding. Without configuration: the message's own level, else the check's default. A
 * severity configured for the check (`severities: {check-id: level}`) sets the level of that check's failures —
 * every message that is not a note, raised or lowered alike; note-level messages (unverified claims, remarks)
 * stay notes. A severity configured for one message (`severities: {check-id/message-id: level}`) sets that
 * message's level, notes included, and wins over the check's.
 */
export function resolveSeverity(
  base: Severity,
  own: Severity | undefined,
  configured: Severity | undefined,
  configuredForMessage?: Severity,
): Severity {
  if (configuredForMessage !== undefined) return configuredForMessage;
  const level = own ?? base;
  if (configured === undefined || level === 'note') return level;
  return configured;
}

/** The key that configures one message of a check: 'check-id/message-id'. */
export function messageKey(checkId: string, messageId: string): string {
  return `${checkId}/${messageId}`;
}

export function configuredSeverity(config: AuditConfig, key: string): Severity | 'off' | undefined {
  return Object.prototype.hasOwnProperty.call(config.severities, key) ? config.severities[key] : undefined;
}

/** Line of a field in the record's source; for bulk records without positions, the row/record line. */
export function lineFor(loaded: LoadedRecord, field: string | null): number | null {
  if (field !== null) {
    const line = lineOf(loaded.positions, field);
    if (line !== null) return line;
  }
  return loaded.origin.kind === 'bulk' ? loaded.origin.line : null;
}

/** False when the configuration switches this message off (`severities: {check-id/message-id: off}`). */
export function messageEnabled(config: AuditConfig, checkId: string, messageId: string): boolean {
  return configuredSeverity(config, messageKey(checkId, messageId)) !== 'off';
}

export function toFinding(
  check: CheckModule,
  raw: RawFinding,
  loaded: LoadedRecord,
  config: AuditConfig,
): Finding {
  const configured = configuredSeverity(config, check.id);
  const forMessage = configuredSeverity(config, messageKey(check.id, raw.messageId));
  const template = check.messages[raw.messageId];
  const message =
    template !== undefined
      ? render(template, raw.data ?? {})
      : `${raw.messageId}${Object.keys(raw.data ?? {}).length ? ` (${JSON.stringify(raw.data)})` : ''}`;
  return {
    check: check.id,
    messageId: raw.messageId,
    severity: resolveSeverity(
      check.defaultSeverity,
      raw.severity,
      configured === 'off' ? undefined : configured,
      forMessage === 'off' ? undefined : forMessage,
    ),
    message,
    data: raw.data ?? {},
    line: lineFor(loaded, raw.field ?? null),
    field: raw.field ?? null,
    waived: null,
    ...(raw.fix === undefined ? {} : { fix: raw.fix }),
  };
}

/**
 * Marks findings accepted by a complete waiver (reason and approver given) that names them: their check, and
 * their message id and other record where the waiver narrows it (src/checks/waivers.ts).
 */
export function applyWaivers(findings: Finding[], loaded: LoadedRecord): void {
  const waivers = loaded.record?.waivers ?? [];
  if (waivers.length === 0) return;
  for (const f of findings) {
    if (f.check === INTERNAL_ERROR_ID) continue;
    f.waived = acceptingWaiver(waivers, f);
  }
}

export function internalError(check: Pick<CheckModule, 'id'>, error: unknown, loaded: LoadedRecord): Finding {
  const text = error instanceof Error ? error.message : String(error);
  return {
    check: INTERNAL_ERROR_ID,
    messageId: 'check-failed',
    severity: 'error',
    message:
      `The check ${check.id} failed with an internal error (${text}), so this record was not fully checked. ` +
      'This is a fault in stereogate, not in the record: please report it with the record attached.',
    data: { check: check.id, error: text },
    line: loaded.origin.kind === 'bulk' ? loaded.origin.line : null,
    field: null,
    waived: null,
  };
}

/** Id of the finding made when a record exceeds its time limit or memory bound (the bulk audit uses it too). */
export const TIME_LIMIT_ID = 'record-time-limit';

/** A record stopped by its time limit or memory bound: the finding names the limit and what to do. */
export function budgetFinding(loaded: LoadedRecord, kind: 'time' | 'memory', limit: number): Finding {
  const what =
    kind === 'time'
      ? `took longer than the ${limit / 1000} s time limit`
      : `needed more than the ${limit} MB memory bound`;
  return {
    check: TIME_LIMIT_ID,
    messageId: kind === 'time' ? 'time-limit-exceeded' : 'memory-bound-exceeded',
    severity: 'error',
    message:
      `The audit of this record ${what}; it was stopped, nothing about it was checked, and the run went on. ` +
      'Audit it on its own with a higher limit (--record-timeout), or simplify the structure (split a mixture, ' +
      'leave out repeated salt or solvent parts).',
    data: { kind, limit },
    line: loaded.origin.kind === 'bulk' ? loaded.origin.line : lineOf(loaded.positions, 'structure'),
    field: null,
    waived: null,
  };
}

export function schemaFindings(loaded: LoadedRecord, config: AuditConfig): Finding[] {
  const configured = configuredSeverity(config, SCHEMA_CHECK_ID);
  if (configured === 'off') return [];
  return loaded.problems.map((p) => ({
    check: SCHEMA_CHECK_ID,
    messageId: p.code ?? 'record-problem',
    severity: configured ?? 'error',
    message: p.message,
    data: { path: p.path, problem: p.message },
    line: p.line ?? (loaded.origin.kind === 'bulk' ? loaded.origin.line : null),
    field: p.path === '' ? null : p.path,
    waived: null,
  }));
}
