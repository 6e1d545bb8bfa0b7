/**
 * The hierarchical digraph of P-92.1.4 (IUPAC 2013), grown lazily from a root atom: a node's children are made
 * only when a comparison first asks for them. Ring closures and multiple bonds give duplicate atoms
 * (P-92.1.4.2), which carry the duplicated atom's atomic number and have no substituents of their own (their
 * three phantom substituents, atomic number 0, are the padding of every comparison). Implicit hydrogens are
 * nodes of atomic number 1; a lone pair is a phantom node of atomic number 0.
 *
 * Following Hanson et al. 2018, auxiliary descriptors of stereo units inside a branch are found in the root's
 * digraph re-rooted at the unit's node: a traversal is therefore a directed step (node, the node we came from),
 * and a node's branches are all its tree neighbours except the one we came from.
 */
import { mancudeOf, type CipGraph } from './graph.js';
import type { CipLabel } from '../facts.js';

export const H_ATOM = -1;
export const PHANTOM = -2;

/** Upper bound on nodes grown for one root, so pathological cages terminate (ties stay ties beyond it). */

export const NODE_BUDGET = 200_000;

/** The children of hydrogens, phantoms and duplicates (shared; never written to). */
const NO_KIDS: CipNode[] = [];
/** Scratch list for kids(); kept, so its room is reserved once. */
const scratch: CipNode[] = [];

export class CipNode {
  kids: CipNode[] | null = null;
  /** Sorted branch lists per (came-from, rule level); see compare.ts. */
  sorted: Map<number | string, SortedBranches> | null = null;
  /** Sorted branches by level for the usual traversal (downwards, inside the scope, plain mode); see down0. */
  down: SortedBranches[] | null = null;
  /** The same for Rule 1a, the level nearly every comparison ends at (kept apart: no array by level for it). */
  down0: SortedBranches | null = null;
  /** Auxiliary descriptor: undefined = not yet computed, null = none. */
  aux: CipLabel | null | undefined = undefined;
  auxBusy = false;
  constructor(
    readonly id: number,
    readonly atom: number,
    readonly z: number,
    /**
     * A duplicate in a mancude ring (made with the mean atomic number): its Rule 2 mass is the mean one too, see
     * Digraph.massOf (the mass is not stored: a number field that holds fractions is boxed, one more object
     * per node).
     */
    readonly mancudeDup: boolean,
    readonly depth: number,
    /** Rule 1b distance: the depth of the corresponding non-duplicated node (own depth when not a duplicate). */
    readonly dist: number,
    readonly dup: boolean,
    readonly parent: CipNode | null,
  ) {}
}

export interface SortedBranches {
  nodes: CipNode[];
  /** tie[i] is true when nodes[i] ties with nodes[i-1] under the rules of this level. */
  tie: boolean[];
  /**
   * Rule 1a level only: so far ordered by atomic number alone, runs of equal atomic number not yet ordered by
   * their whole branches (nor `tie` set); compare.ts completes it when the order itself is needed.
   */
  pending: boolean;
}

export class Digraph {
  readonly root: CipNode;
  private nextId = 0;
  count = 0;
  /** The node budget ran out: comparisons may be wrong, so the unit gets no descriptor (label.ts). */
  truncated = false;
  /** Index into s.stereo of the unit being labelled: its own nodes carry no auxiliary descriptor. */
  readonly rootElement: number;
  /** Proposed Rule 6 reference atom (Hanson et al. 2018), or -1 when unset. */
  rule6Ref = -1;

  constructor(
    readonly g: CipGraph,
    rootAtom: number,
    rootElement: number,
  ) {
    this.rootElement = rootElement;
    this.root = this.make(rootAtom, 0, 0, false, null);
  }

  private make(
    atom: number,
    depth: number,
    dist: number,
    dup: boolean,
    parent: CipNode | null,
    z = -1,
  ): CipNode {
    this.count++;
    const g = this.g;
    g.workLeft--;
    if (z >= 0 && parent !== null) {
      return new CipNode(this.nextId++, atom, z, true, depth, dist, true, parent);
    }
    if (atom === H_ATOM) return new CipNode(this.nextId++, atom, 1, false, depth, dist, false, parent);
    if (atom === PHANTOM) return new CipNode(this.nextId++, atom, 0, false, depth, dist, false, parent);
    return new CipNode(this.nextId++, atom, g.z[atom], false, depth, dist, dup, parent);
  }

