/**
 * relate(a, b): how two drawings are related, as a chemist names it (IUPAC Gold Book terms: enantiomers,
 * diastereoisomers, epimers, constitutional isomers). The one public entry of relate/.
 *
 * Both drawings are taken in charge-neutral form (neutral.ts), so a salt drawn as ions and the free base, or a
 * zwitterion and the neutral amino acid, relate by their parents; what differs in the drawn form is said in
 * formDifferences. The components are grouped into species (composition.ts). The parent's constitution decides
 * constitutional relations. The stereo relation is that of the molecules taken together — the parent and every
 * component with stereo units whose constitution both drawings hold — as one multiset: identical when the
 * multisets match, enantiomers when one is the mirror image of the other as a whole, diastereomers otherwise.
 * Components outside it (achiral counter-ions, solvents, components only one side has) are listed apart.
 */
import type { FormDifference, RelationFacts } from '../facts.js';
import { isomorphic } from '../graph/index.js';
import type { Structure } from '../types.js';
import { composition, drawnAs, hasUnits, type Composition, type Species } from './composition.js';
import { multisetRelation } from './multiset.js';
import { stereoRelation } from './stereo.js';

export function relate(sa: Structure, sb: Structure): RelationFacts {
  const A = composition(sa);
  const B = composition(sb);
  const pa = A.species[A.parent];
  const pb = B.species[B.parent];
  const related = pa && pb && pa.key === pb.key ? relatedKeys(A, B, pa.key) : new Set<string>();
  const inA = A.species.filter((x) => related.has(x.key));
  const inB = B.species.filter((x) => related.has(x.key));
  const otherComponents = otherDifferences(
    A.species.filter((x) => !related.has(x.key)),
    B.species.filter((x) => !related.has(x.key)),
  );
  const formDifferences = formDiffs(A, B, inA, inB, otherComponents);
  const salt =
    otherComponents.onlyInA.length + otherComponents.onlyInB.length > 0
      ? ' (parent components; the other components differ)'
      : '';
  const base = {
    differingUnits: [],
    relabelledUnits: [],
    epimers: false,
    otherComponents,
    formDifferences,
  };
  if (!pa || !pb)
    return { ...base, relation: 'different-compounds', explanation: 'a drawing holds no atoms' };
  const constitutional = (): RelationFacts =>
    pa.formula === pb.formula
      ? {
          ...base,
          relation: 'constitutional-isomers',
          explanation: `same molecular formula, different constitution${salt}`,
        }
      : { ...base, relation: 'different-compounds', explanation: `different molecular formulas${salt}` };
  if (pa.key !== pb.key) return constitutional();
  // The molecules taken together: one copy of each species, one structure for each side.
  const mixed = speciesMismatch(inA, inB);
  if (mixed) return { ...base, relation: 'same-constitution', explanation: mixed + salt };
  // Both drawn alike (the usual case): relate the drawings themselves, so neutralising never changes a relation
  // that the drawings already decide; otherwise the neutral forms.
  const asDrawn = sameDrawnForms(inA, inB);
  const whole = inA.length > 1 || inB.length > 1;
  let r;
  if (whole) r = multisetRelation(inA, inB, asDrawn);
  else {
    const ta = asDrawn ? pa.drawnAnalysis() : pa.analysis();
    const tb = asDrawn ? pb.drawnAnalysis() : pb.analysis();
    const iso = isomorphic(ta.p.structure, tb.p.structure);
    if (!iso) return constitutional();
    r = stereoRelation(ta, tb, iso);
  }
  const together_ =
    whole && r.relation !== 'same-constitution'
      ? ` (the molecules taken together: ${inB.map((x) => x.formula).join(' + ')})`
      : '';
  return {
    ...base,
    relation: r.relation,
    differingUnits: r.differingUnits,
    relabelledUnits: r.relabelledUnits,
    epimers: r.epimers,
    explanation: `${r.explanation}${together_}${salt}`,
  };
}

/** The parent's constitution, and every constitution with stereo units that both drawings hold. */
function relatedKeys(A: Composition, B: Composition, parentKey: string): Set<string> {
  const keys = new Set<string>([parentKey]);
  const inB = new Set(B.species.map((x) => x.key));
  for (const x of A.species) if (!keys.has(x.key) && inB.has(x.key) && hasUnits(x)) keys.add(x.key);
  return keys;
}

