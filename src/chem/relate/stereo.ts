/**
 * The stereo relation of two analyses of one constitution (IUPAC Gold Book: enantiomers, diastereoisomers,
 * epimers). An isomorphism σ: A -> B carries A's configuration onto B's units (describe/carry.ts); A and B are
 * identical when σ(x_A) lies in the orbit of x_B under B's symmetry group, enantiomers when its mirror image
 * does, diastereomers otherwise. A drawing of several molecules is one disconnected graph here, so its symmetry
 * group exchanges molecules of one constitution: the components are compared as a multiset.
 *
 * Configurations are compared through the mapping, never through CIP labels: a label can change while the
 * configuration stays (r/s centres depend on their neighbours; priorities change with substitution). The
 * differing units are those whose configuration differs, in the image of A under B's symmetry that differs
 * least; units whose configuration is kept but whose descriptor changes are listed apart (relabelledUnits).
 */
import type { CipLabel, DifferingUnit, Relation } from '../facts.js';
import { carryOnto, type Analysis } from '../describe/index.js';
import { labelUnits } from '../labels.js';
import { act, elementMapping, mirrorState, stereogenicIn } from '../symmetry/index.js';
import type { Structure } from '../types.js';

export interface StereoRelation {
  relation: Extract<Relation, 'identical' | 'enantiomers' | 'diastereomers' | 'same-constitution'>;
  differingUnits: DifferingUnit[];
  relabelledUnits: DifferingUnit[];
  epimers: boolean;
  /** Plain words, without the suffix about other components. */
  explanation: string;
}

const keyOf = (xs: number[]): string => [...xs].sort((p, q) => p - q).join(',');

function labelMap(a: Analysis): Map<string, CipLabel> {
  const m = new Map<string, CipLabel>();
  if (a.p.structure.stereo.length === 0) return m;
  for (const r of labelUnits(a.p.structure)) if (r.label) m.set(keyOf(r.atoms), r.label);
  return m;
}

