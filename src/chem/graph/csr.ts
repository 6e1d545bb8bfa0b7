/** Compressed adjacency with bond codes for refinement and search (single structures and disjoint unions). */
import type { Structure } from '../types.js';
import { AROMATIC_CODE, type CsrGraph } from './refine.js';

/** Bond code used for equality: aromatic bonds match each other whatever their Kekulé order. */
export function bondCode(s: Structure, k: number, aromatic: readonly boolean[] | undefined): number {
  return aromatic?.[k] ? AROMATIC_CODE : s.bonds[k].order;
}

function valid(s: Structure, k: number): boolean {
  const { a, b } = s.bonds[k];
  const n = s.atoms.length;
  return a >= 0 && b >= 0 && a < n && b < n && a !== b;
}

/** CSR of one or more structures laid side by side (atoms of parts[1] follow those of parts[0]). */
export function csrOf(parts: { s: Structure; aromatic?: readonly boolean[] }[]): CsrGraph {
  let n = 0;
  for (const p of parts) n += p.s.atoms.length;
  const offs = new Int32Array(n + 1);
  let base = 0;
  for (const { s } of parts) {
    for (let k = 0; k < s.bonds.length; k++) {
      if (!valid(s, k)) continue;
      offs[base + s.bonds[k].a + 1]++;
      offs[base + s.bonds[k].b + 1]++;
    }
    base += s.atoms.length;
  }
  for (let i = 0; i < n; i++) offs[i + 1] += offs[i];
  const adj = new Int32Array(offs[n]);
  const code = new Int32Array(offs[n]);
  const fill = offs.slice(0, n);
  base = 0;
  for (const { s, aromatic } of parts) {
    for (let k = 0; k < s.bonds.length; k++) {
      if (!valid(s, k)) continue;
      const a = base + s.bonds[k].a;
      const b = base + s.bonds[k].b;
      const c = bondCode(s, k, aromatic);
      adj[fill[a]] = b;
      code[fill[a]++] = c;
      adj[fill[b]] = a;
      code[fill[b]++] = c;
    }
    base += s.atoms.length;
  }
  return { n, offs, adj, code };
}
