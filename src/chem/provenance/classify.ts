/**
 * Each stereo unit of the product judged against the inputs placed on it (assign.ts): carried, formed or unmapped,
 * and for a carried unit the spatial configuration compared through the mapped neighbours.
 *
 * The comparison carries the input's configuration bit along the atom mapping onto the product unit's reference
 * ligands (perceive/units.ts `rebase`: the parity of the permutation the mapping induces on the four ligands), so it
 * never looks at CIP labels, which change when a new neighbour changes the priorities ((S)-alanine gives
 * (S)-N-acetylalanine, but (S)-2-butanol's centre keeps its arrangement when the label flips). An input with
 * constitutional symmetry can be mapped in several equivalent ways (the two ester groups of a meso diester); each
 * is tried, through the automorphisms the input's symmetry group lists, and the one agreeing best is reported.
 */
import type { Analysis } from '../describe/index.js';
import { mapToken, rebase, type State } from '../perceive/index.js';
import type { Assignment, Placement } from './assign.js';
import { bondClass, type McsGraph } from './mcs.js';
import type { FateReason, InputTrace, UnitFate, UnitOrigin } from './types.js';

interface Side {
  a: Analysis;
  g: McsGraph;
}

type Config = UnitOrigin['configuration'];

const num = (side: Side, atoms: readonly number[]): number[] =>
  atoms.map((x) => side.a.p.structure.atoms[x].inputNumber);

/** Is product atom x a place where placement q could grow by one more shared bond (x free of q, an atom of q's input left over)? */
function couldAlsoCome(x: number, q: Placement, input: McsGraph, product: McsGraph): boolean {
  for (let w = 0; w < input.n; w++) {
    if (q.map[w] >= 0 || input.element[w] !== product.element[x]) continue;
    const l = input.nbrs[w];
    for (let k = 0; k < l.length; k++) {
      const y = q.map[l[k]];
      if (y >= 0 && y !== x && bondClass(product, y, x) === input.cls[w][k]) return true;
    }
  }
  return false;
}

export interface Classified {
  units: UnitOrigin[];
  inputs: InputTrace[];
}

export function classify(product: Side, inputs: readonly (Side | null)[], asg: Assignment): Classified {
  const pa = product.a;
  const pp = pa.p;
  const nOut = pp.structure.atoms.length;
  const inverse = asg.placements.map((pl) => {
    const inv = new Int32Array(nOut).fill(-1);
    pl.map.forEach((v, u) => {
      if (v >= 0) inv[v] = u;
    });
    return inv;
  });
  const units: UnitOrigin[] = [];
  /** Per placement: carried units as [product unit, input unit, index into `units`]. */
  const carried: [number, number, number][][] = asg.placements.map(() => []);

  pp.units.forEach((pu, j) => {
    if (!pa.reported[j]) return;
    const base = {
      kind: pu.kind,
      atoms: num(product, pu.atoms),
      productDefined: pa.defined[j] === 1,
      inputDefined: false,
      configuration: 'open' as Config,
      neighbour: null as UnitOrigin['neighbour'],
    };
    const push = (
      fate: UnitFate,
      reason: FateReason,
      input: number | null = null,
      inputAtoms: number[] | null = null,
      neighbour: UnitOrigin['neighbour'] = null,
    ): void => {
      units.push({ ...base, fate, reason, input, inputAtoms, neighbour });
    };
    if (asg.bounded) return push('unmapped', 'bound');
    const owners = pu.atoms.map((x) => asg.owner[x]);
    if (owners.some((o) => o < 0)) return push('unmapped', 'not-covered');
    const o = owners[0];
    const pl = asg.placements[o];
    const k = pl.input;
    const side = inputs[k]!;
    const inv = inverse[o];
    if (owners.some((x) => x !== o)) return push('formed', 'atoms-from-two-inputs', k, null);
    const inAtoms = pu.atoms.map((x) => inv[x]);
    const inputAtoms = num(side, inAtoms);
    const ip = side.a.p;
    const i = ip.unitOfAtom[inAtoms[0]];
    const iu = i >= 0 ? ip.units[i] : null;
    if (
      iu === null ||
      !side.a.reported[i] ||
      iu.kind !== pu.kind ||
      iu.atoms.length !== inAtoms.length ||
      !inAtoms.every((x) => iu.atoms.includes(x))
    )
      return push('formed', 'new-unit', k, inputAtoms);
    // every bond at the unit's atoms kept, on both sides
    const nb = (x: number): UnitOrigin['neighbour'] => ({
      atom: pp.structure.atoms[x].inputNumber,
      input: asg.owner[x] < 0 ? null : asg.placements[asg.owner[x]].input,
    });
    for (const c of pu.atoms) {
      for (const x of product.g.nbrs[c]) {
        if (asg.owner[x] === o && bondClass(side.g, inv[c], inv[x]) === bondClass(product.g, c, x)) continue;
        // another input holds the neighbour, but this one could have brought it too: no telling which
        const mayBe = asg.owner[x] >= 0 && asg.owner[x] !== o && couldAlsoCome(x, pl, side.g, product.g);
        return push('formed', mayBe ? 'bond-may-be-made' : 'bond-changed', k, inputAtoms, nb(x));
      }
      for (const w of side.g.nbrs[inv[c]]) {
        if (pl.map[w] < 0 || bondClass(product.g, c, pl.map[w]) === 0)
          return push('formed', 'bond-changed', k, inputAtoms, null);
      }
    }
    const nIn = ip.structure.atoms.length;
    if (
      rebase(
        pu,
        iu.tokens.map((t) => mapToken(t, nIn, pl.map, nOut)),
        iu.bit,
      ) < 0
    )
      return push('formed', 'bond-changed', k, inputAtoms);
    // a neighbour another input could have brought: the bond to it may have been made
    for (const c of pu.atoms) {
      for (const x of product.g.nbrs[c]) {
        if (pu.atoms.includes(x)) continue;
        for (let q = 0; q < asg.placements.length; q++) {
          const other = asg.placements[q];
          if (q === o || other.input === k) continue;
          if (couldAlsoCome(x, other, inputs[other.input]!.g, product.g))
            return push('formed', 'bond-may-be-made', k, inputAtoms, {
              atom: nb(x)!.atom,
              input: other.input,
            });
        }
      }
    }
    units.push({
      ...base,
      fate: 'carried',
      reason: 'bonds-kept',
      input: k,
      inputAtoms,
      inputDefined: side.a.defined[i] === 1,
    });
    carried[o].push([j, i, units.length - 1]);
  });

  const perPlacement = asg.placements.map((pl, o) =>
    compare(product, inputs[pl.input]!, pl, carried[o], units),
  );
  const traces: InputTrace[] = [];
  inputs.forEach((side, k) => {
    const mine = asg.placements.map((pl, o) => ({ pl, o })).filter((x) => x.pl.input === k);
    const rel = mine.map((x) => perPlacement[x.o]).filter((r) => r !== 'none');
    const relative: InputTrace['relative'] =
      rel.length === 0
        ? 'none'
        : rel.every((r) => r === 'same')
          ? 'same'
          : rel.every((r) => r === 'mirror')
            ? 'mirror'
            : 'mixed';
    traces.push({
      input: k,
      copies: mine.length,
      heavyAtoms: side?.g.n ?? 0,
      atomsMapped: Math.max(0, ...mine.map((x) => x.pl.atoms)),
      bondsMapped: Math.max(0, ...mine.map((x) => x.pl.bonds)),
      relative,
    });
  });
  return { units, inputs: traces };
}

