/**
 * Stereo from a 2D drawing: wedges and hashes (tetrahedral centres, allenes, biaryl axes) and the drawn
 * geometry of double bonds.
 *
 * Tetrahedral centres. Every atom at the narrow end (bond.a) of a wedge or hash is read. Its neighbours become
 * points (unit 2D bond vector, z = +1 for a wedge starting at the centre, -1 for a hash, 0 otherwise: a wedge
 * seen from its wide end does not count). A three-neighbour centre gets its fourth ligand (implicit H, lone
 * pair) at minus the sum of the three bond vectors, where a real tetrahedron puts it. Each wedged bond is read
 * on its own: that bond lifted (z = +1 wedge, -1 hash), the other bonds in the plane; the sign of the signed
 * volume of the four points gives the winding. If that is flat (a T-shape with the wedge on its stem) the
 * plain bonds lean slightly away from the wedge (z = -0.3 z_wedge) and it is read again. All readings must
 * agree: two adjacent wedges of one kind, or a wedge and a hash in one straight line, contradict each other
 * (no projection of a tetrahedron looks like that) and give no configuration and a warning; so does a drawing
 * where no reading fixes anything (two neighbours drawn in one direction). A wavy bond ('either') at its narrow
 * end leaves the atom explicitly undefined.
 *
 * Double bonds. For each non-aromatic double bond (or odd cumulene) with a substituent on each end, the side of
 * the bond line each substituent lies on gives cis/trans, unless the bond is crossed (stereo 3), a wavy bond
 * touches an end, or a substituent lies on the bond line (warning). Double bonds in a ring of fewer than 8
 * atoms are skipped: their drawn geometry is forced by the ring (Kekulé benzene, cyclohexene), not a claim.
 *
 * Allenes (even cumulenes): the four terminal substituents become points with z from wedges starting at the
 * terminal atoms; an implicit H sits opposite the other two bonds of its end; the signed volume of
 * [near a, near b, far a, far b] gives the winding (the collapsed-tetrahedron convention of types.ts).
 *
 * Biaryl axes: stereo-2d-axes.ts (shared with the CXSMILES reader).
 */
import { objectList } from './make.js';
import type {
  AxialStereo,
  DoubleBondStereo,
  ReadError,
  StereoElement,
  Structure,
  TetrahedralStereo,
} from '../types.js';
import { IMPLICIT_H } from '../types.js';
import { ringInfo } from '../graph/index.js';
import { ringBonds, type Adjacency } from './molfile-graph.js';
import { biarylAxesFrom2d, wedgeZ } from './stereo-2d-axes.js';
import {
  cumulenes,
  fourthLigand,
  others,
  preferHeavy,
  signedVolume,
  unit,
  windingOf,
  type Vec,
} from './molfile-geometry.js';

/** Below this |signed volume| (unit vectors, x6) the drawing does not fix a configuration. */
const MIN_VOLUME = 0.01;
/**
 * Smallest ring in which a double bond can be stereogenic: trans-cyclooctene is the smallest isolable trans
 * cycloalkene (from memory), and RDKit likewise leaves double-bond stereo out for rings under 8 (from memory).
 * In smaller rings, Kekulé aromatic rings included, the drawing can only show cis: forced, not a claim.
 */
const MIN_STEREO_RING = 8;
/** How far plain bonds lean away from the wedge being read (z units, wedge = 1). */
const PLAIN_LEAN = 0.3;
/** Below this |sin| of the angle to the bond line a double-bond substituent counts as on the line. */
const MIN_SIDE = 0.1;

