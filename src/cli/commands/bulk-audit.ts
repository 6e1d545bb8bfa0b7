/**
 * `stereogate audit legacy.sdf [more.csv …] [options]`: the bulk audit of legacy registries (SD, CSV, TSV). The
 * audit command hands over to this when its inputs are bulk files. Also `stereogate merge` of shard outputs.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { parse as parseYaml } from 'yaml';
import { ConfigError, loadConfig } from '../../audit/config.js';
import type { AuditConfig } from '../../checks/types.js';
import type { BulkRecordResult } from '../../bulk/audit-item.js';
import { STEREO_FORMS, type StereoForm } from '../../registry/types.js';
import type { BulkMapping } from '../../bulk/mapping.js';
import { runBulkAudit } from '../../bulk/run.js';
import { mergeShards, MergeError } from '../../bulk/merge.js';
import { parseShard } from '../../bulk/sources.js';
import { ratePerSecond } from '../../bulk/progress.js';
import {
  csvWriter,
  jsonWriter,
  jsonlWriter,
  type BulkTrailer,
  type RecordWriter,
} from '../../bulk/writers.js';
import { sarifWriter } from '../../bulk/sarif-writer.js';
import { HtmlCollector } from '../../bulk/html-collector.js';
import { EXIT_CRASH, UsageError, type Io } from '../command.js';
import { INTERNAL_ERROR_ID } from '../../audit/findings.js';
import { checkWritable } from '../output-path.js';
import { plural } from '../../report/checklist.js';
import { CAUTION } from '../../audit/caution.js';
import { registryLines } from '../../report/registry-summary.js';
import { VERSION } from '../../audit/version.js';

export const BULK_USAGE = `Bulk audit of legacy registries (SD files, CSV/TSV exports):

  stereogate audit <file.sdf|file.csv|file.tsv>… [options]
  stereogate merge <shard.jsonl>… [--config FILE | --root DIR] [output options]

Field mapping (SD data field or CSV column; defaults in parentheses):
  --map-id NAME           registry id (id; SD files fall back to the title line)
  --map-structure NAME    CSV column holding the SMILES or molfile (smiles)
  --map-form NAME         declared stereo form (stereo_form)
  --map-descriptors NAME  stereodescriptors, e.g. (2R,3S) (descriptors)
  --map-ratio NAME        component ratio, e.g. 60:40 (ratio)
  --map-ee NAME           enantiomeric excess in percent (ee)
  --map-rotation NAME     specific rotation in degrees (rotation)
  --map-name NAME         compound name (name)
  --map-origin NAME       inputs it was made from: ids within the export or SMILES, ';'- or ','-separated
                          (read only when mapped; the named records are looked up in the export first)
  --map-control NAME      the origin's stereocontrol: none, chiral-catalyst, … (origin_control)
  --form-word WORD=FORM   map a legacy word onto a form (repeatable), e.g. --form-word "enant.=single-enantiomer"
  --mapping FILE          YAML/JSON file with the keys above (id, structure, form, …, vocabulary: {word: form})

Running:
  --workers N             worker threads (default: all cores)
  --shard I/N             audit only every N-th record starting at the I-th (for a CI matrix)
  --record-timeout SECS   per-record time limit (default 20)
  --progress MODE         auto | bar | lines | none (default auto: a bar on a terminal, lines in CI)
  --config FILE           tolerances and severities (stereogate.config.yml format)
  --root DIR              folder whose stereogate.config.yml applies when --config is not given (default .)

Outputs (any combination; the run always prints a summary table):
  --jsonl FILE            one JSON record per line, then a summary line (input to merge)
  --json FILE             the audit's stable JSON
  --csv FILE              one row per record, for spreadsheets
  --sarif FILE            SARIF 2.1.0
  --html FILE             self-contained HTML report with depictions of the flagged records
  --fail-on LEVEL         error | warning | never (default error): exit 1 when findings reach it
                          (exit 3: stereogate itself failed; the outputs hold what was computed)`;

const OUTPUT_OPTIONS = {
  jsonl: { type: 'string' },
  json: { type: 'string' },
  csv: { type: 'string' },
  sarif: { type: 'string' },
  html: { type: 'string' },
  'fail-on': { type: 'string', default: 'error' },
  progress: { type: 'string', default: 'auto' },
} as const;

type Values = Record<string, string | boolean | (string | boolean)[] | undefined>;

function parse(
  args: string[],
  extra: Record<string, { type: 'string' | 'boolean'; multiple?: boolean }>,
): { values: Values; positionals: string[] } {
  try {
    const r = parseArgs({
      args,
      options: { ...OUTPUT_OPTIONS, ...extra },
      allowPositionals: true,
      strict: true,
    });
    return { values: r.values as Values, positionals: r.positionals };
  } catch (e) {
    throw new UsageError((e as Error).message.replace(/\. To specify a positional.*$/s, ''));
  }
}

const FIELD_KEYS = [
  'id',
  'structure',
  'name',
  'form',
  'descriptors',
  'ratio',
  'ee',
  'rotation',
  'origin',
  'control',
] as const;

function readMapping(path: string): BulkMapping {
  let data: unknown;
  try {
    data = parseYaml(readFileSync(path, 'utf8'));
  } catch (e) {
    throw new UsageError(`--mapping ${path}: ${(e as Error).message}`);
  }
  if (!data || typeof data !== 'object')
    throw new UsageError(`--mapping ${path}: expected a map of field names`);
  const m = data as Record<string, unknown>;
  const out: BulkMapping = {};
  for (const k of Object.keys(m)) {
    if (k !== 'vocabulary' && !(FIELD_KEYS as readonly string[]).includes(k)) {
      throw new UsageError(
        `--mapping ${path}: unknown key '${k}' (known: ${FIELD_KEYS.join(', ')}, vocabulary)`,
      );
    }
  }
  for (const k of FIELD_KEYS) {
    if (m[k] === undefined) continue;
    if (typeof m[k] !== 'string' && typeof m[k] !== 'number')
      throw new UsageError(`--mapping ${path}: '${k}' must be a field name`);
    out[k] = String(m[k]);
  }
  if (m.vocabulary !== undefined && m.vocabulary !== null) {
    const v = m.vocabulary;
    if (typeof v !== 'object' || Array.isArray(v) || Object.values(v).some((f) => typeof f !== 'string')) {
      throw new UsageError(
        `--mapping ${path}: 'vocabulary' must map legacy words to forms, e.g. rac: racemate`,
      );
    }
    out.vocabulary = checkVocabulary(v as Record<string, string>, `--mapping ${path}`);
  }
  return out;
}

function checkVocabulary(v: Record<string, string>, where: string): Record<string, StereoForm> {
  for (const [w, f] of Object.entries(v)) {
    if (!STEREO_FORMS.includes(f as StereoForm)) {
      throw new UsageError(`${where}: '${w}' maps to '${f}', which is not one of ${STEREO_FORMS.join(', ')}`);
    }
  }
  return v as Record<string, StereoForm>;
}

function writersFor(
  values: Record<string, unknown>,
  checks: Parameters<typeof sarifWriter>[1],
): { writers: RecordWriter[]; html: HtmlCollector | null } {
  const writers: RecordWriter[] = [];
  for (const k of ['jsonl', 'json', 'csv', 'sarif', 'html'] as const) {
    const path = values[k];
    if (typeof path === 'string') checkWritable(path, `the --${k} output`);
  }
  if (typeof values.jsonl === 'string') writers.push(jsonlWriter(values.jsonl));
  if (typeof values.json === 'string') writers.push(jsonWriter(values.json));
  if (typeof values.csv === 'string') writers.push(csvWriter(values.csv));
  if (typeof values.sarif === 'string')
    writers.push(sarifWriter(values.sarif, checks, { name: 'stereogate', version: VERSION }, CAUTION));
  const html = typeof values.html === 'string' ? new HtmlCollector(values.html) : null;
  if (html) writers.push(html);
  return { writers, html };
}

/** Run time: the audit's rate on its own, and the time the reports took after it (drawing, writing). */
function timing(records: number, time: { seconds: number; auditSeconds: number } | null): string {
  if (!time) return '';
  const rate = ratePerSecond(records / Math.max(time.auditSeconds, 0.001));
  const reports = Math.max(0, time.seconds - time.auditSeconds);
  return (
    ` in ${time.seconds.toFixed(1)} s (audit ${time.auditSeconds.toFixed(1)} s, ${rate} records/s` +
    `${reports >= 0.05 ? `; reports ${reports.toFixed(1)} s` : ''})`
  );
}

