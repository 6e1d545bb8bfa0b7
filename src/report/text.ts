/** Terminal report: one compact block per record with ✓/✗ items; colour only when asked for. */
import type { AuditResult, RecordResult } from '../audit/types.js';
import { checklistItems, computedText, declaredText, plural } from './checklist.js';

export interface TextOptions {
  color?: boolean;
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

function block(r: RecordResult, paint: Paint): string[] {
  const lines: string[] = [];
  lines.push(`${paint('bold', safeText(r.id ?? '(no id)'))}  ${paint('dim', safeText(r.file))}`);
  const declared = declaredText(r);
  const computed = computedText(r.computed);
  if (declared) lines.push(`  ${paint('dim', 'declared')}  ${safeText(declared)}`);
  if (computed) lines.push(`  ${paint('dim', 'computed')}  ${safeText(computed)}`);
  for (const item of checklistItems(r)) {
    if (item.kind === 'open') {
      const f = item.finding;
      const colour = f.severity === 'error' ? 'red' : f.severity === 'warning' ? 'yellow' : 'cyan';
      const mark = f.severity === 'note' ? 'i' : '✗';
      const at = f.line !== null ? paint('dim', ` line ${f.line}`) : '';
      lines.push(
        `  ${paint(colour, `${mark} ${f.severity.padEnd(7)}`)} ${f.check}${at}: ${safeText(f.message)}`,
      );
    } else if (item.kind === 'accepted') {
      const f = item.finding;
      lines.push(
        `  ${paint('magenta', '~ accepted')} ${f.check}: ${safeText(f.message)} ` +
          paint('dim', `(waived: ${safeText(item.reason)}; approved by ${safeText(item.approvedBy)})`),
      );
    } else {
      const ev = item.evidence ? `: ${paint('dim', safeText(item.evidence))}` : '';
      lines.push(`  ${paint('green', '✓')} ${item.check}${ev}`);
    }
  }
  return lines;
}

export function summaryLine(result: AuditResult): string {
  const s = result.summary;
  const parts = [plural(s.errors, 'error'), plural(s.warnings, 'warning'), plural(s.notes, 'note')];
  if (s.waived > 0) parts.push(`${s.waived} accepted by waiver${s.waived === 1 ? '' : 's'}`);
  return `${plural(s.records, 'record')} audited: ${parts.join(', ')}`;
}

export function renderText(result: AuditResult, options: TextOptions = {}): string {
  const paint: Paint = options.color
    ? (style, s) => `\u001b[${CODES[style]}m${s}\u001b[0m`
    : (_style, s) => s;
  const out: string[] = [];
  for (const r of result.records) {
    out.push(...block(r, paint), '');
  }
  if (result.unmatched?.length) {
    out.push(paint('yellow', `No record matched: ${result.unmatched.map(safeText).join(', ')}`), '');
  }
  const s = result.summary;
  const colour = s.errors > 0 ? 'red' : s.warnings > 0 ? 'yellow' : 'green';
  out.push(paint(colour, summaryLine(result)));
  out.push(paint('dim', result.caution));
  return `${out.join('\n')}\n`;
}
