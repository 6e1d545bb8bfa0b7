/**
 * Stereo from 3D coordinates. Every configuration the geometry fixes is recorded; perception and the CIP
 * labeler decide later which units are stereogenic.
 *  - Tetrahedral: every atom with four neighbours, or three plus an implicit H / lone pair (placed at minus the
 *    sum of the three unit bond vectors), from the sign of the signed volume; flat centres (|volume| small, e.g.
 *    an amide N) get none.
 *  - Double bonds and odd cumulenes: cis/trans from the dihedral angle of the reference substituents; a dihedral
 *    within ~6 degrees of 90 gets none.
 *  - Allenes (even cumulenes) and biaryl axes: winding from the signed volume of [near a, near b, far a, far b]
 *    (terminal substituents / ortho atoms), i.e. from the sign of their dihedral. Biaryl axes need a substituted
 *    ortho atom (three non-hydrogen neighbours) on each ring and a dihedral at least ~6 degrees from planar.
 * A wavy bond drawn in a 3D file still leaves its narrow-end atom undefined.
 */
import { objectList } from './make.js';
import type { ReadError, StereoElement, Structure } from '../types.js';
import { IMPLICIT_H } from '../types.js';
import { ringBonds, type Adjacency } from './molfile-graph.js';
import {
  biarylCandidates,
  cumulenes,
  fourthLigand,
  others,
  preferHeavy,
  signedVolume,
  sub,
  unit,
  windingOf,
  type Vec,
} from './molfile-geometry.js';

const MIN_VOLUME = 0.1;
const MIN_SIN = 0.1;

