/**
 * Text taken from records (names, reasons, ids, messages built from them) made safe to place in a GitHub comment:
 * no markdown or HTML takes effect, no @-mention notifies anyone, no #123 links to an issue, no image is loaded.
 * Inline review comments are built here; the checklist comment is escaped the same way by src/report/markdown.ts.
 */

/** Characters with a meaning in GitHub-flavoured markdown or HTML ($ starts math), and @ / # (see below). */
const SPECIALS = /[\\`*_{}[\]()<>+\-!|~&"'$@#]/g;

/** Escape text for inline markdown. Line breaks become spaces (one finding, one paragraph). */
export function escapeText(text: string): string {
  return text
    // Control characters and bidirectional overrides are dropped: they hide or reorder text.
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\u200b-\u200f\u202a-\u202e\u2066-\u2069]/g, '')
    .replace(/\r\n|\r|\n/g, ' ')
    .replace(SPECIALS, (c) => {
      const entity = `&#${c.charCodeAt(0)};`;
      // A zero-width space after @ and # keeps GitHub from turning @name into a mention and #12 into a link.
      return c === '@' || c === '#' ? entity + '\u200b' : entity;
    });
}

/** Text inside an inline code span that cannot break out of it: backticks are replaced, length is bounded. */
export function codeSpan(text: string, max = 120): string {
  const clean = text.replace(/[\r\n`]/g, ' ').slice(0, max);
  return '`' + clean + '`';
}
