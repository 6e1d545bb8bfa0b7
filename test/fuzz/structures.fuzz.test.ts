/**
 * Fuzz (fast-check, seeded, bounded): mutated SMILES and mutated molfiles never throw out of the readers, and a
 * structure that reads is described without an uncaught error (under a time budget, whose stop is the only
 * exception allowed). Seeds are ordinary molecules; the mutations are random edits of their text.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { describe as describeStructure } from '../../src/chem/index.js';
import { readStructure } from '../../src/chem/read/index.js';
import { parseMolfile } from '../../src/chem/read/molfile.js';
import { BudgetExceeded, withBudget } from '../../src/chem/budget.js';

const SEEDS = [
  'OC(=O)[C@@H](O)[C@@H](O)C(=O)O', // meso-tartaric acid
  'C[C@H](N)C(=O)O', // L-alanine
  'C/C=C/C', // (E)-but-2-ene
  'C1CC[C@H]2CCCC[C@@H]2C1', // trans-decalin
  'CC(C)=C=C(C)C', // tetramethylallene
  'Cc1ccccc1-c1ccccc1C', // 2,2'-dimethylbiphenyl
  'C[N+](C)(C)C.[Cl-]', // tetramethylammonium chloride
  'O=C1N[C@@H](Cc2ccccc2)C(=O)N1 |&1:3|',
];
const ALPHABET = 'CNOSPFIBrcnos()[]=#@+-/\\.%0123456789H:*|&, '.split('');

/** One random edit of `text`: insert, delete, replace or duplicate a stretch. */
const edit = (text: string) =>
  fc
    .record({
      kind: fc.constantFrom('insert', 'delete', 'replace', 'duplicate'),
      at: fc.nat(),
      len: fc.integer({ min: 1, max: 6 }),
      ch: fc.constantFrom(...ALPHABET),
    })
    .map(({ kind, at, len, ch }) => {
      const i = text.length === 0 ? 0 : at % text.length;
      if (kind === 'insert') return text.slice(0, i) + ch + text.slice(i);
      if (kind === 'delete') return text.slice(0, i) + text.slice(i + len);
      if (kind === 'replace') return text.slice(0, i) + ch + text.slice(i + 1);
      return text.slice(0, i) + text.slice(i, i + len) + text.slice(i);
    });

const mutated = (seeds: string[], edits: number) =>
  fc.constantFrom(...seeds).chain((s) => {
    let arb: fc.Arbitrary<string> = fc.constant(s);
    for (let k = 0; k < edits; k++) arb = arb.chain((t) => edit(t));
    return arb;
  });

/** Reads and describes; the only exception allowed is the budget's stop. */
function readAndDescribe(text: string, format: 'smiles' | 'molfile'): void {
  const r = readStructure(text, { format });
  expect(typeof r.ok).toBe('boolean');
  if (!r.ok) {
    expect(r.error.message.length).toBeGreaterThan(0);
    return;
  }
  try {
    withBudget({ timeMs: 2000, memoryMb: 512 }, 'fuzz', () => describeStructure(r.structure));
  } catch (e) {
    if (!(e instanceof BudgetExceeded)) throw e;
  }
}

describe('fuzz: mutated SMILES', () => {
  it('never throw out of the reader or describe()', () => {
    fc.assert(
      fc.property(mutated(SEEDS, 3), (s) => readAndDescribe(s, 'smiles')),
      { seed: 4242, numRuns: 1000 },
    );
  });
});

// L-alanine as a V2000 molfile with a wedge (drawn by hand from its 2D depiction)
const ALANINE = [
  'LX-00042',
  '  stereogate',
  '',
  '  6  5  0  0  1  0  0  0  0  0999 V2000',
  '    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    1.2990    2.2500    0.0000 N   0  0  0  0  0  0  0  0  0  0  0  0',
  '    2.5981    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    3.8971    0.7500    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
  '    2.5981   -1.5000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
  '  1  2  1  0',
  '  2  3  1  1',
  '  2  4  1  0',
  '  4  5  1  0',
  '  4  6  2  0',
  'M  END',
];
const V3000 = [
  'LX-00043',
  '  stereogate',
  '',
  '  0  0  0     0  0            999 V3000',
  'M  V30 BEGIN CTAB',
  'M  V30 COUNTS 4 3 0 0 1',
  'M  V30 BEGIN ATOM',
  'M  V30 1 C 0 0 0 0',
  'M  V30 2 C 1.299 0.75 0 0',
  'M  V30 3 O 1.299 2.25 0 0',
  'M  V30 4 Cl 2.598 0 0 0',
  'M  V30 END ATOM',
  'M  V30 BEGIN BOND',
  'M  V30 1 1 1 2',
  'M  V30 2 1 2 3 CFG=1',
  'M  V30 3 1 2 4',
  'M  V30 END BOND',
  'M  V30 END CTAB',
  'M  END',
];

/** A line-level edit of a molfile: drop, duplicate or swap a line, or edit characters inside one. */
const lineEdit = (lines: string[]) =>
  fc
    .record({
      kind: fc.constantFrom('drop', 'duplicate', 'swap', 'chars', 'shift'),
      at: fc.nat(),
      other: fc.nat(),
      ch: fc.constantFrom(' ', '0', '9', '-', '.', 'X', 'V', '\r', 'M'),
      col: fc.nat({ max: 70 }),
    })
    .map(({ kind, at, other, ch, col }) => {
      const out = [...lines];
      const i = at % out.length;
      const j = other % out.length;
      if (kind === 'drop') out.splice(i, 1);
      else if (kind === 'duplicate') out.splice(i, 0, out[i]!);
      else if (kind === 'swap') [out[i], out[j]] = [out[j]!, out[i]!];
      else if (kind === 'shift') out[i] = ` ${out[i]}`;
      else out[i] = out[i]!.slice(0, col) + ch + out[i]!.slice(col + 1);
      return out;
    });

describe('fuzz: mutated molfiles', () => {
  it('V2000 and V3000 with lines dropped, doubled, swapped or edited never throw', () => {
    const arb = fc.constantFrom(ALANINE, V3000).chain((m) =>
      lineEdit(m)
        .chain((x) => lineEdit(x))
        .chain((x) => lineEdit(x)),
    );
    fc.assert(
      fc.property(arb, (lines) => {
        const text = lines.join('\n') + '\n';
        const r = parseMolfile(text);
        if (r.ok) expect(r.structure.atoms.length).toBeGreaterThan(0);
        readAndDescribe(text, 'molfile');
      }),
      { seed: 4343, numRuns: 1000 },
    );
  });
});
