/**
 * Output files named on the command line: checked before the work starts, so a mistyped folder gives one clear
 * line (exit 2) instead of a raw ENOENT after a long run.
 */
import { existsSync, realpathSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { loadConfig } from '../audit/config.js';
import { recordFolderProblem } from '../registry/files.js';
import { InputError } from './command.js';

/** Why a file cannot be written, in words (not a bare error code). */
export function writeFailureReason(e: unknown): string {
  const code = (e as NodeJS.ErrnoException | null)?.code;
  if (code === 'ENOENT') return 'its folder does not exist';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder';
  if (code === 'ENOSPC') return 'no space left on the device';
  return e instanceof Error ? e.message : String(e);
}

export function writeFailure(path: string, e: unknown): string {
  return `cannot write ${path}: ${writeFailureReason(e)}`;
}

/** Throws InputError when `path` cannot be a file to write: its folder is missing, or it is a folder. */
export function checkWritable(path: string, what: string): void {
  const dir = dirname(resolve(path));
  if (!existsSync(dir) || !statSync(dir).isDirectory())
    throw new InputError(`cannot write ${what} to ${path}: the folder ${dirname(path)} does not exist`);
  if (existsSync(path) && statSync(path).isDirectory())
    throw new InputError(`cannot write ${what} to ${path}: it is a folder`);
}

/**
 * Throws InputError when `path` lies in a record folder of the registry at `root`: a report written there
 * would replace a record file, or be read as one by the next audit. A registry or config that cannot be read
 * is left to the run, which reports it.
 */
export function checkOutsideRecords(path: string, what: string, root: string, configFile?: string): void {
  let problem: string | null = null;
  try {
    const real = realpathSync(resolve(root));
    problem = recordFolderProblem(path, real, loadConfig(real, configFile).config.recordDirs);
  } catch {
    return;
  }
  if (problem !== null) throw new InputError(`cannot write ${what} to ${path}: ${problem}`);
}