export function summaryTable(t: BulkTrailer, time: { seconds: number; auditSeconds: number } | null): string {
  const lines: string[] = [];
  const s = t.summary;
  lines.push(
    `stereogate bulk audit: ${plural(s.records, 'record')}${timing(s.records, time)}${t.shard ? `, shard ${t.shard}` : ''}`,
  );
  lines.push(
    `  ${plural(s.errors, 'error')}, ${plural(s.warnings, 'warning')}, ${plural(s.notes, 'note')}, ${s.waived} accepted by waiver`,
  );
  const rows = Object.entries(t.byCheck);
  if (rows.length > 0) {
    const w = Math.max(5, ...rows.map(([c]) => c.length));
    lines.push('', `  ${'check'.padEnd(w)}  errors  warnings  notes  waived`);
    for (const [c, n] of rows) {
      lines.push(
        `  ${c.padEnd(w)}  ${String(n.error).padStart(6)}  ${String(n.warning).padStart(8)}  ${String(n.note).padStart(5)}  ${String(n.waived).padStart(6)}`,
      );
    }
  }
  if (t.vocabulary.mapped.length > 0) {
    lines.push('', '  legacy form words mapped:');
    for (const [w, e] of t.vocabulary.mapped) lines.push(`    "${w}" -> ${e.form} (${e.count})`);
  }
  if (t.vocabulary.notUnderstood.length > 0) {
    lines.push(
      '',
      '  form words NOT understood (records audited as form unknown; map them with --form-word):',
    );
    const shown = t.vocabulary.notUnderstood.slice(0, 50);
    for (const [w, n] of shown) lines.push(`    "${w}" (${n})`);
    if (t.vocabulary.notUnderstood.length > shown.length) {
      lines.push(`    … and ${t.vocabulary.notUnderstood.length - shown.length} more (see the JSON summary)`);
    }
  }
  const registry = registryLines(t.registry);
  if (registry.length > 0) lines.push('', ...registry.map((l) => `  ${l}`));
  lines.push('', t.caution);
  return lines.join('\n');
}

