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

function usesFile(r: LoadedRecord, file: string): boolean {
  const s = r.sources;
  if (!s) return false;
  return s.main?.file === file || s.components.some((c) => c.file === file);
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
  for (const given of paths) {
    const p = normalizePath(root, given);
    const escapes =
      isAbsolute(given) && (relative(root, given).startsWith(`..${sep}`) || relative(root, given) === '..');
    let hit = false;
    if (!escapes) {
      for (const r of records) {
        if (p === '' || r.file === p || r.file.startsWith(`${p}/`) || usesFile(r, p)) {
          selected.add(r);
          hit = true;
        }
      }
    }
    if (!hit) unmatched.push(given);
  }
  return { selected, unmatched };
}
