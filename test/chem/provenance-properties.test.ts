/**
 * Property tests (fast-check, seeded, bounded) of the provenance engine over real structures with drawn stereo
 * from MoleculeNet (Wu et al., Chem. Sci. 2018, 9, 513–530) plus textbook cases, checked against the engine's own
 * symmetry analysis (an independent path: automorphisms and the mirror image):
 *   - a structure made from itself carries every defined unit with the same arrangement;
 *   - made from itself written in another atom order: the same;
 *   - made from its mirror image: the carried units together show the mirror arrangement, unless the structure is
 *     achiral (then some mapping gives the same);
 *   - every search stays within its step budget and every unit gets a fate.
 */
import fc from 'fast-check';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { traceProvenance } from '../../src/chem/provenance/index.js';
import { parseSmiles } from '../../src/chem/read/smiles.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import type { Structure } from '../../src/chem/types.js';
import { haveSharedData } from '../support/shared-data.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { shuffle } from './graph/permute.js';
import { writeSmiles } from '../../src/chem/write/smiles.js';

const TEXTBOOK = [
  'OC(=O)[C@@H](O)[C@@H](O)C(O)=O',
  'OC(=O)[C@@H](O)[C@H](O)C(O)=O',
  'C[C@H]1CCCC[C@H]1C',
  'C/C=C/C=C\\C',
  'CC=[C@]=CC',
  'N[C@@H](Cc1ccccc1)C(=O)O',
];

function pool(): Structure[] {
  const smiles = [...TEXTBOOK];
  if (haveSharedData('moleculenet')) {
    const rows = loadMoleculeNet().filter(
      (r) => /[@/\\]/.test(r.smiles) && !r.smiles.includes('.') && r.smiles.length < 70,
    );
    for (let i = 0; i < rows.length; i += Math.max(1, Math.floor(rows.length / 60)))
      smiles.push(rows[i].smiles);
  }
  return smiles.flatMap((s) => {
    const r = parseSmiles(s);
    return r.ok ? [r.structure] : [];
  });
}

const anyStructure = fc.constantFrom(...pool());
const BUDGET = 20_000;
const opts = { seed: 20261202, numRuns: 40 };

suite('properties of the provenance engine', () => {
  it('a structure made from itself (any atom order) carries every defined unit unchanged', () => {
    let carried = 0;
    fc.assert(
      fc.property(anyStructure, fc.integer({ min: 1, max: 1e9 }), (s, seed) => {
        const again = parseSmiles(writeSmiles(s, { order: shuffle(s.atoms.length, seed) }));
        expect(again.ok).toBe(true);
        for (const input of again.ok ? [s, again.structure] : [s]) {
          const p = traceProvenance(s, [input], { stepBudget: BUDGET });
          expect(p.steps).toBeLessThanOrEqual(BUDGET);
          if (p.bounded) {
            expect(p.units.every((u) => u.fate === 'unmapped' && u.reason === 'bound')).toBe(true);
            continue;
          }
          for (const u of p.units) {
            expect([u.atoms, u.fate]).toEqual([u.atoms, 'carried']);
            if (u.productDefined) expect([u.atoms, u.configuration]).toEqual([u.atoms, 'same']);
            carried++;
          }
        }
      }),
      opts,
    );
    expect(carried).toBeGreaterThan(20);
  });
  it('made from its mirror image: the mirror arrangement, unless the structure is achiral', () => {
    let judged = 0;
    fc.assert(
      fc.property(anyStructure, (s) => {
        const f = describe(s);
        const p = traceProvenance(s, [mirror(s)], { stepBudget: BUDGET });
        if (p.bounded || f.undefined > 0 || p.inputs[0].relative === 'none') return;
        judged++;
        if (f.chiral === false) expect(p.inputs[0].relative).toBe('same');
        else if (f.chiral === true) expect(p.inputs[0].relative).toBe('mirror');
      }),
      opts,
    );
    expect(judged).toBeGreaterThan(10);
  });
});
