/**
 * The audit: records -> structures -> facts -> check findings -> results. Knows nothing about where the output
 * goes. `runAudit` loads a registry from disk; `auditRecords` is the pure core (records from anywhere).
 */
import { existsSync, realpathSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import type { AuditConfig, CheckContext, CheckModule, RegistryView } from '../checks/types.js';
import { stillMatchesNothing } from '../checks/waivers.js';
import { closestWord } from '../registry/closest.js';
import { loadRegistry } from '../registry/load.js';
import type { LoadedRecord } from '../registry/types.js';
import { CAUTION } from './caution.js';
import { ConfigError, DEFAULT_CONFIG, checkSeverityIds, loadConfig } from './config.js';
import { defaultEngine, type AuditEngine } from './engine.js';
import {
  budgetFinding,
  SCHEMA_CHECK_ID,
  applyWaivers,
  configuredSeverity,
  internalError,
  messageEnabled,
  schemaFindings,
  toFinding,
} from './findings.js';
import { selectRecords } from './select.js';
import { BudgetExceeded, withBudget, type Budget } from '../chem/budget.js';
import { indexRow } from './index-row.js';
import { RegistryPhase, type PhaseResult } from './registry-phase.js';
import { StructureCache, readOnly } from './structures.js';
import type { AuditResult, AuditSummary, Finding, NotRunCheck, PassedCheck, RecordResult } from './types.js';
import { VERSION } from './version.js';
import { buildRegistryView } from './view.js';
import type { Confirm } from '../registry/key-index.js';
import type { RecordKeys } from '../registry/keys.js';
import type { IndexRowData } from '../registry/index-cache.js';

/**
 * Default per-record limits of the audit: 20 s (as the bulk audit's --record-timeout) and 1 GiB of heap growth.
 * A record over either gets a record-time-limit finding and the run goes on.
 */
export const RECORD_BUDGET: Readonly<Budget> = Object.freeze({ timeMs: 20_000, memoryMb: 1024 });

export interface AuditRecordsOptions {
  /** Per-record time and memory limits (default RECORD_BUDGET). */
  budget?: Budget;
  checks: readonly CheckModule[];
  config?: AuditConfig;
  engine: AuditEngine;
  /**
   * The whole registry the records belong to: the records are then reviewed against it (a pull request).
   * Default: the audited records are the registry, audited in full.
   */
  registry?: readonly LoadedRecord[];
  /**
   * Why `registry` is not the whole registry (a bulk run auditing each record on its own, one shard), or
   * undefined when it is: checks that need the registry are then reported as not run with this reason.
   */
  registryIncomplete?: string;
  /** false: skip the registry-wide phase (one bulk item: the main thread runs it over all of them). */
  registryPhase?: boolean;
  /** The registry as per-record checks see it, when the caller has one (a streamed audit's lazy view). */
  view?: RegistryView;
  /**
   * Instead of `registry`: the rest of the registry (every record not audited) as rows of its key index, in
   * registry order — a review against a cached index (review-against-index.ts). The records are then reviewed.
   */
  otherRows?: () => Iterable<IndexRowData>;
}

/** Audits `records` (each must also be in `registry` when one is given). Pure apart from the engine. */
export function auditRecords(records: readonly LoadedRecord[], options: AuditRecordsOptions): AuditResult {
  const config = options.config ?? { ...DEFAULT_CONFIG };
  const cache = new StructureCache(options.engine);
  const engineApi = { relate: options.engine.relate.bind(options.engine) };
  const budget = options.budget ?? RECORD_BUDGET;
  const audited = new Set(records);
  const registry =
    options.view ?? buildRegistryView(options.registry ?? records, cache, (r) => audited.has(r));
  if (options.registryIncomplete) registry.incomplete = options.registryIncomplete;
  const results = records.map((loaded): RecordResult => {
    try {
      return withBudget(budget, 'the audit of this record', () =>
        auditOne(loaded, options.checks, config, cache, registry, engineApi),
      );
    } catch (e) {
      if (e instanceof BudgetExceeded) return overBudget(loaded, e, options.checks);
      // a fault outside any one check (a bug): this record gets an internal-error finding, the others go on
      return {
        id: loaded.id,
        file: loaded.file,
        computed: null,
        findings: [internalError({ id: 'audit' }, e, loaded)],
        passed: [],
        declared: { form: null, descriptors: null },
      };
    }
  });
  const result: AuditResult = {
    tool: { name: 'stereogate', version: VERSION },
    records: results,
    summary: summarize(results),
    caution: CAUTION,
  };
  if (
    options.registryPhase !== false &&
    !options.registryIncomplete &&
    options.checks.some((c) => c.scope === 'registry')
  ) {
    const review = options.registry !== undefined || options.otherRows !== undefined;
    const phase = new RegistryPhase({
      mode: review ? 'review' : 'full',
      config,
      confirm: confirmWith(options.engine),
      duplicateIds: false,
    });
    // a registry record's structure is described within the same per-record budget; over it, it has no keys
    const mainOf = (r: LoadedRecord) => {
      try {
        return withBudget(budget, 'the structure of a registry record', () => cache.main(r));
      } catch {
        return { structure: null, facts: null, error: null };
      }
    };
    const rows = records.map((r, i) => indexRow(r, mainOf(r), i + 1));
    if (review) {
      const audited = new Set(records);
      phase.reviewing(rows);
      let seq = records.length;
      if (options.otherRows)
        for (const row of options.otherRows()) {
          // a row without keys is only counted: no copy of it
          if (row.keys === null) {
            seq++;
            phase.countKeyless();
          } else phase.file({ ...row, seq: ++seq });
        }
      else for (const r of options.registry!) if (!audited.has(r)) phase.file(indexRow(r, mainOf(r), ++seq));
      for (const row of rows) phase.fileUnderReview(row);
    }
    rows.forEach((row, i) => addPhaseResult(results[i]!, phase.next(row)));
    result.summary = summarize(results);
    result.registry = phase.summary();
  }
  return result;
}

/** relate() of two inexact keys from their kept structure texts (see src/registry/key-index.ts). */
export function confirmWith(engine: AuditEngine): Confirm {
  const read = (k: RecordKeys) =>
    k.text
      ? readOnly({ field: 'structure', format: k.text.format, text: k.text.text }, engine).structure
      : null;
  return (a, b) => {
    const sa = read(a);
    const sb = read(b);
    if (!sa || !sb) return null;
    try {
      return engine.relate(sa, sb).relation;
    } catch {
      return null;
    }
  };
}

/** Adds what the registry-wide phase found to a record audited before (checks in CHECKS order). */
export function addPhaseResult(r: Pick<RecordResult, 'findings' | 'passed'>, p: PhaseResult): void {
  if (p.findings.length > 0 || (p.listed?.length ?? 0) > 0) {
    // a waiver of the registry-wide check matched nothing per record; now it may match
    const more = p.listed ? [...p.findings, ...p.listed] : p.findings;
    r.findings = r.findings.filter((f) => stillMatchesNothing(f, more));
    r.findings.push(...p.findings);
  }
  if (p.passed) r.passed.push(p.passed);
}

function auditOne(
  loaded: LoadedRecord,
  checks: readonly CheckModule[],
  config: AuditConfig,
  cache: StructureCache,
  registry: CheckContext['registry'],
  engine: CheckContext['engine'],
): RecordResult {
  const { main, components } = cache.all(loaded);
  const findings: Finding[] = schemaFindings(loaded, config);
  applyWaivers(findings, loaded);
  const passed: PassedCheck[] = [];
  const notRun: NotRunCheck[] = [];
  const notApplicable: NotRunCheck[] = [];
  // A file that could not be parsed at all (syntax error, unreadable) has only its record-schema findings.
  const unparsed = loaded.record === null && loaded.sources === undefined && loaded.problems.length > 0;
  for (const check of unparsed ? [] : checks) {
    if (configuredSeverity(config, check.id) === 'off') continue;
    const ctx: CheckContext = {
      loaded,
      record: loaded.record,
      main,
      components,
      registry,
      config,
      engine,
      findings: [...findings],
    };
    const missing = missingInput(check, ctx);
    if (missing !== null) {
      notRun.push({ check: check.id, reason: missing });
      continue;
    }
    // the registry-wide phase runs it, over every record's keys
    if (check.scope === 'registry') continue;
    let produced: Finding[];
    let outcome;
    try {
      outcome = check.run(ctx);
      if (!outcome || !Array.isArray(outcome.findings))
        throw new Error('the check returned no findings list');
      produced = outcome.findings
        .filter((raw) => messageEnabled(config, check.id, raw.messageId))
        .map((raw) => toFinding(check, raw, loaded, config));
    } catch (e) {
      if (e instanceof BudgetExceeded) throw e; // the record's limit, not a fault of the check
      findings.push(internalError(check, e, loaded));
      continue;
    }
    applyWaivers(produced, loaded);
    findings.push(...produced);
    if (outcome.notRun !== undefined && produced.length === 0) {
      notRun.push({ check: check.id, reason: outcome.notRun });
    } else if (outcome.notApplicable !== undefined && produced.length === 0) {
      notApplicable.push({ check: check.id, reason: outcome.notApplicable });
    } else if (produced.length === 0) {
      passed.push({ check: check.id, evidence: outcome.passed ?? '' });
    }
  }
  const record = loaded.record;
  return {
    id: loaded.id,
    file: loaded.file,
    computed: main.facts,
    findings,
    passed,
    notRun,
    notApplicable,
    declared: { form: record?.stereo.form ?? null, descriptors: record?.stereo.descriptors ?? null },
  };
}

/**
 * Why a check cannot run on this record, or null: a structure it needs could not be read, or the registry it
 * compares with is not all there. Such a check is reported as not run, never as passed.
 */
function missingInput(check: CheckModule, ctx: CheckContext): string | null {
  const needs = check.requires ?? [];
  if (needs.includes('structure')) {
    if (ctx.record === null) return 'the record does not follow the record schema (see record-schema)';
    if (ctx.main.facts === null) {
      return ctx.main.error
        ? 'the structure could not be read (see structure-readable)'
        : 'the record gives no structure';
    }
  }
  if (needs.includes('registry') && ctx.registry.incomplete) return ctx.registry.incomplete;
  return null;
}

/** The result of a record stopped by its budget: one record-time-limit finding, nothing else claimed. */
function overBudget(loaded: LoadedRecord, e: BudgetExceeded, checks: readonly CheckModule[]): RecordResult {
  const reason =
    e.kind === 'time'
      ? 'the record was stopped at its time limit (see record-time-limit)'
      : 'the record was stopped at its memory bound (see record-time-limit)';
  return {
    id: loaded.id,
    file: loaded.file,
    computed: null,
    findings: [budgetFinding(loaded, e.kind, e.limit)],
    passed: [],
    notRun: checks.map((c) => ({ check: c.id, reason })),
    declared: {
      form: loaded.record?.stereo.form ?? null,
      descriptors: loaded.record?.stereo.descriptors ?? null,
    },
  };
}

export function summarize(records: readonly RecordResult[]): AuditSummary {
  const s: AuditSummary = { records: records.length, errors: 0, warnings: 0, notes: 0, waived: 0 };
  for (const r of records) {
    for (const f of r.findings) {
      if (f.waived) s.waived++;
      else if (f.severity === 'error') s.errors++;
      else if (f.severity === 'warning') s.warnings++;
      else s.notes++;
    }
  }
  return s;
}

export interface RunAuditOptions {
  /** Registry root (the folder holding stereogate.config.yml and the record folders). */
  root: string;
  /** Record files, folders or molfiles to audit, relative to the root; default all records. */
  paths?: string[];
  /** Overrides on top of the config file. */
  config?: Partial<AuditConfig>;
  /** Config file to read instead of the one at the root. */
  configFile?: string;
  /** Check modules; default CHECKS from src/checks/index.ts. */
  checks?: CheckModule[];
  /** Engine; default src/chem. */
  engine?: AuditEngine;
  /** Per-record time and memory limits (default RECORD_BUDGET). */
  budget?: Budget;
  /**
   * With paths: the file that caches the registry's key index between runs (review-against-index.ts); null or
   * absent for none. Used with the default engine only.
   */
  indexCache?: string | null;
  /** Lines about the work done (which records were read, the cache); default nowhere. */
  log?: (line: string) => void;
}

/**
 * The registry root as a real path, its config (the file, then the overrides) checked against the checks' ids,
 * and the checks. Throws ConfigError on usage errors.
 */
export async function openRegistry(
  options: Pick<RunAuditOptions, 'root' | 'config' | 'configFile' | 'checks'>,
): Promise<{ root: string; config: AuditConfig; checks: CheckModule[] }> {
  const rootAbs = resolve(options.root);
  if (!existsSync(rootAbs) || !statSync(rootAbs).isDirectory()) {
    throw new ConfigError(`registry folder ${options.root} does not exist`);
  }
  const root = realpathSync(rootAbs);
  const { config } = loadConfig(root, options.configFile, stripUndefined(options.config));
  const checks = options.checks ?? (await import('../checks/index.js')).CHECKS;
  const ids = [SCHEMA_CHECK_ID, ...checks.map((c) => c.id)];
  const messageIds = new Map(checks.map((c) => [c.id, Object.keys(c.messages)]));
  checkSeverityIds(
    config,
    ids,
    (w) => closestWord(w, ids),
    (id) => messageIds.get(id),
  );
  return { root, config, checks };
}

/** The usage error for record folders named in the config that do not exist. */
export function missingDirsError(missing: readonly string[], root: string): ConfigError {
  return new ConfigError(
    `record folder${missing.length > 1 ? 's' : ''} ${missing.map((d) => `'${d}'`).join(', ')} ` +
      `not found in ${root} (set recordDirs in stereogate.config.yml)`,
  );
}

/**
 * Audits every record under `root`, or reviews those named by `paths` against the registry (through its key
 * index: review-against-index.ts). Throws ConfigError on usage errors.
 */
export async function runAudit(options: RunAuditOptions): Promise<AuditResult> {
  const { root, config, checks } = await openRegistry(options);
  const engine = options.engine ?? (await defaultEngine({ axisOrthoMin: config.axisOrthoMin }));
  if (options.paths && options.paths.length > 0) {
    // a review: the rest of the registry is read through its key index, not loaded
    const { reviewAgainstIndex } = await import('./review-against-index.js');
    const reviewed = await reviewAgainstIndex({
      realRoot: root,
      paths: options.paths,
      config,
      checks,
      engine,
      defaultEngine: options.engine === undefined,
      budget: options.budget ?? RECORD_BUDGET,
      indexCache: options.indexCache ?? null,
      ...(options.log ? { log: options.log } : {}),
    });
    if (reviewed) return reviewed;
  }
  const load = loadRegistry(root, { recordDirs: config.recordDirs });
  if (load.missingDirs.length > 0) throw missingDirsError(load.missingDirs, options.root);
  let toAudit: LoadedRecord[] = load.records;
  let unmatched: string[] = [];
  if (options.paths && options.paths.length > 0) {
    const sel = selectRecords(load.records, root, options.paths);
    toAudit = load.records.filter((r) => sel.selected.has(r));
    unmatched = sel.unmatched;
  }
  // every record: a full audit (each compared with those before it); some: a review against the registry
  const registry = toAudit.length === load.records.length ? undefined : load.records;
  const result = auditRecords(toAudit, { checks, config, engine, registry, budget: options.budget });
  if (unmatched.length > 0) result.unmatched = unmatched;
  return result;
}

function stripUndefined(o: Partial<AuditConfig> | undefined): Partial<AuditConfig> | undefined {
  if (!o) return undefined;
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<AuditConfig>;
}