/**
 * Different mixtures of one constitution: another number of stereoisomers (a racemate drawn out against one
 * enantiomer), or, where a side holds several, another number of molecules (1:1 against 1:2).
 */
function speciesMismatch(inA: Species[], inB: Species[]): string | null {
  const count = (xs: Species[], key: string): [number, number] => {
    const own = xs.filter((x) => x.key === key);
    return [own.length, own.reduce((t, x) => t + x.copies, 0)];
  };
  for (const key of new Set(inA.map((x) => x.key))) {
    const [na, ma] = count(inA, key);
    const [nb, mb] = count(inB, key);
    const f = inA.find((x) => x.key === key)!.formula;
    if (na !== nb)
      return `same constitution, different mixtures: A holds ${na} ${na === 1 ? 'stereoisomer' : 'stereoisomers'} of ${f}, B ${nb}, so neither one stereoisomer nor a mirror image of the other`;
    if (na > 1 && ma !== mb)
      return `same constitution, different mixtures: A holds ${ma} molecules of ${f} (${na} stereoisomers), B ${mb}`;
  }
  return null;
}

/** Do both sides draw the related molecules in the same charge state (the same drawn constitutions)? */
function sameDrawnForms(inA: Species[], inB: Species[]): boolean {
  const keys = (xs: Species[]): string =>
    xs
      .map((x) => x.drawnKey)
      .sort()
      .join(' ');
  return keys(inA) === keys(inB);
}

/** Other components matched by neutral constitution and configuration; the unmatched ones on each side, as drawn. */
function otherDifferences(a: Species[], b: Species[]): { onlyInA: string[]; onlyInB: string[] } {
  const left = b.flatMap((x) => Array.from({ length: x.copies }, () => x));
  const onlyInA: string[] = [];
  for (const o of a) {
    for (let k = 0; k < o.copies; k++) {
      const j = left.findIndex((x) => x.key === o.key && sameSpecies(o, x));
      if (j >= 0) left.splice(j, 1);
      else onlyInA.push(o.drawnSmiles());
    }
  }
  return { onlyInA, onlyInB: left.map((x) => x.drawnSmiles()) };
}

function sameSpecies(a: Species, b: Species): boolean {
  if (a.structure.stereo.length + b.structure.stereo.length === 0) return true;
  const ta = a.analysis();
  const tb = b.analysis();
  const iso = isomorphic(ta.p.structure, tb.p.structure);
  return iso !== null && stereoRelation(ta, tb, iso).relation === 'identical';
}

/** What differs besides the relation: how the parent is drawn (protonation), counter-ions, ratios. */
function formDiffs(
  A: Composition,
  B: Composition,
  inA: Species[],
  inB: Species[],
  others: { onlyInA: string[]; onlyInB: string[] },
): FormDifference[] {
  const out: FormDifference[] = [];
  const pa = A.species[A.parent];
  const pb = B.species[B.parent];
  if (!pa || !pb) return out;
  if (pa.key === pb.key) {
    for (const x of inA) {
      const y = inB.find((z) => z.key === x.key);
      if (y && (x.drawnKey !== y.drawnKey || drawnAs(x) !== drawnAs(y))) {
        out.push({
          kind: 'protonation',
          explanation: `${x.formula} (neutral form) is drawn as ${drawnAs(x)} in A and as ${drawnAs(y)} in B`,
        });
      }
    }
    const copies = (xs: Species[], key: string): number =>
      xs.filter((x) => x.key === key).reduce((t, x) => t + x.copies, 0);
    for (const key of new Set(inA.map((x) => x.key))) {
      const na = copies(inA, key);
      const nb = copies(inB, key);
      if (na !== nb) {
        const f = inA.find((x) => x.key === key)!.formula;
        out.push({
          kind: 'ratio',
          explanation: `A holds ${na} ${na === 1 ? 'molecule' : 'molecules'} of ${f}, B ${nb}`,
        });
      }
    }
  }
  if (others.onlyInA.length + others.onlyInB.length > 0) {
    const list = (xs: string[]): string => (xs.length ? xs.join(', ') : 'none');
    out.push({
      kind: 'salt-form',
      explanation: `other components (counter-ions, solvents) differ: only in A ${list(others.onlyInA)}; only in B ${list(others.onlyInB)}`,
    });
  }
  return out;
}
