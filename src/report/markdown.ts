/**
 * The Markdown checklist the action posts on a pull request: a hidden marker, the summary, then the records with
 * open findings (errors first), each with declared vs computed evidence and its findings — errors and warnings
 * as task items to work through, notes and waived findings (with who and why) as plain items — and its passed
 * checks collapsed in one line; then one collapsed line per record without open findings; the caution once.
 * Passed checks are never task items: anyone with write access could tick them and the next push would undo it.
 * Everything taken from records is escaped (escape.ts).
 */
import type { AuditResult, RecordResult } from '../audit/types.js';
import {
  byNeedForAction,
  checklistItems,
  computedText,
  declaredText,
  openCounts,
  plural,
  worstOpen,
  type ChecklistItem,
} from './checklist.js';
import { escapeHtmlText, escapeMarkdown as esc, safeUrl } from './escape.js';

export const CHECKLIST_MARKER = '<!-- stereogate-checklist -->';
export const DEFAULT_MAX_CHARS = 60_000;

export interface MarkdownOptions {
  /** Longer output is summarised (default 60,000; a GitHub comment holds 65,536). */
  maxChars?: number;
  /** Link to the full report (the job summary), shown when the checklist is summarised. */
  detailsUrl?: string;
}

const SEVERITY_MARK = { error: '❌', warning: '⚠️', note: 'ℹ️' } as const;

