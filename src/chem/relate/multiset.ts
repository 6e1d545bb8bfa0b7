/**
 * The stereo relation of two drawings of several molecules, as multisets of molecules: each species (one
 * stereoisomer of one constitution, composition.ts) of A is related to each of B with the same constitution
 * (stereo.ts), then
 *   - identical when the species pair off as the same stereoisomers,
 *   - enantiomers when they pair off as mirror images (an achiral species is its own mirror image),
 *   - diastereomers otherwise, with the differing units of the pairing that differs least.
 * Where a constitution is drawn as several stereoisomers, paired species must also come in the same number
 * ((R):(S) 1:2 is the mirror image of 2:1); where it is drawn as one, the number of copies is a form difference
 * (a 2:1 and a 1:1 salt hold the same parent). Pairing species, rather than searching the symmetry of the whole
 * drawing, keeps the work at (species)^2 relations of single molecules: the symmetry group of n copies of a
 * molecule grows as n!.
 */
import type { Analysis } from '../describe/index.js';
import type { DifferingUnit } from '../facts.js';
import { isomorphic } from '../graph/index.js';
import type { Species } from './composition.js';
import { stereoRelation, type StereoRelation } from './stereo.js';

export function multisetRelation(inA: Species[], inB: Species[], asDrawn: boolean): StereoRelation {
  const an = (x: Species): Analysis => (asDrawn ? x.drawnAnalysis() : x.analysis());
  const several = new Set<string>();
  for (const xs of [inA, inB]) {
    const seen = new Set<string>();
    for (const x of xs) (seen.has(x.key) ? several : seen).add(x.key);
  }
  const rel: (StereoRelation | null)[][] = inA.map((x) =>
    inB.map((y) => {
      if (x.key !== y.key) return null;
      const iso = isomorphic(an(x).p.structure, an(y).p.structure);
      return iso ? stereoRelation(an(x), an(y), iso) : null;
    }),
  );
  const none = {
    differingUnits: [] as DifferingUnit[],
    relabelledUnits: [] as DifferingUnit[],
    epimers: false,
  };
  if (rel.some((row) => row.some((r) => r !== null && r.relation === 'same-constitution'))) {
    return {
      ...none,
      relation: 'same-constitution',
      explanation: 'same constitution; undefined stereo leaves the relation open',
    };
  }
  const countsMatch = (i: number, j: number): boolean =>
    !several.has(inA[i].key) || inA[i].copies === inB[j].copies;
  const pairing = (ok: (i: number, j: number) => boolean): number[] | null => {
    const used = new Set<number>();
    const out: number[] = [];
    for (let i = 0; i < inA.length; i++) {
      const j = inB.findIndex((_y, k) => !used.has(k) && rel[i][k] !== null && countsMatch(i, k) && ok(i, k));
      if (j < 0) return null;
      used.add(j);
      out.push(j);
    }
    return used.size === inB.length ? out : null;
  };
  if (pairing((i, j) => rel[i][j]!.relation === 'identical'))
    return { ...none, relation: 'identical', explanation: 'the same stereoisomers' };
  const mirrored = pairing((i, j) => {
    const r = rel[i][j]!.relation;
    return r === 'enantiomers' || (r === 'identical' && an(inA[i]).chirality.chiral === false);
  });
  if (mirrored) {
    const differingUnits = mirrored.flatMap((j, i) => rel[i][j]!.differingUnits);
    return {
      ...none,
      relation: 'enantiomers',
      differingUnits,
      explanation: 'mirror images that are not superimposable',
    };
  }
  // Diastereomers: pair each species with the one of B that differs least (greedy; exact for the usual few).
  const cost = (r: StereoRelation): number => (r.relation === 'identical' ? 0 : r.differingUnits.length || 1);
  const used = new Set<number>();
  const pairs: [number, number][] = [];
  for (let i = 0; i < inA.length; i++) {
    let best = -1;
    for (let j = 0; j < inB.length; j++) {
      const r = rel[i][j];
      if (r === null || used.has(j)) continue;
      if (best < 0 || cost(r) < cost(rel[i][best]!)) best = j;
    }
    if (best < 0) continue;
    used.add(best);
    pairs.push([i, best]);
  }
  const differing = pairs.filter(([i, j]) => rel[i][j]!.relation !== 'identical');
  const differingUnits = differing.flatMap(([i, j]) => rel[i][j]!.differingUnits);
  const relabelledUnits = differing.flatMap(([i, j]) => rel[i][j]!.relabelledUnits);
  const epimers =
    differing.length === 1 && differingUnits.length === 1 && rel[differing[0][0]][differing[0][1]]!.epimers;
  const words = differing.map(([i, j]) => `${inA[i].formula} ${rel[i][j]!.explanation}`).join('; ');
  return {
    relation: 'diastereomers',
    differingUnits,
    relabelledUnits,
    epimers,
    explanation: `diastereomers as a whole: ${words}${differing.length < pairs.length ? '; the other molecules the same' : ''}`,
  };
}