export function stereoRelation(pa: Analysis, pb: Analysis, iso: ArrayLike<number>): StereoRelation {
  const none = {
    differingUnits: [] as DifferingUnit[],
    relabelledUnits: [] as DifferingUnit[],
    epimers: false,
  };
  const mB = pb.p.units.length;
  const { y, fromA, open } = carryOnto(pa, pb, iso);
  if (open) {
    return {
      ...none,
      relation: 'same-constitution',
      explanation: 'same constitution; undefined stereo leaves the relation open',
    };
  }
  const g = pb.group;
  const xB = pb.state;
  if (elementMapping(g, y, xB) >= 0)
    return { ...none, relation: 'identical', explanation: 'the same stereoisomer' };
  if (!g.complete) {
    // the symmetry search stopped at its limit: a symmetry not found could still make them identical
    return {
      ...none,
      relation: 'same-constitution',
      explanation:
        'same constitution; the symmetry search stopped at its limit, so the relation is left open',
    };
  }
  const labA = labelMap(pa);
  const labB = labelMap(pb);
  const unitFact = (j: number, iA: number): DifferingUnit => {
    const ub = pb.p.units[j];
    const ua = pa.p.units[iA];
    return {
      kind: ub.kind,
      atomsA: ua.atoms.map((x) => pa.p.structure.atoms[x].inputNumber),
      atomsB: ub.atoms.map((x) => pb.p.structure.atoms[x].inputNumber),
      labelA: labA.get(keyOf(ua.atoms)) ?? null,
      labelB: labB.get(keyOf(ub.atoms)) ?? null,
    };
  };
  if (elementMapping(g, mirrorState(g, y), xB) >= 0) {
    const differingUnits: DifferingUnit[] = [];
    for (let j = 0; j < mB; j++) {
      if (pb.p.units[j].mode === 'parity' && stereogenicIn(g, xB, j) && fromA[j] >= 0)
        differingUnits.push(unitFact(j, fromA[j]));
    }
    return {
      ...none,
      relation: 'enantiomers',
      differingUnits,
      explanation: 'mirror images that are not superimposable',
    };
  }
  // Diastereomers: the units that differ in configuration, in B's symmetry image of A that differs least.
  let best: number[] = [];
  let bestH = 0;
  for (let h = 0; h < g.perms.length; h++) {
    const z = act(g, h, y);
    const diff: number[] = [];
    for (let j = 0; j < mB; j++) if (z[j] !== xB[j] && stereogenicIn(g, xB, j)) diff.push(j);
    if (h === 0 || diff.length < best.length) {
      best = diff;
      bestH = h;
      if (diff.length <= 1) break;
    }
  }
  const perm = g.perms[bestH];
  const aOf = new Int32Array(mB).fill(-1);
  for (let j = 0; j < mB; j++) if (fromA[j] >= 0) aOf[perm[j]] = fromA[j];
  const differ = new Set(best);
  const differingUnits = best.filter((j) => aOf[j] >= 0).map((j) => unitFact(j, aOf[j]));
  // Same configuration, other descriptor (cis/trans-1,4-dimethylcyclohexane: 1s,4s vs 1r,4r).
  const relabelledUnits: DifferingUnit[] = [];
  for (let j = 0; j < mB; j++) {
    if (differ.has(j) || aOf[j] < 0 || !pb.reported[j]) continue;
    const u = unitFact(j, aOf[j]);
    if (u.labelA !== null && u.labelB !== null && u.labelA !== u.labelB) relabelledUnits.push(u);
  }
  // Gold Book: one of two or more tetrahedral stereogenic centres of the molecule (a salt of two chiral ions
  // with one centre each is a pair of diastereomeric salts, not epimers).
  const molecule = best.length === 1 ? pb.p.componentOfAtom[pb.p.units[best[0]].atoms[0]] : -1;
  const epimers =
    best.length === 1 &&
    differingUnits.length === 1 &&
    differingUnits[0].kind === 'tetrahedral' &&
    pb.p.units.filter(
      (u, j) =>
        u.mode === 'parity' &&
        u.kind === 'tetrahedral' &&
        pb.reported[j] &&
        pb.p.componentOfAtom[u.atoms[0]] === molecule,
    ).length >= 2;
  const s = pb.p.structure;
  const names = best
    .map((j) => {
      const d = differingUnits.find((u) => keyOf(u.atomsB) === keyOf(inputNumbers(s, pb.p.units[j].atoms)));
      const change =
        d && d.labelA && d.labelB && d.labelA !== d.labelB ? ` (${d.labelA} in A, ${d.labelB} in B)` : '';
      return `${unitWords(s, pb.p.units[j].atoms)}${change}`;
    })
    .join(', ');
  let explanation = epimers
    ? `epimers: diastereomers differing in configuration only at ${names} (atoms numbered as in B)`
    : `diastereomers: differing in configuration at ${names} (atoms numbered as in B)`;
  if (relabelledUnits.length > 0) {
    const list = relabelledUnits
      .map((u) => `atom ${u.atomsB[0]} (${u.labelA} in A, ${u.labelB} in B)`)
      .join(', ');
    explanation += `; the CIP descriptor also changes at ${list}, whose own configuration is kept (its neighbours changed)`;
  }
  return { relation: 'diastereomers', differingUnits, relabelledUnits, epimers, explanation };
}

function inputNumbers(s: Structure, atoms: number[]): number[] {
  return atoms.map((x) => s.atoms[x].inputNumber);
}

/** "atom 5 (C)", or "the unit between atom 2 (C) and atom 3 (C)": never "C5", which reads as a locant. */
function unitWords(s: Structure, atoms: number[]): string {
  const one = (i: number): string => `atom ${s.atoms[i].inputNumber} (${s.atoms[i].element})`;
  return atoms.length === 1 ? one(atoms[0]) : `the unit between ${one(atoms[0])} and ${one(atoms[1])}`;
}
