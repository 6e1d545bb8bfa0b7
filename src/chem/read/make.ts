/**
 * The one construction path for the engine's Atom, Bond and Structure objects (types.ts). Every reader (SMILES,
 * CXSMILES, molfile V2000/V3000, SD) and normalize.ts build them here, so that all of them share one V8 hidden
 * class per type: the same properties, created in the same order, by the same object literal. Code that sees
 * structures from several readers then stays monomorphic instead of being deoptimized ("wrong map") and
 * recompiled each time a structure built elsewhere reaches it. An object spread (`{ ...s, stereo }`) makes a
 * copy with a different hidden class; use the helpers below instead.
 *
 * The lists held by a Structure (atoms, bonds, stereo, groups) are likewise always packed arrays of objects
 * (`objectList`), never holey (`new Array(n)`) and never "small integer" arrays that only turn into object arrays
 * when the first element is pushed, so that an empty list and a full one have the same hidden class too.
 * Coordinates are always arrays of doubles (`coords3`), also when every value happens to be an integer.
 *
 * Code elsewhere that derives a Structure should use `withStereo` / `restructure` / `atomWithHCount` too; the
 * spreads still left are in symmetry/group.ts (mirror), describe/isomer-list.ts, labels.ts and depict.ts.
 */
import type { Atom, Bond, BondOrder, StereoElement, StereoGroup, Structure } from '../types.js';

/** An empty array whose elements kind is already "packed objects" (it stays so when objects are pushed). */
export function objectList<T>(): T[] {
  const a = [null] as unknown as T[];
  a.pop();
  return a;
}

/** [x, y, z] as an array of doubles whatever the values. */
export function coords3(x: number, y: number, z: number): [number, number, number] {
  const c: [number, number, number] = [0.5, 0.5, 0.5];
  c[0] = x;
  c[1] = y;
  c[2] = z;
  return c;
}

export function newAtom(
  element: string,
  atomicNumber: number,
  charge: number,
  isotope: number | null,
  hCount: number,
  aromatic: boolean,
  radical: number,
  mapNumber: number | null,
  inputNumber: number,
  coords: [number, number, number] | null,
): Atom {
  return {
    element,
    atomicNumber,
    charge,
    isotope,
    hCount,
    aromatic,
    radical,
    mapNumber,
    inputNumber,
    coords,
  };
}

/** A copy of `a` with other charge, hCount or coordinates (built by newAtom, so the property order holds). */
export function atomWith(a: Atom, c: { charge?: number; hCount?: number; coords?: Atom['coords'] }): Atom {
  return newAtom(
    a.element,
    a.atomicNumber,
    c.charge ?? a.charge,
    a.isotope,
    c.hCount ?? a.hCount,
    a.aromatic,
    a.radical,
    a.mapNumber,
    a.inputNumber,
    c.coords === undefined ? a.coords : c.coords,
  );
}

/** A copy of `a` with another hCount (the coordinate array, never mutated, is shared). */
export function atomWithHCount(a: Atom, hCount: number): Atom {
  return newAtom(
    a.element,
    a.atomicNumber,
    a.charge,
    a.isotope,
    hCount,
    a.aromatic,
    a.radical,
    a.mapNumber,
    a.inputNumber,
    a.coords,
  );
}

export function newBond(
  a: number,
  b: number,
  order: BondOrder,
  aromatic: boolean,
  wedge: Bond['wedge'],
): Bond {
  return { a, b, order, aromatic, wedge };
}

export function newStructure(
  atoms: Atom[],
  bonds: Bond[],
  stereo: StereoElement[],
  groups: StereoGroup[],
  chiralFlag: boolean | null,
  title: string | null,
  properties: Record<string, string>,
  dimension: 0 | 2 | 3,
): Structure {
  return { atoms, bonds, stereo, groups, chiralFlag, title, properties, dimension };
}

/** `s` with other atoms, bonds, stereo and groups; flags, title, properties and dimension kept. */
export function restructure(
  s: Structure,
  atoms: Atom[],
  bonds: Bond[],
  stereo: StereoElement[],
  groups: StereoGroup[],
): Structure {
  return newStructure(atoms, bonds, stereo, groups, s.chiralFlag, s.title, s.properties, s.dimension);
}

/** `s` with another stereo list (and optionally other groups): the replacement for `{ ...s, stereo }`. */
export function withStereo(
  s: Structure,
  stereo: StereoElement[],
  groups: StereoGroup[] = s.groups,
): Structure {
  return newStructure(s.atoms, s.bonds, stereo, groups, s.chiralFlag, s.title, s.properties, s.dimension);
}

export function newGroup(type: StereoGroup['type'], id: number, atoms: number[]): StereoGroup {
  return { type, id, atoms };
}
