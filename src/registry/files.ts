/**
 * Files of a registry on disk: finding record files, reading text safely (binary / non-UTF-8 / oversized files
 * are reported, not thrown), and resolving molfile paths so that they never leave the registry root.
 */
import {
  closeSync,
  constants,
  fstatSync,
  lstatSync,
  openSync,
  readdirSync,
  readSync,
  realpathSync,
  statSync,
  type Dirent,
} from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';

/** Record files larger than this are refused (a record is a few hundred bytes; molfiles a few hundred kB). */
export const MAX_FILE_BYTES = 8 * 1024 * 1024;

export const RECORD_EXTENSIONS = /\.(ya?ml|json)$/i;

export type TextResult = { ok: true; text: string } | { ok: false; error: string };

const UTF8 = new TextDecoder('utf-8', { fatal: true });
/** Opening never waits (a FIFO among the records would otherwise block); fstat then refuses it. */
const OPEN_FLAGS = constants.O_RDONLY | (constants.O_NONBLOCK ?? 0);

/** The bytes of a regular file of at most MAX_FILE_BYTES: one open, one fstat, reads, one close. */
function readRegularFile(abs: string): { ok: true; bytes: Buffer } | { ok: false; error: string } {
  const fd = openSync(abs, OPEN_FLAGS);
  try {
    const st = fstatSync(fd);
    if (!st.isFile()) return { ok: false, error: 'is not a regular file' };
    if (st.size > MAX_FILE_BYTES)
      return { ok: false, error: `is too large (${st.size} bytes, limit ${MAX_FILE_BYTES})` };
    // one read in the usual case; the buffer grows only if the file grew since the fstat
    let buf = Buffer.allocUnsafe(st.size + 1);
    let total = 0;
    for (;;) {
      if (total === buf.length) {
        if (total > MAX_FILE_BYTES)
          return {
            ok: false,
            error: `is too large (more than ${MAX_FILE_BYTES} bytes, limit ${MAX_FILE_BYTES})`,
          };
        const bigger = Buffer.allocUnsafe(buf.length * 2);
        buf.copy(bigger, 0, 0, total);
        buf = bigger;
      }
      const n = readSync(fd, buf, total, buf.length - total, null);
      if (n === 0) break;
      total += n;
    }
    if (total > MAX_FILE_BYTES)
      return {
        ok: false,
        error: `is too large (more than ${MAX_FILE_BYTES} bytes, limit ${MAX_FILE_BYTES})`,
      };
    return { ok: true, bytes: buf.subarray(0, total) };
  } finally {
    closeSync(fd);
  }
}

/** Reads a file as UTF-8 text; a byte-order mark is dropped. */
export function readTextFile(abs: string): TextResult {
  let bytes: Buffer;
  try {
    const read = readRegularFile(abs);
    if (!read.ok) return read;
    bytes = read.bytes;
  } catch (e) {
    return { ok: false, error: `cannot be read (${(e as NodeJS.ErrnoException).code ?? String(e)})` };
  }
  if (bytes.includes(0)) return { ok: false, error: 'is a binary file, not text' };
  let text: string;
  try {
    text = UTF8.decode(bytes);
  } catch {
    return { ok: false, error: 'is not valid UTF-8 text' };
  }
  return { ok: true, text: text.startsWith('\uFEFF') ? text.slice(1) : text };
}

/** Forward-slash path of `abs` relative to `root`. */
export function relativeTo(root: string, abs: string): string {
  // the common case, a normalized path below the root, without path.relative
  if (abs.startsWith(root) && abs[root.length] === sep && !abs.includes(`${sep}.`) && !abs.endsWith(sep)) {
    const rest = abs.slice(root.length + 1);
    if (rest !== '' && !rest.includes(`${sep}${sep}`)) return sep === '/' ? rest : rest.split(sep).join('/');
  }
  return relative(root, abs).split(sep).join('/');
}

/** `abs` lies outside `root`. */
export function escapes(root: string, abs: string): boolean {
  const rel = relative(root, abs);
  return rel === '..' || rel.startsWith(`..${sep}`) || isAbsolute(rel);
}

export type Resolved = { ok: true; abs: string; rel: string } | { ok: false; error: string };

/**
 * Resolves `path` (as written in a record) against `fromDir`. Refuses absolute paths, paths that climb out of
 * `root` (which must already be a real path), and symlinks whose target lies outside it.
 */
