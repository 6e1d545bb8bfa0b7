/**
 * Property tests (fast-check) of the invariants the GUIDE asks for, over real structures with drawn stereo from
 * MoleculeNet (Wu et al., Chem. Sci. 2018, 9, 513–530) plus textbook cases:
 *   - the mirror of the mirror is the original;
 *   - relations are symmetric (enantiomers <-> enantiomers, identical <-> identical, ...);
 *   - writing the same molecule in another atom order changes no computed fact.
 */
import fc from 'fast-check';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import type { StructureFacts } from '../../src/chem/facts.js';
import { parseSmiles } from '../../src/chem/read/smiles.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import type { Structure } from '../../src/chem/types.js';
import { writeSmiles } from '../../src/chem/write/smiles.js';
import { haveSharedData } from '../support/shared-data.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { shuffle } from './graph/permute.js';

const TEXTBOOK = [
  'OC(=O)[C@@H](O)[C@@H](O)C(O)=O',
  'OC(=O)[C@@H](O)[C@H](O)C(O)=O',
  'C[C@H]1CC[C@@H](C)CC1',
  'C[C@H]1CCCC[C@H]1C',
  'OC(=O)[C@@H](O)[C@H](O)[C@@H](O)C(O)=O',
  'C/C=C/C=C\\C',
  'CC=[C@]=CC',
  'O[C@H]1[C@H](O)[C@@H](O)[C@H](O)[C@@H](O)[C@@H]1O',
  'CC1(C)[C@@H]2CC[C@@]1(C)C(=O)C2',
];

function pool(): Structure[] {
  const smiles = [...TEXTBOOK];
  if (haveSharedData('moleculenet')) {
    const rows = loadMoleculeNet().filter((r) => /[@/\\]/.test(r.smiles) && r.smiles.length < 90);
    for (let i = 0; i < rows.length; i += Math.max(1, Math.floor(rows.length / 150)))
      smiles.push(rows[i].smiles);
  }
  return smiles.flatMap((s) => {
    const r = parseSmiles(s);
    return r.ok ? [r.structure] : [];
  });
}

const structures = pool();
const anyStructure = fc.constantFrom(...structures);

/** Facts in terms of atom-map numbers (set to the original index + 1), so two atom orders can be compared. */
function portable(f: StructureFacts, s: Structure): unknown {
  const byInput = new Map(s.atoms.map((a) => [a.inputNumber, a.mapNumber]));
  const mapped = (n: number): number | null | undefined => byInput.get(n);
  return {
    units: f.units
      .map((u) => ({
        kind: u.kind,
        atoms: u.atoms.map(mapped).sort(),
        label: u.label,
        defined: u.defined,
        pseudo: u.pseudoasymmetric,
      }))
      .sort((x, y) => JSON.stringify(x).localeCompare(JSON.stringify(y))),
    chiral: f.chiral,
    meso: f.meso,
    undefined: f.undefined,
    stereoisomers: f.stereoisomers,
    formula: f.formula,
    constitutionKey: f.constitutionKey,
    enhanced: f.enhanced.meaning,
    mirrorChiral: f.mirror.chiral,
    fixedAtoms: f.mirror.fixedAtoms.length,
  };
}

suite('properties of the stereo engine', () => {
  it('mirror(mirror(x)) is x, and mirror flips chirality only for chiral structures', () => {
    fc.assert(
      fc.property(anyStructure, (s) => {
        expect(mirror(mirror(s))).toEqual(s);
        const f = describe(s);
        const g = describe(mirror(s));
        expect(g.chiral).toBe(f.chiral);
        expect(g.stereoisomers).toEqual(f.stereoisomers);
      }),
      { numRuns: 60 },
    );
  });

  it('relate is symmetric (a structure vs its mirror image, vs itself with some centres inverted, vs another)', () => {
    fc.assert(
      fc.property(
        anyStructure,
        anyStructure,
        fc.constantFrom('mirror', 'invert-some', 'other'),
        fc.integer(),
        (a, b, how, bits) => {
          const other = how === 'mirror' ? mirror(a) : how === 'other' ? b : invertSome(a, bits);
          const ab = relate(a, other);
          const ba = relate(other, a);
          expect(ba.relation).toBe(ab.relation);
          expect(ba.differingUnits.length).toBe(ab.differingUnits.length);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('writing the molecule in another atom order changes no computed fact', () => {
    fc.assert(
      fc.property(anyStructure, fc.integer({ min: 1, max: 2 ** 31 - 1 }), (s0, seed) => {
        const s: Structure = { ...s0, atoms: s0.atoms.map((a, i) => ({ ...a, mapNumber: i + 1 })) };
        const order = shuffle(s.atoms.length, seed);
        const r = parseSmiles(writeSmiles(s, { order }));
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(portable(describe(r.structure), r.structure)).toEqual(portable(describe(s), s));
        expect(relate(s, r.structure).relation).toMatch(/identical|same-constitution/);
      }),
      { numRuns: 80 },
    );
  });
});

/** Inverts the tetrahedral centres selected by the bits of `bits`. */
function invertSome(s: Structure, bits: number): Structure {
  let k = 0;
  return {
    ...s,
    stereo: s.stereo.map((e) =>
      e.kind === 'tetrahedral' && (bits >> (k++ % 31)) & 1
        ? { ...e, winding: e.winding === '@' ? '@@' : '@' }
        : e,
    ),
  };
}
