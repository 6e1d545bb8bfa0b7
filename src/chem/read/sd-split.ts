/**
 * Where the records of an SD file end, read line by line (CTfile format specification, "SDfile": a molfile,
 * data fields `> <NAME>` whose values run to a blank line, then a `$$$$` line). One reader of the boundaries
 * for the whole program: the SD reader here (describe, compare) and the streamed bulk reader (src/bulk) both feed
 * their lines to an `SdBoundaries`, so a record whose `$$$$` was lost is found the same way everywhere:
 * - a counts line after the record's `M  END`, outside any data-field value, starts the next record three lines
 *   earlier (its header: name, program, comment), and the record before it has no `$$$$`;
 * - a second `M  END` in the data block (the header and counts line were lost too) means two records merged.
 */

/** A V2000 or V3000 counts line: two counts in the first six columns, the version at the end. */
const COUNTS_LINE = /^[ \d]{3}[ \d]{3}.*V[23]000\s*$/;

/** What one line does to the record being read. */
export type SdLineKind =
  /** `$$$$`: the record ends before this line. */
  | 'separator'
  /** A counts line after `M  END`: the next record began three lines up (its header); cut the record there. */
  | 'next-record'
  /** Any other line: it belongs to the record. */
  | 'line';

/** Follows one record at a time: where it stands (molfile, data block, inside a value) and what went wrong. */
export class SdBoundaries {
  private afterEnd = false;
  private inValue = false;
  private lines = 0;
  /** Line of a second `M  END` in the record's data block (two records merged), 0 when none. */
  secondEnd = 0;

  /** The kind of the next line of the file (`lineNo` 1-based); call `start()` after a separator or a cut. */
  next(raw: string, lineNo: number): SdLineKind {
    if (raw.startsWith('$$$$')) return 'separator';
    if (this.afterEnd && !this.inValue) {
      if (COUNTS_LINE.test(raw) && this.lines >= 3) return 'next-record';
      if (raw.startsWith('M  END') && this.secondEnd === 0) this.secondEnd = lineNo;
    }
    if (!this.afterEnd && raw.startsWith('M  END')) this.afterEnd = true;
    else if (this.afterEnd) {
      if (raw.startsWith('>')) this.inValue = true;
      else if (raw.trim() === '') this.inValue = false;
    }
    this.lines++;
    return 'line';
  }

  /**
   * A new record: after a separator (`header` = 0), or after a cut at a counts line (`header` = the 3 lines
   * already read, which belong to the new record). Call `next` for the counts line again afterwards.
   */
  start(header = 0): void {
    this.afterEnd = false;
    this.inValue = false;
    this.secondEnd = 0;
    this.lines = header;
  }
}

/** Lines of a record header before its counts line (name, program, comment). */
export const SD_HEADER_LINES = 3;

/** Why a record cut at a counts line is reported: its `$$$$` is missing. */
export function lostSeparatorMessage(nextRecordLine: number): string {
  return (
    `the record has no $$$$ line: the next record starts at line ${nextRecordLine} (its counts line follows ` +
    "this record's data); the two were read as separate records"
  );
}

/** Why a record with a second `M  END` in its data block is reported. */
export function mergedRecordsMessage(secondEndLine: number): string {
  return (
    `a second "M  END" at line ${secondEndLine} inside the record's data block: two records merged ` +
    '(a lost $$$$ line and header?); only the first structure was read'
  );
}
