/**
 * Helicenes (P-92.1.2.2.1 / P-93.5.6, IUPAC 2013, from memory): ortho-fused rings that wind into a helix are a
 * helical stereogenic unit, P for a right-handed and M for a left-handed helix. No reader records this unit, so
 * it is found here from the drawing: the inner rim of the helix (two terminal CH atoms joined by a chain of one
 * fusion atom per fused ring pair) gives the sense of the helix from its torsion angles, with coordinates from a
 * 3D file or, in a 2D drawing, heights taken from the wedges. The label goes on the two terminal atoms, as the
 * CIP validation suite writes it.
 */
import type { CipLabel } from '../facts.js';
import type { Structure } from '../types.js';

export interface HelixResult {
  label: CipLabel;
  /** The terminal atoms of the inner rim (atom indices). */
  atoms: [number, number];
}

type Vec = [number, number, number];

/** Rings of up to 6 atoms through each atom, as atom lists (enough to see ortho-fusion). */
function smallRings(s: Structure, nbr: number[][]): number[][] {
  const out: number[][] = [];
  const seen = new Set<string>();
  const path: number[] = [];
  const walk = (start: number, x: number): void => {
    if (path.length > 6) return;
    for (const y of nbr[x]) {
      if (y === start && path.length >= 5) {
        const id = [...path].sort((a, b) => a - b).join(',');
        if (!seen.has(id)) {
          seen.add(id);
          out.push([...path]);
        }
      } else if (y > start && !path.includes(y) && path.length < 6) {
        path.push(y);
        walk(start, y);
        path.pop();
      }
    }
  };
  for (let a = 0; a < s.atoms.length; a++) {
    if (nbr[a].length < 2) continue;
    path.push(a);
    walk(a, a);
    path.pop();
  }
  return out;
}

function torsion(p0: Vec, p1: Vec, p2: Vec, p3: Vec): number {
  const sub = (a: Vec, b: Vec): Vec => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
  const cross = (a: Vec, b: Vec): Vec => [
    a[1] * b[2] - a[2] * b[1],
    a[2] * b[0] - a[0] * b[2],
    a[0] * b[1] - a[1] * b[0],
  ];
  const dot = (a: Vec, b: Vec): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const b1 = sub(p1, p0);
  const b2 = sub(p2, p1);
  const b3 = sub(p3, p2);
  const n1 = cross(b1, b2);
  const n2 = cross(b2, b3);
  return Math.atan2(Math.sqrt(dot(b2, b2)) * dot(b1, n2), dot(n1, n2));
}

/** Positions: 3D coordinates, or 2D ones lifted by the wedges (the wide end of a wedge up, of a hash down). */
function positions(s: Structure): Vec[] | null {
  if (s.atoms.some((a) => a.coords === null)) return null;
  const p = s.atoms.map((a) => [...(a.coords as Vec)] as Vec);
  if (s.dimension === 3) return p;
  for (const b of s.bonds) {
    if (b.wedge !== 'up' && b.wedge !== 'down') continue;
    const pa = p[b.a];
    const pb = p[b.b];
    const len = Math.hypot(pb[0] - pa[0], pb[1] - pa[1]);
    pb[2] = pa[2] + (b.wedge === 'up' ? 0.8 : -0.8) * len;
  }
  return p;
}

/** The inner rim of a potential helix, from the constitution: terminal atoms and the fusion-atom chain. */
export interface HelixRim {
  /** Terminal CH atoms of the inner rim (where the label goes). */
  ends: [number, number];
  /** The fusion atoms between them, in order from ends[0]. */
  chain: number[];
}

/** Ortho-fused ring chains that wind into a helix ([5]helicene and up), found from the constitution alone. */
export function helixRims(s: Structure): HelixRim[] {
  const n = s.atoms.length;
  if (n < 18) return [];
  const nbr: number[][] = s.atoms.map(() => []);
  for (const b of s.bonds) {
    nbr[b.a].push(b.b);
    nbr[b.b].push(b.a);
  }
  const heavy = (a: number): number[] => nbr[a].filter((b) => s.atoms[b].atomicNumber > 1);
  const rings = smallRings(s, nbr).filter((r) => r.length === 6 || r.length === 5);
  if (rings.length < 5) return [];
  const ringCount = new Map<number, number>();
  const bondKey = (a: number, b: number): number => Math.min(a, b) * n + Math.max(a, b);
  for (const r of rings) {
    for (let i = 0; i < r.length; i++) {
      const k = bondKey(r[i], r[(i + 1) % r.length]);
      ringCount.set(k, (ringCount.get(k) ?? 0) + 1);
    }
  }
  const fusionAtom = new Array<boolean>(n).fill(false);
  for (const [k, c] of ringCount) {
    if (c < 2) continue;
    fusionAtom[Math.floor(k / n)] = true;
    fusionAtom[k % n] = true;
  }
  // inner-rim links: ring bonds between fusion atoms that belong to one ring only
  const link: number[][] = s.atoms.map(() => []);
  for (const [k, c] of ringCount) {
    const a = Math.floor(k / n);
    const b = k % n;
    if (c === 1 && fusionAtom[a] && fusionAtom[b]) {
      link[a].push(b);
      link[b].push(a);
    }
  }
  const out: HelixRim[] = [];
  const done = new Array<boolean>(n).fill(false);
  for (let a = 0; a < n; a++) {
    if (done[a] || link[a].length !== 1) continue;
    const chain = [a];
    done[a] = true;
    let prev = -1;
    let x = a;
    for (;;) {
      const next = link[x].filter((y) => y !== prev);
      if (next.length !== 1 || done[next[0]]) break;
      prev = x;
      x = next[0];
      chain.push(x);
      done[x] = true;
      if (link[x].length !== 2) break;
    }
    if (chain.length < 4) continue; // [5]helicene and up
    const cap = (end: number, inner: number): number => {
      const c = heavy(end).filter((y) => y !== inner && !fusionAtom[y] && ringCount.has(bondKey(end, y)));
      return c.length === 1 ? c[0] : -1;
    };
    const t0 = cap(chain[0], chain[1]);
    const t1 = cap(chain[chain.length - 1], chain[chain.length - 2]);
    if (t0 < 0 || t1 < 0) continue;
    out.push({ ends: [t0, t1], chain });
  }
  return out;
}

/** The sense of a helix from the drawing (3D coordinates, or 2D with wedges); null when the drawing is flat. */
export function helixSense(s: Structure, rim: HelixRim): 'P' | 'M' | null {
  if (s.dimension === 0) return null;
  const pos = positions(s);
  if (pos === null) return null;
  const path = [rim.ends[0], ...rim.chain, rim.ends[1]].map((i) => pos[i]);
  let sum = 0;
  for (let i = 0; i + 3 < path.length; i++) sum += torsion(path[i], path[i + 1], path[i + 2], path[i + 3]);
  if (Math.abs(sum) < 1e-3) return null; // flat drawing without wedges: not defined
  return sum > 0 ? 'P' : 'M';
}

export function findHelices(s: Structure): HelixResult[] {
  if (s.dimension === 0) return [];
  const out: HelixResult[] = [];
  for (const rim of helixRims(s)) {
    const label = helixSense(s, rim);
    if (label !== null) out.push({ label, atoms: rim.ends });
  }
  return out;
}
