/**
 * Components of a salt or solvate that repeat an earlier component: the same constitution and the same
 * configuration, as in a 2:1 salt such as bis(amphetamine) sulfate drawn as two amphetamines and one sulfuric
 * acid. Their stereo units describe the same stereoisomer again, so descriptors cite them once.
 */
import type { StereoUnitFact, StructureFacts } from '../chem/facts.js';
import type { Structure } from '../chem/types.js';
import { connectedComponents } from '../chem/graph/components.js';
import { extractAtoms } from '../chem/normalize.js';
import type { CheckContext } from './types.js';

/** The stereo units that tell a component apart at a glance: kind, symmetry class, definition and label. */
function unitSignature(units: readonly StereoUnitFact[]): string {
  return units
    .map((u) => `${u.kind}/${u.equivalenceClass}/${u.defined ? (u.label ?? '?') : '-'}`)
    .sort()
    .join(',');
}

/**
 * Index of the earlier component each component repeats (same constitution and configuration, confirmed by
 * the engine's relation of the two component structures), for components that repeat one; others absent.
 */
export function repeatedComponents(
  structure: Structure | null,
  facts: StructureFacts,
  engine: CheckContext['engine'],
): Map<number, number> {
  const out = new Map<number, number>();
  const comps = facts.components;
  if (!structure || comps.length < 2) return out;
  const atomsOf = connectedComponents(structure);
  const heavy = (atoms: number[]): number =>
    atoms.filter((a) => structure.atoms[a].atomicNumber !== 1).length;
  // The facts number components in input order of their first atom, as connectedComponents does; refuse
  // to pair them up when the two disagree.
  if (atomsOf.length !== comps.length || atomsOf.some((a, k) => heavy(a) !== comps[k].heavyAtoms)) return out;
  const unitsOf = comps.map((_, k) => facts.units.filter((u) => u.component === k));
  const sub = new Map<number, Structure>();
  const part = (k: number): Structure => {
    let s = sub.get(k);
    if (!s) sub.set(k, (s = extractAtoms(structure, atomsOf[k])));
    return s;
  };
  for (let k = 1; k < comps.length; k++) {
    if (unitsOf[k].length === 0) continue;
    for (let j = 0; j < k; j++) {
      if (out.has(j)) continue; // compare with the first of its kind only
      if (comps[j].formula !== comps[k].formula || comps[j].heavyAtoms !== comps[k].heavyAtoms) continue;
      if (unitSignature(unitsOf[j]) !== unitSignature(unitsOf[k])) continue;
      if (engine.relate(part(j), part(k)).relation === 'identical') {
        out.set(k, j);
        break;
      }
    }
  }
  return out;
}

/** The units of the structure with those of repeated components left out. */
export function distinctUnits(
  facts: StructureFacts,
  repeated: ReadonlyMap<number, number>,
): StereoUnitFact[] {
  return repeated.size === 0 ? facts.units : facts.units.filter((u) => !repeated.has(u.component));
}
