/**
 * Which findings become inline review comments, and their text. Pure. A finding qualifies when it is not waived,
 * names a line, and that line of its record file is shown in the pull request's diff; the rest stay in the
 * checklist. Findings on the same line share one comment. Errors come first, then warnings, then notes. Text
 * from records is escaped exactly as in the checklist comment (src/report/escape.ts).
 */
import type { AuditResult, Finding, Severity } from '../audit/types.js';
import { escapeMarkdown } from '../report/escape.js';
import type { InlineComment } from './inline-comments.js';
import type { DiffLines } from './patch.js';
import { toRepoPath } from './paths.js';

export const INLINE_MARKER = '<!-- stereogate-inline -->';

const RANK: Record<Severity, number> = { error: 0, warning: 1, note: 2 };
const LABEL: Record<Severity, string> = { error: '❌ error', warning: '⚠️ warning', note: 'ℹ️ note' };

export interface InlinePlan {
  comments: InlineComment[];
  /** Findings with a line that is not in the diff (kept in the checklist). */
  outsideDiff: number;
  /** Findings left out because of the comment limit (kept in the checklist). */
  overLimit: number;
}

interface Located {
  path: string;
  line: number;
  recordId: string | null;
  finding: Finding;
}

export function planInlineComments(
  result: AuditResult,
  diffs: ReadonlyMap<string, DiffLines>,
  options: { registryDir: string; max: number; caution: string },
): InlinePlan {
  const located: Located[] = [];
  let outsideDiff = 0;
  for (const record of result.records) {
    const path = toRepoPath(options.registryDir, record.file);
    for (const finding of record.findings) {
      if (finding.waived !== null || finding.line === null) continue;
      if (diffs.get(path)?.commentable.has(finding.line) === true) {
        located.push({ path, line: finding.line, recordId: record.id, finding });
      } else {
        outsideDiff++;
      }
    }
  }
  const groups = new Map<string, Located[]>();
  for (const item of located) {
    const k = `${item.path}\n${item.line}`;
    const group = groups.get(k);
    if (group === undefined) groups.set(k, [item]);
    else group.push(item);
  }
  const ordered = [...groups.values()]
    .map((group) => group.sort((a, b) => RANK[a.finding.severity] - RANK[b.finding.severity]))
    .sort(
      (a, b) =>
        RANK[a[0]!.finding.severity] - RANK[b[0]!.finding.severity] ||
        a[0]!.path.localeCompare(b[0]!.path) ||
        a[0]!.line - b[0]!.line,
    );
  const max = Math.max(0, options.max);
  const kept = ordered.slice(0, max);
  const overLimit = ordered.slice(max).reduce((n, group) => n + group.length, 0);
  const comments = kept.map((group) => ({
    path: group[0]!.path,
    line: group[0]!.line,
    body: commentBody(group, options.caution),
  }));
  return { comments, outsideDiff, overLimit };
}

function commentBody(group: Located[], caution: string): string {
  const record = group[0]!.recordId;
  const lines = group.map(
    ({ finding }) =>
      `**${LABEL[finding.severity]}** \`${finding.check}\`` +
      (finding.field === null ? '' : ` on ${escapeMarkdown(finding.field)}`) +
      `: ${escapeMarkdown(finding.message)}`,
  );
  const head = record === null ? '**stereogate**' : `**stereogate** · record ${escapeMarkdown(record)}`;
  return [
    head,
    '',
    ...lines.map((l) => `- ${l}`),
    '',
    `<sub>${escapeMarkdown(caution)}</sub>`,
    INLINE_MARKER,
  ].join('\n');
}
