/**
 * `stereogate audit [paths…] [--root DIR] [--config FILE] [--format text|json|markdown|sarif] [--output FILE]
 *  [--fail-on error|warning|never]` — audits the registry's records and prints the report.
 * Exit 1 when open (not waived) findings reach --fail-on, 0 otherwise, 2 for usage errors, 3 when stereogate
 * itself failed on a record (the report is still written).
 */
import { existsSync, writeFileSync } from 'node:fs';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { ConfigError } from '../../audit/config.js';
import type { AuditEngine } from '../../audit/engine.js';
import { RECORD_BUDGET, runAudit } from '../../audit/run.js';
import type { AuditResult } from '../../audit/types.js';
import type { CheckModule } from '../../checks/types.js';
import { renderJson } from '../../report/json.js';
import { renderMarkdown } from '../../report/markdown.js';
import { renderSarif } from '../../report/sarif.js';
import { renderText, shouldColor } from '../../report/text.js';
import { parseCommandArgs } from '../args.js';
import { isBulkInput } from '../../bulk/run.js';
import { bulkAudit } from './bulk-audit.js';
import { EXIT_CRASH, EXIT_FINDINGS, EXIT_OK, InputError, UsageError, type Command } from '../command.js';
import { isInternalError } from '../../audit/findings.js';
import { checkIndexCachePath } from '../index-cache-path.js';
import { checkOutsideRecords, checkWritable, writeFailure } from '../output-path.js';
import type { ProgressMode } from '../../bulk/progress.js';
import { auditFolderPooled, pooledAudit, POOLED_FROM } from './audit-folder.js';

export { EXIT_FINDINGS };

const USAGE = [
  'Usage: stereogate audit [paths…] [--root DIR] [--config FILE] [--format text|json|markdown|sarif]',
  '                        [--output FILE] [--fail-on error|warning|never] [--verbose]',
  '                        [--record-timeout SECS] [--workers N] [--progress MODE] [--index-cache FILE]',
  '',
  '  paths…               record files, folders or molfiles to audit (default: every record), reviewed',
  '                       against the rest of the registry through its key index (see --index-cache)',
  '  --root DIR           registry root, holding stereogate.config.yml and the record folders (default .)',
  '  --config FILE        config file to use instead of stereogate.config.yml at the root',
  '  --format FORMAT      text (default), json, markdown (the pull-request checklist) or sarif (2.1.0)',
  '  --output FILE        write the report to FILE instead of standard output',
  '  --verbose, -v        text format: every record in full, each passed check with its evidence and',
  '                       each check that does not apply with why (default: records with findings',
  '                       first, one line per record without)',
  '  --fail-on LEVEL      exit 1 when a finding not accepted by a waiver is at least this severe:',
  '                       error (default), warning, or never',
  '  --record-timeout SECS  per-record time limit (default 20); a record over it, or over 1 GiB of memory,',
  '                       gets a record-time-limit finding and the audit goes on',
  '  --workers N          worker threads for the audit of every record (no paths); default: all cores when',
  `                       the registry holds ${POOLED_FROM.toLocaleString('en-US')} record files or more, else this thread; 0: this thread.`,
  '                       Through the workers the report is written as records come (same report)',
  '  --progress MODE      through the workers: auto (default: a bar on a terminal, lines in CI), bar, lines',
  '                       or none, on standard error',
  '  --index-cache FILE   with paths: keep the key index of the rest of the registry in FILE between runs, so',
  '                       that a later run reads only the record files whose content changed (default: no',
  '                       cache; a missing, stale or damaged cache only costs time; a folder, or a file',
  '                       there that is not an index cache, is refused rather than replaced)',
  '',
  'Exit codes: 0 no finding at the --fail-on level, 1 findings at that level, 2 usage error or a report',
  'file that cannot be written, 3 internal error (the report is still written; records it hit carry an',
  'internal-error finding).',
  '',
  'Legacy exports (.sdf, .csv, .tsv) are audited in bulk; `stereogate merge --help` lists the bulk options.',
].join('\n');

/** Whether open findings reach the threshold (waived findings never count). */
export function reachesThreshold(
  result: Pick<AuditResult, 'summary'>,
  failOn: 'error' | 'warning' | 'never',
): boolean {
  if (failOn === 'never') return false;
  const s = result.summary;
  return failOn === 'error' ? s.errors > 0 : s.errors + s.warnings > 0;
}

/** A record hit a fault of stereogate itself: the report is written, the exit code says it is incomplete. */
export function hasInternalErrors(result: AuditResult): boolean {
  return result.records.some((r) => r.findings.some(isInternalError));
}

/** Paths as typed: one that exists relative to the working folder is taken from there, else from the root. */
function toRootPaths(paths: string[], root: string): string[] {
  const rootAbs = resolve(root);
  return paths.map((p) => {
    const abs = resolve(p);
    if (!existsSync(abs)) return p;
    const rel = relative(rootAbs, abs);
    if (rel === '..' || rel.startsWith(`..${sep}`) || isAbsolute(rel)) {
      if (existsSync(resolve(rootAbs, p))) return p;
      throw new UsageError(`${p} is outside the registry root ${root}`);
    }
    return rel.split(sep).join('/') || '.';
  });
}

export interface AuditCommandDeps {
  checks?: CheckModule[];
  engine?: AuditEngine;
}

