/**
 * The registry index of a pull-request review: one row of keys per record file (index-keys.ts), taken from the
 * cache where the file's blob id (and those of its molfiles) still match, read and keyed otherwise. A file
 * renamed without change keeps its row. Many files to key (a cold cache on a large registry) are keyed by the
 * worker pool of the bulk audit, one worker per core; a few, or an engine handed in by the caller, in this thread.
 */
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import type { Budget } from '../chem/budget.js';
import { mapOrdered } from '../bulk/pool.js';
import { BlobIds, gitBlobIds } from '../registry/blob-ids.js';
import {
  readIndexCache,
  writeIndexCache,
  type CacheSettings,
  type IndexEntry,
} from '../registry/index-cache.js';
import type { AuditEngine } from './engine.js';
import { keyRecordFile, type KeyedFile } from './index-keys.js';
import type { IndexWorkerSetup } from './index-worker.js';
import { VERSION } from './version.js';

/** Fewer files than this to key: this thread keys them (starting workers costs about a second). */
export const MIN_FILES_FOR_WORKERS = 400;

export interface IndexBuildOptions {
  realRoot: string;
  /** The record files, paths relative to the root, sorted. */
  files: readonly string[];
  recordDirs: readonly string[];
  engine: AuditEngine;
  /**
   * True when `engine` is the default engine for `axisOrthoMin`: workers can make their own, and the cache file
   * is used (a cache made by another engine would not match).
   */
  defaultEngine: boolean;
  axisOrthoMin: number;
  budget: Budget;
  /** Cache file, or null for none. */
  cachePath: string | null;
  /** Workers for keying; default one per core (at most 2) when at least MIN_FILES_FOR_WORKERS files are read. */
  workers?: number;
}

export interface BuiltIndex {
  /** One entry per file, in the order of `files`. */
  entries: IndexEntry[];
  /** What happened, in a sentence (for the log). */
  account: string;
}

export async function buildIndex(opts: IndexBuildOptions): Promise<BuiltIndex> {
  const settings: CacheSettings = { version: VERSION, axisOrthoMin: opts.axisOrthoMin };
  const useCache = opts.cachePath !== null && opts.defaultEngine;
  const read = useCache ? readIndexCache(opts.cachePath!, settings) : null;
  const byPath = new Map<string, IndexEntry>();
  const byBlob = new Map<string, IndexEntry>();
  for (const e of read?.entries ?? []) {
    byPath.set(e.file, e);
    if (e.molfiles.length === 0) byBlob.set(e.blob, e);
  }
  const blobs = new BlobIds(gitBlobIds(opts.realRoot, opts.recordDirs), (rel) => join(opts.realRoot, rel));
  const current = (e: IndexEntry) => e.molfiles.every(([path, blob]) => blobs.of(path) === blob);

  const entries: (IndexEntry | null)[] = new Array<IndexEntry | null>(opts.files.length).fill(null);
  const fileBlobs: (string | null)[] = [];
  const toKey: number[] = [];
  let reused = 0;
  opts.files.forEach((file, i) => {
    const blob = blobs.of(file);
    fileBlobs.push(blob);
    if (blob !== null) {
      const same = byPath.get(file);
      if (same && same.blob === blob && current(same)) {
        entries[i] = same;
        reused++;
        return;
      }
      // renamed (or copied) without change: the row is the file's content but for its path
      const moved = byBlob.get(blob);
      if (moved) {
        entries[i] = { ...moved, file, row: { ...moved.row, file } };
        reused++;
        return;
      }
    }
    toKey.push(i);
  });

  const unkept = new Set<IndexEntry>();
  const workers =
    opts.workers ??
    (opts.defaultEngine && toKey.length >= MIN_FILES_FOR_WORKERS ? Math.min(2, availableParallelism()) : 0);
  const noEngine = (abs: string) => keyRecordFile(opts.realRoot, abs, null, opts.budget);
  const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
  const setup: IndexWorkerSetup = {
    realRoot: opts.realRoot,
    budget: opts.budget,
    axisOrthoMin: opts.axisOrthoMin,
  };
  const keyed = mapOrdered<string, KeyedFile>(
    toKey.map((i) => join(opts.realRoot, opts.files[i]!)),
    {
      workers,
      script: new URL(`./index-worker${ext}`, import.meta.url),
      workerData: setup,
      // the worker stops a record at its budget itself; this is the backstop for a stuck or crashed worker
      timeoutMs: opts.budget.timeMs * 2 + 30_000,
      onTimeout: noEngine,
      onCrash: noEngine,
      inline: (abs) => keyRecordFile(opts.realRoot, abs, opts.engine, opts.budget),
      batchSize: 32,
    },
  );
  let k = 0;
  for await (const result of keyed) {
    const i = toKey[k++]!;
    const file = opts.files[i]!;
    const blob = fileBlobs[i];
    const molfiles = result.molfiles.map((m): [string, string | null] => [m, blobs.of(m)]);
    // a file or molfile that could not be read for its blob id is used this once, not cached
    const entry: IndexEntry = {
      file,
      blob: blob ?? '',
      molfiles: molfiles.map(([m, b]) => [m, b ?? '']),
      valid: result.valid,
      row: result.row,
    };
    if (!result.keep || blob === null || molfiles.some((m) => m[1] === null)) unkept.add(entry);
    entries[i] = entry;
  }

  const all = entries as IndexEntry[];
  const parts = [
    `${opts.files.length} record file(s)`,
    `${reused} from the cache`,
    `${toKey.length} read and keyed${workers > 0 ? ` by ${workers} worker(s)` : ''}`,
  ];
  if (read && read.status !== 'used') parts.push(`cache not used: ${read.reason}`);
  const dropped = (read?.entries.length ?? 0) - reused;
  if (useCache && (toKey.length > 0 || dropped !== 0 || read?.status !== 'used')) {
    const error = writeIndexCache(
      opts.cachePath!,
      settings,
      all.filter((e) => !unkept.has(e)),
    );
    parts.push(error === null ? `cache written to ${opts.cachePath}` : `cache not written: ${error}`);
  }
  return { entries: all, account: `Registry index: ${parts.join('; ')}.` };
}
