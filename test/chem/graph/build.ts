/**
 * A tiny structure builder for graph tests: SMILES-like text in Kekulé form only (no aromatic lowercase),
 * organic-subset atoms, bracket atoms with H count, charge and isotope, bonds - = # and '.', branches and ring
 * closures (digits, %nn). Stereo marks are ignored. Implicit H by the shared valence rule.
 */
import { implicitHydrogens, atomicNumberOf } from '../../../src/chem/read/valence.js';
import type { Atom, Bond, BondOrder, Structure } from '../../../src/chem/types.js';

export function build(text: string): Structure {
  const atoms: Atom[] = [];
  const bonds: Bond[] = [];
  const explicitH: (number | null)[] = [];
  const stack: number[] = [];
  const open = new Map<number, { atom: number; order: BondOrder | null }>();
  let prev = -1;
  let order: BondOrder | null = null;
  let i = 0;
  const addAtom = (element: string, h: number | null, charge: number, isotope: number | null) => {
    const z = atomicNumberOf(element);
    if (z === undefined) throw new Error(`build: unknown element ${element} in ${text}`);
    atoms.push({
      element, atomicNumber: z, charge, isotope, hCount: 0, aromatic: false, radical: 0, mapNumber: null,
      inputNumber: atoms.length + 1, coords: null,
    });
    explicitH.push(h);
    const idx = atoms.length - 1;
    if (prev >= 0) bonds.push({ a: prev, b: idx, order: order ?? 1, aromatic: false, wedge: null });
    order = null;
    prev = idx;
  };
  while (i < text.length) {
    const c = text[i];
    if (c === '(') { stack.push(prev); i++; continue; }
    if (c === ')') { prev = stack.pop()!; i++; continue; }
    if (c === '-') { order = 1; i++; continue; }
    if (c === '=') { order = 2; i++; continue; }
    if (c === '#') { order = 3; i++; continue; }
    if (c === '$') { order = 4; i++; continue; }
    if (c === '.') { prev = -1; i++; continue; }
    if (c === '/' || c === '\\') { i++; continue; }
    if (/[0-9%]/.test(c)) {
      let num: number;
      if (c === '%') { num = Number(text.slice(i + 1, i + 3)); i += 3; } else { num = Number(c); i++; }
      const o = open.get(num);
      if (o) {
        bonds.push({ a: o.atom, b: prev, order: order ?? o.order ?? 1, aromatic: false, wedge: null });
        open.delete(num);
      } else open.set(num, { atom: prev, order });
      order = null;
      continue;
    }
    if (c === '[') {
      const end = text.indexOf(']', i);
      const m = /^(\d*)([A-Z][a-z]?|\*)(@*)(H\d*)?([+-]\d*|[+]+|[-]+)?$/.exec(text.slice(i + 1, end));
      if (!m) throw new Error(`build: bad bracket atom in ${text}`);
      const h = m[4] ? (m[4].length > 1 ? Number(m[4].slice(1)) : 1) : 0;
      let q = 0;
      if (m[5]) q = /\d/.test(m[5]) ? Number(m[5]) : (m[5][0] === '+' ? 1 : -1) * m[5].length;
      addAtom(m[2], h, q, m[1] ? Number(m[1]) : null);
      i = end + 1;
      continue;
    }
    const two = text.slice(i, i + 2);
    if (two === 'Cl' || two === 'Br') { addAtom(two, null, 0, null); i += 2; continue; }
    if ('BCNOPSFI*'.includes(c)) { addAtom(c, null, 0, null); i++; continue; }
    throw new Error(`build: unexpected '${c}' in ${text}`);
  }
  const sum = new Array<number>(atoms.length).fill(0);
  for (const b of bonds) { sum[b.a] += b.order; sum[b.b] += b.order; }
  atoms.forEach((a, k) => {
    a.hCount = explicitH[k] ?? implicitHydrogens(a.atomicNumber, a.charge, sum[k]);
  });
  return { atoms, bonds, stereo: [], groups: [], chiralFlag: null, title: null, properties: {}, dimension: 0 };
}
