/**
 * The content id of each record file, as git names it (the blob id: sha1 of "blob <length>\0" and the bytes), so
 * that the registry index can be cached by file content. For a git work tree the ids of every clean tracked file
 * come from one `git ls-files` call, without reading a file; a file that is modified, untracked, a link, marked
 * assume-unchanged or skip-worktree, or outside any work tree is hashed from its bytes as git would.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';

/** The blob id of `bytes`: sha1("blob <length>\0" + bytes), as `git hash-object` gives it. */
export function blobIdOf(bytes: Uint8Array): string {
  const hash = createHash('sha1');
  hash.update(`blob ${bytes.length}\0`);
  hash.update(bytes);
  return hash.digest('hex');
}

/** The blob id of a file's bytes (links followed), or null when it cannot be read. */
export function blobIdOfFile(abs: string): string | null {
  try {
    return blobIdOf(readFileSync(abs));
  } catch {
    return null;
  }
}

/** git's output, or null when git is missing, the folder is no work tree, or git fails. */
function git(cwd: string, args: string[]): string | null {
  try {
    return execFileSync('git', args, {
      cwd,
      encoding: 'utf8',
      maxBuffer: 1 << 30,
      stdio: ['ignore', 'pipe', 'ignore'],
      env: { ...process.env, GIT_OPTIONAL_LOCKS: '0' },
    });
  } catch {
    return null;
  }
}

/**
 * Blob ids of the clean tracked regular files under `dirs` (paths relative to `root`, forward slashes), as git's
 * index holds them. Empty when `root` is not in a git work tree. Never throws.
 */
export function gitBlobIds(root: string, dirs: readonly string[]): Map<string, string> {
  const ids = new Map<string, string>();
  const pathspec = ['--', ...(dirs.length > 0 ? dirs : ['.'])];
  // -v: the tag says whether the entry is assume-unchanged (lower case) or skip-worktree (S); only H is plain
  const staged = git(root, ['ls-files', '-s', '-v', '-z', ...pathspec]);
  if (staged === null) return ids;
  const modified = git(root, ['ls-files', '-m', '-z', ...pathspec]);
  if (modified === null) return ids;
  const dirty = new Set(modified.split('\0'));
  for (const line of staged.split('\0')) {
    // "H 100644 <blob> 0\t<path>"
    const tab = line.indexOf('\t');
    if (tab < 0) continue;
    const [tag, mode, blob, stage] = line.slice(0, tab).split(' ');
    const path = line.slice(tab + 1);
    if (tag !== 'H' || stage !== '0' || (mode !== '100644' && mode !== '100755')) continue;
    if (!blob || !/^[0-9a-f]{40}$/.test(blob) || dirty.has(path)) continue;
    ids.set(path, blob);
  }
  return ids;
}

/** Blob ids by path relative to the root: from git where it knows them, else from the bytes (memoized). */
export class BlobIds {
  private readonly hashed = new Map<string, string | null>();

  constructor(
    private readonly fromGit: ReadonlyMap<string, string>,
    private readonly absOf: (rel: string) => string,
  ) {}

  of(rel: string): string | null {
    const known = this.fromGit.get(rel);
    if (known !== undefined) return known;
    let id = this.hashed.get(rel);
    if (id === undefined) {
      id = blobIdOfFile(this.absOf(rel));
      this.hashed.set(rel, id);
    }
    return id;
  }

  /** How many files were hashed from their bytes (not known to git). */
  get hashedCount(): number {
    return this.hashed.size;
  }
}
