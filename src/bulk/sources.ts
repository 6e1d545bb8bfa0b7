/**
 * Bulk inputs, streamed: SD files (split into records here, parsed in the workers), CSV/TSV files (rows with
 * their line numbers). The main thread only splits text; all chemistry happens in the workers. Memory stays flat:
 * one record's text at a time.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';
import {
  lostSeparatorMessage,
  mergedRecordsMessage,
  SD_HEADER_LINES,
  SdBoundaries,
} from '../chem/read/sd-split.js';
import { readDelimitedRows, type DelimitedLimits } from './delimited.js';

export interface BulkItem {
  /** Input file as given on the command line. */
  source: string;
  /** 1-based record number within the source (SD record, CSV data row). */
  record: number;
  /** 1-based line where the record starts. */
  line: number;
  /** SD: the whole record text (molfile + data fields). CSV: absent. */
  text?: string;
  /** CSV: the row by column name. SD: absent (data fields are parsed in the worker). */
  fields?: Record<string, string>;
  /** A problem found while splitting (e.g. invalid UTF-8, ragged row). */
  splitProblem?: string;
}

export type BulkFormat = 'sd' | 'csv' | 'tsv';

export function formatOf(path: string): BulkFormat | null {
  const p = path.toLowerCase();
  if (p.endsWith('.sdf') || p.endsWith('.sd') || p.endsWith('.sdfile')) return 'sd';
  if (p.endsWith('.csv')) return 'csv';
  if (p.endsWith('.tsv') || p.endsWith('.tab')) return 'tsv';
  return null;
}

/** U+FFFD appears when the file was not valid UTF-8 (Node's decoder replaces bad bytes). */
const REPLACEMENT = '\uFFFD';

/** An SD record longer than this is not kept (a file without $$$$ lines must not fill the memory). */
export const SD_RECORD_LIMITS = { maxLines: 200_000, maxChars: 64 * 2 ** 20 };

/**
 * SD records, streamed. A record ends at its `$$$$` line; a record whose `$$$$` was lost is still found
 * (src/chem/read/sd-split.ts, as the SD reader of single files finds it), and the first record says that its
 * `$$$$` is missing. So every record in the file is reported, none merged into its neighbour.
 */
export async function* readSdItems(path: string, limits = SD_RECORD_LIMITS): AsyncGenerator<BulkItem> {
  const rl = createInterface({ input: createReadStream(path, { encoding: 'utf8' }), crlfDelay: Infinity });
  let lines: string[] = [];
  let chars = 0;
  let dropped = 0; // lines of an over-long record not kept
  let startLine = 1;
  let lineNo = 0;
  let record = 0;
  const bounds = new SdBoundaries();
  const item = (last: boolean, cutAt = 0): BulkItem => {
    record++;
    const text = dropped > 0 ? '' : lines.join('\n') + '\n';
    const problem =
      dropped > 0
        ? `the record is longer than ${limits.maxLines.toLocaleString('en-US')} lines or ` +
          `${limits.maxChars / 2 ** 20} MiB (${dropped.toLocaleString('en-US')} lines${last ? ' to the end of the file' : ''}); ` +
          'not read (a missing $$$$ line?)'
        : text.includes(REPLACEMENT)
          ? 'the record is not valid UTF-8 text (bad bytes replaced)'
          : cutAt > 0
            ? lostSeparatorMessage(cutAt)
            : bounds.secondEnd > 0
              ? mergedRecordsMessage(bounds.secondEnd)
              : last
                ? 'the last record has no $$$$ terminator (file truncated?)'
                : undefined;
    return { source: path, record, line: startLine, text, splitProblem: problem };
  };
  const reset = (): void => {
    lines = [];
    chars = 0;
    dropped = 0;
    bounds.start();
  };
  for await (const raw of rl) {
    lineNo++;
    if (lines.length === 0 && dropped === 0) startLine = lineNo;
    if (raw.startsWith('$$$$')) {
      yield item(false);
      reset();
      continue;
    }
    if (dropped > 0 || lines.length >= limits.maxLines || chars + raw.length > limits.maxChars) {
      if (dropped === 0) {
        dropped = lines.length;
        lines = [];
      }
      dropped++;
      continue;
    }
    if (bounds.next(raw, lineNo) === 'next-record') {
      // a new record began three lines up (name, program, comment) without a $$$$ before it
      const header = lines.splice(lines.length - SD_HEADER_LINES, SD_HEADER_LINES);
      const cutAt = lineNo - SD_HEADER_LINES;
      yield item(false, cutAt);
      reset();
      bounds.start(SD_HEADER_LINES);
      startLine = cutAt;
      for (const h of header) {
        lines.push(h);
        chars += h.length + 1;
      }
      bounds.next(raw, lineNo);
    }
    lines.push(raw);
    chars += raw.length + 1;
  }
  if (dropped > 0 || lines.some((l) => l.trim() !== '')) yield item(true);
}

export async function* readDelimitedItems(
  path: string,
  delimiter: ',' | '\t',
  limits?: DelimitedLimits,
): AsyncGenerator<BulkItem> {
  let header: string[] | null = null;
  let record = 0;
  for await (const row of readDelimitedRows(path, delimiter, limits)) {
    if (header === null) {
      header = row.fields.map((h) => h.trim());
      continue;
    }
    record++;
    const fields: Record<string, string> = {};
    const n = Math.min(header.length, row.fields.length);
    for (let i = 0; i < n; i++) fields[header[i]] = row.fields[i];
    let splitProblem: string | undefined;
    if (row.broken) splitProblem = `the row cannot be split: ${row.broken}`;
    else if (row.strayQuote) splitProblem = row.strayQuote;
    else if (row.fields.some((f) => f.includes(REPLACEMENT)))
      splitProblem = 'the row is not valid UTF-8 text (bad bytes replaced)';
    else if (row.fields.length !== header.length && !(row.fields.length === 1 && row.fields[0].trim() === ''))
      splitProblem = `the row has ${row.fields.length} columns, the header ${header.length}`;
    yield { source: path, record, line: row.line, fields, splitProblem };
  }
}

export function readItems(path: string): AsyncGenerator<BulkItem> {
  const f = formatOf(path);
  if (f === 'sd') return readSdItems(path);
  if (f === 'csv') return readDelimitedItems(path, ',');
  if (f === 'tsv') return readDelimitedItems(path, '\t');
  throw new Error(`not a bulk input: ${path}`);
}

/**
 * Deterministic sharding: record n (1-based) of the whole input belongs to shard ((n - 1) mod N) + 1.
 * Every shard reads the whole input but only audits its own records; merging by (source, record) gives the
 * order of a single run.
 */
export function parseShard(text: string): { index: number; count: number } | null {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  if (!m) return null;
  const index = Number(m[1]);
  const count = Number(m[2]);
  if (count < 1 || index < 1 || index > count) return null;
  return { index, count };
}

export async function* shardFilter<T>(
  items: AsyncIterable<T>,
  shard: { index: number; count: number } | null,
): AsyncGenerator<T> {
  let n = 0;
  for await (const item of items) {
    n++;
    if (!shard || (n - 1) % shard.count === shard.index - 1) yield item;
  }
}
