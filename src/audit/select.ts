/** Which records `paths` name: a record file, a folder of records, or a molfile a record uses. */
import { isAbsolute, relative, sep } from 'node:path';
import type { LoadedRecord } from '../registry/types.js';

/** A path as given (relative to the root, or absolute) -> forward-slash path relative to the root. */
export function normalizePath(root: string, path: string): string {
  const rel = isAbsolute(path) ? relative(root, path) : path;
  const parts: string[] = [];
  for (const part of rel.split(/[\\/]+/)) {
    if (part === '' || part === '.') continue;
    if (part === '..') parts.pop();
    else parts.push(part);
  }
  return parts.join('/');
}

/**
 * What selection needs of a record: its file and the molfiles it uses. A LoadedRecord is one; so is a record
 * known only by its row of the registry index (review-against-index.ts).
 */
export interface SelectableRecord {
  file: string;
  sources?: { main: { file?: string } | null; components: readonly { file?: string }[] };
}

/** Records by the molfile paths they use (main structure and components). */
function byMolfile<R extends SelectableRecord>(records: readonly R[]): Map<string, R[]> {
  const users = new Map<string, R[]>();
  const add = (file: string | undefined, r: R): void => {
    if (file === undefined) return;
    const list = users.get(file);
    if (!list) users.set(file, [r]);
    else if (list[list.length - 1] !== r) list.push(r);
  };
  for (const r of records) {
    const s = r.sources;
    if (!s) continue;
    add(s.main?.file, r);
    for (const c of s.components) add(c.file, r);
  }
  return users;
}

/** Index of the first entry of `sorted` (by file) whose file is >= `file`. */
function lowerBound(sorted: readonly SelectableRecord[], file: string): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]!.file < file) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export interface Selection<R extends SelectableRecord = LoadedRecord> {
  selected: Set<R>;
  /** Paths that named no record (as given). */
  unmatched: string[];
}

export function selectRecords<R extends SelectableRecord = LoadedRecord>(
  records: readonly R[],
  root: string,
  paths: readonly string[],
): Selection<R> {
  const selected = new Set<R>();
  const unmatched: string[] = [];
  let users: Map<string, R[]> | null = null;
  let sorted: R[] | null = null;
  for (const given of paths) {
    const p = normalizePath(root, given);
    const escapes =
      isAbsolute(given) && (relative(root, given).startsWith(`..${sep}`) || relative(root, given) === '..');
    let hit = false;
    if (!escapes) {
      sorted ??= [...records].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
      // the root names every record; else the record file itself, then every record file in the folder p
      if (p === '') {
        for (const r of records) selected.add(r);
        hit = records.length > 0;
      }
      for (const start of p === '' ? [] : [p, `${p}/`]) {
        for (let i = lowerBound(sorted, start); i < sorted.length; i++) {
          const r = sorted[i]!;
          if (start === p ? r.file !== p : !r.file.startsWith(start)) break;
          selected.add(r);
          hit = true;
        }
      }
      users ??= byMolfile(records);
      for (const r of users.get(p) ?? []) {
        selected.add(r);
        hit = true;
      }
    }
    if (!hit) unmatched.push(given);
  }
  return { selected, unmatched };
}
