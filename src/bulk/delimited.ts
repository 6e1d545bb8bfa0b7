/**
 * CSV/TSV rows, streamed line by line with bounded memory. Fields follow RFC 4180 (a field in double quotes may
 * hold the delimiter, line breaks — e.g. a molfile in a cell — and doubled quotes); a stray quote inside an
 * unquoted field is kept as text, as spreadsheets write it. A quoted field that never closes would otherwise
 * swallow the rest of the file: after `maxLines` lines (or `maxChars` characters) the row is given up as broken,
 * with its start line, and reading starts again on the line after it, so one bad row costs one record.
 */
import { createReadStream } from 'node:fs';

export interface DelimitedRow {
  /** 1-based line where the row starts. */
  line: number;
  fields: string[];
  /** Set when the row could not be split (an unclosed quote); `fields` then holds what was read of it. */
  broken?: string;
  /**
   * Set when a quote opening a field did not close on its line and the next line is a row of its own: the quote
   * is taken as a stray character (the row is split as written) instead of swallowing the rows after it.
   */
  strayQuote?: string;
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
  let lineNo = 0;
  let columns = 0; // fields of the header row, once read
  // lines of the row being read (kept so that a row given up can be read again from its second line)
  let held: string[] = [];
  let start = 0;
  let chars = 0;
  // the row so far while it is open: its finished fields and the quoted text of the open one
  let sofar: string[] = [];
  const replay: { text: string; line: number }[] = [];
  const lines = textLines(path);
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
        // a blank line is no row; a line of delimiters only (`\t\t`) is a row of empty fields, and counts
        if (/^ *$/.test(l.text)) continue;
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
    // a quoted field ran into the next line, and that line is a row of its own: the quote was stray
    if (l !== null && held.length >= 2 && columns >= 2 && ownRow(l.text, delimiter, columns)) {
      yield {
        line: start,
        fields: held[0]!.split(delimiter),
        strayQuote:
          `a quote opens a field on line ${start} and does not close on that line, while line ${l.line} is a ` +
          'row of its own: the quote was read as text (remove it, or close it on the same line)',
      };
      replay.unshift(...held.slice(1).map((text, k) => ({ text, line: start + 1 + k })));
      held = [];
      continue;
    }
    if (!split.open) {
      if (columns === 0) columns = split.fields.length;
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

/**
 * The lines of a text file, streamed, without their line ends. Only LF (or CRLF) ends a line: a lone CR inside a
 * field is data, not a row break. A file with no LF at all in its first 64 KiB but with CRs is an old-style
 * CR-only file, and then CR ends lines.
 */
export async function* textLines(path: string): AsyncGenerator<string> {
  let rest = '';
  let mode: 'lf' | 'cr' | null = null;
  let seen = 0;
  for await (const chunk of createReadStream(path, { encoding: 'utf8' }) as AsyncIterable<string>) {
    rest += chunk;
    seen += chunk.length;
    if (mode === null) {
      if (rest.includes('\n')) mode = 'lf';
      else if (seen >= 65_536 && rest.includes('\r')) mode = 'cr';
      else if (seen < 65_536) continue;
      else mode = 'lf';
    }
    const sep = mode === 'cr' ? '\r' : '\n';
    let at = rest.indexOf(sep);
    let from = 0;
    while (at >= 0) {
      yield dropCr(rest.slice(from, at));
      from = at + 1;
      at = rest.indexOf(sep, from);
    }
    rest = rest.slice(from);
    // one line without end longer than any row may be: hand it on in pieces (the row reader gives it up as broken)
    while (rest.length > MAX_LINE_CHARS) {
      yield rest.slice(0, MAX_LINE_CHARS);
      rest = rest.slice(MAX_LINE_CHARS);
    }
  }
  if (mode === null) mode = rest.includes('\n') || !rest.includes('\r') ? 'lf' : 'cr';
  const parts = rest.split(mode === 'cr' ? '\r' : '\n');
  for (let i = 0; i < parts.length; i++) {
    if (i === parts.length - 1 && parts[i] === '') break;
    yield dropCr(parts[i]!);
  }
}

/**
 * Whether a line that a quoted field ran into is a row of its own: it splits into as many fields as the header,
 * and does not start by closing the quoted field (a genuine multi-line field ends on a line whose first part
 * holds the closing quote, `…3",CC,achiral`; a row of its own starts with a plain or a quoted field).
 */
function ownRow(text: string, delimiter: string, columns: number): boolean {
  const parts = text.split(delimiter);
  if (parts.length < columns) return false;
  const first = parts[0]!;
  return !first.includes('"') || first.startsWith('"');
}

const MAX_LINE_CHARS = 32 * 2 ** 20;

function dropCr(line: string): string {
  return line.endsWith('\r') ? line.slice(0, -1) : line;
}
