/**
 * `/` `\` marks on single bonds so that every stored double-bond configuration reads back as stored
 * (OpenSMILES, cis/trans). One unknown per marked bond: s = +1 writes '/', -1 writes '\', relative to the
 * emitted order of its atoms (parent -> child; ring opening -> ring closing, the mark written at the opening
 * digit). Each double bond asks for a product of two unknowns; bonds shared between double bonds (dienes) tie
 * the constraints together, so they are solved as one parity problem (union-find with parity). Where a choice
 * exists, bonds already marked are reused and bonds next to an unspecified double bond are avoided, so the
 * output does not invent a configuration for it.
 */
import { IMPLICIT_H, type DoubleBondStereo, type Structure } from '../types.js';
import type { Emission } from './smiles-stereo.js';

interface Side {
  bond: number;
  /** +1 when the bond leads to the stored reference, -1 when to the other substituent. */
  factor: number;
}

class ParityForest {
  private readonly up = new Map<number, number>();
  private readonly sign = new Map<number, number>();
  has(k: number): boolean {
    return this.up.has(k);
  }
  find(k: number): [number, number] {
    if (!this.up.has(k)) return [k, 1];
    let sg = 1;
    let r = k;
    while (this.up.get(r) !== r) {
      sg *= this.sign.get(r)!;
      r = this.up.get(r)!;
    }
    return [r, sg];
  }
  /** Would value(a) * value(b) = want be consistent? */
  consistent(a: number, b: number, want: number): boolean {
    const [ra, sa] = this.find(a);
    const [rb, sb] = this.find(b);
    return ra !== rb || sa * sb === want;
  }
  /** Requires value(a) * value(b) = want; returns false (and changes nothing) when that contradicts. */
  join(a: number, b: number, want: number): boolean {
    for (const k of [a, b]) {
      if (!this.up.has(k)) {
        this.up.set(k, k);
        this.sign.set(k, 1);
      }
    }
    const [ra, sa] = this.find(a);
    const [rb, sb] = this.find(b);
    if (ra === rb) return sa * sb === want;
    this.up.set(rb, ra);
    this.sign.set(rb, want * sa * sb);
    return true;
  }
  values(): Map<number, number> {
    const res = new Map<number, number>();
    for (const k of this.up.keys()) res.set(k, this.find(k)[1]);
    return res;
  }
}

export function assignBondDirections(s: Structure, em: Emission): Map<number, number> {
  const dbs = s.stereo.filter((x): x is DoubleBondStereo => x.kind === 'double-bond');
  if (dbs.length === 0) return new Map();
  const n = s.atoms.length;
  const first = new Int32Array(s.bonds.length).fill(-1);
  for (let u = 0; u < n; u++) {
    if (em.parentBond[u]! >= 0) first[em.parentBond[u]!] = em.parent[u]!;
    for (const k of em.ringOpen[u]!) first[k] = u;
  }
  const singles: { to: number; bond: number }[][] = Array.from({ length: n }, () => []);
  const unspecifiedDouble = new Uint8Array(n); // atom has a double bond with no stored configuration
  const specified = new Set(
    dbs.map((d) => `${Math.min(d.ends[0], d.ends[1])}-${Math.max(d.ends[0], d.ends[1])}`),
  );
  s.bonds.forEach((b, k) => {
    if (b.a === b.b || b.a < 0 || b.b < 0 || b.a >= n || b.b >= n) return;
    if (b.order === 1) {
      singles[b.a]!.push({ to: b.b, bond: k });
      singles[b.b]!.push({ to: b.a, bond: k });
    } else if (
      b.order === 2 &&
      !b.aromatic &&
      !specified.has(`${Math.min(b.a, b.b)}-${Math.max(b.a, b.b)}`)
    ) {
      unspecifiedDouble[b.a] = 1;
      unspecifiedDouble[b.b] = 1;
    }
  });
  const forest = new ParityForest();
  // pos(x relative to t) through bond k = sigma * value(k): +1 when t is written first on that bond
  const sigma = (k: number, t: number): number => (first[k] === t ? 1 : -1);

  const options = (d: DoubleBondStereo, e: 0 | 1): Side[] => {
    const t = d.ends[e];
    const ref = d.refs[e];
    const subs = singles[t]!.filter((o) => o.to !== d.ends[1 - e]);
    const out: Side[] = [];
    for (const o of subs) {
      if (o.to === ref) out.push({ bond: o.bond, factor: 1 });
      else if (ref === IMPLICIT_H || subs.some((x) => x.to === ref)) out.push({ bond: o.bond, factor: -1 });
    }
    const score = (x: Side): number => {
      if (forest.has(x.bond)) return 0;
      const b = s.bonds[x.bond]!;
      return unspecifiedDouble[b.a === t ? b.b : b.a] ? 2 : 1;
    };
    return out.sort((x, y) => score(x) - score(y));
  };

  for (const d of dbs) {
    const rel = d.relation === 'cis' ? 1 : -1;
    let done = false;
    for (const o0 of options(d, 0)) {
      for (const o1 of options(d, 1)) {
        if (o0.bond === o1.bond) continue;
        const want = rel * o0.factor * o1.factor * sigma(o0.bond, d.ends[0]) * sigma(o1.bond, d.ends[1]);
        if (forest.consistent(o0.bond, o1.bond, want)) {
          forest.join(o0.bond, o1.bond, want);
          done = true;
          break;
        }
      }
      if (done) break;
    }
  }
  // Where both substituents of a stereo end carry marks (reused from a neighbouring double bond), the marks must
  // put them on opposite sides, or the reader sees a contradiction.
  for (let changed = true, round = 0; changed && round < 4; round++) {
    changed = false;
    for (const d of dbs) {
      for (const e of [0, 1] as const) {
        const t = d.ends[e];
        const marked = singles[t]!.filter((o) => o.to !== d.ends[1 - e] && forest.has(o.bond));
        if (marked.length !== 2) continue;
        const [x, y] = [marked[0]!.bond, marked[1]!.bond];
        const want = -1 * sigma(x, t) * sigma(y, t);
        const [rx] = forest.find(x);
        const [ry] = forest.find(y);
        if (rx !== ry && forest.join(x, y, want)) changed = true;
      }
    }
  }
  return forest.values();
}
