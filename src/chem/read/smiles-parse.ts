/**
 * SMILES string -> atoms, bonds and each atom's neighbours in written order (the order OpenSMILES chirality
 * refers to). Syntax only: valence, kekulization and stereo come afterwards (smiles.ts).
 * OpenSMILES specification: bonds, branches, ring closures, disconnected structures.
 */
import { readBracketAtom, readOrganicAtom, type RawAtom, type TokenError } from './smiles-bracket.js';
import { objectList } from './make.js';

/**
 * The parsed graph. Bonds and neighbour lists are flat integer arrays (views on one buffer per SMILES) rather
 * than an object per bond and two arrays per atom: a SMILES is read once per record in a bulk audit, and that
 * per-atom garbage was most of what reading cost.
 *
 * Bond k joins bondA[k] and bondB[k] (in written order: the earlier atom, or the ring-opening atom, first).
 * The neighbours of atom i in written order (the order OpenSMILES chirality refers to) are
 * nbrAtom[nbrStart[i] .. nbrStart[i + 1]), the joining bonds at the same positions of nbrBond.
 */
export interface SmilesGraph {
  atoms: RawAtom[];
  bondCount: number;
  bondA: Int32Array;
  bondB: Int32Array;
  /** 1..4; 1 for ':' and implicit aromatic bonds until kekulization. */
  bondOrder: Int32Array;
  /** 1 when aromatic (smiles.ts clears it on aromatic bonds outside rings). */
  bondAromatic: Int32Array;
  /** 1 when a bond symbol was written ('-', '=', ':', '/', ...). */
  bondExplicit: Int32Array;
  /** Direction mark relative to a -> b: 1 for '/', -1 for '\', 0 none. */
  bondDir: Int32Array;
  /** Offset of the second atom (chain bond) or of the closing ring digit. */
  bondOffset: Int32Array;
  nbrStart: Int32Array;
  nbrAtom: Int32Array;
  nbrBond: Int32Array;
  /** 1 when the first neighbour of atom i is the atom written before it (then an implicit H goes second). */
  preceded: Int32Array;
  /** Offset where the SMILES proper ends (first whitespace or end of text). */
  end: number;
  /** Tolerated oddities (e.g. a doubled backslash). */
  warnings: TokenError[];
}

function err(code: string, message: string, offset: number): { error: TokenError } {
  return { error: { code, message, offset } };
}

function isSpace(c: number): boolean {
  return c === 32 || c === 9 || c === 10 || c === 13;
}

/*
 * Scratch space of the parser, reused from one SMILES to the next (the parser is synchronous and not
 * re-entrant). Sized by the text: a SMILES of L characters has at most L atoms and L bonds (every bond takes
 * the character of its second atom or of its closing ring digit) and 2L neighbour entries.
 */
let cap = 0;
// neighbour entries in the order they are written: owner atom, neighbour (-1 = ring slot not yet closed), bond
let evOwner = new Int32Array(0);
let evAtom = new Int32Array(0);
let evBond = new Int32Array(0);
let evNext = new Int32Array(0); // next entry of the same owner, -1 at the end
let firstEv = new Int32Array(0); // per atom
let lastEv = new Int32Array(0); // per atom
let bA = new Int32Array(0);
let bB = new Int32Array(0);
let bOrder = new Int32Array(0);
let bArom = new Int32Array(0);
let bExpl = new Int32Array(0);
let bDir = new Int32Array(0);
let bOff = new Int32Array(0);
let pre = new Int32Array(0);
let brAtom = new Int32Array(0); // branch stack
let brOff = new Int32Array(0);
let brBefore = new Int32Array(0);

