/**
 * The registry index of a pull-request review: one row per record file (index-keys.ts), taken from the cache
 * where the file's blob id (and those of its molfiles) still match, read otherwise. A file renamed without change
 * keeps its row. Rows are light (no keys) until a review asks for the keys of some (`keyFully`); both depths are
 * cached. Many files to read (a cold cache on a large registry) go to the worker pool of the bulk audit, one
 * worker per core; a few, or an engine handed in by the caller, are read in this thread.
 */
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import type { Budget } from '../chem/budget.js';
import { mapOrdered } from '../bulk/pool.js';
import { BlobIds, gitBlobIds } from '../registry/blob-ids.js';
import { recordFolderProblem } from '../registry/files.js';
import {
  entryRow,
  readIndexCache,
  writeIndexCache,
  type CacheRead,
  type CacheSettings,
  type IndexEntry,
} from '../registry/index-cache.js';
import type { AuditEngine } from './engine.js';
import { keyRecordFile, type KeyedFile } from './index-keys.js';
import type { IndexWorkerItem, IndexWorkerSetup } from './index-worker.js';
import { VERSION } from './version.js';
import { plural } from '../checks/words.js';

/** Fewer files than this to read: this thread reads them (starting workers costs about a second). */
export const MIN_FILES_FOR_WORKERS = 2000;

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
  /** Workers for reading; default one per core (at most 2) when at least MIN_FILES_FOR_WORKERS are read. */
  workers?: number;
  /** git's blob ids (blob-ids.ts gitBlobIds), when the caller started asking git before listing the files. */
  gitIds?: Promise<Map<string, string>>;
}

export class RecordIndex {
  /** One entry per file, in the order of the files. */
  readonly entries: IndexEntry[];
  private readonly unkept = new Set<IndexEntry>();
  /** Entries read in this run that go into the cache: none, and the cache on disk is still whole. */
  private newlyKept = 0;
  private blobs!: BlobIds;
  private read = 0;
  private described = 0;
  private reused = 0;
  private usedWorkers = 0;
  private cache: CacheRead | null = null;

  /** Why the cache path given cannot hold the cache (inside a record folder), or null. */
  private readonly cacheRefused: string | null;

  private constructor(private readonly opts: IndexBuildOptions) {
    this.entries = new Array<IndexEntry>(opts.files.length);
    this.cacheRefused =
      opts.cachePath === null ? null : recordFolderProblem(opts.cachePath, opts.realRoot, opts.recordDirs);
  }

  /** The index of `opts.files`: cached rows where they still hold, light rows read for the rest. */
  static async open(opts: IndexBuildOptions): Promise<RecordIndex> {
    const index = new RecordIndex(opts);
    await index.fill();
    return index;
  }

  private get settings(): CacheSettings {
    return { version: VERSION, axisOrthoMin: this.opts.axisOrthoMin };
  }

  private get useCache(): boolean {
    return this.opts.cachePath !== null && this.opts.defaultEngine && this.cacheRefused === null;
  }

  private async fill(): Promise<void> {
    const gitIds = this.opts.gitIds ?? gitBlobIds(this.opts.realRoot, this.opts.recordDirs);
    // git works in its own processes while the cache is read here
    this.cache = this.useCache ? readIndexCache(this.opts.cachePath!, this.settings) : null;
    this.blobs = new BlobIds(await gitIds, (rel) => join(this.opts.realRoot, rel));
    let cached = this.cache?.entries ?? [];
    if (cached.some((e, i) => i > 0 && cached[i - 1]!.file >= e.file))
      cached = [...cached].sort((x, y) => (x.file < y.file ? -1 : x.file > y.file ? 1 : 0));
    // both lists are in file order (the cache is written so): walked side by side, no map of every path
    let c = 0;
    let byBlob: Map<string, IndexEntry> | null = null;
    const movedFrom = (blob: string): IndexEntry | undefined => {
      if (byBlob === null) {
        byBlob = new Map();
        for (const e of cached) if (e.molfiles.length === 0) byBlob.set(e.blob, e);
      }
      return byBlob.get(blob);
    };
    const current = (e: IndexEntry) => e.molfiles.every(([path, blob]) => this.blobs.of(path) === blob);
    const toRead: number[] = [];
    this.opts.files.forEach((file, i) => {
      while (c < cached.length && cached[c]!.file < file) c++;
      const blob = this.blobs.of(file);
      if (blob === null) return toRead.push(i);
      const same = c < cached.length && cached[c]!.file === file ? cached[c] : undefined;
      if (same && same.blob === blob && current(same)) this.entries[i] = same;
      else {
        // renamed (or copied) without change: the row is the file's content but for its path
        const moved = movedFrom(blob);
        const row = moved && entryRow(moved);
        if (!moved || (moved.keyed && !row)) return toRead.push(i);
        this.entries[i] = { ...moved, file, row: row ? { ...row, file } : null, line: null };
      }
      this.reused++;
    });
    await this.readFiles(toRead, false);
  }

