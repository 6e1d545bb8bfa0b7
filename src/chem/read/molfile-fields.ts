/**
 * Field-level helpers for fixed-column molfile lines (CTfile format specification, V2000 atom, bond and
 * counts lines) and the atom-symbol rules shared by V2000 and V3000. No regular expressions: these run once per
 * atom and bond line.
 */
import { atomicNumberOf } from './valence.js';

/** Integer in columns [start, end) (0-based, end exclusive). Blank or missing -> 0; garbage -> NaN. */
export function intField(line: string, start: number, end: number): number {
  if (end > line.length) end = line.length;
  let i = start;
  while (i < end && line.charCodeAt(i) === 32) i++;
  if (i >= end) return 0;
  let sign = 1;
  const c0 = line.charCodeAt(i);
  if (c0 === 45 /* - */ || c0 === 43 /* + */) {
    if (c0 === 45) sign = -1;
    i++;
  }
  let value = 0;
  let digits = 0;
  for (; i < end; i++) {
    const c = line.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      value = value * 10 + (c - 48);
      digits++;
    } else if (c === 32) break;
    else return NaN;
  }
  for (; i < end; i++) if (line.charCodeAt(i) !== 32) return NaN;
  return digits === 0 ? NaN : sign * value;
}

/**
 * Decimal number in columns [start, end). Blank -> NaN (coordinates are required). Plain decimals
 * ("-12.3456") are read digit by digit as (integer / 10^k), which rounds exactly like Number(); anything else
 * (exponents, stray characters) goes to Number().
 */
export function floatField(line: string, start: number, end: number): number {
  if (end > line.length) end = line.length;
  let i = start;
  while (i < end && line.charCodeAt(i) === 32) i++;
  let j = end;
  while (j > i && line.charCodeAt(j - 1) === 32) j--;
  if (i >= j) return NaN;
  let k = i;
  let neg = false;
  const c0 = line.charCodeAt(k);
  if (c0 === 45 || c0 === 43) {
    neg = c0 === 45;
    k++;
  }
  let mant = 0;
  let scale = 1;
  let digits = 0;
  let dot = false;
  for (; k < j; k++) {
    const c = line.charCodeAt(k);
    if (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48);
      if (dot) scale *= 10;
      digits++;
    } else if (c === 46 && !dot) dot = true;
    else return Number(line.slice(i, j));
  }
  if (digits === 0 || digits > 15) return Number(line.slice(i, j));
  const v = mant / scale;
  return neg ? -v : v;
}

/** Whitespace tokens of a line (for free-format fallbacks and the properties block, not the hot loop). */
export function tokens(line: string): string[] {
  const out: string[] = [];
  let i = 0;
  const n = line.length;
  while (i < n) {
    while (i < n && (line.charCodeAt(i) === 32 || line.charCodeAt(i) === 9)) i++;
    if (i >= n) break;
    const s = i;
    while (i < n && line.charCodeAt(i) !== 32 && line.charCodeAt(i) !== 9) i++;
    out.push(line.slice(s, i));
  }
  return out;
}

/** Symbols read as a wildcard '*': R groups (R, R#, R1...), query atoms (A, Q, L, X, M and their H forms), '*'. */
export function isWildcardSymbol(sym: string): boolean {
  if (sym === '*' || sym === 'A' || sym === 'Q' || sym === 'L' || sym === 'R' || sym === 'R#') return true;
  if (sym === 'AH' || sym === 'QH' || sym === 'X' || sym === 'XH' || sym === 'M' || sym === 'MH') return true;
  if (sym === 'LP' || sym === 'Pol' || sym === 'G' || sym === 'GH') return true;
  if (sym.length >= 2 && sym[0] === 'R' && sym.charCodeAt(1) >= 48 && sym.charCodeAt(1) <= 57) return true;
  return false;
}

export interface ElementInfo {
  element: string;
  atomicNumber: number;
  /** D and T give a mass number. */
  isotope: number | null;
}

/** Element for a molfile symbol; null when unknown. Accepts upper-case two-letter symbols ('CL'). */
export function elementOf(sym: string): ElementInfo | null {
  if (isWildcardSymbol(sym)) return { element: '*', atomicNumber: 0, isotope: null };
  if (sym === 'D') return { element: 'H', atomicNumber: 1, isotope: 2 };
  if (sym === 'T') return { element: 'H', atomicNumber: 1, isotope: 3 };
  let z = atomicNumberOf(sym);
  let element = sym;
  if (z === undefined && sym.length === 2) {
    element = sym[0]!.toUpperCase() + sym[1]!.toLowerCase();
    z = atomicNumberOf(element);
  }
  if (z === undefined || z === 0) return null;
  return { element, atomicNumber: z, isotope: null };
}

/**
 * Mass numbers used to turn a V2000 mass difference (columns 35-36) into an isotope: the standard atomic weight
 * rounded to an integer, for the elements where this field is seen in practice (from memory, IUPAC standard
 * atomic weights). Other elements with a mass difference get a warning.
 */
const ROUNDED_MASS: Record<number, number> = {
  1: 1,
  5: 11,
  6: 12,
  7: 14,
  8: 16,
  9: 19,
  11: 23,
  12: 24,
  14: 28,
  15: 31,
  16: 32,
  17: 35,
  19: 39,
  20: 40,
  26: 56,
  29: 64,
  30: 65,
  34: 79,
  35: 80,
  53: 127,
};

export function roundedMass(z: number): number | undefined {
  return ROUNDED_MASS[z];
}
