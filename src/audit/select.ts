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

/** Records by the molfile paths they use (main structure and components). */
function byMolfile(records: readonly LoadedRecord[]): Map<string, LoadedRecord[]> {
  const users = new Map<string, LoadedRecord[]>();
  const add = (file: string | undefined, r: LoadedRecord): void => {
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
function lowerBound(sorted: readonly LoadedRecord[], file: string): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]!.file < file) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export interface Selection {
  selected: Set<LoadedRecord>;
  /** Paths that named no record (as given). */
  unmatched: string[];
}

export function selectRecords(
  records: readonly LoadedRecord[],
  root: string,
  paths: readonly string[],
): Selection {
  const selected = new Set<LoadedRecord>();
  const unmatched: string[] = [];
  let users: Map<string, LoadedRecord[]> | null = null;
  let sorted: LoadedRecord[] | null = null;
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
