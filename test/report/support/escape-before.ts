/**
 * Escaping of text taken from records for Markdown that GitHub renders: no HTML, no Markdown syntax, no
 * links or images, no @mentions or #references that would notify people or link issues.
 */

const ZWJ = '\u200D';

/**
 * A SMILES with a stereo bracket atom (`[C@@H]`): shown as a code span, where GitHub neither links mentions nor
 * reads Markdown, so the SMILES stays exactly copyable (no joiner after its `@`). No whitespace, backtick or `|`
 * (a table cell separator), and none of `<>&` (which a SMILES never has) inside.
 */
const STEREO_SMILES = /[^\s`|<>&]*\[[^\]\s`|<>&]*@[^\]\s`|<>&]*\][^\s`|<>&]*/g;

/** Escapes `s` so GitHub shows it as the literal text, on one line. */
export function escapeMarkdown(s: string): string {
  let out = '';
  let at = 0;
  for (const m of s.matchAll(STEREO_SMILES)) {
    // a SMILES never starts with '(' or a quote: those are prose before it
    const lead = /^[("']*/.exec(m[0])![0].length;
    const token = smilesPart(m[0].slice(lead));
    if (!token.includes('@')) continue;
    const start = m.index + lead;
    out += escapeText(s.slice(at, start)) + '`' + token + '`';
    at = start + token.length;
  }
  return out + escapeText(s.slice(at));
}

/** The SMILES in a matched token: sentence punctuation after it and unbalanced closing parentheses left out. */
function smilesPart(token: string): string {
  let t = token.replace(/[,;.:!?'"]+$/, '');
  const open = (t.match(/\(/g) ?? []).length;
  let close = (t.match(/\)/g) ?? []).length;
  while (close > open && t.endsWith(')')) {
    t = t.slice(0, -1);
    close--;
  }
  return t;
}

function escapeText(s: string): string {
  return (
    s
      // control characters and line breaks would end the list item or the heading
      // eslint-disable-next-line no-control-regex
      .replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g, ' ')
      .replace(/&/g, '&amp;')
      .replace(/</g, '&lt;')
      .replace(/>/g, '&gt;')
      // every Markdown punctuation mark that can start or end syntax (CommonMark: any ASCII punctuation may be escaped)
      .replace(/[\\`*_{}[\]()#+\-.!|~"'$=:^]/g, (c) => `\\${c}`)
      // @mentions and e-mail autolinks: a zero-width joiner after the @ stops GitHub's mention and autolink
      .replace(/@/g, `@${ZWJ}`)
      // bare-URL autolinks (GFM extension): break "www." and "scheme:"
      .replace(/\b(w)(ww\\\.)/gi, `$1${ZWJ}$2`)
      .replace(/\b(https?|ftp|mailto|xmpp)(\\:)/gi, `$1${ZWJ}$2`)
  );
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
