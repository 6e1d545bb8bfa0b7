/**
 * Molfile V3000 connection table (CTfile format specification, "V3000 connection table"): `M  V30` lines,
 * continuation with a trailing '-', CTAB / ATOM / BOND / COLLECTION blocks; other blocks (SGROUP, OBJ3D,
 * RGROUP, TEMPLATE) are skipped. Enhanced stereo collections MDLV30/STEABS, STERACn, STERELn become groups.
 */
import type { Atom, Bond, ReadError, ReadResult, StereoGroup } from '../types.js';
import { finishMolecule } from './molfile-build.js';
import { elementOf } from './molfile-fields.js';
import { makeBond } from './molfile-bond.js';
import { coords3, newAtom, newGroup, objectList } from './make.js';
import { READ_LIMITS, tooManyAtoms, type ReadLimits } from './limits.js';

interface V30Line {
  text: string;
  line: number;
}

function fail(code: string, message: string, line: number): ReadResult {
  return { ok: false, error: { code, message, at: { line } } };
}

/** Tokens of a V3000 line; (...), [...] and "..." groups stay whole (ATOMS=(3 1 2 5)). */
export function v30Tokens(s: string): string[] {
  const out: string[] = [];
  let i = 0;
  const n = s.length;
  while (i < n) {
    while (i < n && s.charCodeAt(i) === 32) i++;
    if (i >= n) break;
    const st = i;
    let depth = 0;
    let quote = false;
    for (; i < n; i++) {
      const c = s[i]!;
      if (quote) {
        if (c === '"') quote = false;
      } else if (c === '"') quote = true;
      else if (c === '(' || c === '[') depth++;
      else if ((c === ')' || c === ']') && depth > 0) depth--;
      else if (c === ' ' && depth === 0) break;
    }
    out.push(s.slice(st, i));
  }
  return out;
}

/** Splits `KEY=value` tokens; positional tokens have key ''. */
function keyed(tokens: string[], from: number): Map<string, string> {
  const m = new Map<string, string>();
  for (let i = from; i < tokens.length; i++) {
    const t = tokens[i]!;
    const eq = t.indexOf('=');
    if (eq > 0) m.set(t.slice(0, eq).toUpperCase(), t.slice(eq + 1));
  }
  return m;
}

/** `(3 1 2 5)` -> [1, 2, 5]; null when malformed. */
function parseList(v: string): number[] | null {
  if (!v.startsWith('(') || !v.endsWith(')')) return null;
  const parts = v.slice(1, -1).trim().split(/\s+/).map(Number);
  if (parts.length === 0 || !parts.every(Number.isInteger) || parts[0] !== parts.length - 1) return null;
  return parts.slice(1);
}

/**
 * Reads from lines[idx] (absolute line number firstLine) to `M  END`. `title` comes from the header.
 */