function exitCode(t: BulkTrailer, failOn: string): number {
  if (t.byCheck[INTERNAL_ERROR_ID]) return EXIT_CRASH;
  if (failOn === 'never') return 0;
  if (t.summary.errors > 0) return 1;
  if (failOn === 'warning' && t.summary.warnings > 0) return 1;
  return 0;
}

function checkFailOn(v: unknown): string {
  if (v !== 'error' && v !== 'warning' && v !== 'never')
    throw new UsageError(`--fail-on must be error, warning or never (got "${String(v)}")`);
  return v;
}

/** The bulk audit; its usage errors show the bulk options (not the record audit's). */
export async function bulkAudit(args: string[], io: Io): Promise<number> {
  try {
    return await bulkAuditRun(args, io);
  } catch (e) {
    if (e instanceof UsageError && e.usage === undefined) throw new UsageError(e.message, BULK_USAGE);
    throw e;
  }
}

async function bulkAuditRun(args: string[], io: Io): Promise<number> {
  const { values, positionals } = parse(args, {
    'map-id': { type: 'string' },
    'map-structure': { type: 'string' },
    'map-form': { type: 'string' },
    'map-descriptors': { type: 'string' },
    'map-ratio': { type: 'string' },
    'map-ee': { type: 'string' },
    'map-rotation': { type: 'string' },
    'map-name': { type: 'string' },
    'map-origin': { type: 'string' },
    'map-control': { type: 'string' },
    'form-word': { type: 'string', multiple: true },
    mapping: { type: 'string' },
    workers: { type: 'string' },
    shard: { type: 'string' },
    'record-timeout': { type: 'string' },
    config: { type: 'string' },
    root: { type: 'string' },
    format: { type: 'string' },
  });
  if (positionals.length === 0) throw new UsageError('no bulk input given');
  if (values.format !== undefined)
    throw new UsageError(
      '--format is for record files; a bulk audit writes each report to its own file: --jsonl, --json, --csv, --sarif or --html FILE',
    );
  const failOn = checkFailOn(values['fail-on']);
  const mapping: BulkMapping = typeof values.mapping === 'string' ? readMapping(values.mapping) : {};
  for (const k of FIELD_KEYS) {
    const v = values[`map-${k}`];
    if (typeof v === 'string') mapping[k] = v;
  }
  const words: Record<string, string> = {};
  for (const fw of (values['form-word'] as string[] | undefined) ?? []) {
    const at = fw.lastIndexOf('=');
    if (at <= 0) throw new UsageError(`--form-word expects WORD=FORM (got "${fw}")`);
    words[fw.slice(0, at)] = fw.slice(at + 1);
  }
  if (Object.keys(words).length > 0)
    mapping.vocabulary = { ...mapping.vocabulary, ...checkVocabulary(words, '--form-word') };
  let shard = null;
  if (typeof values.shard === 'string') {
    shard = parseShard(values.shard);
    if (!shard) throw new UsageError(`--shard expects I/N with 1 <= I <= N (got "${values.shard}")`);
  }
  const workers = typeof values.workers === 'string' ? Number(values.workers) : undefined;
  if (workers !== undefined && (!Number.isInteger(workers) || workers < 0))
    throw new UsageError('--workers expects a whole number');
  const timeout = typeof values['record-timeout'] === 'string' ? Number(values['record-timeout']) : 20;
  if (!(timeout > 0)) throw new UsageError('--record-timeout expects a positive number of seconds');
  const progress = values.progress as string;
  if (!['auto', 'bar', 'lines', 'none'].includes(progress))
    throw new UsageError('--progress must be auto, bar, lines or none');
  for (const p of positionals) if (!io.isFile(p)) throw new UsageError(`bulk input ${p} not found`);
  const config = configOf(values);
  const { CHECKS } = await import('../../checks/index.js');
  const { writers, html } = writersFor(values, CHECKS);
  const run = await runBulkAudit({
    inputs: positionals,
    mapping,
    config,
    workers,
    shard,
    timeoutMs: timeout * 1000,
    progress: progress as 'auto',
    writers,
  });
  if (html) io.err(`stereogate: HTML report written to ${html.path} (${html.flaggedCount} flagged records)`);
  io.out(summaryTable(run.trailer, run));
  return exitCode(run.trailer, failOn);
}

