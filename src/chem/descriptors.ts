/**
 * IUPAC stereodescriptor strings: parse them (IUPAC 2013 recommendations P-93.1.3 to P-93.5, P-91 for the
 * terms) and compare them with the labels the engine computed. A descriptor may stand alone — `(2R,3S)`,
 * `rac-(1R,2S)`, `(1R*,2S*)` — or at the front of a whole name — `(1R,2S,5R)-(−)-menthol`, `meso-2,3-dibromobutane`.
 * Bad input is data: every problem comes back with the character offset where it was found.
 */
import type { CipLabel } from './facts.js';

export type DescriptorMode = 'absolute' | 'racemic' | 'relative' | 'none';
export type RotationSign = '+' | '-' | '±';

export interface DescriptorItem {
  /** As written: '2', "2'", '4a'; null for a descriptor without locant, `(R)`. */
  locant: string | null;
  /** For `RS`/`SR` the first letter (the configuration of the enantiomer cited first). */
  label: CipLabel;
  /** Written with a star, `2S*` (P-93.1.3: relative configuration). */
  relativeStar?: boolean;
  /** Written `2RS` / `2SR` (P-93.1.3: racemate). */
  pair?: 'RS' | 'SR';
  /** Axial chirality written `Ra`/`Sa` (IUPAC 2013, P-93); the label keeps R/S. */
  axial?: boolean;
  /** Character offset of the item in the input. */
  offset: number;
}

export interface DescriptorProblem {
  offset: number;
  message: string;
}

export interface ParsedDescriptors {
  mode: DescriptorMode;
  rotationSign: RotationSign | null;
  items: DescriptorItem[];
  /** Each problem as "at character N: …" (N 0-based); `problemDetails` holds the same with numeric offsets. */
  problems: string[];
  problemDetails: DescriptorProblem[];
  /** Style remarks that are not errors (e.g. P-93.1.3 cites the lowest locant as R* / RS). */
  remarks: string[];
  /** `rac-` / `rel-` prefixes as written. */
  prefixes: ('rac' | 'rel')[];
  /** meso, cis, trans, erythro, threo, endo, exo, syn, anti (lower case). */
  words: string[];
  /** Fischer–Rosanoff D/L (not comparable with CIP labels); DL marks a racemate. */
  fischer: 'D' | 'L' | 'DL' | null;
  /** The name after the stereo prefixes; '' for a bare descriptor. */
  rest: string;
  /** The rest of the name carries further descriptors (on substituents): counts then cover only the front. */
  embeddedDescriptors: boolean;
  /** A legacy '(R,S)' without locants was read as (RS); it could also mean two centres written without locants. */
  legacyPair?: boolean;
}

const WORDS = ['meso', 'cis', 'trans', 'erythro', 'threo', 'endo', 'exo', 'syn', 'anti'];
/**
 * Characters read as a minus sign in (−) and as a hyphen after a prefix: the hyphen-minus and the dashes and
 * minus look-alikes that word processors and fonts put in names (U+2010–2013 hyphens and dashes, U+2014 em dash,
 * U+2212 minus, U+FE63 small hyphen-minus, U+FF0D fullwidth hyphen-minus, U+02D7 modifier letter minus).
 */
