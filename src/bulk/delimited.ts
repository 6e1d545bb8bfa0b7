/**
 * CSV/TSV rows, streamed line by line with bounded memory. Fields follow RFC 4180 (a field in double quotes may
 * hold the delimiter, line breaks — e.g. a molfile in a cell — and doubled quotes); a stray quote inside an
 * unquoted field is kept as text, as spreadsheets write it. A quoted field that never closes would otherwise
 * swallow the rest of the file: after `maxLines` lines (or `maxChars` characters) the row is given up as broken,
 * with its start line, and reading starts again on the line after it, so one bad row costs one record.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';

export interface DelimitedRow {
  /** 1-based line where the row starts. */
  line: number;
  fields: string[];
  /** Set when the row could not be split (an unclosed quote); `fields` then holds what was read of it. */
  broken?: string;
}

export interface DelimitedLimits {
  maxLines: number;
  maxChars: number;
}

export const DEFAULT_LIMITS: DelimitedLimits = { maxLines: 10_000, maxChars: 16 * 2 ** 20 };

/**
 * Splits the text of one row. `open` is true when the text ends inside a quoted field (the row continues on the
 * next line); then the last field is the quoted text so far. `carry` continues such a row: the text starts inside
 * a quoted field that already holds `carry`.
 */
export function splitRow(
  text: string,
  delimiter: string,
  carry?: string,
): { fields: string[]; open: boolean } {
  if (carry === undefined && !text.includes('"')) return { fields: text.split(delimiter), open: false };
  const fields: string[] = [];
  let field = '';
  let i = 0;
  const n = text.length;
  let quoted = carry !== undefined;
  if (quoted) field = carry as string;
  for (;;) {
    if (quoted || text[i] === '"') {
      // quoted field: up to the closing quote; "" is a quote
      if (!quoted) i++;
      quoted = false;
      for (;;) {
        const q = text.indexOf('"', i);
        if (q < 0) return { fields: [...fields, field + text.slice(i)], open: true };
        field += text.slice(i, q);
        if (text[q + 1] === '"') {
          field += '"';
          i = q + 2;
          continue;
        }
        i = q + 1;
        break;
      }
    }
    // up to the delimiter (after a closing quote: kept, relaxed, as spreadsheets do)
    const d = text.indexOf(delimiter, i);
    field += text.slice(i, d < 0 ? n : d);
    i = d < 0 ? n : d;
    fields.push(field);
    field = '';
    if (i >= n) return { fields, open: false };
    i += delimiter.length; // past the delimiter: another field follows (possibly empty)
    if (i >= n) {
      fields.push('');
      return { fields, open: false };
    }
  }
}

/** Rows of a delimited file (the header row included, as the first row). */
export async function* readDelimitedRows(
  path: string,
  delimiter: string,
  limits: DelimitedLimits = DEFAULT_LIMITS,
): AsyncGenerator<DelimitedRow> {
  const rl = createInterface({ input: createReadStream(path, { encoding: 'utf8' }), crlfDelay: Infinity });
  let lineNo = 0;
  // lines of the row being read (kept so that a row given up can be read again from its second line)
  let held: string[] = [];
  let start = 0;
  let chars = 0;
  // the row so far while it is open: its finished fields and the quoted text of the open one
  let sofar: string[] = [];
  const replay: { text: string; line: number }[] = [];
  const lines = rl[Symbol.asyncIterator]();
  const next = async (): Promise<{ text: string; line: number } | null> => {
    if (replay.length > 0) return replay.shift()!;
    const r = await lines.next();
    if (r.done) return null;
    lineNo++;
    return { text: lineNo === 1 ? r.value.replace(/^\uFEFF/, '') : r.value, line: lineNo };
  };
  for (;;) {
    const l = await next();
    if (l === null && held.length === 0) return;
    if (l !== null) {
      if (held.length === 0) {
        if (l.text.trim() === '') continue;
        start = l.line;
        chars = 0;
      }
      held.push(l.text);
      chars += l.text.length + 1;
    }
    let split: { fields: string[]; open: boolean };
    if (l === null) split = { fields: sofar, open: true };
    else if (held.length === 1) split = splitRow(l.text, delimiter);
    else {
      const more = splitRow(l.text, delimiter, sofar[sofar.length - 1] + '\n');
      split = { fields: [...sofar.slice(0, -1), ...more.fields], open: more.open };
    }
    if (!split.open) {
      yield { line: start, fields: split.fields };
      held = [];
      continue;
    }
    sofar = split.fields;
    if (l === null || held.length >= limits.maxLines || chars >= limits.maxChars) {
      yield {
        line: start,
        fields: split.fields.map((f) => f.slice(0, 200)),
        broken:
          l === null
            ? `a quoted field opened on line ${start} does not close before the end of the file`
            : `a quoted field opened on line ${start} does not close within ${held.length} lines`,
      };
      // read again from the line after the broken row's first line
      replay.unshift(...held.slice(1).map((text, k) => ({ text, line: start + 1 + k })));
      held = [];
    }
  }
}
