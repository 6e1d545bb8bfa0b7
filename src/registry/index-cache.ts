/**
 * The registry index cached on disk: one entry per record file, its row of the key index (keys.ts) filed under
 * the file's blob id (blob-ids.ts) and the blob ids of the molfiles it uses. A later run reuses an entry whose
 * blob ids still match and reads only the other files.
 *
 * The file is text: a JSON header naming the stereogate version and the settings that shape the keys, one line
 * per entry, and an end line with the count. An entry line holds tab-separated columns (file, blob id, schema,
 * keyed, heavy-atom formula, id, line of the id, molfiles) and, for a keyed row only, the rest of the row as
 * JSON. A warm run reads the columns and parses the rest of a row only when a review needs its keys, so it
 * builds no object per row of the registry beyond its entry. Any difference in the header, a missing end line
 * (a truncated file) means the whole cache is built again; a line of the wrong shape, that file alone. A
 * missing, stale or damaged cache only costs time, never a finding. Written to a temporary file and renamed, so
 * a run that stops half-way leaves the previous cache whole.
 */
import { mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { isString, restOf, rowFromRest } from './index-cache-shape.js';
import type { IndexRow } from './keys.js';

/** An index row without its place in one run's order. */
export type IndexRowData = Omit<IndexRow, 'seq'>;

export interface IndexEntry {
  /** Path relative to the registry root, forward slashes (also the row's file). */
  file: string;
  blob: string;
  /** The molfiles the record uses (main structure and components): path relative to the root, blob id. */
  molfiles: [path: string, blob: string][];
  /** The record follows the record schema (per-record checks may look it up by id). */
  valid: boolean;
  /** Heavy-atom formula of the main structure from its SMILES syntax; null when unknown. */
  heavy: string | null;
  /** The row's keys are computed; false: a light row (no keys until a review needs them). */
  keyed: boolean;
  /** The record's id and the line of its id (the row's). */
  id: string | null;
  idLine: number | null;
  /** The whole row: of a file read in this run, or of a cached keyed entry once `entryRow` parsed it. */
  row: IndexRowData | null;
  /** A cached keyed entry: the stored rest of its row, not yet parsed. */
  rest: string | null;
  /** A cached entry: its line as stored, written back unchanged. */
  line: string | null;
}

/** What the keys depend on besides the files: a cache made under other settings is not used. */
export interface CacheSettings {
  version: string;
  /** Engine settings from the audit configuration. */
  axisOrthoMin: number;
}

/** The format name every cache file's header states (the CLI looks for it before it lets a run replace a file). */
export const INDEX_CACHE_FORMAT = 'stereogate registry index cache';
const FORMAT = INDEX_CACHE_FORMAT;
/** A cache larger than this is not read (200,000 records make about 19 MB). */
const MAX_CACHE_BYTES = 1 << 30;
const FORMAT_VERSION = 4;
const END = 'end\t';

export type CacheRead =
  | { status: 'used'; entries: IndexEntry[] }
  | { status: 'missing' | 'unreadable' | 'stale'; entries: []; reason: string };

/**
 * The row of `e`: in memory, or parsed from the cache (then kept). Null for a cached light entry (its row is not
 * stored: a review that needs it reads the file) and for a stored rest of the wrong shape.
 */
export function entryRow(e: IndexEntry): IndexRowData | null {
  if (e.row === null && e.rest !== null) {
    e.row = rowFromRest(e.rest, e.file, e.id, e.idLine);
    // a damaged rest is not tried twice, nor written back
    if (e.row === null) e.line = null;
    e.rest = null;
  }
  return e.row;
}

/** Reads the cache at `path`. Never throws: a missing, damaged or stale file gives no entries and says why. */
export function readIndexCache(path: string, settings: CacheSettings): CacheRead {
  let text: string;
  try {
    const stat = statSync(path);
    if (!stat.isFile()) return { status: 'unreadable', entries: [], reason: `${path} is not a regular file` };
    if (stat.size > MAX_CACHE_BYTES)
      return { status: 'unreadable', entries: [], reason: `${path} is larger than 1 GiB` };
    text = readFileSync(path, 'utf8');
  } catch {
    return { status: 'missing', entries: [], reason: 'no cache file yet' };
  }
  const unreadable = (reason: string): CacheRead => ({ status: 'unreadable', entries: [], reason });
  const headEnd = text.indexOf('\n');
  let head: Record<string, unknown> | null = null;
  try {
    head = JSON.parse(headEnd < 0 ? text : text.slice(0, headEnd)) as Record<string, unknown> | null;
  } catch {
    return unreadable('the cache file does not start with a valid header');
  }
  if (!head || typeof head !== 'object' || head.format !== FORMAT)
    return unreadable('the cache file is not a stereogate index cache');
  const was = head.settings as Partial<CacheSettings> | undefined;
  if (
    head.formatVersion !== FORMAT_VERSION ||
    !was ||
    was.version !== settings.version ||
    was.axisOrthoMin !== settings.axisOrthoMin
  )
    return {
      status: 'stale',
      entries: [],
      reason: 'the cache was made by another stereogate version or with other settings',
    };
  const entries: IndexEntry[] = [];
  let lines = 0;
  for (let at = headEnd + 1; at > 0 && at < text.length;) {
    const end = text.indexOf('\n', at);
    if (end < 0) break;
    if (text.startsWith(END, at)) {
      if (Number(text.slice(at + END.length, end)) === lines && end + 1 === text.length)
        return { status: 'used', entries };
      break;
    }
    lines++;
    const e = entryOf(text, at, end);
    if (e) entries.push(e);
    at = end + 1;
  }
  return unreadable('the cache file is incomplete (no end line with its count of entries)');
}

/** Writes the cache (temporary file, then rename). Returns the error message, or null when written. */
export function writeIndexCache(
  path: string,
  settings: CacheSettings,
  entries: readonly IndexEntry[],
): string | null {
  const tmp = `${path}.${process.pid}.tmp`;
  try {
    let stat = null;
    try {
      stat = statSync(path);
    } catch {
      // not there yet
    }
    if (stat && !stat.isFile()) return `${path} is not a regular file, so it is not replaced`;
    mkdirSync(dirname(path), { recursive: true });
    const head = JSON.stringify({ format: FORMAT, formatVersion: FORMAT_VERSION, settings });
    const lines = entries.map(lineOf);
    writeFileSync(tmp, `${head}\n${lines.join('')}${END}${lines.length}\n`);
    renameSync(tmp, path);
    return null;
  } catch (e) {
    rmSync(tmp, { force: true });
    return (e as Error).message;
  }
}

/** A text column: tab, newline, carriage return and backslash escaped with a backslash. */
function escape(s: string): string {
  return /[\t\n\r\\]/.test(s)
    ? s.replace(/[\t\n\r\\]/g, (c) => (c === '\t' ? '\\t' : c === '\n' ? '\\n' : c === '\r' ? '\\r' : '\\\\'))
    : s;
}

function unescape(s: string): string {
  if (!s.includes('\\')) return s;
  return s.replace(/\\(.)/g, (_, c: string) => (c === 't' ? '\t' : c === 'n' ? '\n' : c === 'r' ? '\r' : c));
}

/** A column that may be null: empty for null, else "=" and the text. */
const optional = (s: string | null) => (s === null ? '' : `=${escape(s)}`);

function lineOf(e: IndexEntry): string {
  if (e.line !== null) return e.line;
  const row = e.keyed ? entryRow(e) : null;
  const cols = [
    escape(e.file),
    e.blob,
    e.valid ? '1' : '0',
    row === null ? '0' : '1',
    optional(e.heavy),
    optional(e.id),
    e.idLine === null ? '' : String(e.idLine),
    e.molfiles.length === 0 ? '' : JSON.stringify(e.molfiles),
    row === null ? '' : JSON.stringify(restOf(row)),
  ];
  return `${cols.join('\t')}\n`;
}

const COLUMNS = 9;

/** The entry of the line text[from, to), or null when it is not of the stored shape (that file is read again). */
function entryOf(text: string, from: number, to: number): IndexEntry | null {
  const cols: string[] = [];
  for (let at = from; cols.length < COLUMNS;) {
    const tab = text.indexOf('\t', at);
    const stop = tab < 0 || tab > to ? to : tab;
    cols.push(text.slice(at, stop));
    if (stop === to) break;
    at = stop + 1;
  }
  if (cols.length !== COLUMNS) return null;
  const [file, blob, valid, keyed, heavy, id, idLine, molfiles, rest] = cols as [
    string,
    string,
    string,
    string,
    string,
    string,
    string,
    string,
    string,
  ];
  // the blob id is only compared with git's: a wrong one only means the file is read again
  if (file === '' || blob.length !== 40 || (valid !== '0' && valid !== '1')) return null;
  if ((keyed === '1') !== (rest !== '') || (keyed !== '0' && keyed !== '1')) return null;
  if ((heavy !== '' && heavy[0] !== '=') || (id !== '' && id[0] !== '=')) return null;
  const line = idLine === '' ? null : Number(idLine);
  if (line !== null && !(Number.isInteger(line) && line > 0)) return null;
  const mols = molfiles === '' ? [] : molfilesOf(molfiles);
  if (mols === null) return null;
  return {
    file: unescape(file),
    blob,
    molfiles: mols,
    valid: valid === '1',
    heavy: heavy === '' ? null : unescape(heavy.slice(1)),
    keyed: keyed === '1',
    id: id === '' ? null : unescape(id.slice(1)),
    idLine: line,
    row: null,
    rest: rest === '' ? null : rest,
    line: text.slice(from, to + 1),
  };
}

function molfilesOf(text: string): [string, string][] | null {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return null;
  }
  return Array.isArray(raw) &&
    raw.every((m) => Array.isArray(m) && m.length === 2 && isString(m[0]) && isString(m[1]))
    ? (raw as [string, string][])
    : null;
}