export function parseV3000(
  lines: readonly string[],
  idx: number,
  end: number,
  firstLine: number,
  title: string | null,
  limits: ReadLimits = READ_LIMITS,
): ReadResult {
  const base = idx;
  const lineNo = (i: number): number => firstLine + (i - base);
  // Join continuation lines into logical V30 lines.
  const logical: V30Line[] = [];
  let endLine = -1;
  for (let i = idx; i < end; i++) {
    const l = lines[i]!;
    if (l.startsWith('M  END')) {
      endLine = i;
      break;
    }
    if (!l.startsWith('M  V30')) {
      return fail(
        'molfile-v3000-bad-line',
        `V3000 lines must start with "M  V30", found "${l.slice(0, 20)}"`,
        lineNo(i),
      );
    }
    const first = lineNo(i);
    let text = l.slice(7);
    while (text.endsWith('-')) {
      i++;
      if (i >= end || !lines[i]!.startsWith('M  V30')) {
        return fail(
          'molfile-v3000-bad-continuation',
          'a V3000 line ends with "-" but no "M  V30" continuation line follows',
          lineNo(i),
        );
      }
      text = text.slice(0, -1) + lines[i]!.slice(7);
    }
    logical.push({ text: text.trim(), line: first });
  }
  if (endLine === -1)
    return fail('molfile-missing-end', 'the V3000 molfile ends without its "M  END" line', lineNo(end));

  const warnings: ReadError[] = [];
  const atoms = objectList<Atom>();
  const atomLines: number[] = [];
  const valences: (number | null)[] = [];
  const bonds = objectList<Bond>();
  const groups = objectList<StereoGroup>();
  const indexOf = new Map<number, number>();
  const seenBonds = new Set<number>();
  let chiralFlag = false;
  let block: string | null = null;
  let blockLine = 0;
  let inCtab = false;
  let ctabDone = false;
  let skipDepth = 0;
  let expectAtoms = -1;
  let expectBonds = -1;
  let countsLine = -1;
  let bondLines = 0;

  for (const { text, line } of logical) {
    const t = v30Tokens(text);
    const head = (t[0] ?? '').toUpperCase();
    if (skipDepth > 0) {
      if (head === 'BEGIN') skipDepth++;
      else if (head === 'END') skipDepth--;
      continue;
    }
    if (head === 'BEGIN') {
      const what = (t[1] ?? '').toUpperCase();
      if (what === 'CTAB') {
        if (inCtab || ctabDone)
          return fail(
            'molfile-v3000-unexpected',
            'a second "BEGIN CTAB" (only one connection table is read)',
            line,
          );
        inCtab = true;
        blockLine = line;
      } else if (!inCtab) {
        return fail('molfile-v3000-unexpected', `"BEGIN ${what}" outside the CTAB block`, line);
      } else if (block !== null) {
        return fail(
          'molfile-v3000-block-not-closed',
          `"BEGIN ${what}" inside the ${block} block opened at line ${blockLine}, which is not closed`,
          line,
        );
      } else if (what === 'ATOM' || what === 'BOND' || what === 'COLLECTION') {
        block = what;
        blockLine = line;
      } else skipDepth = 1; // SGROUP, OBJ3D, RGROUP, TEMPLATE...
      continue;
    }
    if (head === 'END') {
      const what = (t[1] ?? '').toUpperCase();
      if (block !== null && what === block) block = null;
      else if (block === null && inCtab && what === 'CTAB') {
        inCtab = false;
        ctabDone = true;
      } else {
        return fail(
          'molfile-v3000-block-not-closed',
          `"END ${what}" while the ${block ?? (inCtab ? 'CTAB' : 'no')} block is open (opened at line ${blockLine})`,
          line,
        );
      }
      continue;
    }
    if (!inCtab) continue; // lines outside CTAB (e.g. a leading blank V30 line) carry nothing we need
    if (head === 'COUNTS') {
      expectAtoms = Number(t[1]);
      expectBonds = Number(t[2]);
      if (
        !Number.isInteger(expectAtoms) ||
        !Number.isInteger(expectBonds) ||
        expectAtoms < 0 ||
        expectBonds < 0
      ) {
        return fail(
          'molfile-bad-counts-line',
          `the V3000 COUNTS line should start with atom and bond counts, found "${text.slice(0, 40)}"`,
          line,
        );
      }
      chiralFlag = t[5] === '1';
      countsLine = line;
      const large = tooManyAtoms(expectAtoms, limits, { line });
      if (large !== null) return { ok: false, error: large };
      continue;
    }
    if (block === 'ATOM') {
      const r = readAtom(t, line, atoms.length, indexOf, warnings);
      if ('code' in r) return { ok: false, error: r };
      atoms.push(r.atom);
      valences.push(r.valence);
      atomLines.push(line);
    } else if (block === 'BOND') {
      bondLines++;
      if (t.length < 4)
        return fail(
          'molfile-bad-bond-line',
          `a V3000 bond line needs index, type and two atoms, found "${text.slice(0, 40)}"`,
          line,
        );
      const type = Number(t[1]);
      const a = indexOf.get(Number(t[2]));
      const b = indexOf.get(Number(t[3]));
      if (a === undefined || b === undefined) {
        return fail(
          'molfile-bond-atom-missing',
          `bond ${t[0]} refers to atom ${a === undefined ? t[2] : t[3]}, which is not in the ATOM block`,
          line,
        );
      }
      if (!Number.isInteger(type))
        return fail('molfile-bad-bond-type', `bond ${t[0]} has type "${t[1]}"`, line);
      const cfg = Number(keyed(t, 4).get('CFG') ?? 0);
      const stereo = cfg === 1 ? 1 : cfg === 3 ? 6 : cfg === 2 ? (type === 2 ? 3 : 4) : 0;
      const r = makeBond(a + 1, b + 1, type, stereo, atoms.length, bonds.length + 1, line, warnings);
      if ('code' in r) return { ok: false, error: r };
      if (r.bond === null) continue;
      const key = Math.min(a, b) * 1_000_003 + Math.max(a, b);
      if (seenBonds.has(key))
        return fail(
          'molfile-duplicate-bond',
          `bond ${t[0]}: atoms ${t[2]} and ${t[3]} are already bonded`,
          line,
        );
      seenBonds.add(key);
      bonds.push(r.bond);
    } else if (block === 'COLLECTION') {
      const name = (t[0] ?? '').toUpperCase();
      const m = /^MDLV30\/STE(ABS|RAC|REL)(\d*)$/.exec(name);
      if (m === null) continue; // other collections (highlighting, ...) are not stereo
      const list = parseList(keyed(t, 1).get('ATOMS') ?? '');
      if (list === null)
        return fail('molfile-bad-collection', `collection ${t[0]} needs ATOMS=(n a1 ... an)`, line);
      const members: number[] = [];
      for (const n of list) {
        const ai = indexOf.get(n);
        if (ai === undefined)
          return fail(
            'molfile-bad-collection',
            `collection ${t[0]} names atom ${n}, which is not in the ATOM block`,
            line,
          );
        members.push(ai);
      }
      const type = m[1] === 'ABS' ? 'abs' : m[1] === 'RAC' ? 'and' : 'or';
      const id = type === 'abs' ? 0 : Number(m[2] || '0');
      groups.push(newGroup(type, id, members));
    }
  }
  if (block !== null)
    return fail(
      'molfile-v3000-block-not-closed',
      `the ${block} block opened at line ${blockLine} is not closed before "M  END"`,
      lineNo(endLine),
    );
  if (inCtab)
    return fail(
      'molfile-v3000-block-not-closed',
      `the CTAB block opened at line ${blockLine} is not closed before "M  END"`,
      lineNo(endLine),
    );
  if (!ctabDone)
    return fail('molfile-v3000-no-ctab', 'the V3000 molfile has no "BEGIN CTAB" block', lineNo(endLine));
  // CTfile specification: COUNTS gives the number of atom and bond lines; a mismatch means lines were lost or
  // added, so the structure read would not be the one drawn
  if (expectAtoms >= 0 && (expectAtoms !== atoms.length || expectBonds !== bondLines)) {
    return fail(
      'molfile-counts-mismatch',
      `the COUNTS line says ${expectAtoms} atoms and ${expectBonds} bonds, but the ATOM and BOND blocks hold ` +
        `${atoms.length} and ${bondLines}; lines were lost or added`,
      countsLine,
    );
  }
  if (atoms.length === 0) {
    return fail(
      'molfile-no-atoms',
      'the V3000 molfile has no atoms: there is no structure to check',
      countsLine >= 0 ? countsLine : lineNo(endLine),
    );
  }
  return finishMolecule({ atoms, bonds, valences, atomLines, groups, chiralFlag, title, warnings });
}

