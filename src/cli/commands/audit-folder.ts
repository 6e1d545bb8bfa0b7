/**
 * `stereogate audit` of every record (no paths) through the worker pool, the report streamed to its file or to
 * standard output as records come (src/bulk/folder-run.ts, src/report/stream.ts). Used for registries of
 * POOLED_FROM records or more, or when --workers is given; a smaller registry is audited in this thread (the
 * workers' start-up would cost more than they save). Same report, same exit codes.
 */
import { CAUTION } from '../../audit/caution.js';
import { openRegistry, missingDirsError } from '../../audit/run.js';
import type { AuditEngine } from '../../audit/engine.js';
import type { AuditResult } from '../../audit/types.js';
import { VERSION } from '../../audit/version.js';
import type { Budget } from '../../chem/budget.js';
import type { CheckModule } from '../../checks/types.js';
import { runFolderAudit } from '../../bulk/folder-run.js';
import type { ProgressMode } from '../../bulk/progress.js';
import { listRecordFiles, readRecordFolder, type RecordFileList } from '../../bulk/record-files.js';
import { fileSink, lineSink, SinkFailed } from '../../report/sink.js';
import { streamedReport, type ReportFormat } from '../../report/stream.js';
import { InputError } from '../command.js';
import { writeFailure } from '../output-path.js';

/** Record files from which a full audit goes to the worker pool by default. */
export const POOLED_FROM = 1000;

export interface FolderAuditOptions {
  root: string;
  configFile?: string;
  budget: Budget;
  format: ReportFormat;
  output?: string;
  verbose: boolean;
  color: boolean;
  /** Undefined: all cores from POOLED_FROM records, else this thread. */
  workers?: number;
  progress: ProgressMode;
  out: (text: string) => void;
  checks?: CheckModule[];
  engine?: AuditEngine;
}

export type OpenedFolder = Awaited<ReturnType<typeof openRegistry>> & { list: RecordFileList };

/** The registry and its record files when the full audit should go through the pool, else null. */
export async function pooledAudit(
  opts: Pick<FolderAuditOptions, 'root' | 'configFile' | 'workers' | 'checks'>,
): Promise<OpenedFolder | null> {
  if (opts.workers === 0) return null;
  const opened = await openRegistry({ root: opts.root, configFile: opts.configFile, checks: opts.checks });
  const list = listRecordFiles(opened.root, opened.config.recordDirs);
  if (list.missingDirs.length > 0) throw missingDirsError(list.missingDirs, opts.root);
  if (opts.workers === undefined && list.files.length < POOLED_FROM) return null;
  return { ...opened, list };
}

/** Audits every record file through the pool and writes the report; the totals decide the exit code. */
export async function auditFolderPooled(
  opts: FolderAuditOptions,
  found: OpenedFolder,
): Promise<Pick<AuditResult, 'summary'> & { internalErrors: boolean }> {
  const { config, checks } = found;
  const folder = readRecordFolder(found.root, found.list);
  const sink = opts.output === undefined ? lineSink(opts.out) : fileSink(opts.output);
  const known = { tool: { name: 'stereogate' as const, version: VERSION }, caution: CAUTION };
  const report = streamedReport(opts.format, sink, known, {
    text: { color: opts.color, verbose: opts.verbose },
    checks,
  });
  const written = async <T>(step: () => Promise<T>): Promise<T> => {
    try {
      return await step();
    } catch (e) {
      report.abort();
      if (e instanceof SinkFailed && opts.output !== undefined)
        throw new InputError(writeFailure(opts.output, e.cause));
      throw e;
    }
  };
  const run = await written(() =>
    runFolderAudit({
      folder,
      config,
      budget: opts.budget,
      // the workers load the built-in checks: a caller's own checks (tests) run in this thread
      workers: opts.checks ? 0 : opts.workers,
      json: opts.format === 'json',
      progress: opts.progress,
      onRecord: (r) => report.add(r),
      checks,
      engine: opts.engine,
    }),
  );
  const totals = { ...known, summary: run.summary, ...(run.registry ? { registry: run.registry } : {}) };
  await written(() => report.finish(totals));
  return { summary: run.summary, internalErrors: run.internalErrors };
}