export function stereoFrom2d(
  s: Structure,
  adj: Adjacency,
  warnings: ReadError[],
  atomLines: number[],
): StereoElement[] {
  const out = objectList<StereoElement>();
  const wavyAt = new Uint8Array(s.atoms.length); // narrow end of a wavy single bond
  const wavyTouch = new Uint8Array(s.atoms.length); // any end of a wavy single bond
  const wedgedFrom = new Uint8Array(s.atoms.length);
  for (const b of s.bonds) {
    if (b.order !== 1) continue;
    if (b.wedge === 'either') {
      wavyAt[b.a] = 1;
      wavyTouch[b.a] = 1;
      wavyTouch[b.b] = 1;
    } else if (b.wedge !== null) wedgedFrom[b.a] = 1;
  }
  const warn = (code: string, message: string, atom: number): void => {
    warnings.push({ code, message, at: { line: atomLines[atom] } });
  };
  const xy = (i: number): Vec => {
    const c = s.atoms[i]!.coords!;
    return [c[0], c[1], 0];
  };

  // Tetrahedral centres
  for (let c = 0; c < s.atoms.length; c++) {
    if (!wedgedFrom[c] || wavyAt[c]) continue;
    const t = tetrahedral(c);
    if (t !== null) out.push(t);
  }

  function tetrahedral(c: number): TetrahedralStereo | null {
    const ns = adj.nbr[c]!;
    const deg = ns.length;
    const label = `atom ${c + 1} (${s.atoms[c]!.element})`;
    let fourth: number | null = null;
    if (deg === 3) {
      fourth = fourthLigand(s, c);
      if (fourth === null) {
        const sp2 = adj.bnd[c]!.some((k) => s.bonds[k]!.order > 1 || s.bonds[k]!.aromatic);
        if (!sp2)
          warn(
            'stereo-wedge-not-a-centre',
            `${label} has a wedge but three neighbours and no hydrogen or lone pair`,
            c,
          );
        return null;
      }
    } else if (deg !== 4) {
      warn(
        'stereo-wedge-not-a-centre',
        `${label} has a wedge but ${deg} neighbours; only 3 or 4 are read`,
        c,
      );
      return null;
    }
    const pc = xy(c);
    const flat: Vec[] = [];
    const zs: number[] = [];
    for (let j = 0; j < deg; j++) {
      const u = unit([...sub2(xy(ns[j]!), pc), 0] as Vec);
      if (u === null) {
        warn(
          'stereo-ambiguous-wedge',
          `${label}: a neighbour is drawn on top of it; configuration not read`,
          c,
        );
        return null;
      }
      flat.push(u);
      zs.push(wedgeZ(s, c, adj.bnd[c]![j]!));
    }
    const ligands = [...ns];
    if (fourth !== null) ligands.push(fourth);
    // One reading per wedged bond, the others taken as plain; they must agree.
    let sign = 0;
    for (let w = 0; w < deg; w++) {
      if (zs[w] === 0) continue;
      const v = reading(flat, w, zs[w]!, fourth !== null);
      if (v === 0) continue;
      if (sign !== 0 && v !== sign) {
        warn(
          'stereo-conflicting-wedges',
          `${label}: its wedges, read one at a time, imply opposite configurations; configuration not read`,
          c,
        );
        return null;
      }
      sign = v;
    }
    if (sign === 0) {
      warn(
        'stereo-ambiguous-wedge',
        `${label}: the wedges and bond directions do not fix a configuration`,
        c,
      );
      return null;
    }
    const vol = sign;
    return {
      kind: 'tetrahedral',
      centre: c,
      ligands: ligands as [number, number, number, number],
      winding: windingOf(vol),
    };
  }

  /**
   * Sign of the signed volume (-1, +1; 0 = flat) with only bond w lifted by z and the other bonds in the
   * plane. If that is flat (a T-shape with the wedge on its stem), the plain bonds lean slightly the other way
   * (z = -0.3 z_w, as the other three bonds of a tetrahedron do when one points at the viewer) and it is read
   * again. (Leaning always would misplace the implicit H of unevenly drawn three-neighbour centres.)
   */
  function reading(flat: Vec[], w: number, z: number, addFourth: boolean): number {
    for (const plainZ of [0, -PLAIN_LEAN * z]) {
      const pts: Vec[] = flat.map((u, j) => [u[0], u[1], j === w ? z : plainZ]);
      if (addFourth) {
        const sum: Vec = [0, 0, 0];
        for (const p of pts) for (let d = 0; d < 3; d++) sum[d] = sum[d]! - p[d]!;
        pts.push(unit(sum) ?? sum);
      }
      const vol = signedVolume(pts);
      if (Math.abs(vol) >= MIN_VOLUME) return Math.sign(vol);
    }
    return 0;
  }

  // Double bonds and cumulenes
  const ring = ringBonds(s.atoms.length, s.bonds, adj);
  let smallestRing: number[] | null = null;
  for (const cu of cumulenes(s, adj)) {
    const [e0, e1] = cu.ends;
    if (cu.bonds.some((k) => s.bonds[k]!.wedge === 'either')) continue;
    if (wavyTouch[e0] || wavyTouch[e1]) continue;
    const s0 = others(adj, e0, cu.toward[0]);
    const s1 = others(adj, e1, cu.toward[1]);
    if (s0.length === 0 || s1.length === 0 || s0.length > 2 || s1.length > 2) continue;
    if (
      adj.bnd[e0]!.some((k) => s.bonds[k]!.order === 3) ||
      adj.bnd[e1]!.some((k) => s.bonds[k]!.order === 3)
    )
      continue;
    if (cu.inner.length % 2 === 0) {
      // In a ring of fewer than 8 atoms the geometry is forced (trans cannot be closed), not a claim.
      if (cu.bonds.some((k) => ring[k])) {
        smallestRing ??= ringInfo(s).smallestRingOfBond;
        if (cu.bonds.some((k) => smallestRing![k]! > 0 && smallestRing![k]! < MIN_STEREO_RING)) continue;
      }
      const d = doubleBond(cu.ends, s0, s1);
      if (d !== null) out.push(d);
    } else {
      const a = allene(cu.ends, cu.toward, s0, s1);
      if (a !== null) out.push(a);
    }
  }

  function side(p0: Vec, dir: Vec, q: Vec): number {
    const v = sub2(q, p0);
    const l = Math.hypot(v[0], v[1]) * Math.hypot(dir[0], dir[1]);
    if (l < 1e-9) return 0;
    const sn = (dir[0] * v[1] - dir[1] * v[0]) / l;
    return Math.abs(sn) < MIN_SIDE ? 0 : Math.sign(sn);
  }

  /** Side (+1/-1) of the preferred substituent of one end; 0 when it cannot be told. */
  function endSide(subs: number[], p0: Vec, dir: Vec): [number, number] | null {
    const ordered = preferHeavy(s, subs);
    const sides = ordered.map((x) => side(p0, dir, xy(x)));
    if (ordered.length === 2 && sides[0] !== 0 && sides[0] === sides[1]) return null; // both on one side
    if (sides[0] !== 0) return [ordered[0]!, sides[0]!];
    if (ordered.length === 2 && sides[1] !== 0) return [ordered[0]!, -sides[1]!];
    return null;
  }

  function doubleBond(ends: [number, number], s0: number[], s1: number[]): DoubleBondStereo | null {
    const p0 = xy(ends[0]);
    const dir = sub2(xy(ends[1]), p0);
    const a = endSide(s0, p0, [...dir, 0] as Vec);
    const b = endSide(s1, p0, [...dir, 0] as Vec);
    if (a === null || b === null) {
      warn(
        'stereo-double-bond-geometry',
        `double bond at atoms ${ends[0] + 1}-${ends[1] + 1}: a substituent is drawn on the bond line or both on one side; geometry not read`,
        ends[0],
      );
      return null;
    }
    return { kind: 'double-bond', ends, refs: [a[0], b[0]], relation: a[1] === b[1] ? 'cis' : 'trans' };
  }

  /** Pseudo-3D points of an allene end's two ligands (second may be IMPLICIT_H). */
  function allenePoints(
    end: number,
    toward: number,
    subs: number[],
  ): { ligands: number[]; pts: Vec[]; lifted: boolean } {
    const pe = xy(end);
    const ligands: number[] = [];
    const pts: Vec[] = [];
    let lifted = false;
    for (const x of subs) {
      const k = adj.bnd[end]![adj.nbr[end]!.indexOf(x)]!;
      const z = wedgeZ(s, end, k);
      if (z !== 0) lifted = true;
      const v = sub2(xy(x), pe);
      pts.push([pe[0] + v[0], pe[1] + v[1], z * Math.hypot(v[0], v[1])]);
      ligands.push(x);
    }
    if (subs.length === 1) {
      const toAxis = unit([...sub2(xy(toward), pe), 0] as Vec) ?? ([0, 0, 0] as Vec);
      const p = pts[0]!;
      const toSub = unit([p[0] - pe[0], p[1] - pe[1], p[2]]) ?? ([0, 0, 0] as Vec);
      pts.push([pe[0] - toAxis[0] - toSub[0], pe[1] - toAxis[1] - toSub[1], -toAxis[2] - toSub[2]]);
      ligands.push(IMPLICIT_H);
    }
    return { ligands, pts, lifted };
  }

  function allene(
    ends: [number, number],
    toward: [number, number],
    s0: number[],
    s1: number[],
  ): AxialStereo | null {
    const a = allenePoints(ends[0], toward[0], s0);
    const b = allenePoints(ends[1], toward[1], s1);
    if (!a.lifted && !b.lifted) return null; // drawn without wedges: undefined
    const vol = signedVolume([a.pts[0]!, a.pts[1]!, b.pts[0]!, b.pts[1]!]);
    const scale = Math.pow(Math.hypot(...sub2(xy(ends[1]), xy(ends[0]))), 3) || 1;
    if (Math.abs(vol) / scale < 0.01) {
      warn(
        'stereo-ambiguous-wedge',
        `allene ${ends[0] + 1}=…=${ends[1] + 1}: the wedges do not fix a configuration`,
        ends[0],
      );
      return null;
    }
    const ligands = [a.ligands[0]!, a.ligands[1]!, b.ligands[0]!, b.ligands[1]!] as [
      number,
      number,
      number,
      number,
    ];
    return { kind: 'axial', subtype: 'allene', ends, ligands, winding: windingOf(vol) };
  }

  for (const axis of biarylAxesFrom2d(s, adj, ring, warn)) out.push(axis);

  return out;
}

function sub2(a: Vec, b: Vec): [number, number] {
  return [a[0] - b[0], a[1] - b[1]];
}
