/**
 * The registry-wide phase: the second, cheap pass of every audit. Each record's keys (src/registry/keys.ts)
 * go into one index; a record is compared with the index by lookups, never with every other record.
 *
 * - full audit (folder, export, merged shards): records come in the audit's order; each is compared with the
 *   records before it and then filed, so a conflict is found once, when its later record passes.
 * - review (pull request): the index holds the whole registry first; each record under review is compared with
 *   every other record.
 * The findings come back ready for the record (severity after the config, line, waiver), plus the pairs the
 * summary lists once.
 */
import {
  compareWithRegistry,
  consistentWithRegistry,
  type RegistryMode,
  type RegistryPair,
} from '../checks/consistent-with-registry.js';
import type { AuditConfig, RawFinding } from '../checks/types.js';
import { acceptingWaiver, type WaivableFinding } from '../checks/waivers.js';
import { plural } from '../checks/words.js';
import { RegistryIndex, type Confirm } from '../registry/key-index.js';
import type { IndexRow } from '../registry/keys.js';
import type { LoadedRecord } from '../registry/types.js';
import { SCHEMA_CHECK_ID, configuredSeverity, messageEnabled, toFinding } from './findings.js';
import type { Finding, PassedCheck, RegistrySummary } from './types.js';

const CHECK = consistentWithRegistry;

export interface PhaseResult {
  findings: Finding[];
  /**
   * Evidence for the checklist when the check found nothing serious. A streamed audit adds it only to records it
   * rewrites anyway; its summary says once that the check ran over every record.
   */
  passed: PassedCheck | null;
  /**
   * Findings a review would make but a full audit only lists in its summary (an enantiomer registered before):
   * not reported, but a waiver naming one is in use, not stale.
   */
  listed?: WaivableFinding[];
}

export interface PhaseOptions {
  mode: RegistryMode;
  config: AuditConfig;
  /** relate() of two inexact keys (see key-index.ts); null: inexact keys pair with nothing. */
  confirm: Confirm | null;
  /** Whether the records' ids are compared too (record folders: a duplicate id is a schema problem). */
  duplicateIds?: boolean;
}

export class RegistryPhase {
  readonly index: RegistryIndex;
  private readonly pairs: RegistryPair[] = [];
  private readonly firstWithId = new Map<string, string>();
  private records = 0;
  private readonly enabled: boolean;
  private readonly underReview = new Set<IndexRow>();
  /** Review mode: records of the registry filed, under review or not. */
  private registryRecords = 0;
  /** The lookup keys of the records under review (review mode, set by `reviewing`): other keys are not filed. */
  private reach: Set<string> | null = null;

  constructor(private readonly options: PhaseOptions) {
    this.index = new RegistryIndex(options.confirm);
    this.enabled = configuredSeverity(options.config, CHECK.id) !== 'off';
  }

  /**
   * Review mode, before any `file`: the records that will be under review. A record of the registry whose keys
   * none of them looks up is then not filed: the same findings, without forming classes no lookup visits (which
   * may call `confirm`).
   */
  reviewing(rows: readonly IndexRow[]): void {
    this.reach = new Set();
    for (const r of rows) {
      const k = r.keys;
      if (k === null || k.stereo === null || k.mirror === null) continue;
      this.reach.add(`${k.constitution}#${k.stereo}`);
      this.reach.add(`${k.constitution}#${k.mirror}`);
    }
  }

  /** Review mode: a record of the registry, not under review (added before any `review`). */
  file(row: IndexRow): void {
    this.registryRecords++;
    const k = row.keys;
    if (this.reach && k !== null && k.stereo !== null && !this.reach.has(`${k.constitution}#${k.stereo}`))
      return;
    this.index.add(row);
  }

  /** Review mode: a record of the registry without keys (what `file` does with it: count it). */
  countKeyless(): void {
    this.registryRecords++;
  }

  /** Review mode: a record under review, filed before the reviews so that pairs of them are found. */
  fileUnderReview(row: IndexRow): void {
    this.registryRecords++;
    this.underReview.add(row);
    this.index.add(row);
  }

