/**
 * Bulk inputs, streamed: SD files (split into records here, parsed in the workers), CSV/TSV files (rows with
 * their line numbers). The main thread only splits text; all chemistry happens in the workers. Memory stays flat:
 * one record's text at a time.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';
import { parse } from 'csv-parse';

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

export async function* readSdItems(path: string): AsyncGenerator<BulkItem> {
  const rl = createInterface({ input: createReadStream(path, { encoding: 'utf8' }), crlfDelay: Infinity });
  let lines: string[] = [];
  let startLine = 1;
  let lineNo = 0;
  let record = 0;
  for await (const raw of rl) {
    lineNo++;
    if (lines.length === 0) startLine = lineNo;
    if (raw.startsWith('$$$$')) {
      record++;
      const text = lines.join('\n') + '\n';
      yield {
        source: path,
        record,
        line: startLine,
        text,
        splitProblem: text.includes(REPLACEMENT)
          ? 'the record is not valid UTF-8 text (bad bytes replaced)'
          : undefined,
      };
      lines = [];
      continue;
    }
    lines.push(raw);
  }
  if (lines.some((l) => l.trim() !== '')) {
    record++;
    const text = lines.join('\n') + '\n';
    yield {
      source: path,
      record,
      line: startLine,
      text,
      splitProblem: text.includes(REPLACEMENT)
        ? 'the record is not valid UTF-8 text (bad bytes replaced)'
        : 'the last record has no $$$$ terminator (file truncated?)',
    };
  }
}

export async function* readDelimitedItems(path: string, delimiter: ',' | '\t'): AsyncGenerator<BulkItem> {
  const parser = createReadStream(path, { encoding: 'utf8' }).pipe(
    parse({
      delimiter,
      columns: (header: string[]) => header.map((h) => h.trim()),
      relax_column_count: true,
      relax_quotes: true,
      skip_empty_lines: true,
      bom: true,
      info: true,
    }),
  );
  let record = 0;
  for await (const row of parser as AsyncIterable<{
    record: Record<string, string>;
    info: { lines: number; invalid_field_length: number };
  }>) {
    record++;
    const fields = row.record;
    const values = Object.values(fields).join('');
    yield {
      source: path,
      record,
      line: row.info.lines,
      fields,
      splitProblem: values.includes(REPLACEMENT)
        ? 'the row is not valid UTF-8 text (bad bytes replaced)'
        : row.info.invalid_field_length > 0
          ? 'the row has a different number of columns from the header'
          : undefined,
    };
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
