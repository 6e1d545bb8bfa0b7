/**
 * Molfile reader, V2000 connection table (CTfile format specification, "Molfile" and "V2000 connection
 * table"); a counts line marked V3000 hands over to molfile-v3000.ts. Bad input is returned as an error with the
 * absolute line number, never thrown.
 */
import type { Atom, Bond, ReadError, ReadResult } from '../types.js';
import { finishMolecule, type RawMolecule } from './molfile-build.js';
import { elementOf, floatField, intField, roundedMass, tokens } from './molfile-fields.js';
import { parseV3000 } from './molfile-v3000.js';
import { READ_LIMITS, tooManyAtoms, type ReadLimits } from './limits.js';
import { makeBond } from './molfile-bond.js';
import { coords3, newAtom, objectList } from './make.js';

export interface MolfileOptions {
  /** Line number of the molfile's first line within a larger file (for error positions); default 1. */
  firstLine?: number;
  /** Size caps (default READ_LIMITS): an atom count over the cap is refused at the counts line. */
  limits?: ReadLimits;
}

/** Splits text into lines, dropping a trailing '\r' from each. */
export function splitLines(text: string): string[] {
  const lines = text.split('\n');
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    if (l.length > 0 && l.charCodeAt(l.length - 1) === 13) lines[i] = l.slice(0, -1);
  }
  if (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  return lines;
}

export function parseMolfile(text: string, opts?: MolfileOptions): ReadResult {
  const lines = splitLines(text);
  return parseMolfileLines(lines, 0, lines.length, opts?.firstLine ?? 1, opts?.limits);
}

function fail(code: string, message: string, line: number): ReadResult {
  return { ok: false, error: { code, message, at: { line } } };
}

const DIGITS = /^\d+$/;

/** Index of a counts line standing on line 2 or 3 (the header lost lines), or -1. */
function shortHeader(lines: readonly string[], start: number, end: number): number {
  for (let i = start + 1; i < start + 3 && i < end; i++) {
    const l = lines[i]!;
    if (/V[23]000\s*$/.test(l) && DIGITS.test(l.slice(0, 3).trim()) && DIGITS.test(l.slice(3, 6).trim()))
      return i;
  }
  return -1;
}

function headerShort(early: number, start: number, lineNo: (i: number) => number): ReadResult {
  const lost = 3 - (early - start);
  return fail(
    'molfile-header-short',
    `the counts line stands on line ${early - start + 1} of the molfile, not line 4: the header lost ` +
      `${lost === 1 ? 'a line' : `${lost} lines`} (a molfile starts with three header lines: name, program, ` +
      'comment; an unused one stays as an empty line)',
    lineNo(early),
  );
}

/** Charge codes of the V2000 atom line (ccc field). */
const CHARGE_CODE = [0, 3, 2, 1, 0, -1, -2, -3];

/**
 * Reads the molfile in lines[start, end); lines[start] has absolute line number firstLine. Lines after
 * `M  END` are not looked at.
 */
