/**
 * The charge-neutral parent of a drawing, as registries compare salts (common practice, no source): a protonated
 * heteroatom ([NH3+], pyridinium [nH+], oxonium, sulfonium with H) gives up one proton; an anionic O, S, N or Se
 * (carboxylate, phenolate, thiolate, sulfonate, tetrazolide) and a halide ion take one. Charges that are part of
 * a neutral group's drawing stay (nitro N+(=O)[O-], N-oxides, azides, ylides: a negative atom beside a positive
 * one), and so do quaternary ions without H (tetrabutylammonium) and metal ions ([Na+]). So the hydrochloride
 * drawn as [NH3+] with [Cl-], or as the amine with HCl, has the parent amine and HCl; a zwitterionic amino acid
 * has its neutral form.
 *
 * Atoms keep their indices and input numbers; only charges and hydrogen counts change. A stereocentre that gives
 * up its last H keeps its configuration with the lone pair in the H's place (a protonated bridgehead amine), and
 * one that takes an H in the lone pair's place the same way.
 */
import { atomWith, objectList, restructure } from '../read/make.js';
import { IMPLICIT_H, LONE_PAIR, type Atom, type StereoElement, type Structure } from '../types.js';

export interface Neutralised {
  structure: Structure;
  /** Atoms that gave up a proton, and atoms that took one (indices in the structure). */
  deprotonated: number[];
  protonated: number[];
}

const TAKES_PROTON = new Set([7, 8, 16, 34]); // N, O, S, Se
const GIVES_PROTON = new Set([7, 8, 15, 16]); // N, O, P, S
const HALIDE = new Set([9, 17, 35, 53]);

export function neutralise(s: Structure): Neutralised {
  const n = s.atoms.length;
  const nbrs: number[][] = Array.from({ length: n }, () => []);
  for (const b of s.bonds) {
    if (b.a < 0 || b.b < 0 || b.a >= n || b.b >= n || b.a === b.b) continue;
    nbrs[b.a].push(b.b);
    nbrs[b.b].push(b.a);
  }
  const deprotonated: number[] = [];
  const protonated: number[] = [];
  for (let i = 0; i < n; i++) {
    const a = s.atoms[i];
    if (a.radical !== 0 || a.isotope !== null) continue;
    const besidePositive = nbrs[i].some((j) => s.atoms[j].charge > 0);
    const besideNegative = nbrs[i].some((j) => s.atoms[j].charge < 0);
    if (a.charge === 1 && a.hCount > 0 && GIVES_PROTON.has(a.atomicNumber) && !besideNegative)
      deprotonated.push(i);
    else if (a.charge === -1 && nbrs[i].length === 0 && HALIDE.has(a.atomicNumber)) protonated.push(i);
    else if (a.charge === -1 && nbrs[i].length > 0 && TAKES_PROTON.has(a.atomicNumber) && !besidePositive)
      protonated.push(i);
  }
  if (deprotonated.length + protonated.length === 0) return { structure: s, deprotonated, protonated };
  const delta = new Int32Array(n);
  for (const i of deprotonated) delta[i] = -1;
  for (const i of protonated) delta[i] = 1;
  const atoms = objectList<Atom>();
  s.atoms.forEach((a, i) => {
    if (delta[i] === 0) atoms.push(a);
    else atoms.push(atomWith(a, { hCount: a.hCount + delta[i], charge: a.charge + delta[i] }));
  });
  const stereo = objectList<StereoElement>();
  for (const e of s.stereo) {
    const kept = restereo(e, delta, atoms);
    if (kept) stereo.push(kept);
  }
  const structure = restructure(s, atoms, s.bonds, stereo, s.groups);
  return { structure, deprotonated, protonated };
}

/** The stereo element after the proton moves, or null when it no longer names its ligands. */
function restereo(e: StereoElement, delta: Int32Array, atoms: Atom[]): StereoElement | null {
  if (e.kind === 'tetrahedral') {
    const d = delta[e.centre];
    if (d === 0) return e;
    const from = d < 0 ? IMPLICIT_H : LONE_PAIR;
    const to = d < 0 ? LONE_PAIR : IMPLICIT_H;
    // the proton left its last place (or took the only lone-pair place): swap the placeholder
    if (d < 0 && atoms[e.centre].hCount !== 0) return null;
    const k = e.ligands.indexOf(from);
    if (k < 0) return d < 0 ? null : e;
    const ligands: [number, number, number, number] = [...e.ligands];
    ligands[k] = to;
    return { kind: 'tetrahedral', centre: e.centre, ligands, winding: e.winding };
  }
  if (e.kind === 'double-bond') {
    for (let k = 0; k < 2; k++)
      if (e.refs[k] === IMPLICIT_H && delta[e.ends[k]] !== 0 && atoms[e.ends[k]].hCount === 0) return null;
    return e;
  }
  return e;
}