export function makeAuditCommand(deps: AuditCommandDeps = {}): Command {
  return {
    name: 'audit',
    summary: 'audit registry records for stereochemical consistency and print the checklist',
    usage: USAGE,
    async run(args, io) {
      // SD / CSV / TSV inputs are legacy exports: the bulk audit takes them (streamed, parallel, shardable).
      if (args.some((a) => !a.startsWith('-') && isBulkInput(a))) return bulkAudit(args, io);
      const { values, positionals } = parseCommandArgs(
        args,
        {
          root: { type: 'string', default: '.' },
          config: { type: 'string' },
          format: { type: 'string', choices: ['text', 'json', 'markdown', 'sarif'], default: 'text' },
          output: { type: 'string' },
          'fail-on': { type: 'string', choices: ['error', 'warning', 'never'], default: 'error' },
          verbose: { type: 'boolean', short: 'v' },
          'record-timeout': { type: 'string' },
          workers: { type: 'string' },
          progress: { type: 'string', choices: ['auto', 'bar', 'lines', 'none'], default: 'auto' },
          'index-cache': { type: 'string' },
        },
        { min: 0, max: Infinity, names: 'paths' },
      );
      const root = values.root as string;
      const format = values.format as 'text' | 'json' | 'markdown' | 'sarif';
      const failOn = values['fail-on'] as 'error' | 'warning' | 'never';
      const output = values.output as string | undefined;
      if (output === '') throw new UsageError('--output needs a file name');
      if (output !== undefined) {
        checkWritable(output, 'the report');
        checkOutsideRecords(output, 'the report', root, values.config as string | undefined);
      }
      const paths = toRootPaths(positionals, root);
      const timeout = values['record-timeout'];
      const seconds = typeof timeout === 'string' ? Number(timeout) : RECORD_BUDGET.timeMs / 1000;
      if (!(seconds > 0)) throw new UsageError('--record-timeout expects a positive number of seconds');
      const indexCache = values['index-cache'] as string | undefined;
      if (indexCache === '') throw new UsageError('--index-cache needs a file name');
      if (indexCache !== undefined && positionals.length > 0) checkIndexCachePath(indexCache);
      const workers = typeof values.workers === 'string' ? Number(values.workers) : undefined;
      if (workers !== undefined && (!Number.isInteger(workers) || workers < 0))
        throw new UsageError('--workers expects a whole number (0: this thread)');
      for (const line of ignoredOptions(paths.length > 0, args)) io.err(`stereogate: ${line}`);
      const budget = { ...RECORD_BUDGET, timeMs: seconds * 1000 };
      const common = { root, configFile: values.config as string | undefined, checks: deps.checks };
      try {
        const pooled = paths.length === 0 ? await pooledAudit({ ...common, workers }) : null;
        if (pooled) {
          const run = await auditFolderPooled(
            {
              ...common,
              budget,
              format,
              output,
              verbose: values.verbose === true,
              color: output === undefined && shouldColor(process.stdout),
              workers,
              progress: values.progress as ProgressMode,
              out: io.out,
              engine: deps.engine,
            },
            pooled,
          );
          if (run.internalErrors) return EXIT_CRASH;
          return reachesThreshold(run, failOn) ? EXIT_FINDINGS : EXIT_OK;
        }
      } catch (e) {
        if (e instanceof ConfigError) throw new UsageError(e.message);
        throw e;
      }
      let result: AuditResult;
      try {
        result = await runAudit({
          root,
          paths,
          configFile: values.config as string | undefined,
          checks: deps.checks,
          engine: deps.engine,
          budget,
          ...(indexCache === undefined
            ? {}
            : { indexCache: resolve(indexCache), log: (l: string) => io.err(`stereogate: ${l}`) }),
        });
      } catch (e) {
        if (e instanceof ConfigError) throw new UsageError(e.message);
        throw e;
      }
      if (result.unmatched?.length) {
        throw new UsageError(
          `no record file, record folder or molfile in ${root} matches: ${result.unmatched.join(', ')}`,
        );
      }
      const checks = deps.checks ?? (await import('../../checks/index.js')).CHECKS;
      const report =
        format === 'json'
          ? renderJson(result)
          : format === 'markdown'
            ? renderMarkdown(result, { maxChars: Number.POSITIVE_INFINITY }) // a file, not a comment: whole
            : format === 'sarif'
              ? renderSarif(result, checks)
              : renderText(result, {
                  color: output === undefined && shouldColor(process.stdout),
                  verbose: values.verbose === true,
                });
      if (output !== undefined) {
        try {
          writeFileSync(output, report);
        } catch (e) {
          throw new InputError(writeFailure(output, e));
        }
      } else {
        io.out(report);
      }
      if (hasInternalErrors(result)) return EXIT_CRASH;
      return reachesThreshold(result, failOn) ? EXIT_FINDINGS : EXIT_OK;
    },
  };
}

export const auditCommand: Command = makeAuditCommand();

/** Options given where they do nothing (--workers and --progress with paths, --index-cache without), named. */
function ignoredOptions(withPaths: boolean, args: readonly string[]): string[] {
  const given = (name: string): boolean => args.some((a) => a === `--${name}` || a.startsWith(`--${name}=`));
  if (!withPaths) return given('index-cache') ? ['--index-cache applies with paths only: ignored'] : [];
  return ['workers', 'progress']
    .filter(given)
    .map((n) => `--${n} applies to the audit of every record (no paths): ignored with paths`);
}
