/**
 * One SMILES atom token: a bracket atom `[13C@@H2+:7]` or an organic-subset atom (`C`, `Cl`, `c`, `*`).
 * OpenSMILES specification, sections on atoms and on chirality; plain char-code scanning, no regexes.
 */
import { atomicNumberOf } from './valence.js';

/** An atom as written, before valence, kekulization and stereo are worked out. */
export interface RawAtom {
  element: string;
  atomicNumber: number;
  charge: number;
  isotope: number | null;
  /** Bracket H count, or -1 for an organic-subset atom (implicit H by the valence rule). */
  hCount: number;
  aromatic: boolean;
  mapNumber: number | null;
  /** '@', '@@' (TH1/TH2 and AL1/AL2 are folded in), 'other' for @SP/@TB/@OH, or null. */
  chirality: '@' | '@@' | 'other' | null;
  /** 0-based offset of the atom's first character in the SMILES. */
  offset: number;
}

export interface TokenError {
  code: string;
  message: string;
  offset: number;
}

export type AtomToken = { atom: RawAtom; end: number } | { error: TokenError };

const AROMATIC_BRACKET = new Set(['b', 'c', 'n', 'o', 'p', 's', 'se', 'as', 'te', 'si']);

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}
function isUpper(c: number): boolean {
  return c >= 65 && c <= 90;
}
function isLower(c: number): boolean {
  return c >= 97 && c <= 122;
}

function raw(element: string, z: number, aromatic: boolean, offset: number): RawAtom {
  return {
    element,
    atomicNumber: z,
    charge: 0,
    isotope: null,
    hCount: -1,
    aromatic,
    mapNumber: null,
    chirality: null,
    offset,
  };
}

/**
 * Reads an organic-subset atom at `i` (B C N O P S F Cl Br I, aromatic b c n o p s, or `*`); it ends at
 * `i + atom.element.length`. Returns null when the character does not start one.
 */
export function readOrganicAtom(s: string, i: number): RawAtom | null {
  const c = s.charCodeAt(i);
  switch (c) {
    case 66: // B
      if (s.charCodeAt(i + 1) === 114) return raw('Br', 35, false, i);
      return raw('B', 5, false, i);
    case 67: // C
      if (s.charCodeAt(i + 1) === 108) return raw('Cl', 17, false, i);
      return raw('C', 6, false, i);
    case 78:
      return raw('N', 7, false, i);
    case 79:
      return raw('O', 8, false, i);
    case 80:
      return raw('P', 15, false, i);
    case 83:
      return raw('S', 16, false, i);
    case 70:
      return raw('F', 9, false, i);
    case 73:
      return raw('I', 53, false, i);
    case 98:
      return raw('B', 5, true, i);
    case 99:
      return raw('C', 6, true, i);
    case 110:
      return raw('N', 7, true, i);
    case 111:
      return raw('O', 8, true, i);
    case 112:
      return raw('P', 15, true, i);
    case 115:
      return raw('S', 16, true, i);
    case 42:
      return raw('*', 0, false, i);
    default:
      return null;
  }
}

function bad(offset: number, message: string): { error: TokenError } {
  return { error: { code: 'smiles-bad-bracket-atom', message, offset } };
}

/** Reads an unsigned integer at `i`; returns [value, end] or null when no digit is there. */
function readInt(s: string, i: number): [number, number] | null {
  let j = i;
  let v = 0;
  while (j < s.length && isDigit(s.charCodeAt(j)) && j - i < 9) {
    v = v * 10 + (s.charCodeAt(j) - 48);
    j++;
  }
  return j === i ? null : [v, j];
}