  /** Full mode: the next record in the audit's order. Review mode: a record under review (filed before). */
  next(row: IndexRow): PhaseResult {
    this.records++;
    const findings: Finding[] = [];
    if (this.options.duplicateIds && row.id !== null) {
      const first = this.firstWithId.get(row.id);
      if (first === undefined) this.firstWithId.set(row.id, row.file);
      else if (configuredSeverity(this.options.config, SCHEMA_CHECK_ID) !== 'off')
        findings.push(duplicateId(row, first, this.options.config));
    }
    if (!this.enabled || row.keys === null) {
      if (this.options.mode === 'full') this.index.add(row);
      return { findings, passed: null };
    }
    const full = this.options.mode === 'full';
    const matches = this.index.matches(row);
    const c = compareWithRegistry(row, matches, this.options.mode, this.options.config, (r) =>
      this.underReview.has(r),
    );
    if (full) this.index.add(row);
    this.pairs.push(...c.pairs);
    for (const raw of c.findings)
      if (messageEnabled(this.options.config, CHECK.id, raw.messageId))
        findings.push(rowFinding(raw, row, this.options.config));
    const passed = !c.findings.some((f) => (f.severity ?? CHECK.defaultSeverity) !== 'note')
      ? { check: CHECK.id, evidence: c.passed }
      : null;
    // the summary lists an enantiomer pair once; a review says it on the later record (enantiomer-registered)
    const listed: WaivableFinding[] = full
      ? c.pairs
          .filter((p) => p.relation === 'enantiomers')
          .map((p) => ({
            check: CHECK.id,
            messageId: 'enantiomer-registered',
            data: { otherId: p.first.id ?? p.first.file, otherFile: p.first.file },
          }))
      : [];
    return listed.length > 0 ? { findings, passed, listed } : { findings, passed };
  }

  summary(): RegistrySummary {
    // a review files only the keys its records look up, so it counts records, not keys
    const how =
      this.options.mode === 'full'
        ? `every record with each record before it through an index of the keys of ${plural(this.index.size, 'record')}`
        : `each record under review with the whole registry (${plural(this.registryRecords, 'record')}) through its key index`;
    return {
      status: this.enabled ? 'run' : 'not-run',
      reason: this.enabled ? `compared ${how}` : `${CHECK.id} is off in the configuration`,
      records: this.records,
      ...(this.options.mode === 'full' ? {} : { comparedWith: this.registryRecords }),
      pairs: this.pairs,
    };
  }
}

/** The summary of a run whose registry-wide phase did not run (one shard of a split run). */
export function notRunSummary(reason: string, records: number): RegistrySummary {
  return { status: 'not-run', reason, records, pairs: [] };
}

/** The registry check's finding for a record known only by its row: lines from the row, the rest as any check's. */
function rowFinding(raw: RawFinding, row: IndexRow, config: AuditConfig): Finding {
  const lines: Record<string, number | null> = {
    id: row.lines.id,
    structure: row.lines.structure,
    'stereo.rotation.value': row.lines.rotation ?? row.lines.structure,
  };
  const positions = {
    get: (path: string) => (lines[path] != null ? { line: lines[path]!, column: 1 } : undefined),
  };
  const loaded: LoadedRecord = {
    file: row.file,
    id: row.id,
    record: null,
    positions,
    problems: [],
    origin: { kind: 'file' },
  };
  const f = toFinding(CHECK, raw, loaded, config);
  // rows written before waivers were kept in full have none (a shard of an older run)
  return { ...f, waived: acceptingWaiver(row.waivers ?? [], f) };
}

function duplicateId(row: IndexRow, first: string, config: AuditConfig): Finding {
  const configured = configuredSeverity(config, SCHEMA_CHECK_ID);
  const message = `id: '${row.id}' is also used by ${first}; every record needs its own id`;
  return {
    check: SCHEMA_CHECK_ID,
    messageId: 'duplicate-id',
    severity: configured === 'off' || configured === undefined ? 'error' : configured,
    message,
    data: { path: 'id', problem: message },
    line: row.lines.id,
    field: 'id',
    waived: null,
  };
}
