/**
 * SD files (CTfile format specification, "SDfile"): records of a molfile, data fields `> <NAME>` with value
 * lines up to a blank line, and a `$$$$` separator. Records are split at `$$$$` (or where a lost `$$$$` should
 * have been, sd-split.ts) before anything is parsed, so a broken record yields a result with an error at its line
 * and the next record is read as usual.
 */
import type { ReadError, ReadResult } from '../types.js';
import { parseMolfileLines, splitLines } from './molfile.js';
import { lostSeparatorMessage, mergedRecordsMessage, SD_HEADER_LINES, SdBoundaries } from './sd-split.js';

export interface SdRecord {
  /** 1-based record number. */
  record: number;
  /** Absolute line number of the record's first line. */
  line: number;
  result: ReadResult;
}

export function* readSdRecords(text: string): Generator<SdRecord> {
  const records = new SdRecordSplitter();
  const lines = splitLines(text);
  for (let i = 0; i < lines.length; i++) yield* records.line(lines[i]!, i + 1);
  yield* records.end();
}

/** Streaming form: holds one record's lines at a time. `lines` yields lines without their line ends. */
export async function* streamSdRecords(lines: AsyncIterable<string>): AsyncGenerator<SdRecord> {
  const records = new SdRecordSplitter();
  let lineNo = 0;
  for await (let l of lines) {
    lineNo++;
    if (l.length > 0 && l.charCodeAt(l.length - 1) === 13) l = l.slice(0, -1);
    yield* records.line(l, lineNo);
  }
  yield* records.end();
}

/**
 * Lines in, records out. A record ends at its `$$$$` line, or where the next record's header begins when its
 * `$$$$` was lost (sd-split.ts): that record is then a reader error at the line where the next one starts, as is
 * a record holding a second `M  END` (two records merged), so that two molfiles are never read as one.
 */
class SdRecordSplitter {
  private buf: string[] = [];
  private first = 1;
  private record = 0;
  private readonly bounds = new SdBoundaries();

  *line(l: string, lineNo: number): Generator<SdRecord> {
    const kind = this.bounds.next(l, lineNo);
    if (kind === 'separator') {
      yield* this.flush(null);
      this.buf = [];
      this.first = lineNo + 1;
      this.bounds.start();
      return;
    }
    if (kind === 'next-record') {
      const header = this.buf.splice(this.buf.length - SD_HEADER_LINES, SD_HEADER_LINES);
      const cutAt = lineNo - SD_HEADER_LINES;
      yield* this.flush({
        code: 'sdf-missing-separator',
        message: lostSeparatorMessage(cutAt),
        at: { line: cutAt },
      });
      this.buf = header;
      this.first = cutAt;
      this.bounds.start(SD_HEADER_LINES);
      this.bounds.next(l, lineNo);
    }
    this.buf.push(l);
  }

  *end(): Generator<SdRecord> {
    yield* this.flush(null);
  }

  private *flush(cut: ReadError | null): Generator<SdRecord> {
    if (allBlank(this.buf, 0, this.buf.length)) return;
    this.record++;
    const record = this.record;
    let result = readRecord(this.buf, 0, this.buf.length, this.first, record);
    const merged = this.bounds.secondEnd;
    const problem: ReadError | null =
      cut ??
      (merged > 0
        ? { code: 'sdf-merged-records', message: mergedRecordsMessage(merged), at: { line: merged } }
        : null);
    if (problem) result = { ok: false, error: { ...problem, at: { ...problem.at, record } } };
    yield { record, line: this.first, result };
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
