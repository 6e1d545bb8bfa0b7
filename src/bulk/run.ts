/**
 * The bulk audit: stream SD/CSV/TSV inputs through worker threads, write results in input order, keep memory
 * flat. `--shard i/N` audits every N-th record; `mergeShards` (merge.ts) recombines shard outputs into the
 * result of a single run.
 */
import { createReadStream } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { AuditConfig } from '../checks/types.js';
import { auditItem, itemId, type BulkRecordResult } from './audit-item.js';
import { makeItemContext, type WorkerSetup } from './context.js';
import type { BulkMapping } from './mapping.js';
import { collectOriginInputs } from './origins.js';
import { BulkAccumulator } from './accumulate.js';
import { mapOrdered, type PoolStats } from './pool.js';
import { BulkRegistryPhase, notRunSummary, shardNotRun } from './registry-stream.js';
import { makeProgress, type ProgressMode } from './progress.js';
import { formatOf, readItems, shardFilter, type BulkItem } from './sources.js';
import { makeRenderer, type RenderedRecord } from './render-record.js';
import { bulkSarifRules } from './sarif-writer.js';
import { wantsOf, type BulkTrailer, type RecordWriter } from './writers.js';

export interface BulkOptions {
  inputs: string[];
  mapping: BulkMapping;
  config: AuditConfig;
  /** Worker threads; default: all cores. 0 = in this thread. */
  workers?: number;
  shard?: { index: number; count: number } | null;
  /** Per-record time limit in ms (default 20 s). */
  timeoutMs?: number;
  progress?: ProgressMode;
  writers: RecordWriter[];
  /** Items per message to a worker (default 16). */
  batchSize?: number;
  /** Pool accounting at the end of the run (items read ahead, in flight, buffered: the memory window). */
  onPoolStats?: (stats: PoolStats) => void;
  /** Called for every rendered record in order. */
  onRecord?: (r: RenderedRecord) => void;
}

/** Heap growth one record may cause before it is stopped (a record-time-limit finding). */
export const RECORD_MEMORY_MB = 1024;
/**
 * Old-generation heap limit of each bulk worker: a record that outgrows it crashes only its worker (the pool
 * reports it on that record and starts a new worker), never the machine.
 */
export const WORKER_HEAP_MB = 1536;

export function isBulkInput(path: string): boolean {
  return formatOf(path) !== null;
}

/** Fast pre-count of records (for the progress bar's time left): `$$$$` lines, or data lines of a CSV. */
export async function countRecords(path: string): Promise<number> {
  const f = formatOf(path);
  let count = 0;
  let atLineStart = true;
  let lineHasText = false;
  let dollars = 0;
  for await (const chunk of createReadStream(path) as AsyncIterable<Buffer>) {
    for (let i = 0; i < chunk.length; i++) {
      const c = chunk[i];
      if (c === 10) {
        if (f !== 'sd' && lineHasText) count++;
        atLineStart = true;
        lineHasText = false;
        dollars = 0;
        continue;
      }
      if (c !== 13 && c !== 32) lineHasText = true;
      if (f === 'sd' && (atLineStart || dollars > 0)) {
        if (c === 36) {
          dollars++;
          if (dollars === 4) count++;
        } else dollars = 0;
      }
      atLineStart = false;
    }
  }
  if (f !== 'sd' && lineHasText) count++;
  return f === 'sd' ? count : Math.max(0, count - 1); // minus the header row
}

async function* allItems(inputs: string[]): AsyncGenerator<BulkItem & { seq: number }> {
  let seq = 0;
  for (const path of inputs) for await (const item of readItems(path)) yield { ...item, seq: ++seq };
}

export function timeoutResult(
  item: BulkItem & { seq: number },
  limitMs: number,
  crashed: string | null,
  id: string | null = null,
): BulkRecordResult {
  const message = crashed
    ? `the audit of this record crashed its worker (${crashed}); it was not audited, the run went on`
    : `the audit of this record took longer than the ${Math.round(limitMs / 1000)} s limit; it was stopped and the run went on`;
  return {
    seq: item.seq,
    id,
    file: item.source,
    computed: null,
    findings: [
      {
        check: 'record-time-limit',
        messageId: crashed ? 'worker-crashed' : 'time-limit-exceeded',
        severity: 'error',
        message:
          message +
          ` (record ${item.record}, line ${item.line}). Audit it on its own with a longer --record-timeout, or simplify the structure.`,
        data: { record: item.record, line: item.line, limit_ms: limitMs },
        line: item.line,
        field: null,
        waived: null,
      },
    ],
    passed: [],
    declared: { form: null, descriptors: null },
    origin: { source: item.source, record: item.record, line: item.line },
    form_word: { word: null, how: 'empty' },
  };
}

