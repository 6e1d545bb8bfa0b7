/**
 * Inline review comments on the lines of the wrong claims. Each is posted on its own (a 422 for one line does not
 * lose the others); a comment already present with the same path, line and body is not posted again.
 */
import { GitHubApiError, type GitHubClient } from './client.js';
import { enc, type PullRequestRef } from './changed-files.js';

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
  /** Not posted because the token may not write review comments (403). */
  notAllowed: InlineComment[];
}

interface ApiReviewComment {
  path: string;
  line?: number | null;
  body: string;
}

export async function postInlineComments(
  client: GitHubClient,
  pr: PullRequestRef,
  comments: readonly InlineComment[],
): Promise<InlineOutcome> {
  const outcome: InlineOutcome = { posted: [], alreadyThere: [], rejected: [], notAllowed: [] };
  if (comments.length === 0) return outcome;
  const path = `/repos/${enc(pr.owner)}/${enc(pr.repo)}/pulls/${pr.number}/comments`;
  const existing = await client.paginate<ApiReviewComment>(path);
  const seen = new Set(
    existing.filter((c) => c.line != null).map((c) => key(c.path, c.line as number, c.body)),
  );
  for (const [index, comment] of comments.entries()) {
    if (seen.has(key(comment.path, comment.line, comment.body))) {
      outcome.alreadyThere.push(comment);
      continue;
    }
    try {
      await client.request('POST', path, {
        body: comment.body,
        commit_id: pr.headSha,
        path: comment.path,
        line: comment.line,
        side: 'RIGHT',
      });
      outcome.posted.push(comment);
      seen.add(key(comment.path, comment.line, comment.body));
    } catch (error) {
      if (error instanceof GitHubApiError && error.status === 422) {
        outcome.rejected.push({ comment, message: error.message });
      } else if (error instanceof GitHubApiError && error.status === 403) {
        outcome.notAllowed.push(...comments.slice(index));
        break;
      } else {
        throw error;
      }
    }
  }
  return outcome;
}

function key(path: string, line: number, body: string): string {
  return `${path}\n${line}\n${body}`;
}
