/**
 * The --index-cache file named on the command line, checked before the run: the cache is read whole and
 * replaced at the end, so it must be a regular file that is a stereogate index cache (or not there yet, or
 * empty). A folder, a device or another file — a record file, a report — is a usage error naming it, instead
 * of a read that never ends or a file overwritten.
 */
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { INDEX_CACHE_FORMAT as CACHE_FORMAT } from '../registry/index-cache.js';
import { InputError } from './command.js';

const HEAD_BYTES = 256;

export function checkIndexCachePath(path: string): void {
  let stat;
  try {
    stat = statSync(path);
  } catch {
    return; // not there yet: the run writes it (its folder is made)
  }
  const refuse = (why: string): never => {
    throw new InputError(`cannot keep the index cache in ${path}: ${why}`);
  };
  if (stat.isDirectory()) refuse('it is a folder');
  if (!stat.isFile()) refuse('it is not a regular file');
  if (stat.size === 0) return;
  const head = Buffer.alloc(HEAD_BYTES);
  let fd: number | null = null;
  try {
    fd = openSync(path, 'r');
    readSync(fd, head, 0, head.length, 0);
  } catch {
    return; // unreadable: the run says the cache was not used
  } finally {
    if (fd !== null) closeSync(fd);
  }
  if (!head.toString('utf8').includes(CACHE_FORMAT))
    refuse('the file there is not a stereogate index cache, and the run would replace it');
}
