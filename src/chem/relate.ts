/**
 * relate(a, b): how two structures are related, as a chemist names it (IUPAC Gold Book terms: enantiomers,
 * diastereoisomers, epimers, constitutional isomers).
 *
 * Salts and solvates: the parent components (largest component with carbon) are related; the other components
 * are compared by constitution and listed apart. Same constitution: an isomorphism σ: A -> B carries A's
 * configuration onto B's units (perceive/units.ts `rebase`); then A and B are identical when σ(x_A) lies in the
 * orbit of x_B under B's symmetry group, enantiomers when its mirror image does, diastereomers otherwise.
 */
import type { CipLabel, DifferingUnit, RelationFacts } from './facts.js';
import { constitutionKey, isomorphic, molecularFormula } from './graph/index.js';
import {
  analyse,
  carryOnto,
  parentComponent,
  parentCopies,
  sameStereoisomer,
  type Analysis,
} from './describe/index.js';
import { labelUnits } from './labels.js';
import { extractAtoms } from './normalize.js';
import { act, elementMapping, mirrorState, stereogenicIn } from './symmetry/index.js';
import type { Structure } from './types.js';
import { writeSmiles } from './write/smiles.js';

interface Side {
  whole: Analysis;
  parent: Analysis;
  others: { key: string; smiles: string; structure: Structure }[];
}

function side(s: Structure): Side {
  const whole = analyse(s);
  const ns = whole.p.structure;
  const comps = whole.p.components;
  const k = parentComponent(ns, comps);
  const parent = comps.length <= 1 ? whole : analyse(extractAtoms(ns, comps[k] ?? []));
  const copies = parentCopies(ns, comps, k);
  const others = comps
    .filter((_c, i) => i !== k && !copies.includes(i))
    .map((c) => {
      const sub = extractAtoms(ns, c);
      return { key: constitutionKey(sub), smiles: writeSmiles(sub), structure: sub };
    });
  return { whole, parent, others };
}

/** Other components matched by constitution, then by configuration; the unmatched ones on each side. */
function otherDifferences(a: Side, b: Side): { onlyInA: string[]; onlyInB: string[] } {
  const left = b.others.slice();
  const onlyInA: string[] = [];
  for (const o of a.others) {
    const j = left.findIndex(
      (x) =>
        x.key === o.key &&
        (x.structure.stereo.length + o.structure.stereo.length === 0 ||
          sameStereoisomer(o.structure, x.structure)),
    );
    if (j >= 0) left.splice(j, 1);
    else onlyInA.push(o.smiles);
  }
  return { onlyInA, onlyInB: left.map((x) => x.smiles) };
}

const labelMap = (a: Analysis): Map<string, CipLabel> => {
  const m = new Map<string, CipLabel>();
  for (const r of labelUnits(a.p.structure))
    if (r.label) m.set([...r.atoms].sort((x, y) => x - y).join(','), r.label);
  return m;
};