  /**
   * The Rule 2 mass of a node: a duplicate carries the mass of the atom it duplicates (a mancude one the mean
   * mass of the atoms its atom could be double-bonded to, as for its atomic number); hydrogen 1.008, a phantom 0.
   */
  massOf(n: CipNode): number {
    if (n.mancudeDup) return mancudeOf(this.g).dupMass[(n.parent as CipNode).atom];
    if (n.atom === H_ATOM) return 1.008;
    if (n.atom === PHANTOM) return 0;
    return this.g.mass[n.atom];
  }

  /** A phantom branch, used for the lone pair of a three-coordinate stereocentre. */
  phantom(parent: CipNode): CipNode {
    return this.make(PHANTOM, parent.depth + 1, parent.depth + 1, false, parent);
  }

  /** Children of `node` in the root's digraph, made on first use (P-92.1.4.2 duplicates included). */
  kids(node: CipNode): CipNode[] {
    if (node.kids) return node.kids;
    if (node.dup || node.atom < 0) return (node.kids = NO_KIDS);
    if (this.count > NODE_BUDGET || this.g.workLeft <= 0) {
      this.truncated = true;
      return (node.kids = NO_KIDS);
    }
    // collected in a shared scratch array and copied out at their exact size (make() does not re-enter here)
    const out = scratch;
    let cnt = 0;
    const g = this.g;
    const a = node.atom;
    const parent = node.parent;
    const d = node.depth + 1;
    const nb = g.nbr[a];
    const od = g.dupOrd[a];
    for (let i = 0; i < nb.length; i++) {
      const b = nb[i];
      const order = od[i];
      // a double bond in a mancude ring: one duplicate of mean atomic number, wherever the Kekulé bond lies
      let mz = -1;
      if (order === 2) {
        const m = mancudeOf(g);
        if (m.edge[m.off[a] + i] === 1) mz = m.dupZ[a];
      }
      if (parent !== null && b === parent.atom) {
        if (mz >= 0) out[cnt++] = this.make(b, d, d, true, node, mz);
        else for (let k = 1; k < order; k++) out[cnt++] = this.make(b, d, parent.depth, true, node);
        continue;
      }
      // a ring closure needs a ring: off the 2-core, b is no ancestor (the parent was handled above)
      let anc: CipNode | null = g.core[a] && g.core[b] ? parent : null;
      while (anc !== null && anc.atom !== b) anc = anc.parent;
      if (anc !== null) {
        // ring closure: a duplicate of the atom already on the path, plus one per extra bond order
        out[cnt++] = this.make(b, d, anc.depth, true, node);
        if (mz >= 0) out[cnt++] = this.make(b, d, d, true, node, mz);
        else for (let k = 1; k < order; k++) out[cnt++] = this.make(b, d, anc.depth, true, node);
      } else {
        out[cnt++] = this.make(b, d, d, false, node);
        if (mz >= 0) out[cnt++] = this.make(b, d, d, true, node, mz);
        else for (let k = 1; k < order; k++) out[cnt++] = this.make(b, d, d, true, node);
      }
    }
    for (let h = 0; h < g.hCount[a]; h++) out[cnt++] = this.make(H_ATOM, d, d, false, node);
    const kids = out.slice(0, cnt);
    for (let j = 0; j < cnt; j++) out[j] = null as unknown as CipNode; // drop references (setting length frees the room)
    node.kids = kids;
    return kids;
  }

  /** Branches of `node` when it is entered from `from` (null: `node` is the root of the traversal). */
  branches(node: CipNode, from: CipNode | null): CipNode[] {
    const kids = this.kids(node);
    if (from !== null && from === node.parent) return kids;
    const up = node.parent !== null && node.parent !== from;
    let size = up ? 1 : 0;
    for (let i = 0; i < kids.length; i++) if (kids[i] !== from) size++;
    const out = new Array<CipNode>(size);
    let k = 0;
    if (up) out[k++] = node.parent as CipNode;
    for (let i = 0; i < kids.length; i++) if (kids[i] !== from) out[k++] = kids[i];
    return out;
  }
}
