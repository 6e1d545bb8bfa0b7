/**
 * Inline review comments on the lines of the wrong claims. Each is posted on its own (a 422 for one line does not
 * lose the others); a comment of ours already present with the same path, line and body is not posted again.
 *
 * As for the checklist comment (src/github/checklist-comment.ts): only our comment counts (src/github/identity.ts); a creation
 * whose outcome is unknown is looked for before it is sent again; and after posting, the list is read once more
 * and duplicates of ours (overlapping runs) are deleted, the newest of each kept.
 */
import { GitHubApiError, type GitHubClient } from './client.js';
import { enc, type PullRequestRef } from './changed-files.js';
import { isOursFor } from './identity.js';

/** Ends every inline comment stereogate writes (src/github/inline-plan.ts). */
export const INLINE_MARKER = '<!-- stereogate-inline -->';

export interface InlineComment {
  /** Path from the repository root. */
  path: string;
  line: number;
  body: string;
}

export interface InlineOutcome {
  posted: InlineComment[];
  alreadyThere: InlineComment[];
  /** Refused by GitHub with 422 (e.g. the line is not part of the diff): these stay in the checklist only. */
  rejected: { comment: InlineComment; message: string }[];
  /** Not posted because the token may not write review comments (403 that is not a rate limit). */
  notAllowed: InlineComment[];
  /** Not posted because GitHub's rate limit asked for a longer wait than the action allows. */
  rateLimited: { comments: InlineComment[]; error: GitHubApiError } | null;
  /** Duplicates of ours deleted. */
  removed: number;
}

interface ApiReviewComment {
  id: number;
  path: string;
  line?: number | null;
  body: string;
  user?: { login?: string; type?: string } | null;
}

export async function postInlineComments(
  client: GitHubClient,
  pr: PullRequestRef,
  comments: readonly InlineComment[],
): Promise<InlineOutcome> {
  const outcome: InlineOutcome = {
    posted: [],
    alreadyThere: [],
    rejected: [],
    notAllowed: [],
    rateLimited: null,
    removed: 0,
  };
  if (comments.length === 0) return outcome;
  const path = `/repos/${enc(pr.owner)}/${enc(pr.repo)}/pulls/${pr.number}/comments`;
  const listOurs = async (): Promise<ApiReviewComment[]> => {
    const marked = (await client.paginate<ApiReviewComment>(path)).filter(
      (c) => c.line != null && c.body.includes(INLINE_MARKER),
    );
    const isOurs = await isOursFor(
      client,
      marked.map((c) => c.user),
    );
    return marked.filter((c) => isOurs(c.user));
  };
  const seen = new Set((await listOurs()).map((c) => key(c.path, c.line as number, c.body)));

  for (const [index, comment] of comments.entries()) {
    const k = key(comment.path, comment.line, comment.body);
    if (seen.has(k)) {
      outcome.alreadyThere.push(comment);
      continue;
    }
    try {
      await postOnce(client, path, pr, comment, listOurs);
      outcome.posted.push(comment);
      seen.add(k);
    } catch (error) {
      if (!(error instanceof GitHubApiError)) throw error;
      if (error.status === 422) {
        outcome.rejected.push({ comment, message: error.message });
      } else if (error.kind === 'rate-limit') {
        outcome.rateLimited = { comments: comments.slice(index), error };
        break;
      } else if (error.kind === 'refused') {
        outcome.notAllowed.push(...comments.slice(index));
        break;
      } else {
        throw error;
      }
    }
  }
  if (outcome.posted.length > 0) outcome.removed = await removeDuplicates(client, pr, await listOurs());
  return outcome;
}

/** POST one comment; after an unknown outcome, look for it and send it once more only when it is not there. */
async function postOnce(
  client: GitHubClient,
  path: string,
  pr: PullRequestRef,
  comment: InlineComment,
  listOurs: () => Promise<ApiReviewComment[]>,
): Promise<void> {
  const payload = {
    body: comment.body,
    commit_id: pr.headSha,
    path: comment.path,
    line: comment.line,
    side: 'RIGHT',
  };
  for (let attempt = 1; ; attempt++) {
    try {
      await client.request('POST', path, payload);
      return;
    } catch (error) {
      if (!(error instanceof GitHubApiError && error.maybeDone) || attempt >= 2) throw error;
      const k = key(comment.path, comment.line, comment.body);
      if ((await listOurs()).some((c) => key(c.path, c.line as number, c.body) === k)) return;
    }
  }
}

/** Keeps the newest of each path, line and body written by the same bot; a refusal is not an error. */
async function removeDuplicates(
  client: GitHubClient,
  pr: PullRequestRef,
  listed: readonly ApiReviewComment[],
): Promise<number> {
  const newest = new Map<string, ApiReviewComment>();
  for (const c of listed) {
    const k = `${c.user?.login ?? ''}\n${key(c.path, c.line as number, c.body)}`;
    const kept = newest.get(k);
    if (kept === undefined || c.id > kept.id) newest.set(k, c);
  }
  let removed = 0;
  for (const c of listed) {
    const k = `${c.user?.login ?? ''}\n${key(c.path, c.line as number, c.body)}`;
    if (newest.get(k)!.id === c.id) continue;
    try {
      await client.request('DELETE', `/repos/${enc(pr.owner)}/${enc(pr.repo)}/pulls/comments/${c.id}`);
      removed++;
    } catch (error) {
      // already gone (404), or not ours to delete (403): the comment that counts is kept either way
      if (!(error instanceof GitHubApiError)) throw error;
    }
  }
  return removed;
}

function key(path: string, line: number, body: string): string {
  return `${path}\n${line}\n${body}`;
}
