/**
 * Record files as a source of the streamed audit, like an SD or CSV export: the record folders are listed (sorted
 * by path, as loadRegistry sorts them) and read once, quickly, for what every worker must know about the other
 * records before it audits its own — which file holds an id (lookups by id, e.g. origin inputs), the ids of the
 * records that pass the schema (suggestions for an id not found), and the ids used by more than one file (a
 * record-schema problem on each of them). Nothing else of a record is kept; the workers load and audit the files.
 */
import { join } from 'node:path';
import { duplicateIdProblems } from '../registry/load.js';
import { findRecordFiles, readTextFile, relativeTo } from '../registry/files.js';
import { parseRecordText } from '../registry/parse.js';
import { lineOf } from '../registry/positions.js';
import type { LoadedRecord } from '../registry/types.js';

/** One record file to audit: its place in the audit's order and its path relative to the registry root. */
export interface RecordFileItem {
  seq: number;
  file: string;
  /** A file seen but refused while listing (a link out of the registry): why, instead of its text. */
  refused?: string;
}

/** What the workers know of the other records (structured-cloneable, sent once to each worker). */
export interface FolderLookup {
  /** Real path of the registry root. */
  root: string;
  /**
   * id -> file of the first record (in the audit's order) with that id that passes the schema. Its keys are the
   * ids an in-memory registry view lists, each once (a closest-id suggestion picks the same one).
   */
  byId: Map<string, string>;
  /** file -> the duplicate-id problem of that record. */
  duplicates: Map<string, LoadedRecord['problems'][number]>;
}

export interface RecordFolder {
  items: RecordFileItem[];
  lookup: FolderLookup;
  /** Id of each item (null when the file gave none), for results made on the main thread (time limit, crash). */
  idOf: (seq: number) => string | null;
  missingDirs: string[];
}

/** The record files under the record folders, sorted by path; refused files (links out) with the reason. */
export interface RecordFileList {
  files: { file: string; refused?: string }[];
  missingDirs: string[];
}

/** Lists the record folders of a registry (`root` must be a real path), as loadRegistry finds them. */
export function listRecordFiles(root: string, recordDirs: readonly string[]): RecordFileList {
  const found = findRecordFiles(root, recordDirs);
  const files: RecordFileList['files'] = found.files.map((abs) => ({ file: relativeTo(root, abs) }));
  for (const r of found.refused) files.push({ file: r.file, refused: r.message });
  files.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
  return { files, missingDirs: found.missingDirs };
}

/** Pre-reads listed record files for what the workers must know of the other records (see above). */
export function readRecordFolder(root: string, list: RecordFileList): RecordFolder {
  const { files } = list;
  const itemIds: (string | null)[] = [];
  const byId = new Map<string, string>();
  const seen: { id: string; file: string; line: number | null }[] = [];
  for (const f of files) {
    const read = f.refused === undefined ? readTextFile(join(root, f.file)) : null;
    const parsed = read?.ok ? parseRecordText(read.text) : null;
    const id = parsed?.id ?? null;
    itemIds.push(id);
    if (id === null || !parsed) continue;
    seen.push({ id, file: f.file, line: lineOf(parsed.positions, 'id') });
    if (parsed.record !== null && !byId.has(id)) byId.set(id, f.file);
  }
  return {
    items: files.map((f, i) => ({ seq: i + 1, ...f })),
    lookup: { root, byId, duplicates: duplicateIdProblems(seen) },
    idOf: (seq) => itemIds[seq - 1] ?? null,
    missingDirs: list.missingDirs,
  };
}
