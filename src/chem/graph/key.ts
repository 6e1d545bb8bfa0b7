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
  const list = atoms ?? s.atoms.map((_, i) => i);
  for (const i of list) {
    const a = s.atoms[i];
    if (!a) continue;
    h += a.hCount;
    charge += a.charge;
    if (a.atomicNumber === 0 || a.element === '*') wildcards++;
    else if (a.atomicNumber === 1) h++;
    else counts.set(a.element, (counts.get(a.element) ?? 0) + 1);
  }
  if (h > 0) counts.set('H', h);
  const hasC = counts.has('C');
  const order = [...counts.keys()].sort((x, y) => {
    if (hasC) {
      const rank = (e: string) => (e === 'C' ? 0 : e === 'H' ? 1 : 2);
      const d = rank(x) - rank(y);
      if (d !== 0) return d;
    }
    return x < y ? -1 : x > y ? 1 : 0;
  });
  let out = '';
  for (const e of order) {
    const c = counts.get(e)!;
    out += c === 1 ? e : `${e}${c}`;
  }
  if (wildcards > 0) out += wildcards === 1 ? '*' : `*${wildcards}`;
  if (charge !== 0) out += `${Math.abs(charge) === 1 ? '' : Math.abs(charge)}${charge > 0 ? '+' : '-'}`;
  return out;
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
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193 ^ n;
  const mix = (x: number) => {
    h1 = Math.imul(h1 ^ (x | 0), 0x01000193);
    h2 = Math.imul(h2 ^ (x | 0), 0x5bd1e995);
    h2 ^= h2 >>> 13;
  };
  const nb: number[] = [];
  for (let s0 = 0; s0 < n; s0 += p.len[s0]) {
    const v = p.lab[s0];
    mix(p.len[s0]);
    mix(Math.floor(inv[v] / 4294967296));
    mix(inv[v] % 4294967296);
    nb.length = 0;
    for (let e = g.offs[v]; e < g.offs[v + 1]; e++) nb.push(cell[g.adj[e]] * 8 + g.code[e]);
    nb.sort((x, y) => x - y);
    mix(nb.length);
    for (const x of nb) mix(x);
  }
  const hex = (x: number) => (x >>> 0).toString(16).padStart(8, '0');
  return `${formula}/${hex(h1)}${hex(h2)}`;
}
