/**
 * Streaming writers for bulk results: JSON Lines (one record per line, then one summary line), the stable audit
 * JSON (records streamed into the array, summary at the end), and a CSV summary for spreadsheets. Nothing is
 * held in memory but the record being written.
 */
import { createWriteStream, type WriteStream } from 'node:fs';
import type { AuditSummary } from '../audit/types.js';
import type { BulkRecordResult } from './audit-item.js';

export interface BulkTrailer {
  kind: 'summary';
  summary: AuditSummary;
  byCheck: Record<string, { error: number; warning: number; note: number; waived: number }>;
  vocabulary: { mapped: [string, { form: string; count: number }][]; notUnderstood: [string, number][] };
  caution: string;
  tool: { name: 'stereogate'; version: string };
  shard: string | null;
}

export interface RecordWriter {
  write(r: BulkRecordResult): Promise<void>;
  finish(t: BulkTrailer): Promise<void>;
}

function drainWrite(stream: WriteStream, text: string): Promise<void> {
  return stream.write(text) ? Promise.resolve() : new Promise((res) => stream.once('drain', () => res()));
}

function close(stream: WriteStream): Promise<void> {
  return new Promise((res, rej) => stream.end((err?: Error | null) => (err ? rej(err) : res())));
}

export function jsonlWriter(path: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  return {
    write: (r) => drainWrite(s, JSON.stringify({ kind: 'record', ...r }) + '\n'),
    finish: async (t) => {
      await drainWrite(s, JSON.stringify(t) + '\n');
      await close(s);
    },
  };
}

/** The audit's stable JSON: {"tool","caution","records":[…],"summary":{…}} — streamed. */
export function jsonWriter(path: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  let first = true;
  let started = false;
  const start = async () => {
    if (!started) {
      started = true;
      await drainWrite(s, '{"records":[\n');
    }
  };
  return {
    write: async (r) => {
      await start();
      await drainWrite(s, (first ? '' : ',\n') + JSON.stringify(r));
      first = false;
    },
    finish: async (t) => {
      await start();
      await drainWrite(
        s,
        `\n],\n"summary":${JSON.stringify(t.summary)},\n"byCheck":${JSON.stringify(t.byCheck)},\n` +
          `"vocabulary":${JSON.stringify(t.vocabulary)},\n"tool":${JSON.stringify(t.tool)},\n"caution":${JSON.stringify(t.caution)}}\n`,
      );
      await close(s);
    },
  };
}

export function csvCell(v: string | number | null): string {
  const t = v === null ? '' : String(v);
  // Quote always-safe; neutralise spreadsheet formula injection (cells starting with = + - @ tab CR).
  const safe = /^[=+\-@\t\r]/.test(t) ? `'${t}` : t;
  return `"${safe.replace(/"/g, '""')}"`;
}

export function csvWriter(path: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  let header = false;
  return {
    write: async (r) => {
      if (!header) {
        header = true;
        await drainWrite(s, 'seq,source,record,line,id,declared_form,form_word,chiral,meso,stereo_units,undefined_units,errors,warnings,notes,waived,checks\n');
      }
      const open = r.findings.filter((f) => !f.waived);
      const c = r.computed;
      const row = [
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
        open.filter((f) => f.severity === 'error').length,
        open.filter((f) => f.severity === 'warning').length,
        open.filter((f) => f.severity === 'note').length,
        r.findings.length - open.length,
        [...new Set(open.map((f) => f.check))].join(' '),
      ];
      await drainWrite(s, row.map(csvCell).join(',') + '\n');
    },
    finish: async () => {
      await close(s);
    },
  };
}
