/**
 * A record's depiction as the report page carries it: a compact form of the 2D layout (chem/depict.ts) plus its
 * stereo units, which the page script draws as SVG only when the card comes into view. Coordinates are whole
 * hundredths so the page stays small (about 0.5-1 KB for a drug-sized molecule).
 */
import type { BondStyle, Layout } from '../../chem/depict.js';

/** Atom text: 0 for a plain carbon (drawn as a vertex), else [element, hydrogens, charge, isotope]. */
export type PicAtom = 0 | [string, number, number, number];

/** A stereo unit on the drawing: layout atom indexes, CIP label (null when none), defined 1 / undefined 0. */
export type PicUnit = [number[], string | null, 0 | 1];

export interface PicData {
  /** 'd' drawn (the record's own coordinates and wedges), 'c' computed layout. */
  o: 'd' | 'c';
  x: number[];
  y: number[];
  t: PicAtom[];
  /** Input atom numbers, per layout atom. */
  n: number[];
  /** Bonds, flat: a, b, order, style (0 plain, 1 wedge, 2 hash, 3 wavy, 4 crossed). */
  b: number[];
  u: PicUnit[];
}

const STYLE: Record<BondStyle, number> = { plain: 0, wedge: 1, hash: 2, wavy: 3, crossed: 4 };

/** A stereo unit of the computed facts, atoms as 1-based input numbers. */
export interface UnitMark {
  atoms: number[];
  label: string | null;
  defined: boolean;
}

export function pictureData(layout: Layout, units: readonly UnitMark[]): PicData {
  const byNumber = new Map<number, number>();
  layout.atoms.forEach((a, i) => {
    if (a.n > 0) byNumber.set(a.n, i);
  });
  const degree = new Array<number>(layout.atoms.length).fill(0);
  for (const b of layout.bonds) {
    degree[b.a]++;
    degree[b.b]++;
  }
  const t: PicAtom[] = layout.atoms.map((a, i) =>
    a.element === 'C' && a.charge === 0 && a.isotope === null && degree[i]! > 0
      ? 0
      : [a.element, a.hCount, a.charge, a.isotope ?? 0],
  );
  const u: PicUnit[] = [];
  for (const unit of units) {
    const at = unit.atoms.map((n) => byNumber.get(n)).filter((i): i is number => i !== undefined);
    if (at.length > 0) u.push([at, unit.label, unit.defined ? 1 : 0]);
  }
  return {
    o: layout.origin === 'drawn' ? 'd' : 'c',
    x: layout.atoms.map((a) => Math.round(a.x * 100)),
    y: layout.atoms.map((a) => Math.round(a.y * 100)),
    t,
    n: layout.atoms.map((a) => a.n),
    b: layout.bonds.flatMap((b) => [b.a, b.b, b.order, STYLE[b.style]]),
    u,
  };
}
