/**
 * One checklist comment per pull request, kept up to date: found among the issue comments by its hidden marker,
 * updated in place, created only when none exists yet.
 *
 * Only a comment written by us is ever adopted (src/github/identity.ts: a bot, or the person whose token this is):
 * anyone can paste the marker into a comment of their own. A creation whose outcome is unknown (timeout, reset connection,
 * 5xx) is not repeated blindly: the comments are listed again and a comment that did arrive is adopted. Two runs
 * that overlap may both create one; after creating, the list is read again, the newest of our comments is kept and
 * the others by the same author are deleted, so every run ends on the same single comment.
 */
import { GitHubApiError, type GitHubClient } from './client.js';
import { enc } from './changed-files.js';
import { isOursFor } from './identity.js';

/** Rendered into the comment by src/report/markdown.ts. */
export const CHECKLIST_MARKER = '<!-- stereogate-checklist -->';

export interface IssueRef {
  owner: string;
  repo: string;
  number: number;
}

export interface ApiComment {
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
  /** Duplicate checklist comments of ours deleted (left by overlapping or interrupted runs). */
  removed: number;
  /** Creations sent (0 or more); more than one only after a creation whose outcome was unknown. */
  creates: number;
}

export interface UpsertOptions {
  marker?: string;
  createIfMissing?: boolean;
  /** Most creations to send when each ends without a known outcome and the list shows none arrived; 2 by default. */
  maxCreates?: number;
}

export async function upsertChecklistComment(
  client: GitHubClient,
  issue: IssueRef,
  body: string,
  options: UpsertOptions = {},
): Promise<CommentOutcome> {
  const marker = options.marker ?? CHECKLIST_MARKER;
  const base = `/repos/${enc(issue.owner)}/${enc(issue.repo)}/issues`;
  const listOurs = async (): Promise<ApiComment[]> => {
    const marked = (await client.paginate<ApiComment>(`${base}/${issue.number}/comments`)).filter((c) =>
      (c.body ?? '').includes(marker),
    );
    const isOurs = await isOursFor(
      client,
      marked.map((c) => c.user),
    );
    return marked.filter((c) => isOurs(c.user)).sort((a, b) => a.id - b.id);
  };

  let found = await listOurs();
  let action: CommentOutcome['action'];
  let creates = 0;
  if (found.length === 0) {
    if (options.createIfMissing === false)
      return { action: 'none', id: null, url: null, removed: 0, creates };
    const maxCreates = Math.max(1, options.maxCreates ?? 2);
    for (;;) {
      creates++;
      try {
        await client.request<ApiComment>('POST', `${base}/${issue.number}/comments`, { body });
      } catch (error) {
        if (!(error instanceof GitHubApiError && error.maybeDone)) throw error;
        // Did it arrive after all? Look before sending it again.
        found = await listOurs();
        if (found.length > 0) break;
        if (creates >= maxCreates) throw error;
        continue;
      }
      // Another run may have created one at the same time: read the list again and settle on one.
      found = await listOurs();
      break;
    }
    action = 'created';
    if (found.length === 0) throw new Error('the checklist comment was created but is not in the list');
  } else {
    action = 'updated';
  }

  const keep = found[found.length - 1]!;
  const removed = await removeDuplicates(client, base, found, keep);
  if ((keep.body ?? '') === body) {
    return {
      action: action === 'created' ? 'created' : 'unchanged',
      id: keep.id,
      url: keep.html_url ?? null,
      removed,
      creates,
    };
  }
  const updated = await client.request<ApiComment>('PATCH', `${base}/comments/${keep.id}`, { body });
  return {
    action,
    id: updated.data.id,
    url: updated.data.html_url ?? keep.html_url ?? null,
    removed,
    creates,
  };
}

/** Deletes the comments in `found` other than `keep` written by the same bot; a refusal is not an error. */
async function removeDuplicates(
  client: GitHubClient,
  base: string,
  found: readonly ApiComment[],
  keep: ApiComment,
): Promise<number> {
  let removed = 0;
  for (const comment of found) {
    if (comment.id === keep.id || comment.user?.login !== keep.user?.login) continue;
    try {
      await client.request('DELETE', `${base}/comments/${comment.id}`);
      removed++;
    } catch (error) {
      // already gone (404), or not ours to delete (403): the comment that counts is kept either way
      if (!(error instanceof GitHubApiError)) throw error;
    }
  }
  return removed;
}
