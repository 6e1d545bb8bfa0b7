/**
 * Kekulé assignment for molfile aromatic bonds (bond type 4). Written for the molfile reader because the shared
 * kekulize.ts did not exist yet when this reader was written.
 *
 * Each atom on an aromatic bond is classified from its element, charge and the bonds it already has:
 *  - "must": takes exactly one double bond among its aromatic bonds (neutral C/Si/Ge, N+/P+/O+/S+: atoms that
 *    are carbon-like in an aromatic ring and have a free valence);
 *  - "optional": may take one (neutral N/P/As with two bonds: pyridine-type or pyrrole-type NH, which a molfile
 *    leaves open; B; charged carbon; elements without a valence model);
 *  - "never": has no free valence (pyrrole-type N-R, furan O, thiophene S, an atom with an exocyclic double bond).
 * A matching on the aromatic bonds must cover every "must" atom (backtracking, most constrained atom first,
 * with a step limit so that no input can make it run away). Unmatched aromatic bonds stay single.
 */
import type { Atom, Bond } from '../types.js';
import { defaultValences } from './valence.js';
import type { Adjacency } from './molfile-graph.js';

const STEP_LIMIT = 200_000;

type Need = 0 | 1 | 2; // 0 never, 1 optional, 2 must

function classify(
  atom: Atom,
  i: number,
  bonds: readonly Bond[],
  adj: Adjacency,
  valence: number | null,
): Need {
  let aromaticCount = 0;
  let other = 0;
  let exoMultiple = false;
  const bs = adj.bnd[i]!;
  for (const k of bs) {
    const b = bonds[k]!;
    if (b.aromatic) aromaticCount++;
    else {
      other += b.order;
      if (b.order >= 2) exoMultiple = true;
    }
  }
  if (aromaticCount === 0 || exoMultiple) return 0;
  const used = other + aromaticCount + atom.radical;
  if (valence !== null) return valence - used >= 1 ? 1 : 0;
  const vs = defaultValences(atom.atomicNumber, atom.charge);
  if (vs.length === 0) return 1;
  const free = vs[0]! - used;
  if (free < 1) return 0;
  const z = atom.atomicNumber;
  const carbonLike =
    (atom.charge === 0 && (z === 6 || z === 14 || z === 32)) ||
    (atom.charge === 1 && (z === 7 || z === 15 || z === 8 || z === 16 || z === 33 || z === 34));
  return carbonLike ? 2 : 1;
}

/**
 * Sets order 2 on a Kekulé set of aromatic bonds. Returns -1 on success, else the index of an atom that could
 * not be given its double bond.
 */
export function kekulizeAromatic(
  atoms: readonly Atom[],
  bonds: Bond[],
  adj: Adjacency,
  valences: readonly (number | null)[],
): number {
  const n = atoms.length;
  const need = new Int8Array(n);
  for (let i = 0; i < n; i++) need[i] = classify(atoms[i]!, i, bonds, adj, valences[i] ?? null);
  const mate = new Int32Array(n).fill(-1); // bond index matched at atom
  const must: number[] = [];
  for (let i = 0; i < n; i++) if (need[i] === 2) must.push(i);
  if (must.length === 0) return -1;

  const candidates = (i: number): number[] => {
    const out: number[] = [];
    const ns = adj.nbr[i]!;
    const bs = adj.bnd[i]!;
    for (let k = 0; k < ns.length; k++) {
      const j = ns[k]!;
      if (!bonds[bs[k]!]!.aromatic || need[j] === 0 || mate[j] !== -1) continue;
      // prefer partners that must be matched themselves
      if (need[j] === 2) out.unshift(bs[k]!);
      else out.push(bs[k]!);
    }
    return out;
  };

  let steps = 0;
  let failedAt = must[0]!;
  const solve = (): boolean => {
    if (++steps > STEP_LIMIT) return false;
    // most constrained unmatched "must" atom
    let best = -1;
    let bestOpts: number[] = [];
    for (const i of must) {
      if (mate[i] !== -1) continue;
      const opts = candidates(i);
      if (opts.length === 0) {
        failedAt = i;
        return false;
      }
      if (best === -1 || opts.length < bestOpts.length) {
        best = i;
        bestOpts = opts;
        if (opts.length === 1) break;
      }
    }
    if (best === -1) return true;
    for (const k of bestOpts) {
      const b = bonds[k]!;
      const j = b.a === best ? b.b : b.a;
      mate[best] = k;
      mate[j] = k;
      if (solve()) return true;
      mate[best] = -1;
      mate[j] = -1;
      if (steps > STEP_LIMIT) return false;
    }
    return false;
  };

  if (!solve()) return failedAt;
  for (let i = 0; i < n; i++) {
    const k = mate[i]!;
    if (k !== -1) bonds[k]!.order = 2;
  }
  return -1;
}
