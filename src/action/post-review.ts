/**
 * Step three of a review: the checklist comment and the inline review comments. Never throws: a refusal or an
 * API failure becomes a line for the log and the job summary, so the audit result is never lost.
 */
import type { AuditResult } from '../audit/types.js';
import type { ChangedFile } from '../github/changed-files.js';
import { upsertChecklistComment } from '../github/checklist-comment.js';
import { GitHubApiError, type GitHubClient } from '../github/client.js';
import { gitPatch } from '../github/git-diff.js';
import { postInlineComments } from '../github/inline-comments.js';
import { planInlineComments } from '../github/inline-plan.js';
import { parsePatch, type DiffLines } from '../github/patch.js';
import { toRepoPath } from '../github/paths.js';
import { message, type Chosen } from './choose-records.js';
import type { Engine, Runner } from './ports.js';
import type { ActionSettings } from './settings.js';

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
  const say = (line: string, warn = false): void => {
    said.push(line);
    if (warn) runner.warning(line);
    else runner.info(line);
  };

  if (settings.checklistComment) {
    try {
      let body = engine.renderMarkdown(result, {
        maxChars: COMMENT_MAX_CHARS,
        detailsUrl: settings.runUrl ?? undefined,
      });
      if (body.length > COMMENT_MAX_CHARS)
        body =
          body.slice(0, COMMENT_MAX_CHARS - 200) + '\n\n… (cut; the full checklist is in the job summary)\n';
      const done = await upsertChecklistComment(client, pr, body, {
        createIfMissing: result.records.length > 0,
      });
      if (done.action === 'none') say('No record changed and no earlier checklist comment: none posted.');
      else say(`Checklist comment ${done.action}${done.url === null ? '' : `: ${done.url}`}.`);
    } catch (error) {
      if (refused(error)) {
        say(READ_ONLY, true);
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
        caution: result.caution,
      });
      if (plan.comments.length + plan.outsideDiff + plan.overLimit === 0) return said;
      const done = await postInlineComments(client, pr, plan.comments);
      const parts = [`${done.posted.length} inline comment(s) posted`];
      if (done.alreadyThere.length > 0) parts.push(`${done.alreadyThere.length} already there`);
      if (done.rejected.length > 0)
        parts.push(`${done.rejected.length} refused by GitHub (kept in the checklist)`);
      if (plan.outsideDiff > 0)
        parts.push(`${plan.outsideDiff} finding(s) on lines outside the diff (in the checklist)`);
      if (plan.overLimit > 0)
        parts.push(`${plan.overLimit} over the limit of ${settings.maxInlineComments} (in the checklist)`);
      say(parts.join('; ') + '.');
      if (done.notAllowed.length > 0) say(READ_ONLY, true);
    } catch (error) {
      if (refused(error)) say(READ_ONLY, true);
      else
        say(`Could not post inline comments (${message(error)}); the findings are in the checklist.`, true);
    }
  }
  return said;
}

function refused(error: unknown): boolean {
  return error instanceof GitHubApiError && error.status === 403;
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
