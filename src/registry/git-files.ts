/**
 * The record files of a registry in a git work tree, from git's own listings instead of a walk of the folders:
 * `git ls-files -s` (tracked, with blob ids), `-m` (modified) and `-o` (untracked, ignored ones included, as the
 * walk sees them). The files are those findRecordFiles (files.ts) finds, refused ones with the same messages:
 * the same name rules (record extensions, no hidden folder or node_modules below a record folder, at most 32
 * folders deep), a clean tracked regular file taken on git's word, anything else looked at as the walk would
 * (a link followed when it stays inside the registry, refused when broken or leading out). Where the listing
 * cannot say what the walk would find — a link or a folder where git has a file, a nested repository, a record
 * folder that is a link or missing, a path deeper than the walk goes — the answer is null and the caller walks.
 */
import { lstatSync, realpathSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { blobIdsFromListing, eachStaged, git, MODIFIED_ARGS, pathspecOf, STAGED_ARGS } from './blob-ids.js';
import { escapes, RECORD_EXTENSIONS, relativeTo, resolveInside, type FoundFiles } from './files.js';

/** The walk's depth limit (files.ts): folders more than this many below a record folder are not entered. */
const MAX_DEPTH = 32;

export interface GitRecordFiles {
  /** Blob ids git vouches for (blob-ids.ts gitBlobIds). */
  ids: Map<string, string>;
  /**
   * The record files (paths relative to the root, sorted) and the refused ones, or null when git cannot list
   * them as the walk would (then walk).
   */
  found: { files: string[]; refused: FoundFiles['refused'] } | null;
}

/** What a path is to the walk, by its name alone. */
type Named = 'record' | 'other' | 'skipped';

/** Record files and blob ids under `dirs` of the real registry root `root`. Never rejects. */
export async function gitRecordFiles(root: string, dirs: readonly string[]): Promise<GitRecordFiles> {
  const pathspec = pathspecOf(dirs);
  const [staged, modified, untracked] = await Promise.all([
    git(root, [...STAGED_ARGS, ...pathspec]),
    git(root, [...MODIFIED_ARGS, ...pathspec]),
    git(root, ['ls-files', '-o', '-z', ...pathspec]),
  ]);
  if (staged === null || modified === null || untracked === null) return { ids: new Map(), found: null };
  const prefixes = folderPrefixes(root, dirs);
  if (prefixes === null) return { ids: blobIdsFromListing(staged, modified), found: null };
  const named = (path: string): Named => {
    let seen: Named = 'skipped';
    for (const p of prefixes) {
      if (p !== '' && !(path.startsWith(p) && path[p.length] === '/')) continue;
      const rest = p === '' ? path : path.slice(p.length + 1);
      if (hiddenBelow(rest)) continue;
      if (RECORD_EXTENSIONS.test(rest)) return 'record';
      seen = 'other';
    }
    return seen;
  };
  const files: string[] = [];
  const refused: FoundFiles['refused'] = [];
  let walk = false;
  // anything but a clean tracked regular file: looked at on disk as the walk would
  const look = (path: string): void => {
    const name = named(path);
    if (name === 'skipped') return;
    if (depthOf(path) > MAX_DEPTH) {
      walk = true;
      return;
    }
    const abs = join(root, path);
    let st;
    try {
      st = lstatSync(abs);
    } catch {
      return; // gone from the work tree (deleted, or not checked out): the walk does not see it
    }
    if (st.isDirectory()) walk = true;
    else if (st.isFile()) {
      if (name === 'record') files.push(path);
    } else if (st.isSymbolicLink()) {
      let target;
      try {
        target = realpathSync(abs);
      } catch {
        if (name === 'record') refused.push({ file: path, message: 'is a broken link' });
        return;
      }
      if (escapes(root, target)) {
        if (name === 'record')
          refused.push({ file: path, message: 'is a link to a place outside the registry folder' });
        return;
      }
      const to = statSync(abs);
      if (to.isDirectory()) walk = true;
      else if (to.isFile() && name === 'record') files.push(path);
    }
  };
  const ids = new Map<string, string>();
  eachStaged(staged, modified, (path, blob) => {
    if (blob === null) return look(path);
    ids.set(path, blob);
    if (named(path) === 'record') {
      if (depthOf(path) > MAX_DEPTH) walk = true;
      else files.push(path);
    }
  });
  for (const path of untracked.split('\0')) {
    if (path === '') continue;
    // a nested repository is listed as its folder
    if (path.endsWith('/')) walk = true;
    else look(path);
  }
  if (walk) return { ids, found: null };
  files.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  // a path is listed more than once only while a merge conflict is open (one entry per stage)
  const unique = files.filter((f, i) => i === 0 || files[i - 1] !== f);
  return { ids, found: { files: unique, refused } };
}

/** Folders above the file, counted from the root (the walk's depth is counted from a record folder: not more). */
function depthOf(path: string): number {
  let n = 0;
  for (let at = path.indexOf('/'); at >= 0; at = path.indexOf('/', at + 1)) n++;
  return n;
}

/** A part of the path below a record folder is hidden (starts with a dot) or is node_modules: the walk skips it. */
function hiddenBelow(rest: string): boolean {
  if (rest.startsWith('.') || rest.includes('/.')) return true;
  return rest.includes('node_modules') && rest.split('/').includes('node_modules');
}

/**
 * Each record folder as a path relative to the root ('' for the root itself), or null when one is missing, not
 * a folder, or reached through a link (the walk then decides what it holds).
 */
function folderPrefixes(root: string, dirs: readonly string[]): string[] | null {
  const prefixes: string[] = [];
  for (const d of dirs) {
    const r = resolveInside(root, root, d);
    if (!r.ok || r.abs !== resolve(root, d)) return null;
    try {
      if (!statSync(r.abs).isDirectory()) return null;
    } catch {
      return null;
    }
    prefixes.push(r.abs === root ? '' : relativeTo(root, r.abs));
  }
  return prefixes;
}
