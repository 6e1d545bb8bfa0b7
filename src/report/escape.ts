/**
 * Escaping of text taken from records for Markdown that GitHub renders: no HTML, no Markdown syntax, no links or
 * images, no @mentions or #references that would notify people or link issues — and nothing more, so the raw
 * text (e-mail notifications show it) stays readable: `single-enantiomer, (2R,3S)` is left as it is.
 *
 * What is escaped in running text (CommonMark 0.31 and the GFM spec):
 *  - `\` `` ` `` `*` `_` `[` `]` `|` `~` `$` get a backslash (emphasis, code, links, tables, strikethrough, math);
 *  - `<` `>` `&` become character references (raw HTML, autolinks, entities);
 *  - a block marker at the start of the text (`-`, `+`, `#`, `=`, `1.`, `1)`) gets a backslash, so the text can
 *    start a list item or a heading; a `#` run that would close a heading is escaped too;
 *  - `@` (mentions, e-mail autolinks), `#123` and `GH-123` (issue references), `www.` and `http:` (bare-URL
 *    autolinks) get a zero-width joiner: a backslash does not stop GitHub's reference autolinker.
 * One pass over the text, so escaping is linear in its length (no backtracking regular expression).
 */

const ZWJ = '\u200D';

/** Characters that get a backslash wherever they are. */
const BACKSLASHED = new Set(['\\', '`', '*', '_', '[', ']', '|', '~', '$']);
const ENTITY: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;' };
/** Characters that end a word that may be shown as a SMILES code span. */
const WORD_END = new Set(['`', '|', '<', '>', '&']);
/** URL schemes GitHub autolinks bare (GFM extended autolinks and GitHub's own). */
const SCHEMES = ['https', 'http', 'ftp', 'mailto', 'xmpp'];

const UNICODE_SPACE = /\s/;

/** Whitespace as a regular expression's `\s` reads it (Unicode spaces too). */
function isSpace(c: string): boolean {
  const code = c.charCodeAt(0);
  return code === 0x20 || ((code < 0x20 || code > 0x7e) && UNICODE_SPACE.test(c));
}

function isWordChar(c: string | undefined): boolean {
  return c !== undefined && /[A-Za-z0-9_]/.test(c);
}

function isDigit(c: string | undefined): boolean {
  return c !== undefined && c >= '0' && c <= '9';
}

/** Escapes `s` so GitHub shows it as the literal text, on one line. Linear time. */
export function escapeMarkdown(s: string): string {
  return escapeMarkdownCounted(s).text;
}

/**
 * escapeMarkdown, with the number of character visits it made (`steps`): tests bound it by a small multiple of
 * the text's length, the structural proof that escaping is linear.
 */
export function escapeMarkdownCounted(s: string): { text: string; steps: number } {
  const work = { steps: 0 };
  // control characters and line breaks would end the list item or the heading
  // eslint-disable-next-line no-control-regex
  const text = s.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ');
  const out: string[] = [];
  let i = 0;
  // leading spaces are kept; a block marker after them is escaped
  while (i < text.length && text[i] === ' ') out.push(text[i++]!);
  const lead = blockMarkerEnd(text, i);
  let wordStart = true;
  let plainUntil = 0; // the rest of a word already found to hold no stereo SMILES
  while (i < text.length) {
    work.steps++;
    if (wordStart && i >= plainUntil) {
      const w = smilesAt(text, i, work);
      if (w.end > w.start) {
        for (; i < w.start; i++, work.steps++) out.push(escapeChar(text, i, i < lead));
        out.push('`', text.slice(w.start, w.end), '`');
        i = w.end;
        wordStart = false;
        continue;
      }
      plainUntil = w.wordEnd;
    }
    const c = text[i]!;
    out.push(escapeChar(text, i, i < lead));
    wordStart = isSpace(c) || c === '(' || c === '"' || c === "'" || WORD_END.has(c);
    i++;
  }
  return { text: out.join(''), steps: work.steps };
}

/** The escaped form of the character at `i`. */
function escapeChar(t: string, i: number, inLeadMarker: boolean): string {
  const c = t[i]!;
  if (BACKSLASHED.has(c)) return `\\${c}`;
  const entity = ENTITY[c];
  if (entity) return entity;
  if (inLeadMarker && !isDigit(c)) return `\\${c}`;
  if (c === '#' && !isDigit(t[i + 1])) {
    const next = t[i + 1];
    // a run of #s at the end or before a space would close a heading ("### LX-1 #")
    return next === undefined || next === '#' || isSpace(next) ? '\\#' : c;
  }
  return neutralised(t, i) ?? c;
}

/**
 * The character at `i` with a zero-width joiner where GitHub would otherwise link it: `@` (mentions, e-mail
 * autolinks), `#123` and `GH-123` (issue references), `www.` and `scheme:` (bare-URL autolinks). Null when the
 * character needs none. GitHub links these in rendered text, so HTML needs the joiner too.
 */
