/**
 * Terminal report, leading with what needs action: the records with open findings first (errors first), each
 * finding with its line and the passed checks in one line; then one line per record without open findings; the
 * summary and the caution. `verbose` prints every record in full with each passed check's evidence. Colour only
 * when asked for.
 */
import { registryLines } from './registry-summary.js';
import type { AuditResult, Finding, RecordResult } from '../audit/types.js';
import { checklistItems, computedText, declaredText, plural, worstOpen } from './checklist.js';

export interface TextOptions {
  color?: boolean;
  /**
   * Every record in full, every passed check with its evidence, and the checks that do not apply with the reason
   * (default: what needs action first, rest short).
   */
  verbose?: boolean;
}

const CODES = { red: 31, green: 32, yellow: 33, blue: 34, magenta: 35, cyan: 36, dim: 2, bold: 1 } as const;
type Paint = (style: keyof typeof CODES, s: string) => string;

/** Colour for a stream: only a TTY, and only while NO_COLOR is unset or empty (no-color.org). */
export function shouldColor(stream: { isTTY?: boolean }, env: NodeJS.ProcessEnv = process.env): boolean {
  return stream.isTTY === true && (env.NO_COLOR === undefined || env.NO_COLOR === '');
}

/** Control characters from records would move the cursor or recolour the terminal: show them as \\xNN. */
export function safeText(s: string): string {
  return s
    .replace(
      // eslint-disable-next-line no-control-regex
      /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/g,
      (c) => `\\x${c.charCodeAt(0).toString(16).padStart(2, '0')}`,
    )
    .replace(/\n/g, ' ');
}

function findingLine(f: Finding, paint: Paint): string {
  const colour = f.severity === 'error' ? 'red' : f.severity === 'warning' ? 'yellow' : 'cyan';
  const mark = f.severity === 'note' ? 'i' : '✗';
  const at = f.line !== null ? paint('dim', ` line ${f.line}`) : '';
  return `  ${paint(colour, `${mark} ${f.severity.padEnd(7)}`)} ${f.check}${at}: ${safeText(f.message)}`;
}

/** A record with open findings (or any record with --verbose): evidence, findings, waivers, passed checks. */
function block(r: RecordResult, paint: Paint, verbose: boolean, computed: string | null): string[] {
  const lines: string[] = [];
  lines.push(`${paint('bold', safeText(r.id ?? '(no id)'))}  ${paint('dim', safeText(r.file))}`);
  const declared = declaredText(r);
  if (declared) lines.push(`  ${paint('dim', 'declared')}  ${safeText(declared)}`);
  if (computed) lines.push(`  ${paint('dim', 'computed')}  ${safeText(computed)}`);
  const items = checklistItems(r);
  for (const item of items) {
    if (item.kind === 'open') lines.push(findingLine(item.finding, paint));
    else if (item.kind === 'accepted') {
      const f = item.finding;
      const at = f.line !== null ? paint('dim', ` line ${f.line}`) : '';
      lines.push(
        `  ${paint('magenta', '~ accepted')} ${f.check}${at}: ${safeText(f.message)} ` +
          paint(
            'dim',
            `(waived: ${safeText(item.reason)}; approved by ${safeText(item.approvedBy)}` +
              `${item.covers ? `; the waiver covers ${safeText(item.covers)}` : ''})`,
          ),
      );
    } else if (item.kind === 'not-run') {
      lines.push(`  ${paint('dim', '– not run')} ${item.check}: ${safeText(item.reason)}`);
    } else if (verbose) {
      const ev = item.evidence ? `: ${paint('dim', safeText(item.evidence))}` : '';
      lines.push(`  ${paint('green', '✓')} ${item.check}${ev}`);
    }
  }
  if (verbose) {
    for (const n of r.notApplicable ?? [])
      lines.push(`  ${paint('dim', '– not applicable')} ${n.check}: ${safeText(n.reason)}`);
  }
  if (!verbose && r.passed.length > 0) {
    const names = r.passed.map((p) => p.check).join(', ');
    lines.push(
      `  ${paint('green', '✓')} ${plural(r.passed.length, 'check')} passed ${paint('dim', `(${names})`)}`,
    );
  }
  if (r.passed.length === 0 && r.findings.length === 0) lines.push(`  ${paint('dim', 'no check applied')}`);
  return lines;
}

/** A record without open findings, in one line: id, what passed, what was accepted by waiver, file. */
function cleanLine(r: RecordResult, paint: Paint): string {
  const waived = r.findings.filter((f) => f.waived).length;
  const parts = [r.passed.length > 0 ? `${plural(r.passed.length, 'check')} passed` : 'no check applied'];
  if (waived > 0) parts.push(`${waived} accepted by waiver`);
  for (const n of r.notRun ?? []) parts.push(`not run: ${n.check} (${safeText(n.reason)})`);
  return `${paint('green', '✓')} ${paint('bold', safeText(r.id ?? '(no id)'))}  ${parts.join(', ')}  ${paint('dim', safeText(r.file))}`;
}

export function summaryLine(result: Pick<AuditResult, 'summary'>): string {
  const s = result.summary;
  const parts = [plural(s.errors, 'error'), plural(s.warnings, 'warning'), plural(s.notes, 'note')];
  if (s.waived > 0) parts.push(`${s.waived} accepted by waiver${s.waived === 1 ? '' : 's'}`);
  return `${plural(s.records, 'record')} audited: ${parts.join(', ')}`;
}

function painter(options: TextOptions): Paint {
  return options.color ? (style, s) => `\u001b[${CODES[style]}m${s}\u001b[0m` : (_style, s) => s;
}

/**
 * One record of the text report: its group (0-2 the worst open severity, error first; 3 none open) and its
 * lines. The report lists the groups in order, each in the audit's order. `computed` is the computed line when
 * the caller holds it instead of the facts (a streamed audit).
 */
export function textRecord(
  r: RecordResult,
  options: TextOptions = {},
  computed: string | null = computedText(r.computed),
): { group: number; lines: string[] } {
  const paint = painter(options);
  const group = worstOpen(r);
  if (group < 3 || options.verbose === true)
    return { group, lines: [...block(r, paint, options.verbose === true, computed), ''] };
  return { group, lines: [cleanLine(r, paint)] };
}

/** The lines after the records: what matched nothing, the registry-wide summary, the summary line, the caution. */
export function textClosing(
  result: Omit<AuditResult, 'records'>,
  options: TextOptions,
  cleanLines: boolean,
): string[] {
  const paint = painter(options);
  const out: string[] = [];
  if (cleanLines && options.verbose !== true) out.push('');
  if (result.unmatched?.length) {
    out.push(paint('yellow', `No record matched: ${result.unmatched.map(safeText).join(', ')}`), '');
  }
  const registry = registryLines(result.registry, safeText);
  if (registry.length > 0) out.push(...registry, '');
  const s = result.summary;
  const colour = s.errors > 0 ? 'red' : s.warnings > 0 ? 'yellow' : 'green';
  out.push(paint(colour, summaryLine(result)));
  out.push(paint('dim', result.caution));
  return out;
}

export function renderText(result: AuditResult, options: TextOptions = {}): string {
  const groups: string[][] = [[], [], [], []];
  for (const r of result.records) {
    const { group, lines } = textRecord(r, options);
    groups[group]!.push(...lines);
  }
  const out = [...groups.flat(), ...textClosing(result, options, groups[3]!.length > 0)];
  return `${out.join('\n')}\n`;
}
