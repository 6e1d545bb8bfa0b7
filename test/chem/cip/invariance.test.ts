/**
 * Invariants of CIP labelling (common practice for testing canonical algorithms, no source beyond the
 * definitions): renumbering the atoms changes no descriptor; the mirror image (every tetrahedral and axial
 * configuration inverted, double bonds kept) inverts R/S, M/P and e/z and keeps r/s, m/p and E/Z
 * (IUPAC 2013 P-93.5.1.4, pseudoasymmetry, from memory). Structures: the CIP validation suite of Hanson et al.
 * 2018 (J. Chem. Inf. Model. 58, 1755), 2D SD file.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assignCip } from '../../../src/chem/cip/index.js';
import type { StereoElement, Structure } from '../../../src/chem/types.js';
import { haveSharedData } from '../../support/shared-data.js';
import { loadSdf } from './suite.js';

function labelsByInputNumber(s: Structure): string[] {
  return assignCip(s)
    .filter((r) => r.label !== null)
    .flatMap((r) => r.atoms.map((a) => `${s.atoms[a].inputNumber}${r.label}`))
    .sort();
}

/** The same molecule with atoms stored in the order `perm` (new index i holds old atom perm[i]). */
function renumber(s: Structure, perm: number[]): Structure {
  const inv = new Array<number>(perm.length);
  perm.forEach((old, i) => (inv[old] = i));
  const m = (x: number): number => (x < 0 ? x : inv[x]);
  const stereo: StereoElement[] = s.stereo.map((e) => {
    if (e.kind === 'tetrahedral')
      return { ...e, centre: m(e.centre), ligands: e.ligands.map(m) as [number, number, number, number] };
    if (e.kind === 'double-bond')
      return { ...e, ends: [m(e.ends[0]), m(e.ends[1])], refs: [m(e.refs[0]), m(e.refs[1])] };
    return {
      ...e,
      ends: [m(e.ends[0]), m(e.ends[1])],
      ligands: e.ligands.map(m) as [number, number, number, number],
    };
  });
  return {
    ...s,
    atoms: perm.map((old) => s.atoms[old]),
    bonds: s.bonds.map((b) => ({ ...b, a: m(b.a), b: m(b.b) })).reverse(),
    stereo: [...stereo].reverse(),
  };
}

function mirror(s: Structure): Structure {
  const flip = (w: '@' | '@@'): '@' | '@@' => (w === '@' ? '@@' : '@');
  return {
    ...s,
    stereo: s.stereo.map((e) => (e.kind === 'double-bond' ? e : { ...e, winding: flip(e.winding) })),
  };
}

const INVERT: Record<string, string> = { R: 'S', S: 'R', M: 'P', P: 'M', e: 'z', z: 'e' };

describe.skipIf(!haveSharedData('cip-validation-suite'))('CIP invariants on the validation suite', () => {
  const records = haveSharedData('cip-validation-suite')
    ? loadSdf('compounds_2d.sdf')
        .map((r) => r.structure)
        .filter((s): s is Structure => s !== null && s.stereo.length > 0 && s.atoms.length <= 40)
    : [];

  it('renumbering the atoms changes no descriptor', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: records.length - 1 }), fc.integer(), (i, seed) => {
        const s = records[i];
        const perm = s.atoms.map((_, k) => k);
        let x = seed | 0;
        for (let k = perm.length - 1; k > 0; k--) {
          x = (Math.imul(x, 1103515245) + 12345) | 0;
          const j = Math.abs(x) % (k + 1);
          [perm[k], perm[j]] = [perm[j], perm[k]];
        }
        expect(labelsByInputNumber(renumber(s, perm))).toEqual(labelsByInputNumber(s));
      }),
      { numRuns: 60, seed: 20180524 },
    );
  });

  it('the mirror image inverts chiral descriptors and keeps pseudoasymmetric ones and E/Z', () => {
    for (const s of records.slice(0, 120)) {
      const expected = labelsByInputNumber(s)
        .map((l) => {
          const d = l.slice(-1);
          return l.slice(0, -1) + (INVERT[d] ?? d);
        })
        .sort();
      expect(labelsByInputNumber(mirror(s))).toEqual(expected);
    }
  });
});