function summaryText(result: Pick<AuditResult, 'summary'>): string {
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

function evidenceLines(r: RecordResult, computed: string | null): string[] {
  const declared = declaredText(r);
  if (!declared && !computed) return [];
  return [
    `Declared: ${declared ? esc(declared) : '*nothing readable*'}  `,
    `Computed: ${computed ? esc(computed) : '*the structure could not be read*'}`,
    '',
  ];
}

/** One checklist line per item; only findings to act on (errors, warnings) are task items. */
function itemLine(item: ChecklistItem): string {
  if (item.kind === 'open') {
    const f = item.finding;
    const text = `${SEVERITY_MARK[f.severity]} **${f.severity}** \`${f.check}\`${lineRef(f.line)}: ${esc(f.message)}`;
    return f.severity === 'note' ? `- ${text}` : `- [ ] ${text}`;
  }
  if (item.kind === 'accepted') {
    const f = item.finding;
    return (
      `- ☑️ \`${f.check}\` accepted by waiver${lineRef(f.line)}: ${esc(f.message)}  \n` +
      `  Reason: ${esc(item.reason)} · approved by ${esc(item.approvedBy)}` +
      (item.covers ? ` · the waiver covers ${esc(item.covers)}` : '')
    );
  }
  if (item.kind === 'not-run') return `- not run: \`${item.check}\`: ${esc(item.reason)}`;
  return `- \`${item.check}\`${item.evidence ? `: ${esc(item.evidence)}` : ''}`;
}

/** Passed checks as one collapsed line that opens to the list (never task items: nothing to tick). */
function passedBlock(summary: string, items: ChecklistItem[]): string[] {
  return [`<details><summary>${summary}</summary>`, '', ...items.map(itemLine), '', '</details>'];
}

function passedSummary(r: RecordResult, accepted: number): string {
  const parts = [
    r.passed.length === 0 ? 'no check applied' : `✅ ${plural(r.passed.length, 'check')} passed`,
  ];
  if (accepted > 0) parts.push(`${accepted} accepted by waiver`);
  if (r.notRun?.length) parts.push(`${r.notRun.length} not run`);
  return parts.join(' · ');
}

/** A record with open findings: heading, evidence, the findings, passed checks collapsed. */
function recordBlock(r: RecordResult, computed: string | null): string {
  const items = checklistItems(r);
  const out: string[] = [heading(r), '', ...evidenceLines(r, computed)];
  out.push(...items.filter((i) => i.kind !== 'passed').map(itemLine));
  const passed = items.filter((i) => i.kind === 'passed');
  if (passed.length > 0) out.push('', ...passedBlock(`✅ ${plural(passed.length, 'check')} passed`, passed));
  return out.join('\n');
}

/** A record without open findings: one collapsed line that opens to its evidence, waivers and passed checks. */
function cleanLine(r: RecordResult, computed: string | null): string {
  const items = checklistItems(r);
  const accepted = items.filter((i) => i.kind === 'accepted').length;
  const summary = `<b>${escapeHtmlText(r.id ?? '(no id)')}</b> · ${escapeHtmlText(r.file)} — ${passedSummary(r, accepted)}`;
  return [
    `<details><summary>${summary}</summary>`,
    '',
    ...evidenceLines(r, computed),
    ...items.map(itemLine),
    '',
    '</details>',
  ].join('\n');
}

/**
 * One record of the checklist: its group (0-2 the worst open severity, error first; 3 none open) and its text.
 * The checklist lists the groups in order, each in the audit's order. `computed` is the computed line when the
 * caller holds it instead of the facts (a streamed audit).
 */
export function markdownRecord(
  r: RecordResult,
  computed: string | null = computedText(r.computed),
): { group: number; text: string } {
  const group = worstOpen(r);
  return { group, text: group < 3 ? recordBlock(r, computed) : cleanLine(r, computed) };
}

/** The heading of the records without open findings (before the last group). */
export function cleanHeading(count: number): string {
  return `### ${plural(count, 'record')} without open findings`;
}

function recordsPart(result: AuditResult): string[] {
  const groups: string[][] = [[], [], [], []];
  for (const r of result.records) {
    const { group, text } = markdownRecord(r);
    groups[group]!.push(text, '');
  }
  const out = groups.slice(0, 3).flat();
  if (groups[3]!.length > 0) out.push(cleanHeading(groups[3]!.length / 2), '', ...groups[3]!);
  return out;
}

function hasOpen(r: RecordResult): boolean {
  return r.findings.some((f) => !f.waived);
}

export function cautionBlock(result: Pick<AuditResult, 'caution'>): string {
  return `> [!CAUTION]\n> ${esc(result.caution)}`;
}

export function markdownHead(result: Omit<AuditResult, 'records'>): string[] {
  const out = [CHECKLIST_MARKER, '## stereogate checklist', '', summaryText(result), ''];
  if (result.unmatched?.length) {
    out.push(`No record matched: ${result.unmatched.map(esc).join(', ')}`, '');
  }
  return out;
}

export function renderMarkdown(result: AuditResult, options: MarkdownOptions = {}): string {
  const maxChars = options.maxChars ?? DEFAULT_MAX_CHARS;
  const full = [...markdownHead(result), ...recordsPart(result), cautionBlock(result), ''].join('\n');
  if (full.length <= maxChars) return full;
  return summarised(result, maxChars, options.detailsUrl);
}

/** The short form: records with open findings, one line each, as many as fit, and where to read the rest. */
function summarised(result: AuditResult, maxChars: number, detailsUrl: string | undefined): string {
  const url = detailsUrl ? safeUrl(detailsUrl) : null;
  const pointer = url
    ? `The full checklist is too long for a comment: read it in the [job summary](${url}).`
    : 'The full checklist is too long for a comment: read it in the job summary of this run.';
  const top = [...markdownHead(result), pointer, ''].join('\n');
  const bottom = ['', cautionBlock(result), ''].join('\n');
  const lines: string[] = [];
  const flagged = byNeedForAction(result.records.filter((r) => hasOpen(r)));
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
    const task = c.errors + c.warnings > 0 ? '- [ ] ' : '- ';
    const line = `${task}**${esc(r.id ?? '(no id)')}** · ${esc(r.file)}: ${counts} (${checks})`;
    const reserve = 80; // room for the "more records" line
    if (used + line.length + 1 + reserve > maxChars) break;
    lines.push(line);
    used += line.length + 1;
    shown++;
  }
  if (shown < flagged.length)
    lines.push(`- … and ${plural(flagged.length - shown, 'more record')} with findings`);
  const clean = result.records.length - flagged.length;
  if (clean > 0) lines.push(`- ✅ ${plural(clean, 'record')} without open findings`);
  const text = `${top}${lines.join('\n')}\n${bottom}`;
  return text.length <= maxChars ? text : `${top}${bottom}`.slice(0, maxChars);
}
