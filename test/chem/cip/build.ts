/**
 * Structures built by hand for CIP unit tests, independent of any reader: atoms as element symbols with their
 * implicit hydrogen count, bonds as [a, b, order], stereo elements as in src/chem/types.ts.
 */
import type { Atom, BondOrder, StereoElement, Structure } from '../../../src/chem/types.js';

const Z: Record<string, number> = { H: 1, C: 6, N: 7, O: 8, F: 9, P: 15, S: 16, Cl: 17, Br: 35, I: 53 };

export interface AtomSpec {
  el: string;
  h?: number;
  isotope?: number;
  charge?: number;
}

export function build(
  atoms: (string | AtomSpec)[],
  bonds: [number, number, number?][],
  stereo: StereoElement[],
): Structure {
  const at: Atom[] = atoms.map((x, i) => {
    const a = typeof x === 'string' ? { el: x } : x;
    const z = Z[a.el];
    if (z === undefined) throw new Error(`build: unknown element ${a.el}`);
    return {
      element: a.el,
      atomicNumber: z,
      charge: a.charge ?? 0,
      isotope: a.isotope ?? null,
      hCount: a.h ?? 0,
      aromatic: false,
      radical: 0,
      mapNumber: null,
      inputNumber: i + 1,
      coords: null,
    };
  });
  return {
    atoms: at,
    bonds: bonds.map(([a, b, o]) => ({ a, b, order: (o ?? 1) as BondOrder, aromatic: false, wedge: null })),
    stereo,
    groups: [],
    chiralFlag: null,
    title: null,
    properties: {},
    dimension: 0,
  };
}
