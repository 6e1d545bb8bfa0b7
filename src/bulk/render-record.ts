/**
 * One audited bulk record -> everything the outputs need, as strings and small numbers. This runs in the worker
 * that audited the record, so a result crosses to the main thread as a few strings (cheap to copy) instead of a
 * deep object graph (structured clone of the full facts cost about as much as the audit itself), and the main
 * thread only writes. The merge of shard outputs renders the records it reads with the same function, so a
 * merged output is byte for byte the output of a single run.
 */
import type { NotRunCheck, RecordResult, Severity } from '../audit/types.js';
import type { CheckModule } from '../checks/types.js';
import { sarifLog } from '../report/sarif.js';
import { htmlRow, type HtmlRow } from '../report/html/render.js';
import type { UnitMark } from '../report/html/picture.js';
import type { NotRunRecordRef } from '../report/not-run.js';
import type { BulkRecordResult } from './audit-item.js';
import type { VocabularyResult } from './mapping.js';
import type { IndexRow } from '../registry/keys.js';

/** Which renderings the run's outputs need (the tally is always made). */
export interface RenderWants {
  /** The JSON Lines line (JSON Lines and JSON outputs): the full result stringified, skipped when no output wants it. */
  jsonl: boolean;
  csv: boolean;
  sarif: boolean;
  html: boolean;
}

export const NO_EXTRAS: RenderWants = { jsonl: false, csv: false, sarif: false, html: false };

/** What the totals need of a record: its findings' check, severity and waived flag, and its form word. */
export interface Tally {
  findings: [check: string, severity: Severity, waived: boolean][];
  word: string | null;
  how: VocabularyResult['how'];
  form: string | null;
}

/** A flagged record for the HTML report: its row, and what to depict (laid out at the end). */
export interface HtmlEntry {
  row: HtmlRow;
  structure: string | null;
  /** Stereo units at 1-based input atom numbers: CIP labels, and the undefined ones to mark. */
  units: UnitMark[];
}

export interface RenderedRecord {
  seq: number;
  /** The record's row of the registry index (src/registry/keys.ts), for the registry-wide phase. */
  row?: IndexRow;
  /** The JSON Lines line, without the newline: {"kind":"record", …the whole result…}; '' when not wanted. */
  jsonl: string;
  tally: Tally;
  csv?: string;
  /** One SARIF result object (JSON text) per finding. */
  sarif?: string[];
  /** Only for flagged records. */
  html?: HtmlEntry;
  /** The checks that did not run on the record, for the SARIF and HTML outputs (which list them once per run). */
  notRun?: { ref: NotRunRecordRef; checks: NotRunCheck[] };
}

export const JSONL_PREFIX = '{"kind":"record",';

/** The record in the audit's JSON (no `kind`), cut from its JSON Lines line without a second stringify. */
export function jsonOf(r: RenderedRecord): string {
  return '{' + r.jsonl.slice(JSONL_PREFIX.length);
}

export const CSV_HEADER =
  'seq,source,record,line,id,declared_form,form_word,chiral,meso,stereo_units,undefined_units,errors,warnings,notes,waived,checks';

export function csvCell(v: string | number | null): string {
  const t = v === null ? '' : String(v);
  // Quote always; neutralise spreadsheet formula injection (cells starting with = + - @ tab CR).
  const safe = /^[=+\-@\t\r]/.test(t) ? `'${t}` : t;
  return `"${safe.replace(/"/g, '""')}"`;
}

export function csvRow(r: BulkRecordResult): string {
  const open = r.findings.filter((f) => !f.waived);
  const c = r.computed;
  const count = (s: Severity) => open.filter((f) => f.severity === s).length;
  return [
    r.seq,
    r.origin.source,
    r.origin.record,
    r.origin.line,
    r.id,
    r.declared.form,
    r.form_word.word,
    c ? (c.chiral === null ? 'open' : String(c.chiral)) : null,
    c ? (c.meso === null ? 'open' : String(c.meso)) : null,
    c ? c.units.length : null,
    c ? c.undefined : null,
    count('error'),
    count('warning'),
    count('note'),
    r.findings.length - open.length,
    [...new Set(open.map((f) => f.check))].join(' '),
  ]
    .map(csvCell)
    .join(',');
}

export type Renderer = (r: BulkRecordResult) => RenderedRecord;

/**
 * A renderer for the outputs asked for. `checks` is the full rule list of the SARIF log (the same list in the
 * workers and in the main thread, so rule indexes agree).
 */
export function makeRenderer(wants: RenderWants, checks: readonly CheckModule[]): Renderer {
  const tool = { name: 'stereogate' as const, version: '' };
  const none = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  return (r) => {
    const out: RenderedRecord = {
      seq: r.seq,
      row: r.registry_row,
      jsonl: wants.jsonl ? JSONL_PREFIX + JSON.stringify(r).slice(1) : '',
      tally: {
        findings: r.findings.map((f) => [f.check, f.severity, f.waived !== null]),
        word: r.form_word.word,
        how: r.form_word.how,
        form: r.declared.form,
      },
    };
    if (wants.csv) out.csv = csvRow(r);
    if ((wants.sarif || wants.html) && r.notRun?.length)
      out.notRun = { ref: { id: r.id, file: r.file, line: r.origin.line }, checks: r.notRun };
    if (wants.sarif && r.findings.length > 0) {
      // SARIF reads no computed facts
      const log = sarifLog(
        { tool, records: [r as unknown as RecordResult], summary: none, caution: '' },
        checks,
      );
      const results = (log.runs as { results: Record<string, unknown>[] }[])[0].results;
      out.sarif = results.map((res) => {
        (res.properties as Record<string, unknown>).record = r.origin.record;
        return JSON.stringify(res);
      });
    }
    if (wants.html) {
      const row = htmlRow(r);
      if (row) {
        const units = (r.computed?.units ?? []).map((u) => ({
          atoms: u.atoms,
          label: u.label,
          defined: u.defined,
        }));
        row.file = `${r.origin.source} · record ${r.origin.record}, line ${r.origin.line}`;
        const word = r.form_word.word;
        row.word = word !== null && word.trim() !== '' && word.trim() !== r.declared.form ? word : null;
        out.html = { row, structure: r.structure_text ?? null, units };
      }
    }
    return out;
  };
}
