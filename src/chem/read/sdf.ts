/**
 * SD files (CTfile format specification, "SDfile"): records of a molfile, data fields `> <NAME>` with value
 * lines up to a blank line, and a `$$$$` separator. Records are split at `$$$$` before anything is parsed, so a
 * broken record yields a result with an error at its line and the next record is read as usual.
 */
import type { ReadError, ReadResult } from '../types.js';
import { parseMolfileLines, splitLines } from './molfile.js';

export interface SdRecord {
  /** 1-based record number. */
  record: number;
  /** Absolute line number of the record's first line. */
  line: number;
  result: ReadResult;
}

export function* readSdRecords(text: string): Generator<SdRecord> {
  const lines = splitLines(text);
  let start = 0;
  let record = 0;
  for (let i = 0; i <= lines.length; i++) {
    if (i < lines.length && !lines[i]!.startsWith('$$$$')) continue;
    if (!allBlank(lines, start, i)) {
      record++;
      yield { record, line: start + 1, result: readRecord(lines, start, i, start + 1, record) };
    }
    start = i + 1;
  }
}

/** Streaming form: holds one record's lines at a time. `lines` yields lines without their line ends. */
export async function* streamSdRecords(lines: AsyncIterable<string>): AsyncGenerator<SdRecord> {
  let buf: string[] = [];
  let lineNo = 0;
  let first = 1;
  let record = 0;
  for await (let l of lines) {
    lineNo++;
    if (l.length > 0 && l.charCodeAt(l.length - 1) === 13) l = l.slice(0, -1);
    if (l.startsWith('$$$$')) {
      if (!allBlank(buf, 0, buf.length)) {
        record++;
        yield { record, line: first, result: readRecord(buf, 0, buf.length, first, record) };
      }
      buf = [];
      first = lineNo + 1;
    } else buf.push(l);
  }
  if (!allBlank(buf, 0, buf.length)) {
    record++;
    yield { record, line: first, result: readRecord(buf, 0, buf.length, first, record) };
  }
}

function allBlank(lines: readonly string[], start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (lines[i]!.trim() !== '') return false;
  return true;
}

/** One record in lines[start, end) whose first line is absolute line firstLine. */
export function readRecord(
  lines: readonly string[],
  start: number,
  end: number,
  firstLine: number,
  record: number,
): ReadResult {
  let mend = -1;
  for (let i = start; i < end; i++) {
    if (lines[i]!.startsWith('M  END')) {
      mend = i;
      break;
    }
  }
  const molEnd = mend === -1 ? end : mend + 1;
  const result = parseMolfileLines(lines, start, molEnd, firstLine);
  const tag = (e: ReadError): ReadError => ({ ...e, at: { ...e.at, record } });
  if (!result.ok) return { ok: false, error: tag(result.error) };
  const props: Record<string, string> = {};
  const warnings = result.warnings.map(tag);
  let i = molEnd;
  while (i < end) {
    const l = lines[i]!;
    if (l.trim() === '') {
      i++;
      continue;
    }
    if (!l.startsWith('>')) {
      warnings.push(
        tag({
          code: 'sdf-stray-line',
          message: `a line outside any data field: "${l.slice(0, 30)}"`,
          at: { line: firstLine + (i - start) },
        }),
      );
      i++;
      continue;
    }
    const name = fieldName(l);
    const at = firstLine + (i - start);
    i++;
    const value: string[] = [];
    while (i < end && lines[i]!.trim() !== '') value.push(lines[i++]!);
    if (name === null) {
      warnings.push(
        tag({
          code: 'sdf-field-without-name',
          message: 'a data-field header without a <NAME>; its value is skipped',
          at: { line: at },
        }),
      );
      continue;
    }
    if (name in props) {
      warnings.push(
        tag({
          code: 'sdf-duplicate-field',
          message: `data field <${name}> appears twice; the first value is kept`,
          at: { line: at },
        }),
      );
      continue;
    }
    props[name] = value.join('\n');
  }
  result.structure.properties = props;
  return { ok: true, structure: result.structure, warnings };
}

/** `> <NAME>`, `>  <NAME> (12)`, `> 12 <NAME>` -> NAME; null when there is no <...>. */
function fieldName(l: string): string | null {
  const open = l.indexOf('<', 1);
  if (open === -1) return null;
  const close = l.indexOf('>', open + 1);
  if (close === -1) return null;
  return l.slice(open + 1, close);
}