function ensure(len: number): void {
  if (len <= cap) return;
  cap = Math.max(len, 2 * cap, 64);
  evOwner = new Int32Array(2 * cap);
  evAtom = new Int32Array(2 * cap);
  evBond = new Int32Array(2 * cap);
  evNext = new Int32Array(2 * cap);
  firstEv = new Int32Array(cap);
  lastEv = new Int32Array(cap);
  bA = new Int32Array(cap);
  bB = new Int32Array(cap);
  bOrder = new Int32Array(cap);
  bArom = new Int32Array(cap);
  bExpl = new Int32Array(cap);
  bDir = new Int32Array(cap);
  bOff = new Int32Array(cap);
  pre = new Int32Array(cap);
  brAtom = new Int32Array(cap);
  brOff = new Int32Array(cap);
  brBefore = new Int32Array(cap);
}

/** A very long SMILES does not keep its scratch space alive. */
function release(): void {
  if (cap > 1 << 16) {
    cap = 0;
    ensure(64);
  }
}

// Open ring closures 0..99, by number: the opening atom, its reserved neighbour entry, the bond symbol written
// there (order 0 = none), and the digit's offset. Numbers from %(100) on go to a Map made when first needed.
const RING_OPEN = new Uint8Array(100);
const RING_ATOM = new Int32Array(100);
const RING_ENTRY = new Int32Array(100);
const RING_ORDER = new Int32Array(100);
const RING_AROM = new Int32Array(100);
const RING_DIR = new Int32Array(100);
const RING_OFF = new Int32Array(100);

/** Parses the SMILES part of `s` from `start` up to the first whitespace; offsets are into `s`. */
export function parseSmilesGraph(s: string, start = 0): SmilesGraph | { error: TokenError } {
  ensure(s.length - start + 1);
  try {
    return parseInto(s, start);
  } finally {
    RING_OPEN.fill(0);
    release();
  }
}

