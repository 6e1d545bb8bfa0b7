/**
 * Step three of a review: the checklist comment and the inline review comments. Never throws: a refusal or an
 * API failure becomes a line for the log and the job summary, so the audit result is never lost.
 */
import { readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { AuditResult } from '../audit/types.js';
import type { ChangedFile } from '../github/changed-files.js';
import { upsertChecklistComment } from '../github/checklist-comment.js';
import { GitHubApiError, type GitHubClient } from '../github/client.js';
import { gitPatch } from '../github/git-diff.js';
import { postInlineComments } from '../github/inline-comments.js';
import { planInlineComments } from '../github/inline-plan.js';
import { parsePatch, type DiffLines } from '../github/patch.js';
import { toRepoPath } from '../github/paths.js';
import { redactSecret } from '../github/redact.js';
import { message, type Chosen } from './choose-records.js';
import type { Engine, Runner } from './ports.js';
import type { ActionSettings } from './settings.js';
import { plural } from '../checks/words.js';

/** GitHub refuses comment bodies over 65,536 characters; leave room. */
export const COMMENT_MAX_CHARS = 60_000;

const READ_ONLY =
  'The token may not write to this pull request (a pull request from a fork gets a read-only token); the ' +
  'checklist is in the job summary and the findings are annotations on the changed files.';

/** Posts what the settings ask for; returns plain sentences saying what happened. */
export async function postReview(
  settings: ActionSettings,
  result: AuditResult,
  chosen: Chosen,
  engine: Engine,
  client: GitHubClient | null,
  runner: Runner,
): Promise<string[]> {
  const pr = settings.pullRequest;
  if (pr === null) return ['Not a pull request: no comment posted.'];
  if (client === null) return ['No token given: no comment posted.'];
  const said: string[] = [];
  const say = (raw: string, warn = false): void => {
    const line = redactSecret(raw, settings.token);
    said.push(line);
    if (warn) runner.warning(line);
    else runner.info(line);
  };

  let checklistUrl: string | null = null;
  if (settings.checklistComment) {
    try {
      const rendered = engine.renderMarkdown(result, {
        maxChars: COMMENT_MAX_CHARS,
        detailsUrl: settings.runUrl ?? undefined,
      });
      const body = redactSecret(capComment(rendered, COMMENT_MAX_CHARS), settings.token);
      const done = await upsertChecklistComment(client, pr, body, {
        createIfMissing: result.records.length > 0,
      });
      checklistUrl = done.url;
      if (done.action === 'none') say('No record changed and no earlier checklist comment: none posted.');
      else say(`Checklist comment ${done.action}${done.url === null ? '' : `: ${done.url}`}.`);
      if (done.removed > 0)
        say(`${plural(done.removed, 'duplicate checklist comment')} of an overlapping run deleted.`);
    } catch (error) {
      if (refused(error)) {
        say(READ_ONLY, true);
        return said;
      }
      if (rateLimited(error)) {
        say(rateLimitLine(error, settings), true);
        return said;
      }
      say(
        `Could not post the checklist comment (${message(error)}); the checklist is in the job summary.`,
        true,
      );
    }
  }

  if (settings.inlineComments && settings.maxInlineComments > 0 && chosen.changed !== null) {
    try {
      const diffs = await diffLines(settings, result, chosen.changed, chosen.changedSource);
      const plan = planInlineComments(result, diffs, {
        registryDir: settings.registryDir,
        max: settings.maxInlineComments,
        checklistUrl,
        sources: await fixSources(settings, result),
      });
      if (plan.comments.length + plan.outsideDiff + plan.overLimit === 0) return said;
      const comments = plan.comments.map((c) => ({ ...c, body: redactSecret(c.body, settings.token) }));
      const done = await postInlineComments(client, pr, comments);
      const parts = [`${plural(done.posted.length, 'inline comment')} posted`];
      if (done.alreadyThere.length > 0) parts.push(`${done.alreadyThere.length} already there`);
      if (done.rejected.length > 0)
        parts.push(`${done.rejected.length} refused by GitHub (kept in the checklist)`);
      if (plan.outsideDiff > 0)
        parts.push(`${plural(plan.outsideDiff, 'finding')} on lines outside the diff (in the checklist)`);
      if (plan.overLimit > 0)
        parts.push(`${plan.overLimit} over the limit of ${settings.maxInlineComments} (in the checklist)`);
      if (done.removed > 0) parts.push(`${plural(done.removed, 'duplicate')} of an overlapping run deleted`);
      say(parts.join('; ') + '.');
      if (done.notAllowed.length > 0) say(READ_ONLY, true);
      if (done.rateLimited !== null) {
        say(
          `${plural(done.rateLimited.comments.length, 'inline comment')} not posted: ${rateLimitLine(done.rateLimited.error, settings)}`,
          true,
        );
      }
    } catch (error) {
      if (refused(error)) say(READ_ONLY, true);
      else if (rateLimited(error)) say(rateLimitLine(error, settings), true);
      else
        say(`Could not post inline comments (${message(error)}); the findings are in the checklist.`, true);
    }
  }
  return said;
}

/** A permission refusal (e.g. the read-only token of a fork's pull request), not a rate limit. */
function refused(error: unknown): boolean {
  return error instanceof GitHubApiError && error.kind === 'refused';
}

function rateLimited(error: unknown): error is GitHubApiError {
  return error instanceof GitHubApiError && error.kind === 'rate-limit';
}

/** Says which: a rate limit, with GitHub's wait and ours, and that the token is not the problem. */
export function rateLimitLine(error: GitHubApiError, settings: ActionSettings): string {
  const wait = error.retryAfterMs === null ? null : Math.ceil(error.retryAfterMs / 1000);
  return (
    `GitHub's API rate limit stopped posting (HTTP ${error.status}` +
    (wait === null
      ? ''
      : `, retry after ${wait} s, longer than api-max-wait of ${settings.api.maxWaitMs / 1000} s`) +
    '). This is a rate limit, not a read-only token; the checklist is in the job summary and the next run posts it.'
  );
}

/**
 * The comment within GitHub's size limit: cut at a line end, never inside the marker line, with a note saying
 * where the rest is (the job summary and the report file always hold the full checklist).
 */
export function capComment(body: string, max: number): string {
  if (body.length <= max) return body;
  const note = "\n\n… (cut to fit GitHub's comment size limit; the full checklist is in the job summary)\n";
  const room = body.slice(0, max - note.length);
  const end = room.lastIndexOf('\n');
  return (end > 0 ? room.slice(0, end) : room) + note;
}

/** Largest record file read back for a suggested change. */
const SOURCE_MAX_BYTES = 1024 * 1024;

/** The text of each record file that has a finding with a certain fix, by repository path (as checked out). */
async function fixSources(settings: ActionSettings, result: AuditResult): Promise<Map<string, string>> {
  const sources = new Map<string, string>();
  for (const record of result.records) {
    if (!record.findings.some((f) => f.fix !== undefined && f.waived === null && f.line !== null)) continue;
    try {
      const path = join(settings.registryRoot, record.file);
      if ((await stat(path)).size > SOURCE_MAX_BYTES) continue;
      sources.set(toRepoPath(settings.registryDir, record.file), await readFile(path, 'utf8'));
    } catch {
      // no suggestion for a file that cannot be read; the finding still says what to change
    }
  }
  return sources;
}

/** Diff lines of the record files that have findings: from the API's patches, or from git when git listed them. */
async function diffLines(
  settings: ActionSettings,
  result: AuditResult,
  changed: readonly ChangedFile[],
  source: 'api' | 'git' | null,
): Promise<Map<string, DiffLines>> {
  const wanted = new Set(
    result.records
      .filter((r) => r.findings.some((f) => f.line !== null && f.waived === null))
      .map((r) => toRepoPath(settings.registryDir, r.file)),
  );
  const diffs = new Map<string, DiffLines>();
  const pr = settings.pullRequest!;
  for (const file of changed) {
    if (!wanted.has(file.path) || file.status === 'removed') continue;
    const patch =
      file.patch ??
      (source === 'git' ? await gitPatch(settings.repoRoot, pr.baseSha, pr.headSha, file.path) : null);
    if (patch !== null) diffs.set(file.path, parsePatch(patch));
  }
  return diffs;
}
