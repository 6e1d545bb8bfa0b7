/**
 * The changed files of a pull request from the checked-out repository, for when the REST API cannot list them
 * (more than its 3,000-file cap, or the API is down). Needs both commits in the checkout (fetch-depth: 0).
 * Runs git without a shell; commit ids are checked to be hex so nothing can pass as an option.
 */
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { ChangedFile, FileStatus } from './changed-files.js';

const run = promisify(execFile);

function checkSha(sha: string): string {
  if (!/^[0-9a-f]{7,64}$/i.test(sha)) throw new Error(`not a commit id: ${JSON.stringify(sha)}`);
  return sha;
}

async function git(workspace: string, args: string[]): Promise<string> {
  const { stdout } = await run('git', ['-c', 'core.quotepath=off', ...args], {
    cwd: workspace,
    maxBuffer: 256 * 1024 * 1024,
    encoding: 'utf8',
  });
  return stdout;
}

const STATUS: Record<string, FileStatus> = {
  A: 'added',
  M: 'modified',
  D: 'removed',
  R: 'renamed',
  C: 'copied',
  T: 'changed',
};

/** `git diff --name-status base...head`: the files the head side changed since the merge base. */
export async function gitChangedFiles(
  workspace: string,
  baseSha: string,
  headSha: string,
): Promise<ChangedFile[]> {
  const out = await git(workspace, [
    'diff',
    '--name-status',
    '-M',
    '-z',
    `${checkSha(baseSha)}...${checkSha(headSha)}`,
  ]);
  return parseNameStatus(out);
}

/** Parse `git diff --name-status -z` output: status NUL path NUL, or for renames/copies status NUL old NUL new NUL. */
export function parseNameStatus(out: string): ChangedFile[] {
  const parts = out.split('\0');
  const files: ChangedFile[] = [];
  for (let i = 0; i < parts.length;) {
    const code = parts[i++] ?? '';
    if (code === '') continue;
    const status = STATUS[code[0] ?? ''] ?? 'changed';
    if (status === 'renamed' || status === 'copied') {
      const previousPath = parts[i++] ?? '';
      const path = parts[i++] ?? '';
      files.push({ path, status, previousPath, patch: null });
    } else {
      files.push({ path: parts[i++] ?? '', status, previousPath: null, patch: null });
    }
  }
  return files.filter((f) => f.path !== '');
}

/** The unified diff of one file between the merge base and head (hunks only matter), or null on failure. */
export async function gitPatch(
  workspace: string,
  baseSha: string,
  headSha: string,
  path: string,
): Promise<string | null> {
  try {
    return await git(workspace, [
      'diff',
      '--unified=3',
      `${checkSha(baseSha)}...${checkSha(headSha)}`,
      '--',
      path,
    ]);
  } catch {
    return null;
  }
}