function parseInto(s: string, start: number): SmilesGraph | { error: TokenError } {
  const atoms: RawAtom[] = [];
  const warnings = objectList<TokenError>();
  let big: Map<number, number[]> | null = null; // ring numbers >= 100: [atom, entry, order, arom, dir, offset]
  let openRings = 0;
  let branchDepth = 0;
  let nAtoms = 0;
  let m = 0; // bonds
  let ev = 0; // neighbour entries
  let prev = -1;
  // the pending bond symbol (order 0: none)
  let pOrder = 0;
  let pArom = 0;
  let pDir = 0;
  let pOff = 0;
  let i = start;
  const n = s.length;

  const entry = (owner: number, atom: number, bond: number): number => {
    evOwner[ev] = owner;
    evAtom[ev] = atom;
    evBond[ev] = bond;
    evNext[ev] = -1;
    if (lastEv[owner]! < 0) firstEv[owner] = ev;
    else evNext[lastEv[owner]!] = ev;
    lastEv[owner] = ev;
    return ev++;
  };
  // bond a-b with the given symbol (order 0: none written)
  const addBond = (
    a: number,
    b: number,
    order: number,
    arom: number,
    dir: number,
    offset: number,
  ): number => {
    bA[m] = a;
    bB[m] = b;
    if (order === 0) {
      bOrder[m] = 1;
      bArom[m] = atoms[a]!.aromatic && atoms[b]!.aromatic ? 1 : 0;
      bExpl[m] = 0;
      bDir[m] = 0;
    } else {
      bOrder[m] = order;
      bArom[m] = arom;
      bExpl[m] = 1;
      bDir[m] = dir;
    }
    bOff[m] = offset;
    return m++;
  };

  while (i < n) {
    const c = s.charCodeAt(i);
    if (isSpace(c)) break;
    let atom: RawAtom | null;
    let atomEnd = 0;
    if (c === 91) {
      const t = readBracketAtom(s, i);
      if ('error' in t) return t;
      atom = t.atom;
      atomEnd = t.end;
    } else {
      atom = readOrganicAtom(s, i);
      if (atom !== null) atomEnd = i + atom.element.length;
    }
    if (atom !== null) {
      const idx = nAtoms++;
      atoms.push(atom);
      firstEv[idx] = -1;
      lastEv[idx] = -1;
      if (prev >= 0) {
        const bi = addBond(prev, idx, pOrder, pArom, pDir, i);
        entry(prev, idx, bi);
        entry(idx, prev, bi);
        pre[idx] = 1;
      } else {
        if (pOrder !== 0) return err('smiles-dangling-bond', 'bond symbol with no atom before it', pOff);
        pre[idx] = 0;
      }
      pOrder = 0;
      prev = idx;
      i = atomEnd;
      continue;
    }
    const order = bondSymbolOrder(c);
    if (order !== 0) {
      if (prev < 0) return err('smiles-dangling-bond', 'bond symbol with no atom before it', i);
      if (pOrder !== 0) return err('smiles-dangling-bond', 'two bond symbols in a row', i);
      pOrder = order;
      pArom = c === 58 ? 1 : 0;
      pDir = c === 47 ? 1 : c === 92 ? -1 : 0;
      pOff = i;
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
      if (pOrder !== 0) return err('smiles-dangling-bond', "bond symbol before '('", pOff);
      if (s.charCodeAt(i + 1) === 41) return err('smiles-empty-branch', "empty branch '()'", i);
      brAtom[branchDepth] = prev;
      brOff[branchDepth] = i;
      brBefore[branchDepth] = nAtoms;
      branchDepth++;
      i++;
      continue;
    }
    if (c === 41) {
      // )
      if (branchDepth === 0) return err('smiles-unmatched-parenthesis', "')' without a matching '('", i);
      branchDepth--;
      if (pOrder !== 0) return err('smiles-dangling-bond', "bond symbol before ')'", pOff);
      if (nAtoms === brBefore[branchDepth])
        return err('smiles-empty-branch', 'branch with no atom in it', brOff[branchDepth]!);
      prev = brAtom[branchDepth]!;
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
      const rec = num < 100 ? null : (big ??= new Map()).get(num);
      if (num < 100 ? RING_OPEN[num] === 0 : rec === undefined) {
        const slot = entry(prev, -1, -1);
        if (num < 100) {
          RING_OPEN[num] = 1;
          RING_ATOM[num] = prev;
          RING_ENTRY[num] = slot;
          RING_ORDER[num] = pOrder;
          RING_AROM[num] = pArom;
          RING_DIR[num] = pDir;
          RING_OFF[num] = at;
        } else big!.set(num, [prev, slot, pOrder, pArom, pDir, at]);
        openRings++;
      } else {
        let a: number;
        let slot: number;
        // the symbol written at the opening end
        let oOrder: number;
        let oArom: number;
        let oDir: number;
        if (num < 100) {
          RING_OPEN[num] = 0;
          a = RING_ATOM[num]!;
          slot = RING_ENTRY[num]!;
          oOrder = RING_ORDER[num]!;
          oArom = RING_AROM[num]!;
          oDir = RING_DIR[num]!;
        } else {
          big!.delete(num);
          a = rec![0]!;
          slot = rec![1]!;
          oOrder = rec![2]!;
          oArom = rec![3]!;
          oDir = rec![4]!;
        }
        openRings--;
        if (a === prev)
          return err('smiles-ring-bond-to-self', `ring closure ${num} bonds an atom to itself`, at);
        for (let e = firstEv[prev]!; e >= 0; e = evNext[e]!)
          if (evAtom[e] === a)
            return err('smiles-duplicate-bond', `ring closure ${num} repeats an existing bond`, at);
        // combine the symbols written at the two ends
        if (pOrder !== 0) {
          if (oOrder !== 0) {
            if (oOrder !== pOrder || oArom !== pArom) {
              return err(
                'smiles-conflicting-ring-bond',
                `ring closure ${num} has different bond symbols at its two ends`,
                at,
              );
            }
            if (oDir !== 0 && pDir !== 0 && oDir !== -pDir) {
              return err(
                'smiles-conflicting-ring-bond',
                `ring closure ${num} has contradicting '/' '\\' marks`,
                at,
              );
            }
            if (oDir === 0 && pDir !== 0) oDir = -pDir;
          } else {
            // the mark written at the closing end reads closing -> opening
            oOrder = pOrder;
            oArom = pArom;
            oDir = -pDir;
          }
        }
        const bi = addBond(a, prev, oOrder, oArom, oDir, at);
        evAtom[slot] = prev;
        evBond[slot] = bi;
        entry(prev, a, bi);
      }
      pOrder = 0;
      continue;
    }
    if (c === 46) {
      // .
      if (pOrder !== 0) return err('smiles-dangling-bond', "bond symbol before '.'", pOff);
      if (prev < 0) return err('smiles-empty-component', "'.' with no atom before it", i);
      prev = -1;
      i++;
      continue;
    }
    if (c === 93) return err('smiles-bad-bracket-atom', "']' without a matching '['", i);
    return err('smiles-illegal-character', `character '${s[i]}' is not allowed in SMILES`, i);
  }
  const end = i;
  if (nAtoms === 0) return err('smiles-empty', 'no atoms in the SMILES', start);
  if (pOrder !== 0) return err('smiles-dangling-bond', 'bond symbol at the end of the SMILES', pOff);
  if (prev < 0) return err('smiles-empty-component', "'.' at the end of the SMILES", end - 1);
  if (branchDepth > 0)
    return err('smiles-unmatched-parenthesis', "'(' is never closed", brOff[branchDepth - 1]!);
  if (openRings > 0) {
    let first = -1;
    for (let k = 0; k < 100; k++)
      if (RING_OPEN[k] === 1 && (first < 0 || RING_OFF[k]! < first)) first = RING_OFF[k]!;
    if (big !== null) for (const r of big.values()) if (first < 0 || r[5]! < first) first = r[5]!;
    return err('smiles-unclosed-ring', 'ring-closure number is never closed', first);
  }

  // One buffer for the whole result; neighbour lists laid out atom by atom, each in written order.
  const buf = new ArrayBuffer(4 * (2 * nAtoms + 1 + 7 * m + 2 * ev));
  let off = 0;
  const view = (len: number): Int32Array => {
    const v = new Int32Array(buf, off, len);
    off += 4 * len;
    return v;
  };
  const nbrStart = view(nAtoms + 1);
  const preceded = view(nAtoms);
  const bondA = view(m);
  const bondB = view(m);
  const bondOrder = view(m);
  const bondAromatic = view(m);
  const bondExplicit = view(m);
  const bondDir = view(m);
  const bondOffset = view(m);
  const nbrAtom = view(ev);
  const nbrBond = view(ev);
  for (let k = 0; k < m; k++) {
    bondA[k] = bA[k]!;
    bondB[k] = bB[k]!;
    bondOrder[k] = bOrder[k]!;
    bondAromatic[k] = bArom[k]!;
    bondExplicit[k] = bExpl[k]!;
    bondDir[k] = bDir[k]!;
    bondOffset[k] = bOff[k]!;
  }
  let pos = 0;
  for (let a = 0; a < nAtoms; a++) {
    preceded[a] = pre[a]!;
    nbrStart[a] = pos;
    for (let e = firstEv[a]!; e >= 0; e = evNext[e]!) {
      nbrAtom[pos] = evAtom[e]!;
      nbrBond[pos] = evBond[e]!;
      pos++;
    }
  }
  nbrStart[nAtoms] = pos;
  return {
    atoms,
    bondCount: m,
    bondA,
    bondB,
    bondOrder,
    bondAromatic,
    bondExplicit,
    bondDir,
    bondOffset,
    nbrStart,
    nbrAtom,
    nbrBond,
    preceded,
    end,
    warnings,
  };
}

/** Bond order of a bond symbol character, 0 when `c` is not one ('/' and '\\' are single, ':' too). */
function bondSymbolOrder(c: number): number {
  switch (c) {
    case 45: // -
    case 58: // :
    case 47: // /
    case 92: // \
      return 1;
    case 61: // =
      return 2;
    case 35: // #
      return 3;
    case 36: // $
      return 4;
    default:
      return 0;
  }
}