function readAtom(
  tokens: string[],
  line: number,
  position: number,
  indexOf: Map<number, number>,
  warnings: ReadError[],
): { atom: Atom; valence: number | null } | ReadError {
  let t = tokens;
  if ((t[1] ?? '').toUpperCase() === 'NOT' && t.length > 2) t = [t[0]!, `NOT ${t[2]}`, ...t.slice(3)]; // NOT [O,S]
  if (t.length < 6)
    return {
      code: 'molfile-atom-line-short',
      message: `a V3000 atom line needs index, type, x, y, z and map, found ${t.length} fields`,
      at: { line },
    };
  const index = Number(t[0]);
  if (!Number.isInteger(index) || index < 1)
    return {
      code: 'molfile-bad-atom-line',
      message: `atom index "${t[0]}" is not a positive integer`,
      at: { line },
    };
  if (indexOf.has(index))
    return { code: 'molfile-bad-atom-line', message: `atom index ${index} appears twice`, at: { line } };
  const x = Number(t[2]);
  const y = Number(t[3]);
  const z = Number(t[4]);
  if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(z)) {
    return {
      code: 'molfile-bad-coordinate',
      message: `atom ${index}: the coordinates "${t[2]} ${t[3]} ${t[4]}" are not numbers`,
      at: { line },
    };
  }
  let sym = t[1]!;
  if (sym.startsWith('"') && sym.endsWith('"') && sym.length >= 2) sym = sym.slice(1, -1);
  const isList = sym.startsWith('[') || sym.toUpperCase().startsWith('NOT ');
  const el = isList ? elementOf('*') : elementOf(sym);
  if (el === null)
    return {
      code: 'molfile-unknown-element',
      message: `atom ${index}: "${sym}" is not an element symbol or a known query/R-group symbol`,
      at: { line },
    };
  const map = Number(t[5]);
  const kv = keyed(t, 6);
  const num = (k: string): number => {
    const v = kv.get(k);
    if (v === undefined) return 0;
    const n = Number(v);
    if (!Number.isInteger(n)) {
      warnings.push({
        code: 'molfile-bad-atom-property',
        message: `atom ${index}: ${k}=${v} is not an integer; ignored`,
        at: { line },
      });
      return 0;
    }
    return n;
  };
  const charge = num('CHG');
  const rad = num('RAD');
  const mass = num('MASS');
  const val = num('VAL');
  if (index !== position + 1) {
    warnings.push({
      code: 'molfile-atom-index-out-of-order',
      message: `atom index ${index} is at position ${position + 1}; atoms are numbered by position`,
      at: { line },
    });
  }
  indexOf.set(index, position);
  return {
    atom: newAtom(
      el.element,
      el.atomicNumber,
      charge,
      mass > 0 ? mass : el.isotope,
      0,
      false,
      rad === 2 ? 1 : rad === 1 || rad === 3 ? 2 : 0,
      Number.isInteger(map) && map > 0 ? map : null,
      position + 1,
      coords3(x, y, z),
    ),
    // VAL=-1 means zero valence; HCOUNT is a query property and does not set hydrogens.
    valence: val === -1 ? 0 : val > 0 ? val : null,
  };
}