const MINUS_LIKE = '-\u2010\u2011\u2012\u2013\u2014\u2212\uFE63\uFF0D\u02D7';
const HYPHENS = MINUS_LIKE;
/** The plus sign and its fullwidth form U+FF0B. */
const PLUS_LIKE = '+\uFF0B';
const SIGNS: Record<string, RotationSign> = {
  '+': '+',
  '-': '-',
  '±': '±',
  '+/-': '±',
  '+-': '±',
};
/** The sign group as written ('(−)', '(＋)', '(+/–)') with every look-alike folded to + and -. */
function foldSigns(text: string): string {
  let out = '';
  for (const ch of text) out += MINUS_LIKE.includes(ch) ? '-' : PLUS_LIKE.includes(ch) ? '+' : ch;
  return out;
}
/** A separator after a prefix word: a hyphen or dash of any kind, a space, a parenthesis, or the end. */
const WORD_PREFIX = new RegExp(
  `^(rac|rel|meso|cis|trans|erythro|threo|endo|exo|syn|anti|DL|D,L|dl|d,l|D|L|d|l)(?=[\\s(${MINUS_LIKE.replace('-', '\\-')}]|$)`,
);
const ITEM = /^(\d+[a-z]?(?:['\u2032\u2033\u2034]|'')*)?(RS|SR|R|S|r|s|E|Z|M|P|m|p)(a)?(\*)?$/;

/**
 * Parses a descriptor string or the front of a name. `context: 'descriptor'` (the default) reports leftover
 * text as a problem; `context: 'name'` returns it in `rest`.
 */
export function parseDescriptors(
  input: string,
  options: { context?: 'descriptor' | 'name' } = {},
): ParsedDescriptors {
  const context = options.context ?? 'descriptor';
  const out: ParsedDescriptors = {
    mode: 'none',
    rotationSign: null,
    items: [],
    problems: [],
    problemDetails: [],
    remarks: [],
    prefixes: [],
    words: [],
    fischer: null,
    rest: '',
    embeddedDescriptors: false,
  };
  const problem = (offset: number, message: string): void => {
    out.problemDetails.push({ offset, message });
    out.problems.push(`at character ${offset}: ${message}`);
  };
  const signs: { sign: RotationSign; offset: number }[] = [];
  let i = skipSpace(input, 0);
  for (;;) {
    if (i >= input.length) break;
    const ch = input[i];
    let consumed = false;
    if (ch === '(' || ch === '[') {
      const close = ch === '(' ? ')' : ']';
      const end = input.indexOf(close, i + 1);
      const inner = end < 0 ? '' : input.slice(i + 1, end);
      if (end >= 0 && !/[([]/.test(inner)) {
        const g = parseGroup(inner, i + 1, context, problem);
        if (g.kind !== 'not-stereo') {
          consumed = true;
          if (g.sign) signs.push({ sign: g.sign, offset: i });
          out.items.push(...g.items);
          for (const w of g.words) addWord(out, w);
          if (g.legacyPair) {
            out.legacyPair = true;
            out.remarks.push(
              `${g.legacyPair} without locants is the legacy way of naming a racemate and is read as ` +
                `(${g.items[0]!.pair}); IUPAC 2013 (P-93.1.3) writes (RS) or rac-`,
            );
          }
          i = end + 1;
        }
      } else if (end < 0 && context === 'descriptor') {
        problem(i, `'${ch}' is never closed`);
        i = input.length;
        break;
      }
    } else {
      const m = WORD_PREFIX.exec(input.slice(i));
      const word = m?.[1];
      const next = m ? input[i + m[0].length] : undefined;
      // A lone word must be followed by a hyphen in a name ('cis-', 'L-'), so 'd' in 'd-glucose' counts but not
      // the 'l' of 'l ethyl'.
      if (word && (context === 'descriptor' || (next !== undefined && HYPHENS.includes(next)))) {
        consumed = true;
        if (word === 'rac' || word === 'rel') out.prefixes.push(word);
        else if (word === 'D' || word === 'L') out.fischer = word;
        else if (word === 'DL' || word === 'D,L') out.fischer = 'DL';
        else if (word === 'd') signs.push({ sign: '+', offset: i });
        else if (word === 'l') signs.push({ sign: '-', offset: i });
        else if (word === 'dl' || word === 'd,l') signs.push({ sign: '±', offset: i });
        else addWord(out, word);
        if (word === 'd' || word === 'l' || word === 'dl' || word === 'd,l') {
          out.remarks.push(
            `'${word}' for the sign of rotation is obsolete; write (+), (−) or (±) (IUPAC 2013, P-93)`,
          );
        }
        i += word.length;
      }
    }
    if (!consumed) break;
    // Separator: a hyphen (any dash), spaces, or directly the next parenthesis.
    i = skipSpace(input, i);
    if (i < input.length && HYPHENS.includes(input[i])) i = skipSpace(input, i + 1);
  }
  out.rest = input.slice(i).trim();
  if (context === 'descriptor' && out.rest !== '') {
    problem(i, `'${out.rest.slice(0, 20)}' is not a stereodescriptor`);
  }
  out.embeddedDescriptors =
    /[([](?:\d+[a-z]?['\u2032]*)?(?:RS|SR|R|S|E|Z)\*?(?:,\s*(?:\d+[a-z]?['\u2032]*)?(?:RS|SR|R|S|E|Z)\*?)*[)\]]/.test(
      out.rest,
    );
  finish(out, signs, problem);
  return out;
}

function skipSpace(s: string, i: number): number {
  while (i < s.length && /\s/.test(s[i])) i++;
  return i;
}

function addWord(out: ParsedDescriptors, w: string): void {
  if (!out.words.includes(w)) out.words.push(w);
}

interface Group {
  kind: 'sign' | 'items' | 'not-stereo';
  sign?: RotationSign;
  items: DescriptorItem[];
  words: string[];
  /** '(R,S)' as written, when a legacy racemate group was read as (RS). */
  legacyPair?: string;
}

function parseGroup(
  inner: string,
  base: number,
  context: 'descriptor' | 'name',
  problem: (offset: number, message: string) => void,
): Group {
  const compact = inner.replace(/\s+/g, '');
  const sign = SIGNS[foldSigns(compact)];
  if (sign) return { kind: 'sign', sign, items: [], words: [] };
  // '(R,S)', '(S,R)', '(R/S)' without locants: the legacy way of naming a racemate, read as (RS) / (SR).
  const legacy = /^([RS])[,/]([RS])$/.exec(compact);
  if (legacy && legacy[1] !== legacy[2]) {
    const pair = legacy[1] === 'R' ? 'RS' : 'SR';
    return {
      kind: 'items',
      items: [{ locant: null, label: pair[0] as CipLabel, pair, offset: base + inner.indexOf(legacy[1]) }],
      words: [],
      legacyPair: `(${legacy[1]}${compact[1]}${legacy[2]})`,
    };
  }
  const parts: { text: string; offset: number }[] = [];
  let start = 0;
  for (let k = 0; k <= inner.length; k++) {
    if (k === inner.length || inner[k] === ',') {
      const raw = inner.slice(start, k);
      const lead = raw.length - raw.trimStart().length;
      parts.push({ text: raw.trim(), offset: base + start + lead });
      start = k + 1;
    }
  }
  const items: DescriptorItem[] = [];
  const words: string[] = [];
  const bad: { text: string; offset: number }[] = [];
  for (const p of parts) {
    const m = ITEM.exec(p.text);
    if (m) {
      const [, loc, lab, ax, star] = m;
      const item: DescriptorItem = { locant: loc ?? null, label: lab[0] as CipLabel, offset: p.offset };
      if (lab === 'RS' || lab === 'SR') item.pair = lab;
      if (star) item.relativeStar = true;
      if (ax) {
        if (lab === 'R' || lab === 'S') item.axial = true;
        else {
          bad.push(p);
          continue;
        }
      }
      items.push(item);
    } else if (WORDS.includes(p.text.toLowerCase())) {
      words.push(p.text.toLowerCase());
    } else {
      bad.push(p);
    }
  }
  if (items.length === 0 && words.length === 0) {
    // '(2-chloroethyl)…' in a name is the start of the name, not a broken descriptor.
    if (context === 'name') return { kind: 'not-stereo', items: [], words: [] };
  }
  for (const b of bad) {
    problem(
      b.offset,
      b.text === '' ? 'empty stereodescriptor' : `'${b.text}' is not a stereodescriptor (P-93)`,
    );
  }
  return { kind: 'items', items, words };
}

function finish(
  out: ParsedDescriptors,
  signs: { sign: RotationSign; offset: number }[],
  problem: (offset: number, message: string) => void,
): void {
  const distinct = [...new Set(signs.map((s) => s.sign))];
  if (distinct.length > 1) {
    problem(signs[1].offset, `conflicting signs of rotation: ${distinct.map((s) => `(${s})`).join(' and ')}`);
  }
  out.rotationSign = signs[0]?.sign ?? null;

  const seen = new Map<string, number>();
  for (const it of out.items) {
    if (it.locant === null) continue;
    if (seen.has(it.locant)) problem(it.offset, `locant ${it.locant} is given twice`);
    seen.set(it.locant, it.offset);
  }
  const stars = out.items.filter((it) => it.relativeStar).length;
  const pairs = out.items.filter((it) => it.pair).length;
  const chiralItems = out.items.filter(
    (it) => it.label === 'R' || it.label === 'S' || it.label === 'M' || it.label === 'P',
  );
  if (stars > 0 && stars < chiralItems.length) {
    problem(
      out.items.find((it) => !it.relativeStar && chiralItems.includes(it))!.offset,
      'some descriptors carry * and others do not',
    );
  }
  if (pairs > 0 && pairs < chiralItems.length) {
    out.remarks.push(
      'RS/SR cited for some centres only: a mixture of epimers at those centres, not a racemate',
    );
  }
  const racemic =
    out.prefixes.includes('rac') || pairs > 0 || out.rotationSign === '±' || out.fischer === 'DL';
  const relative = out.prefixes.includes('rel') || stars > 0;
  if (racemic && relative) {
    // rac-(1R*,2S*), (±)-rel-(…): both say "relative configuration known"; the racemic part says more.
    out.remarks.push(
      'racemic (rac, RS/SR, ±) and relative (rel, *) notation are mixed, read as racemic; IUPAC 2013 ' +
        '(P-93.1.3) uses one of them',
    );
  }
  if (out.prefixes.includes('rel') && pairs > 0)
    problem(0, "'rel' with RS/SR descriptors: use rel-(…R,…S) or (…RS,…SR)");
  if (out.prefixes.includes('rel') && out.items.length === 0) {
    out.remarks.push("'rel-' without descriptors states no configuration");
  }
  if (out.rotationSign === '±' && chiralItems.length > 0 && !out.prefixes.includes('rac') && pairs === 0) {
    out.remarks.push(
      '(±) with descriptors of one enantiomer is read as rac-(…); IUPAC 2013 (P-93.1.3) writes rac-(…) or (…RS,…SR)',
    );
  }
  if (racemic) out.mode = 'racemic';
  else if (relative) out.mode = 'relative';
  else if (out.items.length > 0) out.mode = 'absolute';
  else out.mode = 'none';

  if ((racemic || relative) && chiralItems.some((it) => it.locant !== null)) {
    const first = [...chiralItems].sort((a, b) => locantOrder(a.locant) - locantOrder(b.locant))[0];
    if (first.label === 'S' || first.label === 'P') {
      out.remarks.push(
        `P-93.1.3 cites the lowest-locant centre as R (R* or RS); ${first.locant ?? ''}${first.pair ?? first.label} comes first here`,
      );
    }
  }
  const unlocated = out.items.filter((it) => it.locant === null);
  if (
    unlocated.length > 1 &&
    unlocated.some((it) => it.label === 'R') &&
    unlocated.some((it) => it.label === 'S')
  ) {
    out.remarks.push('(R,S) without locants is ambiguous: for a racemate P-93.1.3 writes (RS)');
  }
}

function locantOrder(locant: string | null): number {
  if (locant === null) return Number.MAX_SAFE_INTEGER;
  const n = parseInt(locant, 10);
  return Number.isNaN(n) ? Number.MAX_SAFE_INTEGER : n * 100 + locant.length;
}

export { compareDescriptors, type DescriptorComparison, type LabelMismatch } from './descriptors-compare.js';
