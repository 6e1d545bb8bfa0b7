/**
 * Streaming writers for bulk results: JSON Lines (one record per line, then one summary line), the stable audit
 * JSON (records streamed into the array, summary at the end), and a CSV summary for spreadsheets. Nothing is
 * held in memory but the record being written.
 */
import { createWriteStream } from 'node:fs';
import { close, drainWrite } from '../report/sink.js';
import type { AuditSummary, RegistrySummary } from '../audit/types.js';
import { CSV_HEADER, jsonOf, type RenderedRecord, type RenderWants } from './render-record.js';

export interface BulkTrailer {
  kind: 'summary';
  summary: AuditSummary;
  byCheck: Record<string, { error: number; warning: number; note: number; waived: number }>;
  vocabulary: { mapped: [string, { form: string; count: number }][]; notUnderstood: [string, number][] };
  caution: string;
  tool: { name: 'stereogate'; version: string };
  shard: string | null;
  /** The registry-wide phase: run over every record (pairs listed once), or not run with the reason (a shard). */
  registry?: RegistrySummary;
}

export interface RecordWriter {
  /** The optional rendering this writer reads (made in the workers only when some writer asks for it). */
  needs?: keyof RenderWants;
  write(r: RenderedRecord): Promise<void>;
  finish(t: BulkTrailer): Promise<void>;
}

/** The optional renderings the given writers read. */
export function wantsOf(writers: readonly RecordWriter[]): RenderWants {
  const has = (n: keyof RenderWants) => writers.some((w) => w.needs === n);
  return { jsonl: has('jsonl'), csv: has('csv'), sarif: has('sarif'), html: has('html') };
}

export { close, drainWrite };

export function jsonlWriter(path: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  return {
    needs: 'jsonl',
    write: (r) => drainWrite(s, r.jsonl + '\n'),
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
    needs: 'jsonl',
    write: async (r) => {
      await start();
      await drainWrite(s, (first ? '' : ',\n') + jsonOf(r));
      first = false;
    },
    finish: async (t) => {
      await start();
      await drainWrite(
        s,
        `\n],\n"summary":${JSON.stringify(t.summary)},\n"byCheck":${JSON.stringify(t.byCheck)},\n` +
          `"vocabulary":${JSON.stringify(t.vocabulary)},\n` +
          (t.registry ? `"registry":${JSON.stringify(t.registry)},\n` : '') +
          `"tool":${JSON.stringify(t.tool)},\n"caution":${JSON.stringify(t.caution)}}\n`,
      );
      await close(s);
    },
  };
}

export function csvWriter(path: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  let header = false;
  return {
    needs: 'csv',
    write: async (r) => {
      if (!header) {
        header = true;
        await drainWrite(s, CSV_HEADER + '\n');
      }
      await drainWrite(s, (r.csv ?? '') + '\n');
    },
    finish: async () => {
      if (!header) await drainWrite(s, CSV_HEADER + '\n');
      await close(s);
    },
  };
}