export function resolveInside(root: string, fromDir: string, path: string): Resolved {
  if (isAbsolute(path) || /^[a-zA-Z]:[\\/]/.test(path) || path.startsWith('\\') || path.startsWith('~')) {
    return { ok: false, error: `'${path}' is an absolute path; give a path relative to the record file` };
  }
  if (path.includes('\0')) return { ok: false, error: 'the path contains a NUL character' };
  const abs = resolve(fromDir, path);
  if (escapes(root, abs)) return { ok: false, error: `'${path}' leaves the registry folder` };
  let real: string;
  try {
    real = realpathSync(abs);
  } catch {
    return { ok: false, error: `'${path}' does not exist (looked for ${relativeTo(root, abs)})` };
  }
  if (escapes(root, real))
    return { ok: false, error: `'${path}' is a link to a place outside the registry folder` };
  return { ok: true, abs: real, rel: relativeTo(root, abs) };
}

export interface FoundFiles {
  /** Absolute paths, sorted by their path relative to the root. */
  files: string[];
  /** Files that were seen but refused (a link out of the registry), by path relative to the root. */
  refused: { file: string; message: string }[];
  /** Record folders that do not exist. */
  missingDirs: string[];
}

/** All record files (*.yml, *.yaml, *.json) under the record folders; hidden folders and node_modules skipped. */
export function findRecordFiles(root: string, recordDirs: readonly string[]): FoundFiles {
  const found = new Map<string, string>();
  const refused: FoundFiles['refused'] = [];
  const missingDirs: string[] = [];
  const visited = new Set<string>();
  const walk = (dir: string, depth: number): void => {
    if (depth > 32) return;
    let real: string;
    try {
      real = realpathSync(dir);
    } catch {
      return;
    }
    if (visited.has(real) || escapes(root, real)) return;
    visited.add(real);
    let dirents: Dirent[];
    try {
      dirents = readdirSync(dir, { withFileTypes: true }).sort((a, b) =>
        a.name < b.name ? -1 : a.name > b.name ? 1 : 0,
      );
    } catch {
      return;
    }
    for (const dirent of dirents) {
      const name = dirent.name;
      if (name.startsWith('.') || name === 'node_modules') continue;
      const abs = join(dir, name);
      let st: { isDirectory(): boolean; isFile(): boolean; isSymbolicLink(): boolean } = dirent;
      if (!dirent.isDirectory() && !dirent.isFile() && !dirent.isSymbolicLink()) {
        try {
          st = lstatSync(abs);
        } catch {
          continue;
        }
      }
      if (st.isSymbolicLink()) {
        let target;
        try {
          target = realpathSync(abs);
        } catch {
          if (RECORD_EXTENSIONS.test(name))
            refused.push({ file: relativeTo(root, abs), message: 'is a broken link' });
          continue;
        }
        if (escapes(root, target)) {
          if (RECORD_EXTENSIONS.test(name)) {
            refused.push({
              file: relativeTo(root, abs),
              message: 'is a link to a place outside the registry folder',
            });
          }
          continue;
        }
        st = statSync(abs);
      }
      if (st.isDirectory()) walk(abs, depth + 1);
      else if (st.isFile() && RECORD_EXTENSIONS.test(name)) found.set(relativeTo(root, abs), abs);
    }
  };
  for (const d of recordDirs) {
    const r = resolveInside(root, root, d);
    if (!r.ok) {
      missingDirs.push(d);
      continue;
    }
    walk(r.abs === root ? root : resolve(root, d), 0);
  }
  const files = [...found.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([, abs]) => abs);
  return { files, refused, missingDirs };
}

/**
 * Why a file stereogate writes (its index cache, a report) cannot be at `path` in the registry at `realRoot`, or
 * null: inside a record folder it would be read as a record by the next run, or replace one.
 */
export function recordFolderProblem(
  path: string,
  realRoot: string,
  recordDirs: readonly string[],
): string | null {
  let abs = resolve(path);
  try {
    abs = realpathSync(abs);
  } catch {
    try {
      abs = resolve(realpathSync(dirname(abs)), abs.slice(dirname(abs).length + 1));
    } catch {
      // its folder does not exist yet: the cache makes it, outside any existing record folder
    }
  }
  const rel = relativeTo(realRoot, abs);
  if (rel.startsWith('../') || rel === '..' || rel.startsWith('/')) return null;
  const dirs = recordDirs.length > 0 ? recordDirs : ['.'];
  for (const d of dirs) {
    const dir = d.replace(/^\.\/?/, '').replace(/\/+$/, '');
    if (dir === '' || rel === dir || rel.startsWith(`${dir}/`))
      return `${path} is inside the record folder ${dir === '' ? '.' : dir}, where it would be taken for a record`;
  }
  return null;
}
