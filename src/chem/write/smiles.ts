/**
 * Structure -> SMILES (Kekulé form, not canonical). Atoms are visited depth-first in the priority given by
 * `order` (default: input order); each component starts from its first atom in that order; components are
 * joined by '.'. Stereo is written for the emitted neighbour order (smiles-stereo.ts); enhanced-stereo groups
 * follow as a CXSMILES block with indices renumbered to the output order.
 * Syntax: OpenSMILES specification (bracket atoms, bonds, branches, ring closures).
 */
import type { Atom, Structure } from '../types.js';
import { implicitHydrogens, atomicNumberOf, defaultValences, isMetal } from '../read/valence.js';
import { assignBondDirections } from './smiles-directions.js';
import { chiralMarks, type Emission } from './smiles-stereo.js';

export interface WriteSmilesOptions {
  /** Atom priority for the traversal: a permutation (or prefix) of atom indices. */
  order?: number[];
  /** Write stereo marks and groups (default true). */
  stereo?: boolean;
}

const ORGANIC = new Set(['B', 'C', 'N', 'O', 'P', 'S', 'F', 'Cl', 'Br', 'I']);

/** Depth-first traversal: tree edges, ring-closure bonds, emission order. */
function traverse(s: Structure, order: number[] | undefined): Emission {
  const n = s.atoms.length;
  const rank = new Int32Array(n);
  for (let i = 0; i < n; i++) rank[i] = n + i;
  const starts: number[] = [];
  if (order) {
    order.forEach((a, k) => {
      if (a >= 0 && a < n && rank[a]! >= n) {
        rank[a] = k;
        starts.push(a);
      }
    });
  }
  for (let i = 0; i < n; i++) if (rank[i]! >= n) starts.push(i);
  const adj: { to: number; bond: number }[][] = Array.from({ length: n }, () => []);
  s.bonds.forEach((b, k) => {
    if (b.a === b.b || b.a < 0 || b.b < 0 || b.a >= n || b.b >= n) return;
    adj[b.a]!.push({ to: b.b, bond: k });
    adj[b.b]!.push({ to: b.a, bond: k });
  });
  for (const l of adj) l.sort((x, y) => rank[x.to]! - rank[y.to]!);

  const parent = new Int32Array(n).fill(-1);
  const parentBond = new Int32Array(n).fill(-1);
  const children: number[][] = Array.from({ length: n }, () => []);
  const ringOpen: number[][] = Array.from({ length: n }, () => []);
  const ringClose: number[][] = Array.from({ length: n }, () => []);
  const visited = new Uint8Array(n);
  const bondSeen = new Uint8Array(s.bonds.length);
  const roots: number[] = [];
  const iter = new Int32Array(n);
  for (const r of starts) {
    if (visited[r]) continue;
    roots.push(r);
    visited[r] = 1;
    const stack = [r];
    while (stack.length > 0) {
      const u = stack[stack.length - 1]!;
      const l = adj[u]!;
      if (iter[u]! >= l.length) {
        stack.pop();
        continue;
      }
      const { to: v, bond } = l[iter[u]!++]!;
      if (bondSeen[bond]) continue;
      bondSeen[bond] = 1;
      if (visited[v]) {
        ringOpen[v]!.push(bond);
        ringClose[u]!.push(bond);
      } else {
        visited[v] = 1;
        parent[v] = u;
        parentBond[v] = bond;
        children[u]!.push(v);
        stack.push(v);
      }
    }
  }
  // emitted neighbour order: parent, ring closures (closing first, then opening), children
  const nbrOrder: number[][] = new Array(n);
  const ringBondsAt: number[][] = new Array(n);
  for (let u = 0; u < n; u++) {
    const rb = [...ringClose[u]!, ...ringOpen[u]!];
    ringBondsAt[u] = rb;
    const list: number[] = [];
    if (parent[u]! >= 0) list.push(parent[u]!);
    for (const k of rb) {
      const b = s.bonds[k]!;
      list.push(b.a === u ? b.b : b.a);
    }
    list.push(...children[u]!);
    nbrOrder[u] = list;
  }
  // emission order = preorder with children in order
  const outIndex = new Int32Array(n).fill(-1);
  let next = 0;
  for (const r of roots) {
    const st = [r];
    while (st.length > 0) {
      const u = st.pop()!;
      outIndex[u] = next++;
      const ch = children[u]!;
      for (let k = ch.length - 1; k >= 0; k--) st.push(ch[k]!);
    }
  }
  return { roots, parent, parentBond, children, ringOpen, ringClose, ringBondsAt, nbrOrder, outIndex };
}