export function stereoFrom3d(
  s: Structure,
  adj: Adjacency,
  _warnings: ReadError[],
  _atomLines: number[],
): StereoElement[] {
  const out = objectList<StereoElement>();
  const pos = (i: number): Vec => s.atoms[i]!.coords!;
  const wavyAt = new Uint8Array(s.atoms.length);
  const wavyTouch = new Uint8Array(s.atoms.length);
  for (const b of s.bonds) {
    if (b.wedge === 'either' && b.order === 1) {
      wavyAt[b.a] = 1;
      wavyTouch[b.a] = 1;
      wavyTouch[b.b] = 1;
    }
  }

  for (let c = 0; c < s.atoms.length; c++) {
    if (wavyAt[c]) continue;
    const ns = adj.nbr[c]!;
    let fourth: number | null = null;
    if (ns.length === 3) {
      fourth = fourthLigand(s, c);
      if (fourth === null) continue;
    } else if (ns.length !== 4) continue;
    const pc = pos(c);
    const pts: Vec[] = [];
    let bad = false;
    for (const n of ns) {
      const u = unit(sub(pos(n), pc));
      if (u === null) bad = true;
      else pts.push(u);
    }
    if (bad) continue;
    const ligands = [...ns];
    if (fourth !== null) {
      const sum: Vec = [0, 0, 0];
      for (const p of pts) for (let d = 0; d < 3; d++) sum[d] = sum[d]! - p[d]!;
      const u = unit(sum);
      if (u === null || Math.hypot(...sum) < 0.15) continue; // planar three-coordinate atom
      pts.push(u);
      ligands.push(fourth);
    }
    const vol = signedVolume(pts);
    if (Math.abs(vol) < MIN_VOLUME) continue;
    out.push({
      kind: 'tetrahedral',
      centre: c,
      ligands: ligands as [number, number, number, number],
      winding: windingOf(vol),
    });
  }

  for (const cu of cumulenes(s, adj)) {
    const [e0, e1] = cu.ends;
    if (cu.bonds.some((k) => s.bonds[k]!.wedge === 'either') || wavyTouch[e0] || wavyTouch[e1]) continue;
    const s0 = others(adj, e0, cu.toward[0]);
    const s1 = others(adj, e1, cu.toward[1]);
    if (s0.length === 0 || s1.length === 0 || s0.length > 2 || s1.length > 2) continue;
    if (cu.inner.length % 2 === 0) {
      const r0 = preferHeavy(s, s0)[0]!;
      const r1 = preferHeavy(s, s1)[0]!;
      const d = dihedralSin(pos(r0), pos(e0), pos(e1), pos(r1));
      if (d === null || Math.abs(d.cos) < MIN_SIN) continue;
      out.push({
        kind: 'double-bond',
        ends: [e0, e1],
        refs: [r0, r1],
        relation: d.cos > 0 ? 'cis' : 'trans',
      });
    } else {
      const a = endPoints(e0, cu.toward[0], s0);
      const b = endPoints(e1, cu.toward[1], s1);
      const d = dihedralSin(a.pts[0]!, pos(e0), pos(e1), b.pts[0]!);
      if (d === null || Math.abs(d.sin) < MIN_SIN) continue;
      const vol = signedVolume([a.pts[0]!, a.pts[1]!, b.pts[0]!, b.pts[1]!]);
      out.push({
        kind: 'axial',
        subtype: 'allene',
        ends: [e0, e1],
        ligands: [a.ligands[0]!, a.ligands[1]!, b.ligands[0]!, b.ligands[1]!],
        winding: windingOf(vol),
      });
    }
  }

  const heavyDegree = (i: number): number => adj.nbr[i]!.filter((n) => s.atoms[n]!.atomicNumber !== 1).length;
  for (const [k, oa, ob] of biarylCandidates(s, adj, ringBonds(s.atoms.length, s.bonds, adj))) {
    const { a, b } = s.bonds[k]!;
    if (!oa.some((o) => heavyDegree(o) >= 3) || !ob.some((o) => heavyDegree(o) >= 3)) continue;
    const d = dihedralSin(pos(oa[0]!), pos(a), pos(b), pos(ob[0]!));
    if (d === null || Math.abs(d.sin) < MIN_SIN) continue;
    const vol = signedVolume([pos(oa[0]!), pos(oa[1]!), pos(ob[0]!), pos(ob[1]!)]);
    out.push({
      kind: 'axial',
      subtype: 'biaryl',
      ends: [a, b],
      ligands: [oa[0]!, oa[1]!, ob[0]!, ob[1]!],
      winding: windingOf(vol),
    });
  }
  return out;

  function endPoints(end: number, toward: number, subs: number[]): { ligands: number[]; pts: Vec[] } {
    const pts = subs.map(pos);
    const ligands = [...subs];
    if (subs.length === 1) {
      const pe = pos(end);
      const u1 = unit(sub(pos(toward), pe)) ?? ([0, 0, 0] as Vec);
      const u2 = unit(sub(pts[0]!, pe)) ?? ([0, 0, 0] as Vec);
      pts.push([pe[0] - u1[0] - u2[0], pe[1] - u1[1] - u2[1], pe[2] - u1[2] - u2[2]]);
      ligands.push(IMPLICIT_H);
    }
    return { ligands, pts };
  }
}

/** cos and sin of the dihedral a-b-c-d; null when degenerate (collinear atoms). */
function dihedralSin(a: Vec, b: Vec, c: Vec, d: Vec): { cos: number; sin: number } | null {
  const b1 = sub(b, a);
  const b2 = sub(c, b);
  const b3 = sub(d, c);
  const n1 = cross(b1, b2);
  const n2 = cross(b2, b3);
  const l = Math.hypot(...n1) * Math.hypot(...n2);
  if (l < 1e-9) return null;
  const cos = (n1[0] * n2[0] + n1[1] * n2[1] + n1[2] * n2[2]) / l;
  const m = cross(n1, n2);
  const lb = Math.hypot(...b2) || 1;
  const sin = (m[0] * b2[0] + m[1] * b2[1] + m[2] * b2[2]) / (l * lb);
  return { cos, sin };
}

function cross(a: Vec, b: Vec): Vec {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}
