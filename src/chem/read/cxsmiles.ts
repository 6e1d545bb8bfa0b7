/**
 * The CXSMILES extension block `|...|` that may follow a SMILES. Enhanced stereo is read:
 * `a:0,2` (absolute), `&1:3,5` (AND group 1), `o1:7` (OR group 1); radicals: `^1:3` one unpaired electron
 * on atom 3, `^2:`…`^7:` two or more (held as 2, the most the structure records); and the drawing: coordinates
 * `(...)` and wedges `wU:`/`wD:`/`w:` (cxsmiles-drawing.ts). Atom indices there are 0-based in the order
 * atoms are written, explicit `[H]` atoms included, which is exactly our atom index; bond indices likewise
 * follow our bond order. Every other field (labels `$...$`, `r`, `c:`, `t:`, `Sg:`, ...) is skipped.
 * Field syntax as published with the format (ChemAxon's CXSMILES documentation); the skip rule is our own.
 */
import type { StereoGroup } from '../types.js';
import { newGroup, objectList } from './make.js';
import {
  fail,
  isDigit,
  readCoordinates,
  readIndex,
  readWedges,
  wedgeFieldAt,
  type CxWedge,
  type Failure,
} from './cxsmiles-drawing.js';

export type CxResult =
  | {
      ok: true;
      groups: StereoGroup[];
      radicals: Map<number, number>;
      /** The first coordinate block, one [x, y, z] per atom; null when there is none. */
      coords: [number, number, number][] | null;
      /** Offset of that block's '(' (-1 when there is none). */
      coordsAt: number;
      wedges: CxWedge[];
      end: number;
    }
  | Failure;

/**
 * Reads the block whose opening '|' is at `start`. `atomCount` and `bondCount` bound the indices.
 * Returns what it read and the offset just past the closing '|'.
 */
export function parseCxExtension(s: string, start: number, atomCount: number, bondCount: number): CxResult {
  const n = s.length;
  const groups = objectList<StereoGroup>();
  const radicals = new Map<number, number>();
  let coords: [number, number, number][] | null = null;
  let coordsAt = -1;
  const wedges = objectList<CxWedge>();
  let i = start + 1;
  for (;;) {
    if (i >= n) return fail('cxsmiles-unclosed', "CXSMILES block is not closed with '|'", start);
    const c = s.charCodeAt(i);
    if (c === 124) return { ok: true, groups, radicals, coords, coordsAt, wedges, end: i + 1 };
    if (c === 40) {
      const r = readCoordinates(s, i, atomCount);
      if (!r.ok) return r;
      if (coords === null) {
        coords = r.coords;
        coordsAt = i;
      }
      i = r.end;
      continue;
    }
    if (wedgeFieldAt(s, i) >= 0) {
      const r = readWedges(s, i, atomCount, bondCount, wedges);
      if (!r.ok) return r;
      i = r.end;
      continue;
    }
    if (c === 94 && s.charCodeAt(i + 1) >= 49 && s.charCodeAt(i + 1) <= 55 && s.charCodeAt(i + 2) === 58) {
      // ^n:i,j radicals (n = 1 monovalent, 2–7 divalent and more)
      const count = s.charCodeAt(i + 1) === 49 ? 1 : 2;
      let j = i + 3;
      while (isDigit(s.charCodeAt(j))) {
        const r = readIndex(s, j, atomCount, 'cxsmiles-bad-radical');
        if ('ok' in r) return r;
        j = r.end;
        radicals.set(r.v, count);
        if (s.charCodeAt(j) === 44 && isDigit(s.charCodeAt(j + 1))) j++;
        else break;
      }
      i = j;
      continue;
    }
    if (c === 44) {
      i++;
      continue;
    }
    let type: StereoGroup['type'] | null = null;
    let id = 0;
    let j = i;
    if (c === 97 && s.charCodeAt(i + 1) === 58) {
      type = 'abs';
      j = i + 2;
    } else if ((c === 111 || c === 38) && isDigit(s.charCodeAt(i + 1))) {
      j = i + 1;
      while (isDigit(s.charCodeAt(j))) id = id * 10 + s.charCodeAt(j++) - 48;
      if (s.charCodeAt(j) === 58) {
        type = c === 111 ? 'or' : 'and';
        j++;
      } else if (c === 38) {
        return fail('cxsmiles-bad-group', "stereo group '&n' must be followed by ':'", j);
      }
    } else if (c === 38) {
      return fail('cxsmiles-bad-group', "stereo group '&' must be followed by a group number", i);
    }
    if (type !== null) {
      const atoms: number[] = [];
      for (;;) {
        if (!isDigit(s.charCodeAt(j)))
          return fail('cxsmiles-bad-group', 'expected an atom index in the stereo group', j);
        const r = readIndex(s, j, atomCount, 'cxsmiles-bad-group');
        if ('ok' in r) return r;
        j = r.end;
        atoms.push(r.v);
        const d = s.charCodeAt(j);
        if (d === 44 && isDigit(s.charCodeAt(j + 1))) {
          j++;
          continue;
        }
        if (d === 44 || d === 124) break;
        if (j >= n) return fail('cxsmiles-unclosed', "CXSMILES block is not closed with '|'", start);
        return fail('cxsmiles-bad-group', `unexpected '${s[j] ?? 'end of text'}' in the stereo group`, j);
      }
      const same = groups.find((g) => g.type === type && g.id === id);
      if (same) {
        for (const a of atoms) if (!same.atoms.includes(a)) same.atoms.push(a);
      } else {
        groups.push(newGroup(type, id, atoms));
      }
      i = j;
      continue;
    }
    i = skipField(s, i);
  }
}

/** Skips one field we do not read; returns the offset of the ',' or '|' that ends it (or n). */
function skipField(s: string, start: number): number {
  const n = s.length;
  let i = start;
  while (i < n) {
    const c = s.charCodeAt(i);
    if (c === 40) {
      // ( ... ) inside a field we skip; may contain ',' and ';'
      const close = s.indexOf(')', i + 1);
      i = close < 0 ? n : close + 1;
      continue;
    }
    if (c === 36) {
      // $ ... $ atom labels / values
      const close = s.indexOf('$', i + 1);
      i = close < 0 ? n : close + 1;
      continue;
    }
    if (c === 124) return i;
    if (c === 44) {
      const d = s.charCodeAt(i + 1);
      if (isDigit(d) || d === 46 || d === 45) {
        i++;
        continue;
      }
      return i;
    }
    i++;
  }
  return n;
}
