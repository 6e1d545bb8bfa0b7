/**
 * What a pull request asks to audit, as paths relative to the registry root: the record files it adds or changes
 * (in the record folders), and the molfiles it adds, changes, renames or removes — the audit picks the records that
 * use those (src/audit/select.ts). Removed record files are not audited (they are gone).
 */
import { posix } from 'node:path';
import type { ChangedFile } from '../github/changed-files.js';
import { toRegistryPath } from '../github/paths.js';

const RECORD_FILE = /\.(ya?ml|json)$/i;
const STRUCTURE_FILE = /\.(mol|sdf|mdl)$/i;

export interface Selection {
  /** Record files to audit. */
  records: string[];
  /** Structure files whose records are to be audited. */
  molfiles: string[];
}

export function selectChanged(
  changed: readonly ChangedFile[],
  options: { registryDir: string; recordDirs: readonly string[] },
): Selection {
  const dirs = options.recordDirs.map((d) => posix.normalize(d.replace(/\\/g, '/')).replace(/\/+$/, ''));
  const inRecordDir = (rel: string): boolean =>
    dirs.some((dir) => dir === '.' || dir === '' || rel.startsWith(dir + '/'));
  const records = new Set<string>();
  const molfiles = new Set<string>();
  for (const file of changed) {
    for (const repoPath of [file.path, file.previousPath]) {
      if (repoPath === null) continue;
      const rel = toRegistryPath(options.registryDir, repoPath);
      if (rel === null) continue;
      if (STRUCTURE_FILE.test(rel)) molfiles.add(rel);
      else if (
        repoPath === file.path &&
        file.status !== 'removed' &&
        RECORD_FILE.test(rel) &&
        inRecordDir(rel)
      ) {
        records.add(rel);
      }
    }
  }
  return { records: [...records].sort(), molfiles: [...molfiles].sort() };
}
