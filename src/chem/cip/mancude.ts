/**
 * Mancude rings (P-92.1.4.4, IUPAC 2013, from memory): in a ring with the maximum number of non-cumulative double
 * bonds the digraph must not depend on the Kekulé structure drawn, so the duplicate atom each ring atom gets for
 * its ring double bond carries the mean atomic number of the ring neighbours it could be double-bonded to
 * (pyridine C2: (7 + 6) / 2 = 6.5; benzene: 6).
 *
 * Which rings count is decided here from the Kekulé structure alone, so SMILES and molfile input agree: a ring
 * of 5 to 8 atoms is mancude when every atom has a double bond inside the ring system or a lone pair to give
 * (N, O, S, Se, P without a double bond, a carbanion), and the π count is 4n + 2.
 */
import type { Structure } from '../types.js';

export interface Mancude {
  /** Per bond key (a * n + b, both orders), whether the bond lies in a mancude ring. */
  bond: Set<number>;
  /** Mean atomic number for the duplicate of each mancude atom; 0 elsewhere. */
  dupZ: number[];
}

export function perceiveMancude(s: Structure, nbr: number[][], ord: number[][]): Mancude {
  const n = s.atoms.length;
  const bond = new Set<number>();
  const dupZ = new Array<number>(n).fill(0);
  if (!nbr.some((o, a) => ord[a].some((x, i) => x === 2 && o[i] > a))) return { bond, dupZ };
  const rings = smallRings(n, nbr, 8);
  const ringBond = new Set<number>();
  for (const r of rings) {
    for (let i = 0; i < r.length; i++) {
      ringBond.add(key(n, r[i], r[(i + 1) % r.length]));
      ringBond.add(key(n, r[(i + 1) % r.length], r[i]));
    }
  }
  const piDouble = (a: number): boolean => nbr[a].some((b, i) => ord[a][i] === 2 && ringBond.has(key(n, a, b)));
  for (const r of rings) {
    let pi = 0;
    let ok = true;
    for (const a of r) {
      const at = s.atoms[a];
      const exoDouble = nbr[a].some((b, i) => ord[a][i] >= 2 && !ringBond.has(key(n, a, b)));
      if (exoDouble || nbr[a].some((_, i) => ord[a][i] === 3)) {
        ok = false;
        break;
      }
      if (piDouble(a)) pi += 1;
      else if ([7, 8, 15, 16, 34].includes(at.atomicNumber) && at.charge <= 0) pi += 2;
      else if (at.atomicNumber === 6 && at.charge === -1) pi += 2;
      else {
        ok = false;
        break;
      }
    }
    if (!ok || pi % 4 !== 2) continue;
    for (let i = 0; i < r.length; i++) {
      const a = r[i];
      const b = r[(i + 1) % r.length];
      bond.add(key(n, a, b));
      bond.add(key(n, b, a));
    }
  }
  for (let a = 0; a < n; a++) {
    if (!piDouble(a)) continue;
    let sum = 0;
    let cnt = 0;
    nbr[a].forEach((b) => {
      if (bond.has(key(n, a, b)) && piDouble(b)) {
        sum += s.atoms[b].atomicNumber;
        cnt++;
      }
    });
    if (cnt > 0) dupZ[a] = sum / cnt;
  }
  return { bond, dupZ };
}

export function key(n: number, a: number, b: number): number {
  return a * n + b;
}

/** The smallest ring through each bond (up to `max` atoms), deduplicated; enough for ring perception here. */
function smallRings(n: number, nbr: number[][], max: number): number[][] {
  const seen = new Set<string>();
  const out: number[][] = [];
  const prev = new Int32Array(n);
  const dist = new Int32Array(n);
  for (let u = 0; u < n; u++) {
    for (const v of nbr[u]) {
      if (v < u) continue;
      // shortest path from u to v not using the bond u-v
      prev.fill(-1);
      dist.fill(-1);
      dist[u] = 0;
      const q = [u];
      let found = false;
      for (let qi = 0; qi < q.length && !found; qi++) {
        const x = q[qi];
        if (dist[x] >= max - 1) break;
        for (const y of nbr[x]) {
          if (x === u && y === v) continue;
          if (dist[y] >= 0) continue;
          dist[y] = dist[x] + 1;
          prev[y] = x;
          if (y === v) {
            found = true;
            break;
          }
          q.push(y);
        }
      }
      if (!found) continue;
      const ring: number[] = [];
      for (let x = v; x !== -1; x = prev[x]) ring.push(x);
      const id = [...ring].sort((a, b) => a - b).join(',');
      if (seen.has(id)) continue;
      seen.add(id);
      out.push(ring);
    }
  }
  return out;
}
