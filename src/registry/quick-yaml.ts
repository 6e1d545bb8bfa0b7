/**
 * A fast reader for the plain shape nearly every record file has: block mappings, block lists and one-line flow
 * lists of single-line scalars, with comments. It returns exactly what the full YAML parser (parse.ts) would (the
 * same value and the same field positions) or null, and then the full parser reads the file. Anything outside
 * the plain shape gives null: flow mappings, nested or multi-line flow lists, anchors, tags, block scalars,
 * multi-line scalars, escapes other than \\ and \", tabs, CR line ends, duplicate keys, keys that are not plain
 * words, document markers and directives. Plain scalars resolve as in the YAML 1.2.2 core schema (spec section
 * 10.3.2): null, booleans, decimal integers and floats; octal, hexadecimal, infinity and NaN forms give null
 * (left to the full parser).
 */
import { PositionMap } from './positions.js';

export interface QuickDocument {
  value: Record<string, unknown>;
  positions: PositionMap;
}

interface Line {
  /** 1-based line number. */
  no: number;
  indent: number;
  text: string;
}

/** Thrown inside this module only, to give up on the fast path. */
class NotPlain extends Error {}

const KEY = /^[A-Za-z][A-Za-z0-9_-]*(?=:(?: |$))/;
const NOT_STRING_KEY = /^(?:[Nn]ull|NULL|[Tt]rue|TRUE|[Ff]alse|FALSE)$/;
const NULL = /^(?:~|[Nn]ull|NULL)$/;
const TRUE = /^(?:[Tt]rue|TRUE)$/;
const FALSE = /^(?:[Ff]alse|FALSE)$/;
const INT = /^[-+]?[0-9]+$/;
const FLOAT = /^[-+]?(?:\.[0-9]+|[0-9]+\.[0-9]*)$/;
const FLOAT_EXP = /^[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)[eE][-+]?[0-9]+$/;
/** Other core-schema forms (0o17, 0x1F, .inf, .nan) are left to the full parser. */
const OTHER_NUMBER = /^(?:0o|0x|[-+]?\.(?:inf|Inf|INF)$|\.(?:nan|NaN|NAN)$)/;
/** A plain scalar may not start with an indicator (YAML 1.2.2 section 7.3.3); '-' only before a digit or '.'. */
const BAD_START = /^(?:[-?:](?![0-9.])|[,[\]{}#&*!|>'"%@`])/;

/** Characters the full parser may treat specially or refuse (controls, NEL, line and paragraph separators). */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\x00-\x08\x0b-\x1f\x7f-\x9f\u2028\u2029\ufeff\ufffe\uffff]/;

function fail(): never {
  throw new NotPlain();
}

/** A quoted scalar starting at `start` (a '"' or a "'") -> its value and the offset after the closing quote. */
function quoted(text: string, start: number): { value: string; end: number } {
  const q = text[start];
  let out = '';
  let i = start + 1;
  for (;;) {
    if (i >= text.length) fail();
    const ch = text[i]!;
    if (ch === q) {
      if (q === '"' || text[i + 1] !== "'") break;
      out += "'";
      i += 2;
    } else if (ch === '\\' && q === '"') {
      const next = text[i + 1];
      if (next !== '\\' && next !== '"') fail();
      out += next;
      i += 2;
    } else {
      out += ch;
      i++;
    }
  }
  return { value: out, end: i + 1 };
}

/** A plain scalar's text -> its value by the core schema. */
function resolvePlain(plain: string): unknown {
  if (plain === '' || BAD_START.test(plain) || plain.includes(': ') || plain.endsWith(':')) fail();
  if (NULL.test(plain)) return null;
  if (TRUE.test(plain)) return true;
  if (FALSE.test(plain)) return false;
  if (INT.test(plain)) return parseInt(plain, 10);
  if (FLOAT.test(plain) || FLOAT_EXP.test(plain)) return parseFloat(plain);
  if (OTHER_NUMBER.test(plain)) fail();
  return plain;
}

/** The reading of one single-line scalar (after `key: ` or `- `), comments dropped. */
function scalar(text: string): unknown {
  if (text[0] === '"' || text[0] === "'") {
    const q = quoted(text, 0);
    trailing(text.slice(q.end));
    return q.value;
  }
  const hash = text.indexOf(' #');
  return resolvePlain((hash < 0 ? text : text.slice(0, hash)).replace(/ +$/, ''));
}

/**
 * A one-line flow list of scalars, `[chiral HPLC, "NMR"]`, in `text` (which starts with '['); `at(i, offset)`
 * records the position of item i at offset `offset` of `text`.
 */
function flowList(text: string, at: (i: number, offset: number) => void): unknown[] {
  const out: unknown[] = [];
  let i = 1;
  const spaces = (): void => {
    while (text[i] === ' ') i++;
  };
  spaces();
  if (text[i] === ']') {
    trailing(text.slice(i + 1));
    return out;
  }
  for (;;) {
    spaces();
    at(out.length, i);
    const c = text[i];
    if (c === '"' || c === "'") {
      const q = quoted(text, i);
      out.push(q.value);
      i = q.end;
    } else {
      let j = i;
      while (j < text.length && !',[]{}'.includes(text[j]!)) j++;
      const plain = text.slice(i, j).replace(/ +$/, '');
      if (plain.includes(':') || plain.includes(' #')) fail();
      out.push(resolvePlain(plain));
      i = j;
    }
    spaces();
    if (text[i] === ']') break;
    if (text[i] !== ',') fail();
    i++;
    spaces();
    if (text[i] === ']') fail(); // a trailing comma: left to the full parser
  }
  trailing(text.slice(i + 1));
  return out;
}

/** What may follow a quoted scalar on its line: spaces, then optionally a comment. */
function trailing(rest: string): void {
  const t = rest.replace(/^ +/, '');
  if (t !== '' && !(t.startsWith('#') && t.length < rest.length)) fail();
}

/** Content lines (blank and comment-only lines dropped); null when a line is outside the plain shape. */
function contentLines(text: string): Line[] | null {
  if (text.includes('\t') || text.includes('\r') || CONTROL.test(text)) return null;
  const lines: Line[] = [];
  const raw = text.split('\n');
  for (let k = 0; k < raw.length; k++) {
    const s = raw[k]!;
    let indent = 0;
    while (s.charCodeAt(indent) === 32) indent++;
    if (indent === s.length || s[indent] === '#') continue;
    if (indent === 0 && (s.startsWith('---') || s.startsWith('...') || s.startsWith('%'))) return null;
    lines.push({ no: k + 1, indent, text: s.slice(indent) });
  }
  return lines;
}

/** Reads `text` if it has the plain shape of a record file; null otherwise (then use the full parser). */
export function quickParse(text: string): QuickDocument | null {
  const lines = contentLines(text);
  if (lines === null || lines.length === 0 || lines[0]!.indent !== 0) return null;
  const positions = new PositionMap();
  let at = 0;

  const put = (path: string, line: Line, column: number): void =>
    positions.set(path, { line: line.no, column });

  /** A block mapping whose keys stand at `indent`; the first key may sit after a '- ' (column `first`). */
  const mapping = (indent: number, path: string, firstText?: string): Record<string, unknown> => {
    const out: Record<string, unknown> = {};
    const seen = new Set<string>();
    let first = firstText !== undefined;
    while (at < lines.length) {
      const line = lines[at]!;
      const body = first ? firstText! : line.text;
      if (!first) {
        if (line.indent < indent) break;
        if (line.indent > indent) fail();
      }
      first = false;
      const m = KEY.exec(body);
      if (!m) fail();
      const key = m[0];
      if (NOT_STRING_KEY.test(key) || seen.has(key) || key.length > 1000) fail();
      seen.add(key);
      const childPath = path === '' ? key : `${path}.${key}`;
      put(childPath, line, indent + 1);
      at++;
      const rest = body.slice(key.length + 1).replace(/^ +/, '');
      if (rest.startsWith('[')) {
        const restColumn = indent + body.length - rest.length;
        out[key] = flowList(rest, (i, offset) => put(`${childPath}.${i}`, line, restColumn + offset + 1));
        continue;
      }
      if (rest !== '' && !rest.startsWith('#')) {
        out[key] = scalar(rest);
        continue;
      }
      const next = lines[at];
      if (next && next.indent > indent) out[key] = block(next.indent, childPath);
      else if (next && next.indent === indent && isItem(next.text)) out[key] = list(indent, childPath);
      else out[key] = null;
    }
    return out;
  };

  const isItem = (t: string): boolean => t === '-' || t.startsWith('- ');

  /** A block list whose '-' stand at `indent`. */
  const list = (indent: number, path: string): unknown[] => {
    const out: unknown[] = [];
    while (at < lines.length) {
      const line = lines[at]!;
      if (line.indent < indent) break;
      if (line.indent > indent) fail();
      if (!isItem(line.text)) break; // a list at its parent key's indent ends at the next key
      const itemPath = path === '' ? String(out.length) : `${path}.${out.length}`;
      let gap = 1;
      while (line.text.charCodeAt(gap) === 32) gap++;
      const body = line.text.slice(gap);
      if (body === '' || body.startsWith('#') || isItem(body)) fail();
      const column = indent + gap;
      put(itemPath, line, column + 1);
      if (KEY.test(body)) out.push(mapping(column, itemPath, body));
      else {
        out.push(scalar(body));
        at++;
      }
    }
    return out;
  };

  /** The block node starting on the current line, at `indent`. */
  const block = (indent: number, path: string): unknown =>
    isItem(lines[at]!.text) ? list(indent, path) : mapping(indent, path);

  try {
    put('', lines[0]!, 1);
    const value = mapping(0, '');
    if (at !== lines.length) return null;
    return { value, positions };
  } catch (e) {
    if (e instanceof NotPlain) return null;
    throw e;
  }
}