/**
 * The carried units of one placement compared with the input, over every equivalent mapping M∘σ (σ an
 * automorphism of the input): sets each unit's `configuration` from the mapping that agrees best, and returns
 * 'same' / 'mirror' / 'mixed' / 'none' for the units together.
 */
function compare(
  product: Side,
  input: Side,
  pl: Placement,
  list: readonly [number, number, number][],
  units: UnitOrigin[],
): InputTrace['relative'] {
  const pa = product.a;
  const ia = input.a;
  const nOut = pa.p.structure.atoms.length;
  const nIn = ia.p.structure.atoms.length;
  const x: State = pa.state;
  let best: Config[] | null = null;
  let bestSame = -1;
  let anySame = false;
  let anyMirror = false;
  for (const sigma of ia.group.atomMaps) {
    const inv = new Int32Array(nIn);
    sigma.forEach((v, u) => {
      inv[v] = u;
    });
    const verdict: Config[] = [];
    let same = 0;
    let compared = 0;
    let mirrorOk = true;
    let sameOk = true;
    for (const [j, i] of list) {
      const pu = pa.p.units[j];
      const i2 = ia.p.unitOfAtom[inv[ia.p.units[i].atoms[0]]];
      if (i2 < 0 || !ia.defined[i2] || !pa.defined[j]) {
        verdict.push('open');
        continue;
      }
      const iu = ia.p.units[i2];
      const tokens = iu.tokens.map((t) => mapToken(mapToken(t, nIn, sigma), nIn, pl.map, nOut));
      const y = rebase(pu, tokens, iu.bit);
      if (y < 0) {
        verdict.push('open');
        continue;
      }
      compared++;
      const agree = y === x[j];
      verdict.push(agree ? 'same' : 'inverted');
      if (agree) same++;
      else sameOk = false;
      // the mirror image inverts every parity unit and keeps every cis/trans unit
      if (agree === (pu.mode === 'parity')) mirrorOk = false;
    }
    if (compared > 0 && sameOk) anySame = true;
    if (compared > 0 && mirrorOk) anyMirror = true;
    if (same > bestSame) {
      bestSame = same;
      best = verdict;
    }
  }
  list.forEach(([, , u], k) => {
    units[u].configuration = best?.[k] ?? 'open';
  });
  if (!best || best.every((v) => v === 'open')) return 'none';
  return anySame ? 'same' : anyMirror ? 'mirror' : 'mixed';
}
