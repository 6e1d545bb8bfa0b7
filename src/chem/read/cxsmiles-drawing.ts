/**
 * The drawing fields of a CXSMILES block: atom coordinates `(x,y,z;x,y,z;...)` (one triple per atom in written
 * order, an empty number meaning 0; only the first block is kept when several conformers follow) and bond wedges
 * `wU:a.b,...` (wedge), `wD:a.b,...` (hash), `w:a.b,...` (wavy): atom index `a` at the narrow end of bond `b`,
 * both 0-based in written order, a ring-closure bond counted where its ring is closed (as RDKit counts them).
 * Field syntax as published with the format (ChemAxon's CXSMILES documentation).
 */
import type { ReadError, Structure } from '../types.js';
import { atomWith, newBond, newStructure } from './make.js';
import { adjacency, ringBonds } from './molfile-graph.js';
import { biarylAxesFrom2d } from './stereo-2d-axes.js';

export interface CxWedge {
  atom: number;
  bond: number;
  wedge: 'up' | 'down' | 'either';
  /** Offset of the pair in the text (for an error about it). */
  offset: number;
}

/** What applyDrawing needs of a CXSMILES block: its first coordinate block (and where it is) and its wedges. */
export interface CxDrawing {
  coords: [number, number, number][] | null;
  coordsAt: number;
  wedges: CxWedge[];
}

export type Failure = { ok: false; error: ReadError };

export function fail(code: string, message: string, offset: number): Failure {
  return { ok: false, error: { code, message, at: { offset } } };
}

export function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

/** The coordinate block whose '(' is at `start`: one [x, y, z] per atom, and the offset after ')'. */
export function readCoordinates(
  s: string,
  start: number,
  atomCount: number,
): { ok: true; coords: [number, number, number][]; end: number } | Failure {
  const close = s.indexOf(')', start + 1);
  if (close < 0) return fail('cxsmiles-bad-coordinates', "coordinate block is not closed with ')'", start);
  const body = s.slice(start + 1, close);
  const entries = body.split(';');
  // a trailing ';' after the last atom is tolerated
  if (entries.length === atomCount + 1 && entries[atomCount] === '') entries.pop();
  if (entries.length !== atomCount)
    return fail(
      'cxsmiles-bad-coordinates',
      `coordinate block lists ${entries.length} atoms; the SMILES has ${atomCount}`,
      start,
    );
  const coords: [number, number, number][] = [];
  let at = start + 1;
  for (const entry of entries) {
    const parts = entry.split(',');
    if (parts.length > 3)
      return fail('cxsmiles-bad-coordinates', `coordinate '${entry}' has more than three numbers`, at);
    const xyz: [number, number, number] = [0, 0, 0];
    for (let d = 0; d < parts.length; d++) {
      const t = parts[d]!.trim();
      const v = t === '' ? 0 : Number(t);
      if (!Number.isFinite(v)) return fail('cxsmiles-bad-coordinates', `'${t}' is not a number`, at);
      xyz[d] = v;
    }
    coords.push(xyz);
    at += entry.length + 1;
  }
  return { ok: true, coords, end: close + 1 };
}

/** Is a wedge field (`wU:`, `wD:`, `w:`) at `i`? Returns the offset of its first pair, or -1. */
export function wedgeFieldAt(s: string, i: number): number {
  if (s.charCodeAt(i) !== 119) return -1;
  const c = s.charCodeAt(i + 1);
  if (c === 58) return i + 2;
  if ((c === 85 || c === 68) && s.charCodeAt(i + 2) === 58) return i + 3;
  return -1;
}

/** Reads the `atom.bond` pairs of the wedge field at `i` into `out`; returns the offset of the ',' or '|' after it. */
export function readWedges(
  s: string,
  i: number,
  atomCount: number,
  bondCount: number,
  out: CxWedge[],
): { ok: true; end: number } | Failure {
  const c = s.charCodeAt(i + 1);
  const wedge = c === 85 ? 'up' : c === 68 ? 'down' : 'either';
  let j = wedgeFieldAt(s, i);
  for (;;) {
    const atom = readIndex(s, j, atomCount, 'cxsmiles-bad-wedge');
    if ('ok' in atom) return atom;
    if (s.charCodeAt(atom.end) !== 46)
      return fail('cxsmiles-bad-wedge', "expected '.' and a bond index after the atom index", atom.end);
    const bond = readIndex(s, atom.end + 1, bondCount, 'cxsmiles-bad-wedge', 'bond');
    if ('ok' in bond) return bond;
    out.push({ atom: atom.v, bond: bond.v, wedge, offset: j });
    j = bond.end;
    if (s.charCodeAt(j) === 44 && isDigit(s.charCodeAt(j + 1))) {
      j++;
      continue;
    }
    return { ok: true, end: j };
  }
}