export function writeSmiles(s: Structure, opts: WriteSmilesOptions = {}): string {
  return writeSmilesWithOrder(s, opts).smiles;
}

/** As writeSmiles, also returning `atomOrder`: the input atom index of each written atom, in output order. */
export function writeSmilesWithOrder(
  s: Structure,
  opts: WriteSmilesOptions = {},
): { smiles: string; atomOrder: number[] } {
  const withStereo = opts.stereo !== false;
  const em = traverse(s, opts.order);
  const chir = withStereo ? chiralMarks(s, em) : new Map<number, string>();
  const dir = withStereo ? assignBondDirections(s, em) : new Map<number, number>();
  const valence = new Int32Array(s.atoms.length);
  // bonds to metals, which the readers do not count against a neutral N's three (read/valence.ts)
  const toMetal = new Int32Array(s.atoms.length);
  const metal = (i: number) => isMetal(atomicNumberOf(s.atoms[i]!.element) ?? 0);
  for (const b of s.bonds) {
    if (b.a >= 0 && b.a < valence.length) valence[b.a] += b.order;
    if (b.b >= 0 && b.b < valence.length && b.b !== b.a) valence[b.b] += b.order;
    if (b.a >= 0 && b.a < valence.length && b.b >= 0 && b.b < valence.length && b.b !== b.a) {
      if (metal(b.b)) toMetal[b.a] += b.order;
      if (metal(b.a)) toMetal[b.b] += b.order;
    }
  }
  const out: string[] = [];
  const freeDigits: number[] = [];
  let nextDigit = 1;
  const digitOf = new Map<number, number>();
  const takeDigit = (): number => {
    if (freeDigits.length > 0) {
      freeDigits.sort((a, b) => a - b);
      return freeDigits.shift()!;
    }
    return nextDigit++;
  };
  const bondText = (k: number): string => {
    const d = dir.get(k);
    if (d !== undefined) return d > 0 ? '/' : '\\';
    switch (s.bonds[k]!.order) {
      case 2:
        return '=';
      case 3:
        return '#';
      case 4:
        return '$';
      default:
        return '';
    }
  };
  em.roots.forEach((r, ci) => {
    if (ci > 0) out.push('.');
    // stack items: atom index (>= 0) or a literal via negative codes: -1 '(' , -2 ')'
    const st: number[] = [r];
    while (st.length > 0) {
      const u = st.pop()!;
      if (u === -1) {
        out.push('(');
        continue;
      }
      if (u === -2) {
        out.push(')');
        continue;
      }
      if (em.parentBond[u]! >= 0) out.push(bondText(em.parentBond[u]!));
      out.push(atomText(s.atoms[u]!, valence[u]!, chir.get(u) ?? '', toMetal[u]!));
      const release: number[] = [];
      for (const k of em.ringClose[u]!) {
        const d = digitOf.get(k)!;
        out.push(ringDigit(d));
        release.push(d);
      }
      for (const k of em.ringOpen[u]!) {
        const d = takeDigit();
        digitOf.set(k, d);
        out.push(bondText(k), ringDigit(d));
      }
      freeDigits.push(...release);
      const ch = em.children[u]!;
      for (let k = ch.length - 1; k >= 0; k--) {
        if (k === ch.length - 1) st.push(ch[k]!);
        else st.push(-2, ch[k]!, -1);
      }
    }
  });
  let smi = out.join('');
  const parts: string[] = [];
  // A radical the bracket atom does not imply by itself (one on an atom that could hold more bonds) is written
  // in the CXSMILES block, so that reading the SMILES back gives the same structure.
  const byCount: [number[], number[]] = [[], []];
  for (let a = 0; a < s.atoms.length; a++) {
    const at = s.atoms[a]!;
    if (at.radical > 0 && impliedRadical(at, valence[a]!) !== at.radical)
      byCount[at.radical >= 2 ? 1 : 0].push(em.outIndex[a]!);
  }
  byCount.forEach((idx, k) => {
    if (idx.length > 0) parts.push(`^${k + 1}:${idx.sort((x, y) => x - y).join(',')}`);
  });
  if (withStereo && s.groups.length > 0) {
    for (const g of s.groups) {
      const idx = g.atoms.filter((a) => a >= 0 && a < s.atoms.length).map((a) => em.outIndex[a]!);
      if (idx.length === 0) continue;
      idx.sort((a, b) => a - b);
      const head = g.type === 'abs' ? 'a' : g.type === 'and' ? `&${g.id}` : `o${g.id}`;
      parts.push(`${head}:${idx.join(',')}`);
    }
  }
  if (parts.length > 0) smi += ` |${parts.join(',')}|`;
  const atomOrder = new Array<number>(s.atoms.length);
  for (let a = 0; a < s.atoms.length; a++) atomOrder[em.outIndex[a]!] = a;
  return { smiles: smi, atomOrder };
}

