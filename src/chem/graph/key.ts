/**
 * Molecular formula (Hill order) and a constitution key: the formula plus a hash of the refined equivalence
 * classes (each class's invariant, size and bonds to other classes). Isomorphic structures always get the same
 * key, whatever the atom order or Kekulé structure; different constitutions almost always get different keys,
 * but callers that need certainty confirm with isomorphic().
 */
import type { Structure } from '../types.js';
import { prepare, refinedPartition } from './prepared.js';
import { cellIndex } from './refine.js';

/** Hill order (C, H, then alphabetical; alphabetical throughout without carbon), implicit H included. */
export function molecularFormula(s: Structure, atoms?: number[]): string {
  const counts = new Map<string, number>();
  let charge = 0;
  let h = 0;
  let wildcards = 0;
  const total = atoms ? atoms.length : s.atoms.length;
  for (let t = 0; t < total; t++) {
    const a = s.atoms[atoms ? atoms[t] : t];
    if (!a) continue;
    h += a.hCount;
    charge += a.charge;
    if (a.atomicNumber === 0 || a.element === '*') wildcards++;
    else if (a.atomicNumber === 1) h++;
    else counts.set(a.element, (counts.get(a.element) ?? 0) + 1);
  }
  if (h > 0) counts.set('H', h);
  // Hill order: with carbon, C then H then the rest by code unit; without, everything by code unit.
  let out = '';
  const add = (e: string, c: number) => {
    out += c === 1 ? e : `${e}${c}`;
  };
  const c = counts.get('C');
  if (c !== undefined) {
    add('C', c);
    const hc = counts.get('H');
    if (hc !== undefined) add('H', hc);
    const rest: string[] = [];
    for (const e of counts.keys()) if (e !== 'C' && e !== 'H') rest.push(e);
    sortSymbols(rest);
    for (const e of rest) add(e, counts.get(e)!);
  } else {
    const order = [...counts.keys()];
    sortSymbols(order);
    for (const e of order) add(e, counts.get(e)!);
  }
  if (wildcards > 0) out += wildcards === 1 ? '*' : `*${wildcards}`;
  if (charge !== 0) out += `${Math.abs(charge) === 1 ? '' : Math.abs(charge)}${charge > 0 ? '+' : '-'}`;
  return out;
}

/** Distinct element symbols by code unit (as Array#sort without a comparator), in place: lists are short. */
function sortSymbols(a: string[]): void {
  for (let t = 1; t < a.length; t++) {
    const x = a[t];
    let j = t;
    while (j > 0 && a[j - 1] > x) {
      a[j] = a[j - 1];
      j--;
    }
    a[j] = x;
  }
}

/** Formula + "/" + 16 hex digits; equal for isomorphic structures (no stereo). */
export function constitutionKey(s: Structure): string {
  const n = s.atoms.length;
  const formula = molecularFormula(s);
  if (n === 0) return `${formula}/0000000000000000`;
  const prep = prepare(s);
  const { inv, csr: g } = prep;
  const p = refinedPartition(prep);
  const cell = cellIndex(p);
  // The mixing is written out inline (a closure over h1/h2 would box both on every step).
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193 ^ n;
  let x = 0;
  const nb: number[] = [];
  for (let s0 = 0; s0 < n; s0 += p.len[s0]) {
    const v = p.lab[s0];
    x = p.len[s0] | 0;
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995);
    h2 ^= h2 >>> 13;
    x = Math.floor(inv[v] / 4294967296) | 0;
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995);
    h2 ^= h2 >>> 13;
    x = (inv[v] % 4294967296) | 0;
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995);
    h2 ^= h2 >>> 13;
    // Neighbour codes in ascending order (insertion sort: degrees are small).
    let d = 0;
    for (let e = g.offs[v]; e < g.offs[v + 1]; e++) {
      const c = cell[g.adj[e]] * 8 + g.code[e];
      let j = d++;
      while (j > 0 && nb[j - 1] > c) {
        nb[j] = nb[j - 1];
        j--;
      }
      nb[j] = c;
    }
    x = d;
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995);
    h2 ^= h2 >>> 13;
    for (let j = 0; j < d; j++) {
      x = nb[j] | 0;
      h1 = Math.imul(h1 ^ x, 0x01000193);
      h2 = Math.imul(h2 ^ x, 0x5bd1e995);
      h2 ^= h2 >>> 13;
    }
  }
  const hex = (x: number) => (x >>> 0).toString(16).padStart(8, '0');
  return `${formula}/${hex(h1)}${hex(h2)}`;
}
