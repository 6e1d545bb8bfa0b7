/**
 * The Markdown checklist the action posts on a pull request: a hidden marker, the summary, per record a heading
 * and ticked/crossed items with declared vs computed evidence, waived findings as accepted with who and why, and
 * the caution once. Everything taken from records is escaped (escape.ts).
 */
import type { AuditResult, RecordResult } from '../audit/types.js';
import { checklistItems, computedText, declaredText, openCounts, plural } from './checklist.js';
import { escapeMarkdown as esc, safeUrl } from './escape.js';

export const CHECKLIST_MARKER = '<!-- stereogate-checklist -->';
export const DEFAULT_MAX_CHARS = 60_000;

export interface MarkdownOptions {
  /** Longer output is summarised (default 60,000; a GitHub comment holds 65,536). */
  maxChars?: number;
  /** Link to the full report (the job summary), shown when the checklist is summarised. */
  detailsUrl?: string;
}

const SEVERITY_MARK = { error: '❌', warning: '⚠️', note: 'ℹ️' } as const;

function summaryText(result: AuditResult): string {
  const s = result.summary;
  const parts = [
    `${SEVERITY_MARK.error} ${plural(s.errors, 'error')}`,
    `${SEVERITY_MARK.warning} ${plural(s.warnings, 'warning')}`,
    `${SEVERITY_MARK.note} ${plural(s.notes, 'note')}`,
  ];
  if (s.waived > 0) parts.push(`${s.waived} accepted by waiver${s.waived === 1 ? '' : 's'}`);
  const verdict =
    s.errors + s.warnings === 0 ? 'no stereochemical inconsistencies found' : 'please review the items below';
  return `**${plural(s.records, 'record')} audited** · ${parts.join(' · ')} — ${verdict}`;
}

function heading(r: RecordResult): string {
  return `### ${esc(r.id ?? '(no id)')} · ${esc(r.file)}`;
}

function lineRef(line: number | null): string {
  return line === null ? '' : ` (line ${line})`;
}

function recordBlock(r: RecordResult): string {
  const out: string[] = [heading(r), ''];
  const declared = declaredText(r);
  const computed = computedText(r.computed);
  if (declared || computed) {
    out.push(`Declared: ${declared ? esc(declared) : '*nothing readable*'}  `);
    out.push(`Computed: ${computed ? esc(computed) : '*the structure could not be read*'}`);
    out.push('');
  }
  for (const item of checklistItems(r)) {
    if (item.kind === 'open') {
      const f = item.finding;
      out.push(
        `- [ ] ${SEVERITY_MARK[f.severity]} **${f.severity}** \`${f.check}\`${lineRef(f.line)}: ${esc(f.message)}`,
      );
    } else if (item.kind === 'accepted') {
      const f = item.finding;
      out.push(
        `- [x] \`${f.check}\` accepted by waiver${lineRef(f.line)}: ${esc(f.message)}  \n` +
          `  Reason: ${esc(item.reason)} · approved by ${esc(item.approvedBy)}`,
      );
    } else {
      out.push(`- [x] \`${item.check}\`${item.evidence ? `: ${esc(item.evidence)}` : ''}`);
    }
  }
  if (r.findings.length === 0 && r.passed.length === 0) out.push('- [x] no check applied to this record');
  return out.join('\n');
}

function cautionBlock(result: AuditResult): string {
  return `> [!CAUTION]\n> ${esc(result.caution)}`;
}

function head(result: AuditResult): string[] {
  const out = [CHECKLIST_MARKER, '## stereogate checklist', '', summaryText(result), ''];
  if (result.unmatched?.length) {
    out.push(`No record matched: ${result.unmatched.map(esc).join(', ')}`, '');
  }
  return out;
}

export function renderMarkdown(result: AuditResult, options: MarkdownOptions = {}): string {
  const maxChars = options.maxChars ?? DEFAULT_MAX_CHARS;
  const full = [
    ...head(result),
    ...result.records.flatMap((r) => [recordBlock(r), '']),
    cautionBlock(result),
    '',
  ].join('\n');
  if (full.length <= maxChars) return full;
  return summarised(result, maxChars, options.detailsUrl);
}

/** The short form: records with open findings, one line each, as many as fit, and where to read the rest. */
function summarised(result: AuditResult, maxChars: number, detailsUrl: string | undefined): string {
  const url = detailsUrl ? safeUrl(detailsUrl) : null;
  const pointer = url
    ? `The full checklist is too long for a comment: read it in the [job summary](${url}).`
    : 'The full checklist is too long for a comment: read it in the job summary of this run.';
  const top = [...head(result), pointer, ''].join('\n');
  const bottom = ['', cautionBlock(result), ''].join('\n');
  const lines: string[] = [];
  const flagged = result.records.filter((r) => r.findings.some((f) => !f.waived));
  let used = top.length + bottom.length;
  let shown = 0;
  for (const r of flagged) {
    const c = openCounts(r);
    const counts = [
      c.errors && plural(c.errors, 'error'),
      c.warnings && plural(c.warnings, 'warning'),
      c.notes && plural(c.notes, 'note'),
    ]
      .filter(Boolean)
      .join(', ');
    const checks = [...new Set(r.findings.filter((f) => !f.waived).map((f) => `\`${f.check}\``))].join(', ');
    const line = `- [ ] **${esc(r.id ?? '(no id)')}** · ${esc(r.file)}: ${counts} (${checks})`;
    const reserve = 80; // room for the "more records" line
    if (used + line.length + 1 + reserve > maxChars) break;
    lines.push(line);
    used += line.length + 1;
    shown++;
  }
  if (shown < flagged.length)
    lines.push(`- … and ${plural(flagged.length - shown, 'more record')} with findings`);
  const clean = result.records.length - flagged.length;
  if (clean > 0) lines.push(`- [x] ${plural(clean, 'record')} without open findings`);
  const text = `${top}${lines.join('\n')}\n${bottom}`;
  return text.length <= maxChars ? text : `${top}${bottom}`.slice(0, maxChars);
}