export interface BulkRunSummary {
  trailer: BulkTrailer;
  /** The whole run, reports included. */
  seconds: number;
  /** Reading and auditing the records (up to the last record written); the rest is finishing the reports. */
  auditSeconds: number;
}

export async function runBulkAudit(opts: BulkOptions): Promise<BulkRunSummary> {
  const started = Date.now();
  const workers = opts.workers ?? Math.max(1, availableParallelism());
  const timeoutMs = opts.timeoutMs ?? 20_000;
  const progressMode = opts.progress ?? 'auto';
  let total: number | null = null;
  if (progressMode !== 'none') {
    total = 0;
    for (const p of opts.inputs) total += await countRecords(p);
    if (opts.shard) total = Math.ceil(total / opts.shard.count);
  }
  const progress = makeProgress(progressMode, total);
  const wants = wantsOf(opts.writers);
  // the worker stops a record itself a little before the pool would terminate it (no worker restart then)
  const budget = { timeMs: Math.max(1, Math.floor(timeoutMs * 0.9)), memoryMb: RECORD_MEMORY_MB };
  // one shard: the registry-wide checks wait for the merge; one run: this thread runs them as results stream
  // past, and may render a record again, so the workers write every record's JSON text
  const registryNotRun = opts.shard ? shardNotRun(opts.shard) : null;
  const setup: WorkerSetup = {
    mapping: opts.mapping,
    config: opts.config,
    wants: registryNotRun === null ? { ...wants, jsonl: true } : wants,
    budget,
    registryNotRun,
  };
  if (opts.mapping.origin) setup.originInputs = await collectOriginInputs(opts.inputs, opts.mapping);
  const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
  const script = new URL(`./worker${ext}`, import.meta.url);
  // Time-limit and crash results are made here, so this thread renders them too (same rules as the workers).
  const { CHECKS } = await import('../checks/index.js');
  const render = makeRenderer(wants, bulkSarifRules(CHECKS));
  let inline: ((item: BulkItem & { seq: number }) => RenderedRecord) | undefined;
  if (workers === 0) {
    const ctx = await makeItemContext(setup);
    inline = (item) => ctx.render(auditItem(item, ctx));
  }
  const phase = registryNotRun === null ? await BulkRegistryPhase.create(opts.config, render, CHECKS) : null;
  const acc = new BulkAccumulator();
  const results = mapOrdered<BulkItem & { seq: number }, RenderedRecord>(
    shardFilter(allItems(opts.inputs), opts.shard ?? null),
    {
      workers,
      script,
      workerData: setup,
      timeoutMs,
      onTimeout: (item) => render(timeoutResult(item, timeoutMs, null, itemId(item, opts.mapping))),
      onCrash: (item, _i, error) => render(timeoutResult(item, timeoutMs, error, itemId(item, opts.mapping))),
      inline,
      resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB },
      batchSize: opts.batchSize ?? 16,
      onStats: opts.onPoolStats,
    },
  );
  const shard = opts.shard ? `${opts.shard.index}/${opts.shard.count}` : null;
  try {
    for await (const rendered of results) {
      let r = phase ? phase.rendered(rendered) : rendered;
      // the JSON text was made for the phase only: no output wants it
      if (phase && !wants.jsonl && r.jsonl !== '') r = { ...r, jsonl: '' };
      acc.add(r.tally);
      for (const w of opts.writers) await w.write(r);
      opts.onRecord?.(r);
      progress.tick();
    }
  } catch (e) {
    // a fault of stereogate itself: the outputs still get what was computed, then the error ends the run (exit 3)
    const partial = acc.trailer(shard);
    for (const w of opts.writers) await w.finish(partial).catch(() => undefined);
    throw e;
  } finally {
    progress.stop();
  }
  const audited = Date.now();
  const trailer = acc.trailer(shard);
  trailer.registry = phase ? phase.summary() : notRunSummary(registryNotRun!, trailer.summary.records);
  for (const w of opts.writers) await w.finish(trailer);
  return { trailer, seconds: (Date.now() - started) / 1000, auditSeconds: (audited - started) / 1000 };
}