function neutralised(t: string, i: number): string | null {
  const c = t[i]!;
  if (c === '@') return `@${ZWJ}`;
  if (c === '#') return isDigit(t[i + 1]) ? `#${ZWJ}` : null;
  if (c === ':') {
    for (const scheme of SCHEMES) {
      const from = i - scheme.length;
      if (from >= 0 && t.slice(from, i).toLowerCase() === scheme) return `${ZWJ}:`;
    }
    return null;
  }
  if ((c === 'w' || c === 'W') && t.slice(i + 1, i + 4).toLowerCase() === 'ww.') return `${c}${ZWJ}`;
  if (isWordChar(t[i - 1])) return null;
  if (
    (c === 'G' || c === 'g') &&
    (t[i + 1] === 'H' || t[i + 1] === 'h') &&
    t[i + 2] === '-' &&
    isDigit(t[i + 3])
  )
    return `${c}${ZWJ}`;
  return null;
}

/**
 * Escapes `s` for HTML that GitHub renders inside Markdown (a `<summary>` line, where Markdown is not read):
 * character references for `& < > "`, the same joiners as in running text, one line. Linear time.
 */
export function escapeHtmlText(s: string): string {
  // eslint-disable-next-line no-control-regex
  const t = s.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, ' ');
  const out: string[] = [];
  for (let i = 0; i < t.length; i++) {
    const c = t[i]!;
    out.push(ENTITY[c] ?? (c === '"' ? '&quot;' : (neutralised(t, i) ?? c)));
  }
  return out.join('');
}

/**
 * End of a block marker at `i` that Markdown would read at the start of a line: `-`, `+`, `=`, `#`, or a number
 * followed by `.` or `)` (ordered list); `i` when there is none. `*`, `>`, `` ` ``, `~`, `|`, `<` and `_` are
 * escaped everywhere anyway.
 */
function blockMarkerEnd(t: string, i: number): number {
  const c = t[i];
  if (c === '-' || c === '+' || c === '=' || c === '#') return i + 1;
  let j = i;
  while (j < t.length && j - i < 9 && isDigit(t[j])) j++;
  if (j > i && (t[j] === '.' || t[j] === ')')) return j + 1;
  return i;
}

/**
 * A SMILES with a stereo bracket atom (`[C@@H]`) in the word at `i`: shown as a code span, where GitHub neither
 * links mentions nor reads Markdown, so the SMILES stays exactly copyable (no joiner after its `@`). The word runs
 * to whitespace or one of `` ` | < > & `` (never in a SMILES); a SMILES never starts with `(` or a quote (those
 * are prose before it); sentence punctuation and unbalanced `)` after it are left out. `smiles` is the end of the
 * SMILES from `start` to `end` (empty when there is none), `wordEnd` the end of the word. One scan of the word.
 */
function smilesAt(
  t: string,
  i: number,
  work: { steps: number },
): { start: number; end: number; wordEnd: number } {
  let start = i;
  while (t[start] === '(' || t[start] === '"' || t[start] === "'") start++;
  work.steps += start - i;
  let end = start;
  let open = false; // a '[' since the last ']'
  let atInBracket = false;
  let stereo = false;
  while (end < t.length && !isSpace(t[end]!) && !WORD_END.has(t[end]!)) {
    const c = t[end]!;
    if (c === '[') open = true;
    else if (c === '@' && open) atInBracket = true;
    else if (c === ']') {
      if (open && atInBracket) stereo = true;
      open = false;
      atInBracket = false;
    }
    end++;
  }
  const wordEnd = end;
  work.steps += wordEnd - start;
  if (!stereo) return { start, end: start, wordEnd };
  // sentence punctuation after the SMILES (never a ']', so the stereo bracket atom stays in)
  while (end > start && ',;.:!?\'"'.includes(t[end - 1]!)) end--;
  // closing parentheses that close prose, not a branch
  let depth = 0;
  for (let k = start; k < end; k++) {
    if (t[k] === '(') depth++;
    else if (t[k] === ')') depth--;
  }
  while (depth < 0 && t[end - 1] === ')') {
    end--;
    depth++;
  }
  work.steps += 2 * (wordEnd - start);
  return { start, end, wordEnd };
}

/** For text inside an HTML comment (markers): nothing that could close the comment. */
export function escapeComment(s: string): string {
  return s.replace(/-->/g, '--&gt;').replace(/--/g, '- -');
}

/** Escapes a URL we put into a link ourselves (detailsUrl): only http(s) and no characters that end the link. */
export function safeUrl(url: string): string | null {
  if (!/^https?:\/\/[^\s<>()[\]"'`]+$/i.test(url)) return null;
  return url;
}
