/**
 * Read the input's stereo elements onto the perceived units: which units are defined and their configuration
 * bit. Stereo drawn where there is no unit becomes a remark (or an invertible-nitrogen entry).
 */
import { IMPLICIT_H, LONE_PAIR, type StereoElement, type Structure } from '../types.js';
import { hToken, lpToken, rebase, type PerceivedUnit } from './units.js';

export function atomName(s: Structure, i: number): string {
  return `${s.atoms[i].element}${s.atoms[i].inputNumber}`;
}

/** Marks units defined; returns the invertible nitrogens that carry drawn stereo. */
export function applyInputStereo(
  s: Structure,
  units: PerceivedUnit[],
  unitOfAtom: Int32Array,
  invertible: Set<number>,
  remarks: string[],
): number[] {
  const n = s.atoms.length;
  const drawnN: number[] = [];
  // A token for an input ligand: the unit decides whether a pseudo-ligand is an H or a lone pair.
  const pseudo = (u: PerceivedUnit, atom: number, x: number): number => {
    if (x >= 0) return x;
    const h = hToken(n, atom);
    const lp = lpToken(n, atom);
    if (x === IMPLICIT_H) return u.tokens.includes(h) ? h : lp;
    if (x === LONE_PAIR) return u.tokens.includes(lp) ? lp : h;
    return x;
  };
  for (const e of s.stereo) {
    const anchor = e.kind === 'tetrahedral' ? e.centre : e.ends[0];
    const k = unitOfAtom[anchor];
    const u = k >= 0 ? units[k] : undefined;
    const bit = u ? bitFor(u, e, pseudo) : -1;
    if (u && bit >= 0) {
      u.defined = true;
      u.bit = bit as 0 | 1;
      continue;
    }
    if (e.kind === 'tetrahedral' && invertible.has(e.centre)) {
      drawnN.push(e.centre);
      remarks.push(
        `configuration drawn on ${atomName(s, e.centre)}, an ordinary amine nitrogen: it inverts rapidly, so it is not a stereocentre`,
      );
      continue;
    }
    const where =
      e.kind === 'tetrahedral'
        ? atomName(s, e.centre)
        : `the ${atomName(s, e.ends[0])}–${atomName(s, e.ends[1])} unit`;
    // 3D input records a configuration for every atom from its coordinates: silence, not a drawing error.
    if (s.dimension !== 3)
      remarks.push(`configuration drawn on ${where}, which is not a stereogenic unit; ignored`);
  }
  return drawnN;
}

function bitFor(
  u: PerceivedUnit,
  e: StereoElement,
  pseudo: (u: PerceivedUnit, atom: number, x: number) => number,
): number {
  if (e.kind === 'tetrahedral') {
    if (u.kind !== 'tetrahedral') return -1;
    const l = e.ligands;
    const c = e.centre;
    const list = [pseudo(u, c, l[0]), pseudo(u, c, l[1]), pseudo(u, c, l[2]), pseudo(u, c, l[3])];
    return rebase(u, list, e.winding === '@@' ? 1 : 0);
  }
  const [a, b] = e.ends;
  const sameOrder = u.atoms[0] === a && u.atoms[1] === b;
  const reversed = u.atoms[0] === b && u.atoms[1] === a;
  if (!sameOrder && !reversed) return -1;
  if (e.kind === 'double-bond') {
    if (u.mode !== 'cistrans') return -1;
    const ra = pseudo(u, a, e.refs[0]);
    const rb = pseudo(u, b, e.refs[1]);
    const other = (t: number, side: number): number =>
      u.tokens[side] === t ? u.tokens[side + 1] : u.tokens[side];
    const sideA = sameOrder ? 0 : 2;
    const sideB = sameOrder ? 2 : 0;
    if (!u.tokens.includes(ra) || !u.tokens.includes(rb)) return -1;
    const list = [ra, other(ra, sideA), rb, other(rb, sideB)];
    return rebase(u, list, e.relation === 'trans' ? 1 : 0);
  }
  if (u.mode !== 'parity') return -1;
  const l = e.ligands;
  const list = [pseudo(u, a, l[0]), pseudo(u, a, l[1]), pseudo(u, b, l[2]), pseudo(u, b, l[3])];
  return rebase(u, list, e.winding === '@@' ? 1 : 0);
}