/** Reads a bracket atom starting at the '[' at `start`. */
export function readBracketAtom(s: string, start: number): AtomToken {
  let i = start + 1;
  const n = s.length;
  let isotope: number | null = null;
  const iso = readInt(s, i);
  if (iso) {
    isotope = iso[0];
    i = iso[1];
  }
  // element symbol
  const c0 = s.charCodeAt(i);
  let element: string;
  let aromatic = false;
  let z: number;
  if (c0 === 42) {
    element = '*';
    z = 0;
    i++;
  } else if (isUpper(c0)) {
    const c1 = s.charCodeAt(i + 1);
    const two = isLower(c1) ? s.substring(i, i + 2) : null;
    const zz2 = two === null ? undefined : atomicNumberOf(two);
    if (two !== null && zz2 !== undefined) {
      element = two;
      z = zz2;
      i += 2;
    } else {
      element = s[i]!;
      const zz = atomicNumberOf(element);
      if (zz === undefined || two !== null) {
        return {
          error: {
            code: 'smiles-unknown-element',
            message: `unknown element '${two ?? element}'`,
            offset: i,
          },
        };
      }
      z = zz;
      i++;
    }
  } else if (isLower(c0)) {
    const two = s.substring(i, i + 2);
    if (AROMATIC_BRACKET.has(two)) {
      element = two[0]!.toUpperCase() + two[1];
      i += 2;
    } else if (AROMATIC_BRACKET.has(s[i]!)) {
      element = s[i]!.toUpperCase();
      i++;
    } else {
      return {
        error: { code: 'smiles-unknown-element', message: `unknown aromatic element '${s[i]}'`, offset: i },
      };
    }
    aromatic = true;
    z = atomicNumberOf(element)!;
  } else {
    return bad(i < n ? i : start, 'bracket atom without an element symbol');
  }
  const atom: RawAtom = {
    element,
    atomicNumber: z,
    charge: 0,
    isotope,
    hCount: 0,
    aromatic,
    mapNumber: null,
    chirality: null,
    offset: start,
  };
  // chirality
  if (s.charCodeAt(i) === 64) {
    i++;
    if (s.charCodeAt(i) === 64) {
      atom.chirality = '@@';
      i++;
    } else if (isUpper(s.charCodeAt(i)) && isUpper(s.charCodeAt(i + 1)) && s.charCodeAt(i) !== 72) {
      const cls = s.substring(i, i + 2);
      const num = readInt(s, i + 2);
      if (!num || !['TH', 'AL', 'SP', 'TB', 'OH'].includes(cls))
        return bad(i, `unknown chirality class '@${cls}'`);
      if (cls === 'TH' || cls === 'AL') {
        if (num[0] !== 1 && num[0] !== 2) return bad(i, `chirality '@${cls}${num[0]}' must be 1 or 2`);
        atom.chirality = num[0] === 1 ? '@' : '@@';
      } else {
        atom.chirality = 'other';
      }
      i = num[1];
    } else {
      atom.chirality = '@';
    }
  }
  // hydrogens
  if (s.charCodeAt(i) === 72) {
    i++;
    const h = readInt(s, i);
    if (h) {
      atom.hCount = h[0];
      i = h[1];
    } else atom.hCount = 1;
  }
  // charge
  const sc = s.charCodeAt(i);
  if (sc === 43 || sc === 45) {
    const sign = sc === 43 ? 1 : -1;
    i++;
    const num = readInt(s, i);
    if (num) {
      atom.charge = sign * num[0];
      i = num[1];
    } else {
      let k = 1;
      while (s.charCodeAt(i) === sc) {
        k++;
        i++;
      }
      atom.charge = sign * k;
    }
  }
  // atom class
  if (s.charCodeAt(i) === 58) {
    const num = readInt(s, i + 1);
    if (!num) return bad(i, "atom class ':' without a number");
    atom.mapNumber = num[0];
    i = num[1];
  }
  if (i >= n) return bad(start, "bracket atom not closed with ']'");
  if (s.charCodeAt(i) !== 93) return bad(i, `unexpected '${s[i]}' in bracket atom`);
  return { atom, end: i + 1 };
}
