/**
 * A finding's certain fix (src/audit/types.ts, Fix) as a GitHub suggested change: the record file's line with the
 * field's value corrected, in a ```suggestion block (GitHub docs, "Incorporating feedback in your pull request":
 * a suggestion replaces the lines the review comment is on). Pure.
 *
 * Only a line holding the field as `key: value` (YAML, plain or quoted) or `"key": value,` (JSON) is changed, and
 * only when reading the changed line back gives exactly the corrected value; anything else (a folded value, a value
 * on the next line, an escape the fix cannot see) gives no suggestion, and the finding's message still says what
 * to change.
 */
import { parse } from 'yaml';
import type { Fix } from '../audit/types.js';

/** The lines of a text file, whatever its line ends (LF, CRLF, CR). */
export function fileLines(text: string): string[] {
  return text.split(/\r\n|\r|\n/);
}

/** `lineText` with the fix applied, or null when that cannot be done with certainty. */
export function fixLine(lineText: string, fix: Fix): string | null {
  const key = fix.field.split('.').pop() ?? '';
  if (key === '' || /^\d+$/.test(key) || fix.from === '' || fix.from === fix.to) return null;
  const head = new RegExp(`^(\\s*(?:-\\s+)?)(["']?)${escapeRegExp(key)}\\2\\s*:\\s*`).exec(lineText);
  if (head === null) return null;
  const valueStart = head[0].length;
  const value = lineText.slice(valueStart);
  const at = value.indexOf(fix.from);
  if (at < 0 || value.indexOf(fix.from, at + 1) >= 0) return null;
  const quote = value[0] === '"' || value[0] === "'" ? value[0] : null;
  const to =
    quote === '"' ? JSON.stringify(fix.to).slice(1, -1) : quote === "'" ? fix.to.replace(/'/g, "''") : fix.to;
  const fixed = lineText.slice(0, valueStart) + value.slice(0, at) + to + value.slice(at + fix.from.length);
  const before = readValue(lineText, key);
  const after = readValue(fixed, key);
  if (typeof before !== 'string' || typeof after !== 'string') return null;
  const at2 = before.indexOf(fix.from);
  if (at2 < 0) return null;
  const expected = before.slice(0, at2) + fix.to + before.slice(at2 + fix.from.length);
  return after === expected ? fixed : null;
}

/**
 * The suggested-change block for line `line` (1-based) of `fileText` with every fix applied in turn; null when
 * none applies. A fence longer than any backtick run on the line keeps the block closed.
 */
export function suggestionBlock(fileText: string, line: number, fixes: readonly Fix[]): string | null {
  const original = fileLines(fileText)[line - 1];
  if (original === undefined) return null;
  let current = original;
  for (const fix of fixes) current = fixLine(current, fix) ?? current;
  if (current === original) return null;
  const longest = Math.max(2, ...[...current.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = '`'.repeat(longest + 1);
  return `${fence}suggestion\n${current}\n${fence}`;
}

/** The value of `key` on a one-line mapping entry, read as YAML (JSON lines too, without a trailing comma). */
function readValue(lineText: string, key: string): unknown {
  const entry = lineText
    .replace(/^\s*(?:-\s+)?/, '')
    .replace(/,\s*$/, '')
    .trim();
  try {
    const parsed: unknown = parse(entry);
    if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) return undefined;
    const keys = Object.keys(parsed);
    return keys.length === 1 && keys[0] === key ? (parsed as Record<string, unknown>)[key] : undefined;
  } catch {
    return undefined;
  }
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}