export function parseMolfileLines(
  lines: readonly string[],
  start: number,
  end: number,
  firstLine: number,
  limits: ReadLimits = READ_LIMITS,
): ReadResult {
  const lineNo = (idx: number): number => firstLine + (idx - start);
  if (end - start < 4) {
    return fail(
      'molfile-truncated',
      `the molfile ends after ${end - start} lines, before its counts line (line 4)`,
      lineNo(end),
    );
  }
  const title = lines[start]!.trim() || null;
  const counts = lines[start + 3]!;
  if (counts.includes('V3000')) return parseV3000(lines, start + 4, end, firstLine + 4, title, limits);

  let nAtoms = intField(counts, 0, 3);
  let nBonds = intField(counts, 3, 6);
  let nLists = intField(counts, 6, 9);
  let chiral = intField(counts, 12, 15);
  const warnings: ReadError[] = [];
  if (!(nAtoms >= 0) || !(nBonds >= 0) || counts.trim() === '') {
    // Free-format fallback: some writers do not keep the fixed columns.
    const t = tokens(counts);
    // counts are whole numbers as written: an atom line's "0.0000" is no count
    const a = t.length >= 2 && DIGITS.test(t[0]!) ? Number(t[0]) : NaN;
    const b = t.length >= 2 && DIGITS.test(t[1]!) ? Number(t[1]) : NaN;
    if (!Number.isInteger(a) || !Number.isInteger(b) || a < 0 || b < 0) {
      const early = shortHeader(lines, start, end);
      if (early >= 0) {
        return headerShort(early, start, lineNo);
      }
      return fail(
        'molfile-bad-counts-line',
        `line 4 of the molfile should be the counts line (atoms, bonds, ..., V2000), found "${counts.slice(0, 40)}"`,
        lineNo(start + 3),
      );
    }
    nAtoms = a;
    nBonds = b;
    nLists = Number(t[2]) || 0;
    chiral = Number(t[4]) || 0;
    warnings.push({
      code: 'molfile-counts-not-fixed-width',
      message: 'the counts line does not keep the fixed columns of the format',
      at: { line: lineNo(start + 3) },
    });
  }
  if (!(nLists >= 0)) nLists = 0;
  const large = tooManyAtoms(nAtoms, limits, { line: lineNo(start + 3) });
  if (large !== null) return { ok: false, error: large };
  if (nAtoms === 0) {
    const early = shortHeader(lines, start, end);
    return early >= 0
      ? headerShort(early, start, lineNo)
      : fail(
          'molfile-no-atoms',
          'the counts line gives 0 atoms: there is no structure to check',
          lineNo(start + 3),
        );
  }

  const atoms = objectList<Atom>();
  const atomLines: number[] = [];
  const valences: (number | null)[] = [];
  let idx = start + 4;
  for (let i = 0; i < nAtoms; i++, idx++) {
    if (idx >= end) {
      return fail(
        'molfile-truncated',
        `the molfile ends after ${i} of its ${nAtoms} atom lines`,
        lineNo(idx),
      );
    }
    const line = lines[idx]!;
    let x = floatField(line, 0, 10);
    let y = floatField(line, 10, 20);
    let z = floatField(line, 20, 30);
    let sym = line.length >= 32 ? line.slice(31, 34).trim() : '';
    let free: string[] | null = null;
    if (Number.isNaN(x) || Number.isNaN(y) || Number.isNaN(z) || sym === '') {
      free = tokens(line);
      const fx = Number(free[0]);
      const fy = Number(free[1]);
      const fz = Number(free[2]);
      if (free.length < 4 || !Number.isFinite(fx) || !Number.isFinite(fy) || !Number.isFinite(fz)) {
        if (line.length < 32 && free.length < 4) {
          return fail(
            'molfile-atom-line-short',
            `atom line ${i + 1} is too short (${line.length} characters; coordinates and symbol need 34)`,
            lineNo(idx),
          );
        }
        return fail(
          'molfile-bad-coordinate',
          `atom line ${i + 1}: the coordinates are not numbers ("${line.slice(0, 30).trim()}")`,
          lineNo(idx),
        );
      }
      x = fx;
      y = fy;
      z = fz;
      sym = free[3]!;
    }
    if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(z)) {
      return fail(
        'molfile-bad-coordinate',
        `atom line ${i + 1}: the coordinates are not finite numbers`,
        lineNo(idx),
      );
    }
    const el = elementOf(sym);
    if (el === null) {
      return fail(
        'molfile-unknown-element',
        `atom line ${i + 1}: "${sym}" is not an element symbol or a known query/R-group symbol`,
        lineNo(idx),
      );
    }
    let massDiff = 0;
    let chargeCode = 0;
    let valence = 0;
    let map = 0;
    if (free === null) {
      massDiff = intField(line, 34, 36);
      chargeCode = intField(line, 36, 39);
      valence = intField(line, 48, 51);
      map = intField(line, 60, 63);
    } else {
      massDiff = Number(free[4] ?? 0);
      chargeCode = Number(free[5] ?? 0);
      valence = Number(free[9] ?? 0);
      map = Number(free[13] ?? 0);
    }
    if (!Number.isInteger(massDiff)) massDiff = 0;
    if (!Number.isInteger(valence)) valence = 0;
    if (!Number.isInteger(map) || map < 0) map = 0;
    let charge = 0;
    let radical = 0;
    if (Number.isInteger(chargeCode) && chargeCode >= 0 && chargeCode <= 7) {
      charge = CHARGE_CODE[chargeCode]!;
      if (chargeCode === 4) radical = 1;
    } else {
      warnings.push({
        code: 'molfile-bad-charge-code',
        message: `atom ${i + 1}: charge code "${chargeCode}" is not 0-7; read as no charge`,
        at: { line: lineNo(idx) },
      });
    }
    let isotope = el.isotope;
    if (massDiff !== 0 && el.atomicNumber > 0) {
      const m = roundedMass(el.atomicNumber);
      if (m === undefined) {
        warnings.push({
          code: 'molfile-mass-difference-unknown',
          message: `atom ${i + 1}: a mass difference is given for ${el.element}, whose reference mass this reader does not know; isotope ignored`,
          at: { line: lineNo(idx) },
        });
      } else isotope = m + massDiff;
    }
    atoms.push(
      newAtom(
        el.element,
        el.atomicNumber,
        charge,
        isotope,
        0,
        false,
        radical,
        map > 0 ? map : null,
        i + 1,
        coords3(x, y, z),
      ),
    );
    valences.push(valence >= 1 && valence <= 14 ? valence : valence === 15 ? 0 : null);
    atomLines.push(lineNo(idx));
  }

  const bonds = objectList<Bond>();
  const seen = new Set<number>();
  for (let i = 0; i < nBonds; i++, idx++) {
    if (idx >= end)
      return fail(
        'molfile-truncated',
        `the molfile ends after ${i} of its ${nBonds} bond lines`,
        lineNo(idx),
      );
    const line = lines[idx]!;
    let a = intField(line, 0, 3);
    let b = intField(line, 3, 6);
    let type = intField(line, 6, 9);
    let stereo = intField(line, 9, 12);
    if (line.length < 9 || Number.isNaN(a) || Number.isNaN(b) || Number.isNaN(type) || Number.isNaN(stereo)) {
      const t = tokens(line);
      a = Number(t[0]);
      b = Number(t[1]);
      type = Number(t[2]);
      stereo = Number(t[3] ?? 0);
      if (t.length < 3 || !Number.isInteger(a) || !Number.isInteger(b) || !Number.isInteger(type)) {
        return fail(
          'molfile-bad-bond-line',
          `bond line ${i + 1} should hold two atom numbers and a bond type, found "${line.trim().slice(0, 30)}"`,
          lineNo(idx),
        );
      }
      if (!Number.isInteger(stereo)) stereo = 0;
    }
    const r = makeBond(a, b, type, stereo, atoms.length, i + 1, lineNo(idx), warnings);
    if ('code' in r) return { ok: false, error: r };
    if (r.bond === null) continue;
    const key = Math.min(r.bond.a, r.bond.b) * 1_000_003 + Math.max(r.bond.a, r.bond.b);
    if (seen.has(key))
      return fail(
        'molfile-duplicate-bond',
        `bond line ${i + 1}: atoms ${a} and ${b} are already bonded`,
        lineNo(idx),
      );
    seen.add(key);
    bonds.push(r.bond);
  }
  idx += nLists; // obsolete atom-list block; the M  ALS lines carry the same information

  const raw: RawMolecule = {
    atoms,
    bonds,
    valences,
    atomLines,
    groups: objectList(),
    chiralFlag: chiral === 1,
    title,
    warnings,
  };
  const propError = readProperties(lines, idx, end, lineNo, raw);
  if (propError !== null) return { ok: false, error: propError };
  return finishMolecule(raw);
}