  /** Computes the keys of the entries `wanted` picks that have none yet. */
  async keyFully(wanted: (e: IndexEntry) => boolean): Promise<void> {
    const todo: number[] = [];
    this.entries.forEach((e, i) => {
      // a cached row whose stored keys are damaged is read again
      if (wanted(e) && (!e.keyed || entryRow(e) === null)) todo.push(i);
    });
    await this.readFiles(todo, true);
  }

  private async readFiles(at: readonly number[], full: boolean): Promise<void> {
    if (at.length === 0) return;
    const { opts } = this;
    const workers =
      opts.workers ??
      (opts.defaultEngine && at.length >= MIN_FILES_FOR_WORKERS ? Math.min(2, availableParallelism()) : 0);
    this.usedWorkers = Math.max(this.usedWorkers, workers);
    const noEngine = (item: IndexWorkerItem) =>
      keyRecordFile(opts.realRoot, item.abs, null, opts.budget, full);
    const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
    const setup: IndexWorkerSetup = {
      realRoot: opts.realRoot,
      budget: opts.budget,
      axisOrthoMin: opts.axisOrthoMin,
    };
    const results = mapOrdered<IndexWorkerItem, KeyedFile>(
      at.map((i) => ({ abs: join(opts.realRoot, opts.files[i]!), full })),
      {
        workers,
        script: new URL(`./index-worker${ext}`, import.meta.url),
        workerData: setup,
        // the worker stops a record at its budget itself; this is the backstop for a stuck or crashed worker
        timeoutMs: opts.budget.timeMs * 2 + 30_000,
        onTimeout: noEngine,
        onCrash: noEngine,
        inline: (item) => keyRecordFile(opts.realRoot, item.abs, opts.engine, opts.budget, full),
        batchSize: 64,
      },
    );
    let k = 0;
    for await (const result of results) {
      const i = at[k++]!;
      const file = opts.files[i]!;
      const blob = this.blobs.of(file);
      const molfiles = result.molfiles.map((m): [string, string | null] => [m, this.blobs.of(m)]);
      // a file or molfile that could not be read for its blob id is used this once, not cached
      const entry: IndexEntry = {
        file,
        blob: blob ?? '',
        molfiles: molfiles.map(([m, b]) => [m, b ?? '']),
        valid: result.valid,
        heavy: result.heavy,
        keyed: result.keyed,
        id: result.row.id,
        idLine: result.row.lines.id,
        row: result.row,
        rest: null,
        line: null,
      };
      this.unkept.delete(this.entries[i]!);
      if (!result.keep || blob === null || molfiles.some((m) => m[1] === null)) this.unkept.add(entry);
      else this.newlyKept++;
      this.entries[i] = entry;
    }
    if (full) this.described += at.length;
    else this.read += at.length;
  }

  /** Writes the cache when anything changed; says in a sentence what was done (for the log). */
  save(): string {
    const parts = [
      plural(this.entries.length, 'record file'),
      `${this.reused} from the cache`,
      `${this.read} read`,
      `${this.described} described for their keys`,
    ];
    if (this.usedWorkers > 0) parts.push(plural(this.usedWorkers, 'worker'));
    if (this.cacheRefused !== null) parts.push(`cache not used: ${this.cacheRefused}`);
    if (this.cache && this.cache.status !== 'used') parts.push(`cache not used: ${this.cache.reason}`);
    const dropped = (this.cache?.entries.length ?? 0) !== this.reused;
    // a file read again only because it is never cached (a molfile out of reach) changes nothing to write
    if (this.useCache && (this.newlyKept > 0 || dropped || this.cache?.status !== 'used')) {
      const kept = this.entries.filter((e) => !this.unkept.has(e));
      const error = writeIndexCache(this.opts.cachePath!, this.settings, kept);
      parts.push(error === null ? `cache written to ${this.opts.cachePath}` : `cache not written: ${error}`);
    }
    return `Registry index: ${parts.join('; ')}.`;
  }
}