export function relate(sa: Structure, sb: Structure): RelationFacts {
  const A = side(sa);
  const B = side(sb);
  const otherComponents = otherDifferences(A, B);
  const salt =
    otherComponents.onlyInA.length + otherComponents.onlyInB.length > 0
      ? ' (parent components; the other components differ)'
      : '';
  const pa = A.parent;
  const pb = B.parent;
  const base = { differingUnits: [] as DifferingUnit[], epimers: false, otherComponents };
  const iso = isomorphic(pa.p.structure, pb.p.structure);
  if (!iso) {
    const same = molecularFormula(pa.p.structure) === molecularFormula(pb.p.structure);
    return same
      ? {
          ...base,
          relation: 'constitutional-isomers',
          explanation: `same molecular formula, different constitution${salt}`,
        }
      : { ...base, relation: 'different-compounds', explanation: `different molecular formulas${salt}` };
  }
  const mB = pb.p.units.length;
  // A's configuration carried onto B's units.
  const { y, fromA, open } = carryOnto(pa, pb, iso);
  if (open) {
    return {
      ...base,
      relation: 'same-constitution',
      explanation: `same constitution; undefined stereo leaves the relation open${salt}`,
    };
  }
  const g = pb.group;
  const xB = pb.state;
  if (elementMapping(g, y, xB) >= 0) {
    return { ...base, relation: 'identical', explanation: `the same stereoisomer${salt}` };
  }
  const labA = labelMap(pa);
  const labB = labelMap(pb);
  const unitFact = (j: number, iA: number): DifferingUnit => {
    const ub = pb.p.units[j];
    const ua = pa.p.units[iA];
    const key = (xs: number[]): string => [...xs].sort((p, q) => p - q).join(',');
    return {
      kind: ub.kind,
      atomsA: ua.atoms.map((x) => pa.p.structure.atoms[x].inputNumber),
      atomsB: ub.atoms.map((x) => pb.p.structure.atoms[x].inputNumber),
      labelA: labA.get(key(ua.atoms)) ?? null,
      labelB: labB.get(key(ub.atoms)) ?? null,
    };
  };
  if (elementMapping(g, mirrorState(g, y), xB) >= 0) {
    const differingUnits: DifferingUnit[] = [];
    for (let j = 0; j < mB; j++) {
      if (pb.p.units[j].mode === 'parity' && stereogenicIn(g, xB, j) && fromA[j] >= 0) {
        differingUnits.push(unitFact(j, fromA[j]));
      }
    }
    return {
      ...base,
      relation: 'enantiomers',
      differingUnits,
      explanation: `mirror images that are not superimposable${salt}`,
    };
  }
  // Diastereomers: name the units that differ, choosing B's symmetry image of A that differs least.
  let best: number[] = [];
  let bestH = 0;
  for (let h = 0; h < g.perms.length; h++) {
    const z = act(g, h, y);
    const diff: number[] = [];
    for (let j = 0; j < mB; j++) if (z[j] !== xB[j] && stereogenicIn(g, xB, j)) diff.push(j);
    if (h === 0 || diff.length < best.length) {
      best = diff;
      bestH = h;
    }
  }
  const perm = g.perms[bestH];
  const aOf = new Int32Array(mB).fill(-1);
  for (let j = 0; j < mB; j++) if (fromA[j] >= 0) aOf[perm[j]] = fromA[j];
  // A unit whose own configuration is kept can still change its CIP descriptor (a pseudoasymmetric r/s centre:
  // cis- and trans-1,4-dimethylcyclohexane change both labels). The list names those too, so that it agrees
  // with the labels; epimers then differ at exactly one centre in configuration and in descriptors.
  const keyOf = (xs: number[]): string => [...xs].sort((p, q) => p - q).join(',');
  const differ = new Set(best);
  for (let j = 0; j < mB; j++) {
    if (differ.has(j) || aOf[j] < 0 || !pb.reported[j]) continue;
    const la = labA.get(keyOf(pa.p.units[aOf[j]].atoms)) ?? null;
    const lb = labB.get(keyOf(pb.p.units[j].atoms)) ?? null;
    if (la !== null && lb !== null && la !== lb) differ.add(j);
  }
  const listed = [...differ].sort((p, q) => p - q);
  const differingUnits = listed.filter((j) => aOf[j] >= 0).map((j) => unitFact(j, aOf[j]));
  const epimers =
    listed.length === 1 &&
    differingUnits.length === 1 &&
    differingUnits[0].kind === 'tetrahedral' &&
    pb.p.units.filter((u, j) => u.mode === 'parity' && pb.reported[j]).length >= 2;
  const names = listed
    .map((j) => {
      const d = differingUnits.find(
        (u) => keyOf(u.atomsB) === keyOf(pb.p.units[j].atoms.map((x) => pb.p.structure.atoms[x].inputNumber)),
      );
      const change =
        d && d.labelA && d.labelB && d.labelA !== d.labelB ? ` (${d.labelA} in A, ${d.labelB} in B)` : '';
      return `${unitWords(pb.p.structure, pb.p.units[j].atoms)}${change}`;
    })
    .join(', ');
  const explanation = epimers
    ? `epimers: diastereomers differing only at ${names} (atoms numbered as in B)${salt}`
    : `diastereomers: differing at ${names} (atoms numbered as in B)${salt}`;
  return { ...base, relation: 'diastereomers', differingUnits, epimers, explanation };
}

/** "atom 5 (C)", or "the double bond between atom 2 (C) and atom 3 (C)": never "C5", which reads as a locant. */
function unitWords(s: Structure, atoms: number[]): string {
  const one = (i: number): string => `atom ${s.atoms[i].inputNumber} (${s.atoms[i].element})`;
  return atoms.length === 1 ? one(atoms[0]) : `the unit between ${one(atoms[0])} and ${one(atoms[1])}`;
}