/** Properties block up to `M  END`. Returns an error or null. */
function readProperties(
  lines: readonly string[],
  idx: number,
  end: number,
  lineNo: (i: number) => number,
  raw: RawMolecule,
): ReadError | null {
  const { atoms } = raw;
  let chgSeen = false;
  let isoSeen = false;
  const atomRef = (s: string | undefined, i: number): number | ReadError => {
    const n = Number(s);
    if (!Number.isInteger(n) || n < 1 || n > atoms.length) {
      return {
        code: 'molfile-bad-property',
        message: `"${lines[i]!.slice(0, 6)}" line refers to atom "${s ?? ''}", which does not exist`,
        at: { line: lineNo(i) },
      };
    }
    return n - 1;
  };
  for (; idx < end; idx++) {
    const line = lines[idx]!;
    const tag = line.slice(0, 6);
    if (tag === 'M  END') return null;
    if (tag === 'M  CHG' || tag === 'M  RAD' || tag === 'M  ISO') {
      const t = tokens(line);
      const n = Number(t[2]);
      if (!Number.isInteger(n) || n < 0 || t.length < 3 + 2 * n) {
        return {
          code: 'molfile-bad-property',
          message: `"${tag}" line: the entry count does not match the entries`,
          at: { line: lineNo(idx) },
        };
      }
      if (tag === 'M  CHG' || tag === 'M  RAD') {
        if (!chgSeen) {
          // CTfile spec: charge and radical lines supersede all charge and radical values of the atom block.
          chgSeen = true;
          for (const a of atoms) {
            a.charge = 0;
            a.radical = 0;
          }
        }
      } else if (!isoSeen) {
        isoSeen = true;
        for (const a of atoms) if (a.atomicNumber !== 1) a.isotope = null; // D and T keep theirs
      }
      for (let k = 0; k < n; k++) {
        const ai = atomRef(t[3 + 2 * k], idx);
        if (typeof ai !== 'number') return ai;
        const v = Number(t[4 + 2 * k]);
        if (!Number.isInteger(v)) {
          return {
            code: 'molfile-bad-property',
            message: `"${tag}" line: value "${t[4 + 2 * k]}" is not an integer`,
            at: { line: lineNo(idx) },
          };
        }
        if (tag === 'M  CHG') atoms[ai]!.charge = v;
        else if (tag === 'M  ISO') atoms[ai]!.isotope = v;
        else atoms[ai]!.radical = v === 2 ? 1 : v === 1 || v === 3 ? 2 : 0; // 1 singlet, 2 doublet, 3 triplet
      }
    } else if (tag === 'M  ALS') {
      const t = tokens(line);
      const ai = atomRef(t[2], idx);
      if (typeof ai !== 'number') return ai;
      const a = atoms[ai]!;
      a.element = '*';
      a.atomicNumber = 0;
    } else if (tag.startsWith('A  ') || tag.startsWith('G  ')) {
      idx++; // alias / group abbreviation: the text is on the next line
    } else if (tag === 'S  SKP') {
      const n = Number(tokens(line)[2]);
      if (Number.isInteger(n) && n > 0) idx += n;
    } else if (line.startsWith('$$$$') || line.startsWith('>')) {
      return {
        code: 'molfile-missing-end',
        message: 'the molfile has no "M  END" line before this line',
        at: { line: lineNo(idx) },
      };
    }
    // other M lines (Sgroups, R-group logic, ...) and V lines are not needed here
  }
  return {
    code: 'molfile-missing-end',
    message: 'the molfile ends without its "M  END" line',
    at: { line: lineNo(end) },
  };
}
