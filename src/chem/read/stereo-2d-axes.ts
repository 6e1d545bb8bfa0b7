/**
 * Biaryl axes from a 2D drawing with wedges (our rule, common practice, no source), shared by the molfile reader
 * and the CXSMILES reader (2D coordinates plus `wU:`/`wD:` wedges): a single bond between two sp2 ring atoms that
 * each have two ring neighbours (ortho atoms). An ortho atom is lifted towards the viewer (z = +1) by a wedge, or
 * away (z = -1) by a hash, drawn either from the axis atom to that ortho atom or from the ortho atom to a
 * substituent outside the ring; the other ortho atom of the same ring gets the opposite z; the other ring stays
 * flat unless it is marked too. The signed volume of [ortho a1, ortho a2, ortho b1, ortho b2] gives the winding.
 */
import type { AxialStereo, Structure } from '../types.js';
import type { Adjacency } from './molfile-graph.js';
import { biarylCandidates, signedVolume, windingOf, type Vec } from './molfile-geometry.js';

/** A reader's warning about one atom (the reader knows where the atom is in its input). */
export type AtomWarning = (code: string, message: string, atom: number) => void;

/**
 * z of bond k as seen from `centre`: +1 for a wedge starting there, -1 for a hash, 0 otherwise. Only single bonds
 * count, and aromatic ones when `aromatic` is set (the ring bond from an axis atom to its ortho atom: a reader's
 * Kekulé form may have made it double where the writer's had it single).
 */
export function wedgeZ(s: Structure, centre: number, k: number, aromatic = false): number {
  const b = s.bonds[k]!;
  if (b.a !== centre || (b.order !== 1 && !(aromatic && b.aromatic))) return 0;
  return b.wedge === 'up' ? 1 : b.wedge === 'down' ? -1 : 0;
}

/** The axes the wedges of a 2D drawing fix (every atom has coordinates); `ring[k]`: bond k lies on a cycle. */
export function biarylAxesFrom2d(
  s: Structure,
  adj: Adjacency,
  ring: readonly boolean[],
  warn: AtomWarning,
): AxialStereo[] {
  const out: AxialStereo[] = [];
  const xy = (i: number): [number, number] => {
    const c = s.atoms[i]!.coords!;
    return [c[0], c[1]];
  };
  for (const [k, oa, ob] of biarylCandidates(s, adj, ring)) {
    const bond = s.bonds[k]!;
    const za = orthoLift(bond.a, oa);
    const zb = orthoLift(bond.b, ob);
    if (za === null || zb === null) {
      warn(
        'stereo-ambiguous-wedge',
        `axis ${bond.a + 1}-${bond.b + 1}: both ortho atoms of one ring are marked the same way`,
        bond.a,
      );
      continue;
    }
    if (za[0] === 0 && zb[0] === 0) continue;
    const [ax, ay] = xy(bond.a);
    const [bx, by] = xy(bond.b);
    const len = Math.hypot(bx - ax, by - ay) || 1;
    const pts: Vec[] = [];
    [...oa.map((o, i) => [o, za[i]!] as const), ...ob.map((o, i) => [o, zb[i]!] as const)].forEach(
      ([o, z]) => {
        const p = xy(o);
        pts.push([p[0], p[1], z * len]);
      },
    );
    const vol = signedVolume(pts);
    if (Math.abs(vol) / (len * len * len) < 0.01) {
      warn(
        'stereo-ambiguous-wedge',
        `axis ${bond.a + 1}-${bond.b + 1}: the wedges do not fix a configuration`,
        bond.a,
      );
      continue;
    }
    out.push({
      kind: 'axial',
      subtype: 'biaryl',
      ends: [bond.a, bond.b],
      ligands: [oa[0]!, oa[1]!, ob[0]!, ob[1]!],
      winding: windingOf(vol),
    });
  }
  return out;

  /** z lift of the two ortho atoms of an axis end from wedges; [0,0] when unmarked, null when contradictory. */
  function orthoLift(end: number, orth: number[]): [number, number] | null {
    const z: number[] = orth.map((o) => {
      let v = wedgeZ(s, end, adj.bnd[end]![adj.nbr[end]!.indexOf(o)]!, true);
      if (v === 0) {
        for (let j = 0; j < adj.nbr[o]!.length; j++) {
          const x = adj.nbr[o]![j]!;
          const bk = adj.bnd[o]![j]!;
          if (x === end || ring[bk]) continue;
          const w = wedgeZ(s, o, bk);
          if (w !== 0) v = w;
        }
      }
      return v;
    });
    if (z[0] !== 0 && z[0] === z[1]) return null;
    if (z[0] === 0 && z[1] !== 0) z[0] = -z[1]!;
    else if (z[1] === 0 && z[0] !== 0) z[1] = -z[0]!;
    return [z[0]!, z[1]!];
  }
}
