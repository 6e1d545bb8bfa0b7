/**
 * One checklist comment per pull request, kept up to date: found among the issue comments by its hidden marker,
 * updated in place, created only when none exists yet.
 */
import type { GitHubClient } from './client.js';
import { enc } from './changed-files.js';

/** Rendered into the comment by src/report/markdown.ts. */
export const CHECKLIST_MARKER = '<!-- stereogate-checklist -->';

export interface IssueRef {
  owner: string;
  repo: string;
  number: number;
}

interface ApiComment {
  id: number;
  body?: string | null;
  html_url?: string;
  user?: { login?: string; type?: string } | null;
}

export interface CommentOutcome {
  action: 'created' | 'updated' | 'unchanged' | 'none';
  /** null when there is no comment ('none': nothing to update and creating was not wanted). */
  id: number | null;
  url: string | null;
}

export async function upsertChecklistComment(
  client: GitHubClient,
  issue: IssueRef,
  body: string,
  options: { marker?: string; createIfMissing?: boolean } = {},
): Promise<CommentOutcome> {
  const marker = options.marker ?? CHECKLIST_MARKER;
  const base = `/repos/${enc(issue.owner)}/${enc(issue.repo)}/issues`;
  const comments = await client.paginate<ApiComment>(`${base}/${issue.number}/comments`);
  const ours = pickOurs(comments.filter((c) => (c.body ?? '').includes(marker)));
  if (ours === null) {
    if (options.createIfMissing === false) return { action: 'none', id: null, url: null };
    const made = await client.request<ApiComment>('POST', `${base}/${issue.number}/comments`, { body });
    return { action: 'created', id: made.data.id, url: made.data.html_url ?? null };
  }
  if (ours.body === body) return { action: 'unchanged', id: ours.id, url: ours.html_url ?? null };
  const updated = await client.request<ApiComment>('PATCH', `${base}/comments/${ours.id}`, { body });
  return { action: 'updated', id: updated.data.id, url: updated.data.html_url ?? null };
}

/** Prefer a comment written by a bot (the workflow token's github-actions[bot]); a person quoting the marker is not us. */
function pickOurs(candidates: ApiComment[]): ApiComment | null {
  return candidates.find((c) => c.user?.type === 'Bot') ?? candidates[0] ?? null;
}
