/**
 * Which findings become inline review comments, and their text. Pure. A finding qualifies when it is not waived,
 * names a line, and that line of its record file is shown in the pull request's diff; the rest stay in the
 * checklist. Findings on the same line share one comment. Errors come first, then warnings, then notes. Text
 * from records is escaped exactly as in the checklist comment (src/report/escape.ts).
 */
import type { AuditResult, Finding, Severity } from '../audit/types.js';
import { escapeMarkdown } from '../report/escape.js';
import { INLINE_MARKER, type InlineComment } from './inline-comments.js';
import type { DiffLines } from './patch.js';
import { toRepoPath } from './paths.js';
import { suggestionBlock } from './suggestion.js';
import { plural } from '../checks/words.js';

export { INLINE_MARKER };

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
  options: {
    registryDir: string;
    max: number;
    checklistUrl?: string | null;
    /** Record files' text by repository path, for suggested changes (findings with a certain fix). */
    sources?: ReadonlyMap<string, string>;
  },
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
    body: commentBody(group, options.checklistUrl ?? null, options.sources?.get(group[0]!.path) ?? null),
  }));
  return { comments, outsideDiff, overLimit };
}

/** GitHub refuses comment bodies over 65,536 characters; an inline comment stays far below. */
export const INLINE_MAX_CHARS = 16_000;
/** One finding's message in an inline comment; the checklist holds it whole. */
export const INLINE_MESSAGE_MAX_CHARS = 3_000;

/**
 * The short caution every inline comment carries, on one line; the checklist comment carries the full one. All four
 * points of the full caution, briefly: computed, the responsible chemist confirms, not analytical evidence, SOPs.
 */
export function shortCaution(checklistUrl: string | null): string {
  const where = checklistUrl === null ? 'the checklist comment' : `the [checklist comment](${checklistUrl})`;
  return (
    '<sub>Computed from the drawn structure: the responsible chemist confirms; no substitute for analytical ' +
    `evidence; local SOPs decide. Full caution in ${where}.</sub>`
  );
}

function commentBody(group: Located[], checklistUrl: string | null, source: string | null): string {
  const record = group[0]!.recordId;
  const head = record === null ? '**stereogate**' : `**stereogate** · record ${escapeMarkdown(record)}`;
  const fixes = group.flatMap(({ finding }) => (finding.fix === undefined ? [] : [finding.fix]));
  const block = source === null || fixes.length === 0 ? null : suggestionBlock(source, group[0]!.line, fixes);
  const suggestion =
    block === null
      ? ''
      : '\n**Suggested change**, as the drawn structure decides it: accept it if the drawing is right; if the ' +
        `drawing is what is wrong, correct the structure instead.\n\n${block}`;
  const tail = [suggestion, '', shortCaution(checklistUrl), INLINE_MARKER].join('\n');
  let body = `${head}\n`;
  for (const [index, { finding }] of group.entries()) {
    const text =
      finding.message.length > INLINE_MESSAGE_MAX_CHARS
        ? `${finding.message.slice(0, INLINE_MESSAGE_MAX_CHARS)}… (cut; whole in the checklist)`
        : finding.message;
    const line =
      `\n- **${LABEL[finding.severity]}** \`${finding.check}\`` +
      (finding.field === null ? '' : ` on ${escapeMarkdown(finding.field)}`) +
      `: ${escapeMarkdown(text)}`;
    const rest = group.length - index;
    const more = `\n- … ${plural(rest, 'more finding')} on this line: see the checklist.`;
    if (body.length + line.length + more.length + tail.length > INLINE_MAX_CHARS) {
      body += more;
      break;
    }
    body += line;
  }
  return `${body}\n${tail}`;
}
