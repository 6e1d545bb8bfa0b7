/**
 * The content id of each record file, as git names it (the blob id: sha1 of "blob <length>\0" and the bytes), so
 * that the registry index can be cached by file content. For a git work tree the ids of every clean tracked file
 * come from one `git ls-files` call, without reading a file; a file that is modified, untracked, a link, marked
 * assume-unchanged or skip-worktree, or outside any work tree is hashed from its bytes as git would.
 */
import { execFile } from 'node:child_process';
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

/** git's output, or null when git is missing, the folder is no work tree, or git fails. Never rejects. */
function git(cwd: string, args: string[]): Promise<string | null> {
  return new Promise((done) => {
    execFile(
      'git',
      args,
      { cwd, encoding: 'utf8', maxBuffer: 1 << 30, env: { ...process.env, GIT_OPTIONAL_LOCKS: '0' } },
      (error, stdout) => done(error ? null : stdout),
    );
  });
}

/**
 * Blob ids of the clean tracked regular files under `dirs` (paths relative to `root`, forward slashes), as git's
 * index holds them. Empty when `root` is not in a git work tree. The two git commands run while the caller goes
 * on (they take a second at 200,000 files). Never rejects.
 */
export async function gitBlobIds(root: string, dirs: readonly string[]): Promise<Map<string, string>> {
  const ids = new Map<string, string>();
  const pathspec = ['--', ...(dirs.length > 0 ? dirs : ['.'])];
  // -v: the tag says whether the entry is assume-unchanged (lower case) or skip-worktree (S); only H is plain
  const [staged, modified] = await Promise.all([
    git(root, ['ls-files', '-s', '-v', '-z', ...pathspec]),
    git(root, ['ls-files', '-m', '-z', ...pathspec]),
  ]);
  if (staged === null || modified === null) return ids;
  const dirty = new Set(modified.split('\0'));
  // each entry: "H 100644 <40 hex> 0\t<path>\0", read at fixed offsets (no string per field)
  for (let at = 0; at < staged.length;) {
    const end = staged.indexOf('\0', at);
    const stop = end < 0 ? staged.length : end;
    const plain =
      staged.startsWith('H 100644 ', at) || staged.startsWith('H 100755 ', at)
        ? staged.startsWith(' 0\t', at + 49)
        : false;
    if (plain && stop > at + 52) {
      const path = staged.slice(at + 52, stop);
      const blob = staged.slice(at + 9, at + 49);
      if (!dirty.has(path) && /^[0-9a-f]{40}$/.test(blob)) ids.set(path, blob);
    }
    at = stop + 1;
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
