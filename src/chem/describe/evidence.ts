/**
 * Evidence for the chirality verdict: when a configuration is achiral, the improper symmetry found (an
 * automorphism σ with σ·x = M(x), so σ composed with the reflection maps the molecule onto itself) and the atoms
 * and bonds it leaves in place. Fixed atoms lie on the mirror plane (or axis); a bond whose two ends σ exchanges
 * is cut in its middle by the plane, or holds the inversion centre. The symmetry is constitutional: the
 * conformation that shows it may need rotations about single bonds.
 */
import type { MirrorFacts } from '../facts.js';
import type { Analysis } from './analyse.js';
import { atomName } from '../perceive/index.js';

export function mirrorFacts(a: Analysis): MirrorFacts {
  const { p, group, chirality } = a;
  const s = p.structure;
  const none = { fixedAtoms: [] as number[], fixedBonds: [] as [number, number][] };
  const hasUndefined = a.defined.some((d, k) => d === 0 && a.reported[k]);
  if (chirality.impossible) {
    return {
      chiral: null,
      ...none,
      explanation:
        'open: the configurations drawn cannot all hold (see the remarks), so the drawing is no stereoisomer to call chiral or achiral',
    };
  }
  if (chirality.chiral === null) {
    return {
      chiral: null,
      ...none,
      explanation:
        'open: some ways of completing the undefined stereo units give a chiral molecule, others an achiral one',
    };
  }
  if (chirality.chiral) {
    return {
      chiral: true,
      ...none,
      explanation: hasUndefined
        ? 'chiral whatever the undefined units are: no completion is superimposable on its mirror image'
        : 'chiral: no symmetry of the constitution maps the configuration onto its mirror image',
    };
  }
  const parityUnits = p.units.filter((u, k) => u.mode === 'parity' && a.reported[k]);
  if (parityUnits.length === 0) {
    return {
      chiral: false,
      ...none,
      explanation: 'achiral: no stereocentre or stereogenic axis, so reflection changes no configuration',
    };
  }
  if (chirality.witness < 0) {
    return { chiral: false, ...none, explanation: 'achiral whatever the undefined units are' };
  }
  const sigma = group.atomMaps[chirality.witness];
  const heavy = (i: number): boolean => s.atoms[i].atomicNumber !== 1;
  const fixedIdx: number[] = [];
  for (let i = 0; i < s.atoms.length; i++) if (sigma[i] === i) fixedIdx.push(i);
  const swapped: [number, number][] = [];
  for (const b of s.bonds) if (sigma[b.a] === b.b && sigma[b.b] === b.a) swapped.push([b.a, b.b]);
  const num = (i: number): number => s.atoms[i].inputNumber;
  const fixedAtoms = fixedIdx.map(num).sort((x, y) => x - y);
  const fixedBonds = swapped.map(([x, y]) => [num(x), num(y)].sort((u, v) => u - v) as [number, number]);
  const onUnit = fixedIdx.filter((i) => p.unitOfAtom[i] >= 0);
  const skeleton = fixedIdx.filter((i) => heavy(i) && p.graph.nbrs[i].length >= 2);
  const named = [...onUnit, ...skeleton.filter((i) => !onUnit.includes(i))].slice(0, 3);
  const bondNames = swapped.slice(0, 2).map(([x, y]) => `${atomName(s, x)}–${atomName(s, y)}`);
  let explanation: string;
  if (named.length > 0) {
    explanation = `achiral: mirror plane through ${named.map((i) => atomName(s, i)).join(', ')}`;
    if (bondNames.length > 0)
      explanation += ` and the middle of the ${bondNames.join(' and ')} bond${bondNames.length > 1 ? 's' : ''}`;
  } else if (bondNames.length > 0) {
    explanation = `achiral: mirror plane or inversion centre at the middle of the ${bondNames.join(' and ')} bond${bondNames.length > 1 ? 's' : ''}`;
  } else {
    explanation = 'achiral: inversion centre (or rotation–reflection axis) with no atom on it';
  }
  return { chiral: false, fixedAtoms, fixedBonds, explanation };
}