/**
 * One atom (or bond) index of at most 9 digits at `at`, and the offset after it; a failure with `code` when
 * there is none or it is out of range.
 */
export function readIndex(
  s: string,
  at: number,
  count: number,
  code: string,
  what: 'atom' | 'bond' = 'atom',
): { v: number; end: number } | Failure {
  let v = 0;
  let j = at;
  while (isDigit(s.charCodeAt(j)) && j - at < 9) v = v * 10 + s.charCodeAt(j++) - 48;
  if (j === at) return fail(code, `expected ${what === 'atom' ? 'an atom' : 'a bond'} index`, at);
  if (v >= count)
    return fail(code, `${what} index ${v} is out of range (the SMILES has ${count} ${what}s)`, at);
  return { v, end: j };
}

/**
 * The structure read from the SMILES with the drawing of its CXSMILES block applied. Wedges are put on their
 * bonds, narrow end first (a wedge on a bond its atom is not an end of is an error, as is a second wedge on one
 * bond). 2D coordinates make the structure a 2D drawing, and the wedges next to a biaryl axis then fix its
 * configuration exactly as in a molfile (stereo-2d-axes.ts); the SMILES's own `@`/`@@` and `/`/`\` stay what
 * states centres and double bonds, so a wedge on a stereocentre's bond changes nothing. Without coordinates the
 * wedges are kept on the bonds but fix nothing: the same SMILES and wedges drawn reflected in a line are the
 * mirror image, so a wedge means something only together with where the atoms are drawn (describe says so for
 * an axis). 3D coordinates are not read (a warning says so).
 */
export function applyDrawing(
  st: Structure,
  { coords, coordsAt, wedges }: CxDrawing,
  atomOffset: (atom: number) => number,
  warnings: ReadError[],
): Structure | Failure {
  const bonds = st.bonds.slice();
  const wedged = new Uint8Array(bonds.length);
  for (const w of wedges) {
    const b = bonds[w.bond]!;
    if (b.a !== w.atom && b.b !== w.atom)
      return fail('cxsmiles-bad-wedge', `atom ${w.atom} is not an end of bond ${w.bond}`, w.offset);
    if (wedged[w.bond]) return fail('cxsmiles-bad-wedge', `bond ${w.bond} is given two wedges`, w.offset);
    wedged[w.bond] = 1;
    bonds[w.bond] = newBond(w.atom, b.a === w.atom ? b.b : b.a, b.order, b.aromatic, w.wedge);
  }
  let dimension: 0 | 2 = 0;
  let atoms = st.atoms;
  if (coords !== null) {
    if (coords.some((c) => c[2] !== 0)) {
      warnings.push({
        code: 'cxsmiles-3d-coordinates',
        message:
          'the CXSMILES gives 3D coordinates, which are not read; configurations come from the SMILES alone',
        at: { offset: coordsAt },
      });
    } else if (coords.some((c) => c[0] !== coords[0]![0] || c[1] !== coords[0]![1])) {
      dimension = 2;
      atoms = st.atoms.map((a, i) => atomWith(a, { coords: coords[i]! }));
    }
  }
  const drawn = newStructure(
    atoms,
    bonds,
    st.stereo,
    st.groups,
    st.chiralFlag,
    st.title,
    st.properties,
    dimension,
  );
  if (dimension === 2 && wedges.length > 0) {
    const adj = adjacency(atoms.length, bonds);
    const warn = (code: string, message: string, atom: number): void => {
      warnings.push({ code, message, at: { offset: atomOffset(atom) } });
    };
    const axes = biarylAxesFrom2d(drawn, adj, ringBonds(atoms.length, bonds, adj), warn);
    if (axes.length > 0) drawn.stereo = [...st.stereo, ...axes];
  }
  return drawn;
}
