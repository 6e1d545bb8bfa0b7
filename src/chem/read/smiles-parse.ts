/**
 * SMILES string -> atoms, bonds and each atom's neighbours in written order (the order OpenSMILES chirality
 * refers to). Syntax only: valence, kekulization and stereo come afterwards (smiles.ts).
 * OpenSMILES specification: bonds, branches, ring closures, disconnected structures.
 */
import { readBracketAtom, readOrganicAtom, type RawAtom, type TokenError } from './smiles-bracket.js';

export interface RawBond {
  a: number;
  b: number;
  /** 1..4; 1 for ':' and implicit aromatic bonds until kekulization. */
  order: 1 | 2 | 3 | 4;
  aromatic: boolean;
  /** A bond symbol was written ('-', '=', ':', '/', ...). */
  explicit: boolean;
  /** Direction mark relative to a -> b: 1 for '/', -1 for '\', 0 none. */
  dir: number;
  /** Offset of the second atom (chain bond) or of the closing ring digit. */
  offset: number;
}

export interface SmilesGraph {
  atoms: RawAtom[];
  bonds: RawBond[];
  /** Neighbour atoms of each atom in written order. */
  nbr: number[][];
  /** Bond index parallel to nbr. */
  nbrBond: number[][];
  /** Whether nbr[i][0] is the atom written before i (then an implicit H goes second, else first). */
  preceded: boolean[];
  /** Offset where the SMILES proper ends (first whitespace or end of text). */
  end: number;
  /** Tolerated oddities (e.g. a doubled backslash). */
  warnings: TokenError[];
}

interface PendingBond {
  order: 1 | 2 | 3 | 4;
  aromatic: boolean;
  dir: number;
  offset: number;
}

interface OpenRing {
  atom: number;
  slot: number;
  bond: PendingBond | null;
  offset: number;
}

function err(code: string, message: string, offset: number): { error: TokenError } {
  return { error: { code, message, offset } };
}

function bondSymbol(c: number, offset: number): PendingBond | null {
  switch (c) {
    case 45:
      return { order: 1, aromatic: false, dir: 0, offset }; // -
    case 61:
      return { order: 2, aromatic: false, dir: 0, offset }; // =
    case 35:
      return { order: 3, aromatic: false, dir: 0, offset }; // #
    case 36:
      return { order: 4, aromatic: false, dir: 0, offset }; // $
    case 58:
      return { order: 1, aromatic: true, dir: 0, offset }; // :
    case 47:
      return { order: 1, aromatic: false, dir: 1, offset }; // /
    case 92:
      return { order: 1, aromatic: false, dir: -1, offset }; // \
    default:
      return null;
  }
}

function isSpace(c: number): boolean {
  return c === 32 || c === 9 || c === 10 || c === 13;
}

