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
export function git(cwd: string, args: string[]): Promise<string | null> {
  return new Promise((done) => {
    execFile(
      'git',
      // pathspecs are folder names from the config, never patterns
      ['--literal-pathspecs', ...args],
      { cwd, encoding: 'utf8', maxBuffer: 1 << 30, env: { ...process.env, GIT_OPTIONAL_LOCKS: '0' } },
      (error, stdout) => done(error ? null : stdout),
    );
  });
}

/** The pathspec of the record folders for git. */
export const pathspecOf = (dirs: readonly string[]) => ['--', ...(dirs.length > 0 ? dirs : ['.'])];

/** The arguments of the two listings `eachStaged` reads. */
export const STAGED_ARGS = ['ls-files', '-s', '-v', '-z'];
export const MODIFIED_ARGS = ['ls-files', '-m', '-z'];

/**
 * Each entry of git's index listing (`git ls-files -s -v -z`), with its blob id when git vouches for the file's
 * content: a clean (not in `modified`, from `git ls-files -m -z`), plainly tracked (tag H: not assume-unchanged
 * or skip-worktree), merged (stage 0) regular file; else null (a link, a submodule, a modified file...).
 */
export function eachStaged(
  staged: string,
  modified: string,
  visit: (path: string, blob: string | null) => void,
): void {
  const dirty = new Set(modified.split('\0'));
  // each entry: "H 100644 <40 hex> 0\t<path>\0", read at fixed offsets (no string per field)
  for (let at = 0; at < staged.length;) {
    const end = staged.indexOf('\0', at);
    const stop = end < 0 ? staged.length : end;
    const plain =
      staged.startsWith('H 100644 ', at) || staged.startsWith('H 100755 ', at)
        ? staged.startsWith(' 0\t', at + 49)
        : false;
    const tab = staged.indexOf('\t', at);
    if (plain && stop > at + 52) {
      const path = staged.slice(at + 52, stop);
      const blob = staged.slice(at + 9, at + 49);
      visit(path, !dirty.has(path) && isHex40(blob) ? blob : null);
    } else if (tab >= 0 && tab < stop - 1) visit(staged.slice(tab + 1, stop), null);
    at = stop + 1;
  }
}

/** 40 lower-case hex digits, without a regular expression per entry. */
function isHex40(s: string): boolean {
  if (s.length !== 40) return false;
  for (let i = 0; i < 40; i++) {
    const c = s.charCodeAt(i);
    if (!((c >= 48 && c <= 57) || (c >= 97 && c <= 102))) return false;
  }
  return true;
}

/**
 * Blob ids of the clean tracked regular files under `dirs` (paths relative to `root`, forward slashes), as git's
 * index holds them. Empty when `root` is not in a git work tree. The two git commands run while the caller goes
 * on (they take a second at 200,000 files). Never rejects.
 */
export async function gitBlobIds(root: string, dirs: readonly string[]): Promise<Map<string, string>> {
  const pathspec = pathspecOf(dirs);
  const [staged, modified] = await Promise.all([
    git(root, [...STAGED_ARGS, ...pathspec]),
    git(root, [...MODIFIED_ARGS, ...pathspec]),
  ]);
  return staged === null || modified === null ? new Map() : blobIdsFromListing(staged, modified);
}

/** The blob ids git vouches for in its listings (see eachStaged), by path. */
export function blobIdsFromListing(staged: string, modified: string): Map<string, string> {
  const ids = new Map<string, string>();
  eachStaged(staged, modified, (path, blob) => {
    if (blob !== null) ids.set(path, blob);
  });
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