/** The run's configuration: --config, else stereogate.config.yml under --root (default the working folder). */
function configOf(values: { root?: unknown; config?: unknown }): AuditConfig {
  try {
    return loadConfig(
      typeof values.root === 'string' ? values.root : process.cwd(),
      typeof values.config === 'string' ? values.config : undefined,
    ).config;
  } catch (e) {
    if (e instanceof ConfigError) throw new UsageError(e.message);
    throw e;
  }
}

export async function mergeCommand(args: string[], io: Io): Promise<number> {
  const { values, positionals } = parse(args, { config: { type: 'string' }, root: { type: 'string' } });
  if (positionals.length === 0) throw new UsageError('no shard outputs given');
  const failOn = checkFailOn(values['fail-on']);
  for (const p of positionals) if (!io.isFile(p)) throw new UsageError(`shard output ${p} not found`);
  const { CHECKS } = await import('../../checks/index.js');
  // The shard runs' configuration: the registry-wide findings that merge computes take its severities.
  const config = configOf(values);
  const { writers, html } = writersFor(values, CHECKS);
  let trailer: BulkTrailer;
  try {
    trailer = await mergeShards(positionals, writers, undefined, config);
  } catch (e) {
    if (e instanceof MergeError) {
      io.err(`stereogate merge: ${e.message}`);
      return 2;
    }
    throw e;
  }
  if (html) io.err(`stereogate: HTML report written to ${html.path} (${html.flaggedCount} flagged records)`);
  io.out(summaryTable(trailer, null));
  return exitCode(trailer, failOn);
}

export type { BulkRecordResult };

export const mergeShardsCommand = {
  name: 'merge',
  summary: 'combine the JSON Lines outputs of sharded bulk audits into one report',
  usage: BULK_USAGE,
  run: mergeCommand,
};
