/**
 * Robustness (property tests, fast-check): any string, and any mutation of a valid SMILES, gives either a
 * structure or an error with an offset inside the text; never a throw and never an internal error.
 * Common practice for readers of untrusted input, no source.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { writeSmiles } from '../../../src/chem/write/smiles.js';

const SEEDS = [
  'N[C@@H](C)C(=O)O',
  'C[S@](=O)c1ccccc1',
  'F/C=C/C=C\\Cl',
  'NC(Br)=[C@]=C(O)C',
  'c1ccc2[nH]ccc2c1.[Na+].[Cl-]',
  'c1ccc2[nH]=cc2c1', // once written as C2=N=C=C2, which our reader refuses (neutral N, four bonds)
  'O=C1C[C@H]2CC[C@@H]1C2 |&1:3,6|',
  'C%10CC[C@]%11(F)CC%10.C%11',
  '[2H][13C@@H]([NH3+])C(=O)[O-] LX-00012',
];
const ALPHABET = 'CNOSPFIBrclnosp[]()=#$:/\\@H+-.%0123456789*| ,a&'.split('');

function check(s: string): void {
  const r = parseSmiles(s);
  if (r.ok) {
    expect(r.structure.atoms.length).toBeGreaterThan(0);
    // whatever we read we can write, and read back
    const w = writeSmiles(r.structure);
    expect(parseSmiles(w).ok).toBe(true);
  } else {
    expect(r.error.code).not.toBe('smiles-internal-error');
    expect(r.error.at.offset).toBeGreaterThanOrEqual(0);
    expect(r.error.at.offset).toBeLessThanOrEqual(s.length);
  }
}

describe('parseSmiles never throws', () => {
  it('on random strings over the SMILES alphabet', () => {
    fc.assert(
      fc.property(
        fc.array(fc.constantFrom(...ALPHABET), { maxLength: 40 }).map((a) => a.join('')),
        check,
      ),
      {
        numRuns: 3000,
      },
    );
  });
  it('on arbitrary unicode strings', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 30 }), check), { numRuns: 1000 });
  });
  it('on random mutations (insert, delete, replace) of valid SMILES', () => {
    const mutation = fc.record({
      seed: fc.constantFrom(...SEEDS),
      edits: fc.array(
        fc.record({
          kind: fc.constantFrom('ins', 'del', 'rep'),
          at: fc.nat(),
          ch: fc.constantFrom(...ALPHABET),
        }),
        { minLength: 1, maxLength: 4 },
      ),
    });
    fc.assert(
      fc.property(mutation, ({ seed, edits }) => {
        let s = seed;
        for (const e of edits) {
          const i = e.at % (s.length + 1);
          if (e.kind === 'ins') s = s.slice(0, i) + e.ch + s.slice(i);
          else if (e.kind === 'del') s = s.slice(0, i) + s.slice(i + 1);
          else s = s.slice(0, i) + e.ch + s.slice(i + 1);
        }
        check(s);
      }),
      { numRuns: 3000 },
    );
  });
});
