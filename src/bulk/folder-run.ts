/**
 * The full audit of a registry's record folders through the bulk audit's ordered worker pool: record files
 * stream to the workers (record-files.ts lists them), each worker loads and audits its files, and this thread
 * keeps only each record's row of the key index for the registry-wide phase, adds what that phase finds to the
 * record, and hands the record on (to the streamed reports) in the audit's order. Same results as auditRecords
 * over the whole registry; memory flat in the number of records but for the key index.
 */
import { availableParallelism } from 'node:os';
import { confirmWith, addPhaseResult, summarize } from '../audit/run.js';
import { defaultEngine, type AuditEngine } from '../audit/engine.js';
import { RegistryPhase } from '../audit/registry-phase.js';
import type { AuditSummary, RegistrySummary } from '../audit/types.js';
import { isInternalError } from '../audit/findings.js';
import type { AuditConfig, CheckModule } from '../checks/types.js';
import type { Budget } from '../chem/budget.js';
import { mapOrdered, type PoolStats } from './pool.js';
import { makeProgress, type ProgressMode } from './progress.js';
import {
  auditRecordFile,
  makeFolderContext,
  stoppedRecordFile,
  type FolderRecord,
  type FolderSetup,
} from './record-file-audit.js';
import type { RecordFileItem, RecordFolder } from './record-files.js';
import { WORKER_HEAP_MB } from './run.js';

export interface FolderRunOptions {
  folder: RecordFolder;
  config: AuditConfig;
  /** Per-record limits (the worker stops a record at them itself, as the in-memory audit does). */
  budget: Budget;
  /** Worker threads (default: all cores); 0 audits in this thread through the same steps. */
  workers?: number;
  /** Whether the records' facts come back as JSON text (a JSON report is written). */
  json: boolean;
  progress?: ProgressMode;
  /** Each record in the audit's order, registry-wide findings added. */
  onRecord: (r: FolderRecord) => Promise<void> | void;
  /** Checks and engine of this thread (the registry-wide phase, and the audit when workers is 0). */
  checks: readonly CheckModule[];
  engine?: AuditEngine;
  batchSize?: number;
  /** Worker entry (default: the bulk worker, ./worker); tests give one that fails on purpose. */
  script?: URL;
  onPoolStats?: (stats: PoolStats) => void;
}

export interface FolderRunResult {
  summary: AuditSummary;
  registry?: RegistrySummary;
  /** A record got an internal-error finding (stereogate failed on it). */
  internalErrors: boolean;
}

/** How long the pool waits on a record before it stops its worker: past the record's own limit, a backstop. */
export function poolLimitMs(budget: Budget): number {
  return Math.ceil(budget.timeMs * 1.25) + 2000;
}

export async function runFolderAudit(opts: FolderRunOptions): Promise<FolderRunResult> {
  // never more workers than record files: each costs a heap and a start-up (--workers 64 on 3 files starts 3)
  const asked = opts.workers ?? Math.max(1, availableParallelism());
  const workers = asked === 0 ? 0 : Math.min(asked, Math.max(1, opts.folder.items.length));
  const setup: FolderSetup = {
    kind: 'record-files',
    config: opts.config,
    lookup: opts.folder.lookup,
    budget: opts.budget,
    json: opts.json,
  };
  const engine = opts.engine ?? (await defaultEngine({ axisOrthoMin: opts.config.axisOrthoMin }));
  const phase = opts.checks.some((c) => c.scope === 'registry')
    ? new RegistryPhase({
        mode: 'full',
        config: opts.config,
        confirm: confirmWith(engine),
        duplicateIds: false,
      })
    : null;
  let inline: ((item: RecordFileItem) => FolderRecord) | undefined;
  if (workers === 0) {
    const ctx = await makeFolderContext(setup, opts.checks);
    ctx.engine = engine;
    inline = (item) => auditRecordFile(item, ctx);
  }
  const limit = poolLimitMs(opts.budget);
  const stopped = (item: RecordFileItem, crashed: string | null) =>
    stoppedRecordFile(item, opts.folder.idOf(item.seq), limit, crashed);
  const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
  const results = mapOrdered<RecordFileItem, FolderRecord>(opts.folder.items, {
    workers,
    script: opts.script ?? new URL(`./worker${ext}`, import.meta.url),
    workerData: setup,
    timeoutMs: limit,
    onTimeout: (item) => stopped(item, null),
    onCrash: (item, _i, error) => stopped(item, error),
    inline,
    resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB },
    batchSize: opts.batchSize ?? 16,
    onStats: opts.onPoolStats,
  });
  const progress = makeProgress(opts.progress ?? 'auto', opts.folder.items.length);
  const summary: AuditSummary = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  let internalErrors = false;
  try {
    for await (const r of results) {
      if (phase) addPhaseResult(r.result, phase.next(r.row));
      const s = summarize([r.result]);
      for (const k of ['records', 'errors', 'warnings', 'notes', 'waived'] as const) summary[k] += s[k];
      internalErrors ||= r.result.findings.some(isInternalError);
      await opts.onRecord(r);
      progress.tick();
    }
  } finally {
    progress.stop();
  }
  return phase ? { summary, registry: phase.summary(), internalErrors } : { summary, internalErrors };
}