/** Parses the SMILES part of `s` from `start` up to the first whitespace; offsets are into `s`. */
export function parseSmilesGraph(s: string, start = 0): SmilesGraph | { error: TokenError } {
  const atoms: RawAtom[] = [];
  const bonds: RawBond[] = [];
  const nbr: number[][] = [];
  const nbrBond: number[][] = [];
  const preceded: boolean[] = [];
  const warnings: TokenError[] = [];
  const rings: (OpenRing | undefined)[] = [];
  let openRings = 0;
  const branchStack: { atom: number; offset: number; atomsBefore: number }[] = [];
  let prev = -1;
  let pending: PendingBond | null = null;
  let i = start;
  const n = s.length;

  const addBond = (a: number, b: number, p: PendingBond | null, offset: number): number => {
    const arom = p ? p.aromatic : atoms[a]!.aromatic && atoms[b]!.aromatic;
    bonds.push({
      a,
      b,
      order: p ? p.order : 1,
      aromatic: arom,
      explicit: p !== null,
      dir: p ? p.dir : 0,
      offset,
    });
    return bonds.length - 1;
  };

  while (i < n) {
    const c = s.charCodeAt(i);
    if (isSpace(c)) break;
    let tok: { atom: RawAtom; end: number } | null = null;
    if (c === 91) {
      const t = readBracketAtom(s, i);
      if ('error' in t) return t;
      tok = t;
    } else {
      tok = readOrganicAtom(s, i);
    }
    if (tok) {
      const idx = atoms.length;
      atoms.push(tok.atom);
      nbr.push([]);
      nbrBond.push([]);
      if (prev >= 0) {
        const bi = addBond(prev, idx, pending, i);
        nbr[prev]!.push(idx);
        nbrBond[prev]!.push(bi);
        nbr[idx]!.push(prev);
        nbrBond[idx]!.push(bi);
        preceded.push(true);
      } else {
        if (pending) return err('smiles-dangling-bond', 'bond symbol with no atom before it', pending.offset);
        preceded.push(false);
      }
      pending = null;
      prev = idx;
      i = tok.end;
      continue;
    }
    const bs = bondSymbol(c, i);
    if (bs) {
      if (prev < 0) return err('smiles-dangling-bond', 'bond symbol with no atom before it', i);
      if (pending) return err('smiles-dangling-bond', 'two bond symbols in a row', i);
      pending = bs;
      i++;
      if (c === 92 && s.charCodeAt(i) === 92) {
        // '\\': a backslash escaped for a programming language or CSV; read as one '\' (RDKit does too)
        warnings.push({
          code: 'smiles-doubled-backslash',
          message: "'\\\\' read as a single '\\'",
          offset: i - 1,
        });
        i++;
      }
      continue;
    }
    if (c === 40) {
      // (
      if (prev < 0) return err('smiles-unmatched-parenthesis', "branch '(' with no atom before it", i);
      if (pending) return err('smiles-dangling-bond', "bond symbol before '('", pending.offset);
      if (s.charCodeAt(i + 1) === 41) return err('smiles-empty-branch', "empty branch '()'", i);
      branchStack.push({ atom: prev, offset: i, atomsBefore: atoms.length });
      i++;
      continue;
    }
    if (c === 41) {
      // )
      const top = branchStack.pop();
      if (!top) return err('smiles-unmatched-parenthesis', "')' without a matching '('", i);
      if (pending) return err('smiles-dangling-bond', "bond symbol before ')'", pending.offset);
      if (atoms.length === top.atomsBefore)
        return err('smiles-empty-branch', 'branch with no atom in it', top.offset);
      prev = top.atom;
      i++;
      continue;
    }
    if ((c >= 48 && c <= 57) || c === 37) {
      // ring closure digit or %nn
      const at = i;
      let num: number;
      if (c === 37) {
        const d1 = s.charCodeAt(i + 1) - 48;
        const d2 = s.charCodeAt(i + 2) - 48;
        if (d1 >= 0 && d1 <= 9 && d2 >= 0 && d2 <= 9) {
          num = d1 * 10 + d2;
          i += 3;
        } else if (s.charCodeAt(i + 1) === 40) {
          // %(nnn) ring-closure extension
          let j = i + 2;
          num = 0;
          while (j < n && s.charCodeAt(j) >= 48 && s.charCodeAt(j) <= 57 && j - i < 8)
            num = num * 10 + s.charCodeAt(j++) - 48;
          if (j === i + 2 || s.charCodeAt(j) !== 41)
            return err('smiles-bad-ring-number', "'%(' must be followed by digits and ')'", i);
          i = j + 1;
        } else {
          return err('smiles-bad-ring-number', "'%' must be followed by two digits", i);
        }
      } else {
        num = c - 48;
        i++;
      }
      if (prev < 0) return err('smiles-dangling-ring-bond', 'ring-closure number with no atom before it', at);
      const open = rings[num];
      if (open === undefined) {
        rings[num] = { atom: prev, slot: nbr[prev]!.length, bond: pending, offset: at };
        openRings++;
        nbr[prev]!.push(-1);
        nbrBond[prev]!.push(-1);
      } else {
        rings[num] = undefined;
        openRings--;
        const a = open.atom;
        if (a === prev)
          return err('smiles-ring-bond-to-self', `ring closure ${num} bonds an atom to itself`, at);
        if (nbr[prev]!.includes(a))
          return err('smiles-duplicate-bond', `ring closure ${num} repeats an existing bond`, at);
        // combine the symbols written at the two ends
        let p: PendingBond | null = open.bond;
        const q = pending;
        if (q) {
          if (p) {
            if (p.order !== q.order || p.aromatic !== q.aromatic) {
              return err(
                'smiles-conflicting-ring-bond',
                `ring closure ${num} has different bond symbols at its two ends`,
                at,
              );
            }
            if (p.dir !== 0 && q.dir !== 0 && p.dir !== -q.dir) {
              return err(
                'smiles-conflicting-ring-bond',
                `ring closure ${num} has contradicting '/' '\\' marks`,
                at,
              );
            }
            if (p.dir === 0 && q.dir !== 0) p = { ...p, dir: -q.dir };
          } else {
            // the mark written at the closing end reads closing -> opening
            p = { ...q, dir: -q.dir };
          }
        }
        const bi = addBond(a, prev, p, at);
        nbr[a]![open.slot] = prev;
        nbrBond[a]![open.slot] = bi;
        nbr[prev]!.push(a);
        nbrBond[prev]!.push(bi);
      }
      pending = null;
      continue;
    }
    if (c === 46) {
      // .
      if (pending) return err('smiles-dangling-bond', "bond symbol before '.'", pending.offset);
      if (prev < 0) return err('smiles-empty-component', "'.' with no atom before it", i);
      prev = -1;
      i++;
      continue;
    }
    if (c === 93) return err('smiles-bad-bracket-atom', "']' without a matching '['", i);
    return err('smiles-illegal-character', `character '${s[i]}' is not allowed in SMILES`, i);
  }
  const end = i;
  if (atoms.length === 0) return err('smiles-empty', 'no atoms in the SMILES', start);
  if (pending) return err('smiles-dangling-bond', 'bond symbol at the end of the SMILES', pending.offset);
  if (prev < 0) return err('smiles-empty-component', "'.' at the end of the SMILES", end - 1);
  if (branchStack.length > 0) {
    return err(
      'smiles-unmatched-parenthesis',
      "'(' is never closed",
      branchStack[branchStack.length - 1]!.offset,
    );
  }
  if (openRings > 0) {
    let first: OpenRing | undefined;
    for (const r of rings) if (r && (!first || r.offset < first.offset)) first = r;
    return err('smiles-unclosed-ring', 'ring-closure number is never closed', first!.offset);
  }
  return { atoms, bonds, nbr, nbrBond, preceded, end, warnings };
}
