/**
 * The files a pull request changes: `GET /repos/{owner}/{repo}/pulls/{pull_number}/files`, 100 per page. The API
 * lists at most 3,000 files (GitHub REST docs, "List pull requests files"); past that, or when the API fails, the
 * list comes from `git diff` of the checked-out base and head.
 */
import type { GitHubClient } from './client.js';
import { gitChangedFiles } from './git-diff.js';

export type FileStatus = 'added' | 'modified' | 'removed' | 'renamed' | 'copied' | 'changed' | 'unchanged';

export interface ChangedFile {
  /** Path from the repository root, forward slashes. */
  path: string;
  status: FileStatus;
  previousPath: string | null;
  /** The unified-diff hunks, when known (the API omits them for large or binary files). */
  patch: string | null;
}

export interface PullRequestRef {
  owner: string;
  repo: string;
  number: number;
  baseSha: string;
  headSha: string;
  /** `changed_files` from the event payload, when given. */
  changedFiles: number | null;
}

export const API_FILE_CAP = 3000;

interface ApiFile {
  filename: string;
  status: FileStatus;
  previous_filename?: string;
  patch?: string;
}

export interface ChangedFiles {
  files: ChangedFile[];
  source: 'api' | 'git';
  /** Why git was used instead of the API. */
  reason: string | null;
}

export async function listChangedFiles(
  client: GitHubClient,
  pr: PullRequestRef,
  workspace: string,
): Promise<ChangedFiles> {
  let reason: string;
  try {
    const path = `/repos/${enc(pr.owner)}/${enc(pr.repo)}/pulls/${pr.number}/files`;
    const listed = await client.paginate<ApiFile>(path);
    const capped =
      listed.length >= API_FILE_CAP || (pr.changedFiles !== null && pr.changedFiles > listed.length);
    if (!capped) {
      const files = listed.map((f) => ({
        path: f.filename,
        status: f.status,
        previousPath: f.previous_filename ?? null,
        patch: f.patch ?? null,
      }));
      return { files, source: 'api', reason: null };
    }
    reason = `the API lists at most ${API_FILE_CAP} files and this pull request changes ${pr.changedFiles ?? 'more'}`;
  } catch (error) {
    reason = `the API could not list the files (${error instanceof Error ? error.message : String(error)})`;
  }
  const files = await gitChangedFiles(workspace, pr.baseSha, pr.headSha);
  return { files, source: 'git', reason };
}

export function enc(part: string): string {
  return encodeURIComponent(part);
}