/** The radical a reader infers from a bracket atom: what its bonds and H leave of its lowest normal valence. */
function impliedRadical(a: Atom, valence: number): number {
  const vals = defaultValences(a.atomicNumber, a.charge);
  const used = valence + a.hCount;
  return vals.length > 0 && used < vals[0]! ? Math.min(2, vals[0]! - used) : 0;
}

function ringDigit(d: number): string {
  return d < 10 ? String(d) : d < 100 ? `%${d}` : `%(${d})`;
}

function atomText(a: Atom, valence: number, chir: string, toMetal: number): string {
  let sym = a.element;
  let isotope = a.isotope;
  if (sym === 'D' || sym === 'T') {
    isotope = isotope ?? (sym === 'D' ? 2 : 3);
    sym = 'H';
  } else if (sym !== '*' && atomicNumberOf(sym) === undefined) {
    sym = '*';
  }
  let bracket = chir !== '' || a.charge !== 0 || isotope !== null || a.mapNumber !== null || a.radical !== 0;
  if (!bracket) {
    if (sym === '*') bracket = a.hCount !== 0;
    else if (!ORGANIC.has(sym)) bracket = true;
    else {
      // A neutral N with bond-order sum 4 in the organic subset would get 1 H (valence 5) by the OpenSMILES rule,
      // but our readers refuse a neutral N with four bonds, none of them to a metal, and no explicit H
      // (valence.ts): write [NH] so that what was read (an [nH] given an extra double bond, say) reads back.
      bracket =
        implicitHydrogens(atomicNumberOf(sym)!, 0, valence) !== a.hCount ||
        (sym === 'N' && valence === 4 && toMetal === 0);
    }
  }
  if (!bracket) return sym;
  let t = '[';
  if (isotope !== null) t += String(isotope);
  t += sym + chir;
  if (a.hCount > 0) t += a.hCount === 1 ? 'H' : `H${a.hCount}`;
  if (a.charge !== 0) {
    const sign = a.charge > 0 ? '+' : '-';
    const mag = Math.abs(a.charge);
    t += mag === 1 ? sign : sign + String(mag);
  }
  if (a.mapNumber !== null) t += `:${a.mapNumber}`;
  return t + ']';
}
